using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The data a galactic-binary calculation sees: A, E (and optionally T) spectra on one window of bins of the
/// full-resolution spectrum, with their inverse noise PSDs.</summary>
/// <remarks>The arrays are the caller's and are read, not copied: a band worker refills them in place between
/// iterations (not while a calculation runs). Values follow the continuous-transform convention of
/// <see cref="FourierTransform"/>; weights are <c>1/S_k</c> as <see cref="InnerProduct"/> expects (0 excludes a bin).</remarks>
public sealed class GalacticBinaryBand
{
    /// <summary>Wraps the band's arrays.</summary>
    /// <param name="window">Full-resolution bins the arrays hold.</param>
    /// <param name="dfHz">Bin spacing 1/T.</param>
    /// <param name="dataA">Channel A data.</param>
    /// <param name="dataE">Channel E data.</param>
    /// <param name="inverseA">1/S_A per bin.</param>
    /// <param name="inverseE">1/S_E per bin.</param>
    /// <param name="dataT">Channel T data, or null to use A and E only.</param>
    /// <param name="inverseT">1/S_T per bin, given exactly when T data are.</param>
    /// <exception cref="ArgumentException">A length differs from the window, the spacing is not positive and finite,
    /// or only one of the T arrays is given.</exception>
    public GalacticBinaryBand(BinWindow window, double dfHz, Complex[] dataA, Complex[] dataE, double[] inverseA, double[] inverseE,
        Complex[]? dataT = null, double[]? inverseT = null)
    {
        ArgumentNullException.ThrowIfNull(dataA);
        ArgumentNullException.ThrowIfNull(dataE);
        ArgumentNullException.ThrowIfNull(inverseA);
        ArgumentNullException.ThrowIfNull(inverseE);
        if (!(dfHz > 0) || !double.IsFinite(dfHz))
            throw new ArgumentException($"bin spacing must be positive and finite, got {dfHz}", nameof(dfHz));
        if ((dataT is null) != (inverseT is null))
            throw new ArgumentException("give both the T data and the T weights, or neither");
        foreach (int length in new[] { dataA.Length, dataE.Length, inverseA.Length, inverseE.Length, dataT?.Length ?? window.Count, inverseT?.Length ?? window.Count })
            if (length != window.Count)
                throw new ArgumentException($"every array must hold the window's {window.Count} bins, one holds {length}");
        Window = window;
        DfHz = dfHz;
        DataA = dataA;
        DataE = dataE;
        InverseA = inverseA;
        InverseE = inverseE;
        DataT = dataT;
        InverseT = inverseT;
    }

    /// <summary>Bins held.</summary>
    public BinWindow Window { get; }

    /// <summary>Bin spacing.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>Channel A data.</summary>
    public Complex[] DataA { get; }

    /// <summary>Channel E data.</summary>
    public Complex[] DataE { get; }

    /// <summary>Channel T data, or null.</summary>
    public Complex[]? DataT { get; }

    /// <summary>1/S_A.</summary>
    public double[] InverseA { get; }

    /// <summary>1/S_E.</summary>
    public double[] InverseE { get; }

    /// <summary>1/S_T, or null.</summary>
    public double[]? InverseT { get; }

    /// <summary>True when channel T takes part.</summary>
    public bool IncludesT => DataT is not null;
}
