namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>A proposal density over the intrinsic parameters (f0, ḟ, β, λ) built from an F-statistic map: a
/// categorical choice of cell followed by a uniform point inside it.</summary>
/// <remarks>
/// <para>Cell probabilities <c>w_c = (1 − ε) e^{F_c/τ}/Σ e^{F/τ} + ε/N_cells</c>: τ (the temperature) flattens the map,
/// and the uniform fraction ε keeps the density positive on every cell, which a reversible-jump birth needs so that
/// the reverse (death) move of any source has a finite ratio. Inside a cell the point is uniform in f0, ḟ, sin β and
/// λ, so the density in (f0, ḟ, β, λ) is <c>w_c cos β / V_cell</c> with V_cell the cell volume in (f0, ḟ, sin β, λ);
/// outside the grid it is 0. Immutable and thread-safe.</para>
/// </remarks>
public sealed class FStatisticBirthDensity
{
    /// <summary>Uniform variates one <see cref="Draw"/> consumes.</summary>
    public const int UniformsPerDraw = 5;

    private readonly double[] _cumulative;
    private readonly double[] _logCellDensity;

    /// <summary>Builds the density from <paramref name="map"/>.</summary>
    /// <param name="map">The F-statistic map.</param>
    /// <param name="temperature">τ &gt; 0; default 1 (weights e^F, the likelihood maximised over amplitudes).</param>
    /// <param name="uniformFraction">ε in [0, 1]; default 0.1.</param>
    /// <exception cref="ArgumentOutOfRangeException">τ is not positive and finite or ε is outside [0, 1], or a map value
    /// is not finite.</exception>
    public FStatisticBirthDensity(FStatisticMap map, double temperature = 1.0, double uniformFraction = 0.1)
    {
        ArgumentNullException.ThrowIfNull(map);
        if (!(temperature > 0) || !double.IsFinite(temperature))
            throw new ArgumentOutOfRangeException(nameof(temperature), temperature, "temperature must be positive and finite");
        if (!(uniformFraction >= 0 && uniformFraction <= 1))
            throw new ArgumentOutOfRangeException(nameof(uniformFraction), uniformFraction, "uniform fraction must lie in [0, 1]");
        Grid = map.Grid;
        int count = Grid.CellCount;
        double largest = double.NegativeInfinity;
        foreach (double f in map.Values)
        {
            if (!double.IsFinite(f)) throw new ArgumentOutOfRangeException(nameof(map), f, "map values must be finite");
            largest = Math.Max(largest, f);
        }
        // Log-sum-exp: loud sources have F in the thousands.
        var weights = new double[count];
        double total = 0;
        for (int c = 0; c < count; c++)
        {
            weights[c] = Math.Exp((map.Values[c] - largest) / temperature);
            total += weights[c];
        }
        _cumulative = new double[count];
        _logCellDensity = new double[count];
        double running = 0, logVolume = Math.Log(Grid.CellVolume);
        for (int c = 0; c < count; c++)
        {
            double probability = (1.0 - uniformFraction) * weights[c] / total + uniformFraction / count;
            running += probability;
            _cumulative[c] = running;
            _logCellDensity[c] = Math.Log(probability) - logVolume;
        }
        for (int c = 0; c < count; c++) _cumulative[c] /= running;
    }

    /// <summary>The grid the density lives on.</summary>
    public FStatisticGrid Grid { get; }

    /// <summary>Probability of cell <paramref name="cell"/>.</summary>
    public double CellProbability(int cell) => cell == 0 ? _cumulative[0] : _cumulative[cell] - _cumulative[cell - 1];

    /// <summary>ln of the density at <paramref name="point"/> in (f0, ḟ, β, λ); −∞ outside the grid.</summary>
    public double LogDensity(in GalacticBinaryIntrinsics point)
    {
        int cell = Grid.CellOf(point);
        if (cell < 0) return double.NegativeInfinity;
        double cosBeta = Math.Cos(point.EclipticLatitudeRad);
        return cosBeta > 0 ? _logCellDensity[cell] + Math.Log(cosBeta) : double.NegativeInfinity;
    }

    /// <summary>ln of the density at the intrinsic part of <paramref name="source"/>.</summary>
    public double LogDensity(in GalacticBinaryParameters source) => LogDensity(GalacticBinaryIntrinsics.Of(source));

    /// <summary>Draws a point from <see cref="UniformsPerDraw"/> independent uniform variates in [0, 1).</summary>
    /// <exception cref="ArgumentException">Fewer than <see cref="UniformsPerDraw"/> variates are given.</exception>
    public GalacticBinaryIntrinsics Draw(ReadOnlySpan<double> uniforms)
    {
        if (uniforms.Length < UniformsPerDraw)
            throw new ArgumentException($"a draw needs {UniformsPerDraw} uniform variates, got {uniforms.Length}", nameof(uniforms));
        int cell = _cumulative.AsSpan().BinarySearch(uniforms[0]);
        // BinarySearch returns the complement of the first larger entry when the value is not present.
        if (cell < 0) cell = ~cell;
        else cell++;
        cell = Math.Min(cell, _cumulative.Length - 1);
        return Grid.At(cell, uniforms[1], uniforms[2], uniforms[3], uniforms[4]);
    }
}
