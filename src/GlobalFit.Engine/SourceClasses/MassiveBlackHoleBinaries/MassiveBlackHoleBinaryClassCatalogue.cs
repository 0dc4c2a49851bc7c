using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary rows of a run's catalogue: one row per worker (binary), with the median and the
/// 5 % and 95 % quantiles of each parameter over its samples after the burn-in, its median optimal SNR and its samples.</summary>
/// <remarks>A worker holds exactly one binary in every sample, so its confidence is 1. The SNR is the median over at most
/// <see cref="SnrSamples"/> samples spread evenly over the kept ones of <c>√(Σ_c (h_c|h_c))</c> over A, E and T on the workers'
/// window, weighted by the final noise model. Rows are numbered <c>mbhb-0001</c>, … by median t_c. Deterministic for the same
/// blocks in the same order. Not thread-safe.</remarks>
public sealed class MassiveBlackHoleBinaryClassCatalogue : IClassCatalogue
{
    /// <summary>Prefix of the row ids.</summary>
    public const string IdPrefix = "mbhb-";

    /// <summary>Largest number of samples whose SNR is computed per row (each costs one template over the window).</summary>
    public const int SnrSamples = 64;

    private readonly MassiveBlackHoleBinaryTemplateGenerator _generator;
    private readonly BinWindow _window;
    private readonly double _dfHz;
    private readonly double[][] _inverse;
    private readonly long _burnIn;
    private readonly SortedDictionary<string, List<double[]>> _samples = new(StringComparer.Ordinal);

    /// <summary>Creates an empty catalogue.</summary>
    /// <param name="orbits">The constellation.</param>
    /// <param name="shape">The data record.</param>
    /// <param name="window">The workers' window.</param>
    /// <param name="noise">The noise model that weights the SNRs.</param>
    /// <param name="burnInIterations">Blocks of iterations 1 … this are ignored.</param>
    /// <exception cref="ArgumentOutOfRangeException">The burn-in is negative.</exception>
    public MassiveBlackHoleBinaryClassCatalogue(IConstellationOrbits orbits, FitDataShape shape, BinWindow window, IPsdSource noise, long burnInIterations)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        ArgumentNullException.ThrowIfNull(shape);
        ArgumentNullException.ThrowIfNull(noise);
        ArgumentOutOfRangeException.ThrowIfNegative(burnInIterations);
        _generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, window.Count, shape.StartS);
        _window = window;
        _dfHz = shape.DfHz;
        _burnIn = burnInIterations;
        _inverse = new double[3][];
        var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
        for (int c = 0; c < 3; c++)
        {
            _inverse[c] = new double[window.Count];
            InversePsd.Fill(noise, channels[c], window, _inverse[c]);
        }
    }

    /// <summary>Adds the samples of <paramref name="block"/> to its worker's row, unless the block is burn-in.</summary>
    /// <exception cref="ArgumentException">The block is of another class or its columns are not the class's.</exception>
    public void Add(SampleBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        if (block.ClassId != MassiveBlackHoleBinaryClass.Id)
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: a block of class '{block.ClassId}' cannot join the {MassiveBlackHoleBinaryClass.Id} catalogue", nameof(block));
        if (!block.ParameterNames.AsSpan().SequenceEqual(MassiveBlackHoleBinaryParameters.ColumnNames.AsSpan()))
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: columns must be {string.Join(", ", MassiveBlackHoleBinaryParameters.ColumnNames)}", nameof(block));
        if (block.Iteration <= _burnIn) return;
        if (!_samples.TryGetValue(block.WorkerId, out var rows)) _samples[block.WorkerId] = rows = [];
        for (int i = 0; i < block.SampleCount; i++) rows.Add(block.Values[(11 * i)..(11 * i + 11)]);
    }

    /// <summary>One row per worker with samples, by median t_c.</summary>
    public ImmutableArray<CatalogueRecord> Build()
    {
        var rows = _samples.Values.Where(s => s.Count > 0).Select(Summarise).OrderBy(r => r.Median[4]).ToList();
        int digits = Math.Max(4, rows.Count.ToString(CultureInfo.InvariantCulture).Length);
        return [.. rows.Select((r, i) => r with { Id = IdPrefix + (i + 1).ToString(CultureInfo.InvariantCulture).PadLeft(digits, '0') })];
    }

    private CatalogueRecord Summarise(List<double[]> samples)
    {
        var median = new double[11];
        var lower = new double[11];
        var upper = new double[11];
        var column = new double[samples.Count];
        for (int p = 0; p < 11; p++)
        {
            for (int i = 0; i < samples.Count; i++) column[i] = samples[i][p];
            Array.Sort(column);
            median[p] = Quantile(column, 0.5);
            lower[p] = Quantile(column, 0.05);
            upper[p] = Quantile(column, 0.95);
        }
        int count = Math.Min(SnrSamples, samples.Count);
        var snrs = new double[count];
        var h = new[] { new Complex[_window.Count], new Complex[_window.Count], new Complex[_window.Count] };
        for (int j = 0; j < count; j++)
        {
            var source = MassiveBlackHoleBinaryParameters.FromSpan(samples[(int)((long)j * samples.Count / count)]);
            _generator.RenderBins(source, _window, _dfHz, h[0], h[1], h[2]);
            double total = 0;
            for (int c = 0; c < 3; c++) total += InnerProduct.SquaredNorm(h[c], _inverse[c], _dfHz);
            snrs[j] = Math.Sqrt(total);
        }
        Array.Sort(snrs);
        return new CatalogueRecord("", MassiveBlackHoleBinaryClass.Id, 1.0, Quantile(snrs, 0.5), MassiveBlackHoleBinaryParameters.ColumnNames,
            [.. median], [.. lower], [.. upper], [.. samples.SelectMany(s => s)]);
    }

    // Linear interpolation between order statistics (the usual definition 7 of Hyndman & Fan 1996).
    private static double Quantile(double[] sorted, double q)
    {
        double position = q * (sorted.Length - 1);
        int below = (int)Math.Floor(position);
        int above = Math.Min(below + 1, sorted.Length - 1);
        return sorted[below] + (position - below) * (sorted[above] - sorted[below]);
    }
}
