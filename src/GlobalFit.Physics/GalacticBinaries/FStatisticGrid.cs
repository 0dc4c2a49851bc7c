using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>A box grid over the intrinsic parameters (f0, ḟ, sin β, λ): the cells of an F-statistic map.</summary>
/// <remarks>
/// Every axis is split into equal cells and the statistic is evaluated at cell centres. The sky is split uniformly in
/// sin β and λ, so every sky cell has the same solid angle (<c>4π/(n_β n_λ)</c>). Cell index
/// <c>((i_f n_ḟ + i_ḟ) n_β + i_β) n_λ + i_λ</c>. Immutable.
/// </remarks>
public sealed record FStatisticGrid
{
    /// <summary>Creates a grid; see the properties for the meaning of each argument.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A count is not positive, a width is not positive and finite, or
    /// a start is not finite.</exception>
    public FStatisticGrid(double frequencyStartHz, double frequencyCellHz, int frequencyCount,
        double derivativeStartHzS, double derivativeCellHzS, int derivativeCount, int latitudeCount, int longitudeCount)
    {
        RequireCell(frequencyStartHz, frequencyCellHz, frequencyCount, nameof(frequencyCellHz));
        RequireCell(derivativeStartHzS, derivativeCellHzS, derivativeCount, nameof(derivativeCellHzS));
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(latitudeCount);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(longitudeCount);
        FrequencyStartHz = frequencyStartHz;
        FrequencyCellHz = frequencyCellHz;
        FrequencyCount = frequencyCount;
        DerivativeStartHzS = derivativeStartHzS;
        DerivativeCellHzS = derivativeCellHzS;
        DerivativeCount = derivativeCount;
        LatitudeCount = latitudeCount;
        LongitudeCount = longitudeCount;
        CellCount = checked(frequencyCount * derivativeCount * latitudeCount * longitudeCount);
    }

    /// <summary>A grid covering the bins of <paramref name="window"/> with <paramref name="cellsPerBin"/> frequency cells
    /// per bin, ḟ in [<paramref name="derivativeMinHzS"/>, <paramref name="derivativeMaxHzS"/>] split into
    /// <paramref name="derivativeCount"/> cells, and the sky into <paramref name="latitudeCount"/> × <paramref name="longitudeCount"/>
    /// equal-area cells.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A count is not positive or the ḟ range is empty.</exception>
    public static FStatisticGrid ForWindow(BinWindow window, double dfHz, int cellsPerBin,
        double derivativeMinHzS, double derivativeMaxHzS, int derivativeCount, int latitudeCount, int longitudeCount)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(cellsPerBin);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(derivativeCount);
        if (!(derivativeMaxHzS > derivativeMinHzS))
            throw new ArgumentOutOfRangeException(nameof(derivativeMaxHzS), derivativeMaxHzS, "fdot range must not be empty");
        return new FStatisticGrid(window.First * dfHz, dfHz / cellsPerBin, checked(window.Count * cellsPerBin),
            derivativeMinHzS, (derivativeMaxHzS - derivativeMinHzS) / derivativeCount, derivativeCount, latitudeCount, longitudeCount);
    }

    /// <summary>Lower edge of the first frequency cell.</summary>
    /// <value>Hz.</value>
    public double FrequencyStartHz { get; }

    /// <summary>Width of a frequency cell.</summary>
    /// <value>Hz.</value>
    public double FrequencyCellHz { get; }

    /// <summary>Number of frequency cells.</summary>
    public int FrequencyCount { get; }

    /// <summary>Lower edge of the first ḟ cell.</summary>
    /// <value>Hz/s.</value>
    public double DerivativeStartHzS { get; }

    /// <summary>Width of a ḟ cell.</summary>
    /// <value>Hz/s.</value>
    public double DerivativeCellHzS { get; }

    /// <summary>Number of ḟ cells.</summary>
    public int DerivativeCount { get; }

    /// <summary>Number of cells in sin β over [−1, 1].</summary>
    public int LatitudeCount { get; }

    /// <summary>Number of cells in λ over [0, 2π).</summary>
    public int LongitudeCount { get; }

    /// <summary>Total number of cells.</summary>
    public int CellCount { get; }

    /// <summary>Volume of one cell in (f0, ḟ, sin β, λ).</summary>
    /// <value>Hz · Hz/s · rad.</value>
    public double CellVolume => FrequencyCellHz * DerivativeCellHzS * (2.0 / LatitudeCount) * (2.0 * Math.PI / LongitudeCount);

    /// <summary>The centre of cell <paramref name="cell"/>.</summary>
    public GalacticBinaryIntrinsics Centre(int cell) => At(cell, 0.5, 0.5, 0.5, 0.5);

    /// <summary>The point at fractional position (each in [0, 1)) inside cell <paramref name="cell"/>, uniform in sin β.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The cell index is outside the grid.</exception>
    public GalacticBinaryIntrinsics At(int cell, double frequencyFraction, double derivativeFraction, double latitudeFraction, double longitudeFraction)
    {
        if (cell < 0 || cell >= CellCount)
            throw new ArgumentOutOfRangeException(nameof(cell), cell, $"cell must lie in [0, {CellCount})");
        int lambdaIndex = cell % LongitudeCount;
        int rest = cell / LongitudeCount;
        int betaIndex = rest % LatitudeCount;
        rest /= LatitudeCount;
        int derivativeIndex = rest % DerivativeCount;
        int frequencyIndex = rest / DerivativeCount;
        double sinBeta = -1.0 + (betaIndex + latitudeFraction) * 2.0 / LatitudeCount;
        return new GalacticBinaryIntrinsics(
            FrequencyStartHz + (frequencyIndex + frequencyFraction) * FrequencyCellHz,
            DerivativeStartHzS + (derivativeIndex + derivativeFraction) * DerivativeCellHzS,
            Math.Asin(Math.Clamp(sinBeta, -1.0, 1.0)),
            (lambdaIndex + longitudeFraction) * 2.0 * Math.PI / LongitudeCount);
    }

    /// <summary>The cell holding <paramref name="point"/>, or −1 outside the grid. λ is taken modulo 2π.</summary>
    public int CellOf(in GalacticBinaryIntrinsics point)
    {
        int frequencyIndex = Index((point.FrequencyHz - FrequencyStartHz) / FrequencyCellHz, FrequencyCount);
        int derivativeIndex = Index((point.FrequencyDerivativeHzS - DerivativeStartHzS) / DerivativeCellHzS, DerivativeCount);
        if (!(Math.Abs(point.EclipticLatitudeRad) <= 0.5 * Math.PI)) return -1;
        int betaIndex = Math.Min(LatitudeCount - 1, Index((Math.Sin(point.EclipticLatitudeRad) + 1.0) * 0.5 * LatitudeCount, LatitudeCount + 1));
        double lambda = point.EclipticLongitudeRad - 2.0 * Math.PI * Math.Floor(point.EclipticLongitudeRad / (2.0 * Math.PI));
        int lambdaIndex = Math.Min(LongitudeCount - 1, Index(lambda / (2.0 * Math.PI) * LongitudeCount, LongitudeCount + 1));
        if (frequencyIndex < 0 || derivativeIndex < 0 || betaIndex < 0 || lambdaIndex < 0) return -1;
        return ((frequencyIndex * DerivativeCount + derivativeIndex) * LatitudeCount + betaIndex) * LongitudeCount + lambdaIndex;
    }

    private static int Index(double position, int count) =>
        position >= 0 && position < count ? (int)position : -1;

    private static void RequireCell(double start, double width, int count, string name)
    {
        if (!double.IsFinite(start))
            throw new ArgumentOutOfRangeException(name, start, "grid start must be finite");
        if (!(width > 0) || !double.IsFinite(width))
            throw new ArgumentOutOfRangeException(name, width, "cell width must be positive and finite");
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(count);
    }
}
