namespace GlobalFit.Engine.Benchmarking;

/// <summary>One named throughput figure of <c>globalfit bench</c>.</summary>
/// <param name="Name">Stable snake_case name with its unit, e.g. <c>inner_product_gigabytes_per_s</c>.</param>
/// <param name="Value">The measured figure.</param>
/// <param name="Description">What was timed.</param>
public sealed record BenchFigure(string Name, double Value, string Description);
