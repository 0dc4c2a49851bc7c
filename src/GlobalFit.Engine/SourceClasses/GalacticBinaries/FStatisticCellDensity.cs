using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A normalised density over (f0, ḟ, sin β, λ) from an F-statistic map: a cell chosen with probability
/// growing linearly with the F-statistic above a noise threshold, then a uniform point inside it.</summary>
/// <remarks>
/// <para>Cell probabilities <c>w_c = (1 − ε) max(F_c − F_th, 0)/Σ max(F − F_th, 0) + ε/N_cells</c> (ε/N_cells alone when no
/// cell exceeds the threshold). The Physics <see cref="FStatisticBirthDensity"/> weights cells by e^{F/τ}; in a window
/// with several sources that puts nearly all births on the loudest one (an SNR-50 source has F ≈ 1250, an SNR-20 one
/// F ≈ 200, so e^{F} separates them by e^{1000}), which is why the worker weights linearly instead. F_th =
/// <see cref="NoiseThreshold"/> keeps the many noise cells (2F ~ χ²₄, mean F = 2) from diluting the signal cells:
/// P(F &gt; 10) in noise is e^{−10}(1 + 10) ≈ 5·10⁻⁴ per cell. The uniform part ε keeps every cell reachable, which a
/// death move's reverse needs. The density is uniform in sin β inside a cell, i.e. in the coordinates the worker
/// samples, so no cos β factor appears. Immutable.</para>
/// </remarks>
public sealed class FStatisticCellDensity
{
    /// <summary>F below which a cell counts as noise.</summary>
    public const double NoiseThreshold = 10.0;

    private readonly double[] _cumulative;
    private readonly double[] _logCellDensity;

    /// <summary>Builds the density from a map.</summary>
    /// <param name="map">The F-statistic map.</param>
    /// <param name="uniformFraction">ε in (0, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">ε is outside (0, 1] or a map value is not finite.</exception>
    public FStatisticCellDensity(FStatisticMap map, double uniformFraction)
    {
        ArgumentNullException.ThrowIfNull(map);
        if (!(uniformFraction > 0 && uniformFraction <= 1))
            throw new ArgumentOutOfRangeException(nameof(uniformFraction), uniformFraction, "uniform fraction must lie in (0, 1]");
        Grid = map.Grid;
        int count = Grid.CellCount;
        double total = 0;
        foreach (double f in map.Values)
        {
            if (!double.IsFinite(f)) throw new ArgumentOutOfRangeException(nameof(map), f, "map values must be finite");
            total += Math.Max(f - NoiseThreshold, 0.0);
        }
        double signalFraction = total > 0 ? 1.0 - uniformFraction : 0.0;
        _cumulative = new double[count];
        _logCellDensity = new double[count];
        double running = 0, logVolume = Math.Log(Grid.CellVolume);
        for (int c = 0; c < count; c++)
        {
            double excess = Math.Max(map.Values[c] - NoiseThreshold, 0.0);
            double probability = (total > 0 ? signalFraction * excess / total : 0.0) + (1.0 - signalFraction) / count;
            running += probability;
            _cumulative[c] = running;
            _logCellDensity[c] = Math.Log(probability) - logVolume;
        }
        for (int c = 0; c < count; c++) _cumulative[c] /= running;
    }

    /// <summary>The grid.</summary>
    public FStatisticGrid Grid { get; }

    /// <summary>ln of the density in (f0, ḟ, sin β, λ); −∞ outside the grid.</summary>
    /// <param name="point">The intrinsic parameters (β, not sin β).</param>
    public double LogDensity(in GalacticBinaryIntrinsics point)
    {
        int cell = Grid.CellOf(point);
        return cell < 0 ? double.NegativeInfinity : _logCellDensity[cell];
    }

    /// <summary>A point from five uniform variates in [0, 1): one picks the cell, four place the point in it.</summary>
    /// <param name="cellUniform">Selects the cell.</param>
    /// <param name="frequencyFraction">Position in f0.</param>
    /// <param name="derivativeFraction">Position in ḟ.</param>
    /// <param name="latitudeFraction">Position in sin β.</param>
    /// <param name="longitudeFraction">Position in λ.</param>
    public GalacticBinaryIntrinsics Draw(double cellUniform, double frequencyFraction, double derivativeFraction, double latitudeFraction, double longitudeFraction)
    {
        int cell = _cumulative.AsSpan().BinarySearch(cellUniform);
        // BinarySearch returns the complement of the first larger entry when the value is absent.
        cell = cell < 0 ? ~cell : cell + 1;
        cell = Math.Min(cell, _cumulative.Length - 1);
        return Grid.At(cell, frequencyFraction, derivativeFraction, latitudeFraction, longitudeFraction);
    }
}
