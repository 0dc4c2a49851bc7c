namespace GlobalFit.Engine.Benchmarking;

/// <summary>A named group of quick measurements of <c>globalfit bench</c>.</summary>
/// <param name="Name">Shown while the suite runs.</param>
/// <param name="Run">Runs the measurements.</param>
public sealed record QuickBenchSuite(string Name, Func<IEnumerable<BenchFigure>> Run);
