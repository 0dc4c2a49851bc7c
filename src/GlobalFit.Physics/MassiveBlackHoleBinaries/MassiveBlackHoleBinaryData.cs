using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The data a massive black-hole binary calculation sees: A, E, T spectra on one window of full-resolution bins, with
/// their inverse noise PSDs.</summary>
/// <remarks>The arrays are the caller's and are read, not copied: a worker may refill the data in place between calculations
/// (then call <see cref="MassiveBlackHoleBinaryHeterodynedLikelihood.UpdateData"/> on any heterodyned likelihood built on them).
/// Values follow the continuous-transform convention of <see cref="FourierTransform"/>; weights are <c>1/S_k</c> as
/// <see cref="InnerProduct"/> expects (0 excludes a bin, e.g. T where it is not used).</remarks>
public sealed class MassiveBlackHoleBinaryData
{
    /// <summary>Wraps the arrays.</summary>
    /// <param name="window">Full-resolution bins the arrays hold (bin k at k Δf).</param>
    /// <param name="dfHz">Bin spacing 1/T.</param>
    /// <param name="channels">Data of A, E, T (three arrays).</param>
    /// <param name="inversePsd">1/S of A, E, T (three arrays).</param>
    /// <exception cref="ArgumentException">Not three channels, a length differs from the window, or the spacing is not positive and finite.</exception>
    public MassiveBlackHoleBinaryData(BinWindow window, double dfHz, Complex[][] channels, double[][] inversePsd)
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(inversePsd);
        if (!(dfHz > 0) || !double.IsFinite(dfHz))
            throw new ArgumentException($"bin spacing must be positive and finite, got {dfHz}", nameof(dfHz));
        if (channels.Length != 3 || inversePsd.Length != 3)
            throw new ArgumentException("give A, E and T data and weights (three arrays each)");
        for (int c = 0; c < 3; c++)
            if (channels[c] is null || inversePsd[c] is null || channels[c].Length != window.Count || inversePsd[c].Length != window.Count)
                throw new ArgumentException($"every array must hold the window's {window.Count} bins");
        if (window.First < 0 || window.Count <= 0)
            throw new ArgumentException($"window must start at a non-negative bin and hold at least one, got {window}", nameof(window));
        Window = window;
        DfHz = dfHz;
        Channels = channels;
        InversePsd = inversePsd;
    }

    /// <summary>Bins held.</summary>
    public BinWindow Window { get; }

    /// <summary>Bin spacing.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>Data of A, E, T, in that order.</summary>
    public Complex[][] Channels { get; }

    /// <summary>1/S of A, E, T, in that order.</summary>
    public double[][] InversePsd { get; }

    /// <summary>Frequency of the i-th bin of the window.</summary>
    /// <value>Hz.</value>
    public double FrequencyOf(int index) => (Window.First + index) * DfHz;
}
