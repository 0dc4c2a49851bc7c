using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>A synthetic year-long fit layout for timing the engine's own work (residual cuts, stage commits, the
/// residual of the noise worker), shared by <c>globalfit bench</c> and the BenchmarkDotNet suite.</summary>
/// <remarks>A year at 5 s (3,155,761 bins) with a given number of band windows of 256 core bins padded by 64 on each
/// side from 0.3 mHz up, each holding a non-zero template, as in a fit of about a thousand windows, and one noise worker
/// over 0.1–30 mHz.</remarks>
public sealed class OrchestrationWorkload
{
    /// <summary>Builds the layout.</summary>
    /// <param name="windowCount">Number of band windows.</param>
    public OrchestrationWorkload(int windowCount = 1000)
    {
        var shape = new FitDataShape("synthetic year", 6_311_520, 5.0, 0.0);
        int bins = shape.BinCount;
        Complex[] Channel() => Enumerable.Range(0, bins).Select(k => new Complex(Math.Sin(k), Math.Cos(k))).ToArray();
        var ones = Enumerable.Repeat(1.0, bins).ToArray();
        int first = (int)(3e-4 / shape.DfHz);
        Windows = [.. Enumerable.Range(0, windowCount).Select(i => (Id: $"bands/{i:D4}", Bins: new BinWindow(first + i * 256 - 64, 384)))];
        NoiseBins = new BinWindow((int)(1e-4 / shape.DfHz), (int)(3e-2 / shape.DfHz) - (int)(1e-4 / shape.DfHz));
        var workers = Windows.Select(w => new WorkerDescriptor(w.Id, w.Bins, w.Id, false))
            .Append(new WorkerDescriptor(NoiseWorkerId, NoiseBins, "noise", true, WorkerRole.Noise));
        Book = new ResidualBook(FitData.FromSpectra(shape, Channel(), Channel(), Channel()), workers, ones, ones, ones);
        foreach (var (id, window) in Windows)
            Book.Replace(id, new WindowSpectra(window, Enumerable.Repeat(new Complex(0.1, 0.2), window.Count).ToArray(),
                Enumerable.Repeat(new Complex(0.3, 0.1), window.Count).ToArray(), null));
    }

    /// <summary>The noise worker's id in the book.</summary>
    public const string NoiseWorkerId = "noise";

    /// <summary>The book.</summary>
    public ResidualBook Book { get; }

    /// <summary>The windows by id.</summary>
    public IReadOnlyList<(string Id, BinWindow Bins)> Windows { get; }

    /// <summary>The noise worker's default band, 0.1–30 mHz.</summary>
    public BinWindow NoiseBins { get; }
}
