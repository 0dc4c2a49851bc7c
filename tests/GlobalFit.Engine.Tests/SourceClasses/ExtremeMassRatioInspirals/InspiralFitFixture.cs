using System.Globalization;
using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Builds inspiral fit plans from TOML and residuals from an injected source plus seeded Gaussian noise over a
/// worker's window, without simulating a whole record.</summary>
internal static class InspiralFitFixture
{
    /// <summary>A box around the fixture's source (M 5e5, μ 10, χ 0.6, ν0 1.2e-3 Hz, e0 0.15), as a user who knows roughly where
    /// to look would give it.</summary>
    public const string SearchBoxKeys = """
        search_central_mass_min_msun = 4e5
        search_central_mass_max_msun = 6e5
        search_compact_mass_min_msun = 8
        search_compact_mass_max_msun = 12
        search_spin_min = 0.4
        search_spin_max = 0.8
        search_orbital_frequency_min_hz = 1.15e-3
        search_orbital_frequency_max_hz = 1.25e-3
        search_eccentricity_min = 0.1
        search_eccentricity_max = 0.2
        """;

    /// <summary>The same box as <see cref="SearchBoxKeys"/>.</summary>
    public static InspiralSearchBox SearchBox { get; } = new(4e5, 6e5, 8, 12, 0.4, 0.8, 1.15e-3, 1.25e-3, 0.1, 0.2);

    /// <summary>A month at 10 s: short enough that a template costs a few milliseconds.</summary>
    public static FitDataShape Month { get; } = new("month.h5", 259_200, 10, 0);

    /// <summary>An invented source (the demo's) of SNR 43 over <see cref="Month"/> against the default noise (measured:
    /// 8.65 at 1000 Mpc, and the SNR scales as 1/D).</summary>
    public static ExtremeMassRatioInspiralParameters Source { get; } =
        new(5e5, 10, 0.6, 1.2e-3, 0.15, 0.8, 0.4, 2.0, 1.2, 0.7, 200, 1.0, 0.5, 2.5);

    public static AetNoiseModel Noise { get; } = new(InstrumentNoiseSettings.Default);

    /// <summary>The TOML of a start row.</summary>
    public static string StartRow(string id, in ExtremeMassRatioInspiralParameters p)
    {
        var text = new System.Text.StringBuilder($"[[extreme_mass_ratio_inspirals.start]]\nid = \"{id}\"\n");
        double[] row = p.ToArray();
        for (int c = 0; c < row.Length; c++)
            text.Append(ExtremeMassRatioInspiralParameters.ColumnNames[c]).Append(" = ").Append(row[c].ToString("R", CultureInfo.InvariantCulture)).Append('\n');
        return text.ToString();
    }

    public static InspiralFitPlan Plan(string keys, params (string Id, ExtremeMassRatioInspiralParameters Start)[] starts) =>
        InspiralFitPlan.FromConfig(Section(keys, starts), Month);

    public static ConfigTable Section(string keys, params (string Id, ExtremeMassRatioInspiralParameters Start)[] starts)
    {
        string text = "[extreme_mass_ratio_inspirals]\n" + keys + "\n" + string.Concat(starts.Select(s => StartRow(s.Id, s.Start)));
        return ConfigDocument.Parse(text, "fit.toml").GetTable("extreme_mass_ratio_inspirals")!;
    }

    /// <summary>The residual over <paramref name="bins"/>: the injected source plus Gaussian noise of the default model
    /// (E|n_k|² = (T/2) S_k, the convention of the Fourier transform), seeded; no noise when the seed is null.</summary>
    public static WorkerResidual Residual(BinWindow bins, in ExtremeMassRatioInspiralParameters injected, ulong? noiseSeed, FitDataShape? shape = null)
    {
        shape ??= Month;
        var generator = InspiralFitPlan.Generator(shape);
        var (a, e) = (new Complex[bins.Count], new Complex[bins.Count]);
        generator.AddResponse(injected, bins, a, e, Span<Complex>.Empty);
        double df = shape.DfHz;
        var (inverseA, inverseE) = (new double[bins.Count], new double[bins.Count]);
        for (int k = 0; k < bins.Count; k++)
        {
            double f = (bins.First + k) * df;
            inverseA[k] = 1 / Noise.Psd(AetChannel.A, f);
            inverseE[k] = 1 / Noise.Psd(AetChannel.E, f);
        }
        if (noiseSeed is { } seed)
        {
            var random = RandomStream.ForPath(seed, 1, 2);
            for (int k = 0; k < bins.Count; k++)
            {
                // Re and Im each of variance (T/4) S.
                double sa = Math.Sqrt(shape.DurationS / 4 / inverseA[k]), se = Math.Sqrt(shape.DurationS / 4 / inverseE[k]);
                a[k] += new Complex(sa * random.NextGaussian(), sa * random.NextGaussian());
                e[k] += new Complex(se * random.NextGaussian(), se * random.NextGaussian());
            }
        }
        return new WorkerResidual(new WindowSpectra(bins, a, e, null), df, inverseA, inverseE, null);
    }

    public static double Snr(in ExtremeMassRatioInspiralParameters p, FitDataShape? shape = null) =>
        ExtremeMassRatioInspiralSnr.Optimal(InspiralFitPlan.Generator(shape ?? Month), p, Noise);
}
