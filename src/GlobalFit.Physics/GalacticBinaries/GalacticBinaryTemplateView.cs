using System.Numerics;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>A rendered A/E/T template on its own bins, <c>FirstBin … FirstBin + Count − 1</c> of the full-resolution
/// one-sided spectrum.</summary>
/// <remarks>A view into the generator's scratch buffers: valid until the next call on the same generator. Bins below
/// zero (a source within N/2 bins of DC) are included as computed; <see cref="GalacticBinaryTemplateGenerator.AddResponse"/>
/// folds them onto positive frequencies.</remarks>
public readonly ref struct GalacticBinaryTemplateView
{
    internal GalacticBinaryTemplateView(int firstBin, ReadOnlySpan<Complex> a, ReadOnlySpan<Complex> e, ReadOnlySpan<Complex> t)
    {
        FirstBin = firstBin;
        A = a;
        E = e;
        T = t;
    }

    /// <summary>Full-resolution index of the first bin (may be negative for sources next to DC).</summary>
    public int FirstBin { get; }

    /// <summary>Number of bins, the envelope length N.</summary>
    public int Count => A.Length;

    /// <summary>The bins covered, when <see cref="FirstBin"/> is not negative.</summary>
    public Series.BinWindow Bins => new(FirstBin, Count);

    /// <summary>Channel A, continuous-transform convention (Δt × DFT).</summary>
    public ReadOnlySpan<Complex> A { get; }

    /// <summary>Channel E.</summary>
    public ReadOnlySpan<Complex> E { get; }

    /// <summary>Channel T; empty when the caller asked for A and E only.</summary>
    public ReadOnlySpan<Complex> T { get; }
}
