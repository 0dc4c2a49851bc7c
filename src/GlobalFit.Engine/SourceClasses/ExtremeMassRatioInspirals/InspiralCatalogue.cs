using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The inspiral rows of a run's catalogue: one per worker, with the medians and 5–95 % quantiles of its
/// samples after burn-in, the median optimal SNR and the samples themselves.</summary>
/// <remarks>
/// <para>Ids <c>emri-0001</c>, <c>emri-0002</c>, … in the plan's row order; the confidence is 1 (a worker holds its one
/// source in every sample). Periodic angles (longitude, φ_K, Φ0, γ̃0, α0) are summarised around their circular mean:
/// samples are unwrapped into the period centred there, so an interval that straddles 0 stays one interval; the median is
/// wrapped back into [0, 2π) and the interval keeps its width, so its ends may fall outside [0, 2π).</para>
/// <para>The SNR is the median over at most <see cref="SnrSamples"/> samples spread evenly through the chain, against
/// the fit's final noise model (a template costs milliseconds, so not every sample).</para>
/// </remarks>
internal sealed class InspiralCatalogue : IClassCatalogue
{
    /// <summary>Prefix of the row ids.</summary>
    public const string IdPrefix = "emri-";

    /// <summary>Most samples whose SNR enters the median.</summary>
    public const int SnrSamples = 16;

    private readonly ExtremeMassRatioInspiralTemplateGenerator _generator;
    private readonly IPsdSource _noise;
    private readonly long _burnIn;
    private readonly ImmutableArray<string> _workers;
    private readonly Dictionary<string, List<double>> _samples = new(StringComparer.Ordinal);

    /// <summary>Creates an empty catalogue for the workers <paramref name="workers"/> (in row order).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The burn-in is negative.</exception>
    public InspiralCatalogue(ExtremeMassRatioInspiralTemplateGenerator generator, IPsdSource noise, long burnInIterations, ImmutableArray<string> workers)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(noise);
        ArgumentOutOfRangeException.ThrowIfNegative(burnInIterations);
        _generator = generator;
        _noise = noise;
        _burnIn = burnInIterations;
        _workers = workers;
    }

    /// <inheritdoc />
    public void Add(SampleBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        if (block.Iteration <= _burnIn) return;
        if (!block.ParameterNames.AsSpan().SequenceEqual(P.ColumnNames.AsSpan()))
            throw new ArgumentException($"block of {block.WorkerId} has columns {string.Join(", ", block.ParameterNames)}, not the inspiral columns", nameof(block));
        if (!_samples.TryGetValue(block.WorkerId, out var values)) _samples[block.WorkerId] = values = [];
        values.AddRange(block.Values);
    }

    /// <inheritdoc />
    public ImmutableArray<CatalogueRecord> Build()
    {
        var rows = ImmutableArray.CreateBuilder<CatalogueRecord>();
        int d = P.ColumnNames.Length;
        for (int w = 0; w < _workers.Length; w++)
        {
            if (!_samples.TryGetValue(_workers[w], out var values) || values.Count == 0) continue;
            int n = values.Count / d;
            var median = new double[d];
            var lower = new double[d];
            var upper = new double[d];
            var column = new double[n];
            for (int c = 0; c < d; c++)
            {
                for (int i = 0; i < n; i++) column[i] = values[i * d + c];
                (median[c], lower[c], upper[c]) = Summarise(column, InspiralSamplingCoordinates.IsPeriodic(c));
            }
            rows.Add(new CatalogueRecord($"{IdPrefix}{w + 1:D4}", ExtremeMassRatioInspiralClass.Id, 1.0, MedianSnr(values, n),
                P.ColumnNames, [.. median], [.. lower], [.. upper], [.. values]));
        }
        return rows.ToImmutable();
    }

    /// <summary>Median and 5 %, 95 % quantiles (order statistics at ⌊q (n − 1)⌋), around the circular mean for a
    /// periodic column.</summary>
    public static (double Median, double Lower, double Upper) Summarise(double[] column, bool periodic)
    {
        double[] sorted = (double[])column.Clone();
        double centre = 0;
        if (periodic)
        {
            double s = 0, c = 0;
            foreach (double v in column) { s += Math.Sin(v); c += Math.Cos(v); }
            centre = Math.Atan2(s, c);
            for (int i = 0; i < sorted.Length; i++) sorted[i] = centre + Math.IEEERemainder(sorted[i] - centre, 2 * Math.PI);
        }
        Array.Sort(sorted);
        double At(double q) => sorted[(int)(q * (sorted.Length - 1))];
        double median = At(0.5), lower = At(0.05), upper = At(0.95);
        if (!periodic) return (median, lower, upper);
        double wrapped = InspiralSamplingCoordinates.Wrap(median);
        return (wrapped, wrapped - (median - lower), wrapped + (upper - median));
    }

    private double MedianSnr(List<double> values, int n)
    {
        int d = P.ColumnNames.Length;
        int count = Math.Min(n, SnrSamples);
        var snrs = new double[count];
        for (int k = 0; k < count; k++)
        {
            int i = (int)((long)k * n / count);
            var p = P.FromSpan(values.GetRange(i * d, d).ToArray());
            snrs[k] = Snr(p);
        }
        Array.Sort(snrs);
        return snrs[count / 2];
    }

    private double Snr(in P p)
    {
        BinWindow bins;
        try
        {
            bins = _generator.TemplateBins(p);
        }
        catch (ArgumentOutOfRangeException)
        {
            return 0;
        }
        if (bins.Count == 0) return 0;
        var a = new Complex[bins.Count];
        var e = new Complex[bins.Count];
        _generator.AddResponse(p, bins, a, e, Span<Complex>.Empty);
        var inverse = new double[bins.Count];
        double df = _generator.FrequencyResolutionHz;
        double snr2 = 0;
        foreach (var (channel, h) in new[] { (AetChannel.A, a), (AetChannel.E, e) })
        {
            InversePsd.Fill(_noise, channel, bins, inverse);
            snr2 += InnerProduct.SquaredNorm(h, inverse, df);
        }
        return Math.Sqrt(snr2);
    }
}
