using System.Globalization;
using System.Numerics;
using System.Text;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Galactic binaries in a scenario: an optional invented population (<c>[galactic_binaries.population]</c>)
/// and any number of explicitly listed binaries (<c>[[galactic_binaries.binary]]</c>).</summary>
public sealed class GalacticBinarySimulation : ISimulatedSourceClass
{
    private const string Id = GalacticBinaryClass.Id;

    /// <summary>The first element of the population's random-stream path under the scenario seed (the second is 0).
    /// Changing it changes every simulated population, so it is never reused; the noise uses 1.</summary>
    internal const ulong PopulationStream = 2;

    /// <inheritdoc/>
    public ISourceInjection ReadScenario(ConfigTable section, ObservationSettings observation)
    {
        double nyquistHz = 0.5 / observation.CadenceS;
        GalacticPopulationSettings? population = null;
        if (section.GetTable("population") is { } table)
        {
            population = GalacticPopulationSettings.FromConfig(table);
            if (population.MaxFrequencyHz >= 0.9 * nyquistHz)
                throw table.Invalid("f_max_hz", $"must stay below 90 % of the Nyquist frequency {nyquistHz} Hz of the {observation.CadenceS} s cadence, got {population.MaxFrequencyHz}");
        }
        var explicitBinaries = new List<(string Id, GalacticBinaryParameters Parameters)>();
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in section.GetTableArray("binary"))
        {
            var (id, parameters) = ReadBinary(entry, explicitBinaries.Count, nyquistHz);
            if (!ids.Add(id)) throw entry.Invalid("id", $"id \"{id}\" is used twice");
            explicitBinaries.Add((id, parameters));
        }
        section.RejectUnknownKeys(["population", "binary"]);
        return new Injection(population, explicitBinaries);
    }

    private static (string, GalacticBinaryParameters) ReadBinary(ConfigTable t, int index, double nyquistHz)
    {
        string id = t.GetString("id", $"gb-e{index + 1:D4}");
        double f0 = t.GetPositive(GalacticBinaryParameters.FrequencyColumn, 1e-3);
        if (!t.Has(GalacticBinaryParameters.FrequencyColumn)) throw t.InvalidTable($"each binary needs '{GalacticBinaryParameters.FrequencyColumn}'");
        if (f0 >= 0.9 * nyquistHz) throw t.Invalid(GalacticBinaryParameters.FrequencyColumn, $"must stay below 90 % of the Nyquist frequency {nyquistHz} Hz, got {f0}");
        double fdot = t.GetDouble(GalacticBinaryParameters.FrequencyDerivativeColumn, 0.0);
        if (!double.IsFinite(fdot)) throw t.Invalid(GalacticBinaryParameters.FrequencyDerivativeColumn, "must be finite");
        if (!t.Has(GalacticBinaryParameters.AmplitudeColumn)) throw t.InvalidTable($"each binary needs '{GalacticBinaryParameters.AmplitudeColumn}'");
        double amplitude = t.GetPositive(GalacticBinaryParameters.AmplitudeColumn, 1e-22);
        double beta = t.GetInRange(GalacticBinaryParameters.EclipticLatitudeColumn, 0.0, -Math.PI / 2, Math.PI / 2);
        double lambda = t.GetInRange(GalacticBinaryParameters.EclipticLongitudeColumn, 0.0, 0, 2 * Math.PI);
        double iota = t.GetInRange(GalacticBinaryParameters.InclinationColumn, 0.0, 0, Math.PI);
        double psi = t.GetInRange(GalacticBinaryParameters.PolarisationColumn, 0.0, 0, Math.PI);
        double phi0 = t.GetInRange(GalacticBinaryParameters.InitialPhaseColumn, 0.0, 0, 2 * Math.PI);
        double fddot = t.GetDouble(GalacticBinaryParameters.SecondFrequencyDerivativeColumn, 0.0);
        if (!double.IsFinite(fddot)) throw t.Invalid(GalacticBinaryParameters.SecondFrequencyDerivativeColumn, "must be finite");
        t.RejectUnknownKeys(["id", .. GalacticBinaryParameters.ColumnNames, GalacticBinaryParameters.SecondFrequencyDerivativeColumn]);
        return (id, new GalacticBinaryParameters(f0, fdot, amplitude, beta, lambda, iota, psi, phi0, fddot));
    }

    private sealed class Injection(GalacticPopulationSettings? population, IReadOnlyList<(string Id, GalacticBinaryParameters Parameters)> explicitBinaries)
        : ISourceInjection
    {
        public string ClassId => Id;

        public string ToToml()
        {
            var text = new StringBuilder();
            if (population is { } p)
            {
                text.Append(CultureInfo.InvariantCulture, $"""
                    [{Id}.population]
                    count = {p.Count}
                    f_min_hz = {TomlText.Number(p.MinFrequencyHz)}
                    f_max_hz = {TomlText.Number(p.MaxFrequencyHz)}
                    frequency_power = {TomlText.Number(p.FrequencyPower)}
                    chirp_mass_mean_msun = {TomlText.Number(p.ChirpMassMeanMsun)}
                    chirp_mass_sd_msun = {TomlText.Number(p.ChirpMassSdMsun)}
                    chirp_mass_min_msun = {TomlText.Number(p.ChirpMassMinMsun)}
                    chirp_mass_max_msun = {TomlText.Number(p.ChirpMassMaxMsun)}
                    disc_scale_length_kpc = {TomlText.Number(p.DiscScaleLengthKpc)}
                    disc_scale_height_kpc = {TomlText.Number(p.DiscScaleHeightKpc)}
                    sun_radius_kpc = {TomlText.Number(p.SunRadiusKpc)}

                    """);
            }
            foreach (var (id, b) in explicitBinaries)
            {
                text.Append(CultureInfo.InvariantCulture, $"""
                    [[{Id}.binary]]
                    id = {TomlText.String(id)}
                    f0_hz = {TomlText.Number(b.FrequencyHz)}
                    fdot_hz_s = {TomlText.Number(b.FrequencyDerivativeHzS)}
                    amplitude = {TomlText.Number(b.Amplitude)}
                    beta_rad = {TomlText.Number(b.EclipticLatitudeRad)}
                    lambda_rad = {TomlText.Number(b.EclipticLongitudeRad)}
                    iota_rad = {TomlText.Number(b.InclinationRad)}
                    psi_rad = {TomlText.Number(b.PolarisationRad)}
                    phi0_rad = {TomlText.Number(b.InitialPhaseRad)}
                    fddot_hz_s2 = {TomlText.Number(b.SecondFrequencyDerivativeHzS2)}

                    """);
            }
            return text.ToString();
        }

        public TruthTable Inject(InjectionContext context, Complex[] a, Complex[] e, Complex[] t)
        {
            var sources = new List<(string Id, GalacticBinaryParameters Parameters)>(explicitBinaries);
            if (population is { } p)
            {
                var stream = RandomStream.ForPath(context.Seed, PopulationStream, 0);
                var drawn = GalacticPopulation.Draw(p, ref stream);
                for (int i = 0; i < drawn.Length; i++) sources.Add(($"gb-p{i + 1:D6}", ToParameters(drawn[i])));
            }
            var generator = new GalacticBinaryTemplateGenerator(
                context.Observation.SampleCount * context.Observation.CadenceS, context.Observation.CadenceS,
                startSeconds: context.Observation.StartS);
            var whole = new BinWindow(0, a.Length);
            string[] columns = [.. GalacticBinaryParameters.TableColumnNames, "snr"];
            var values = new double[sources.Count * columns.Length];
            for (int i = 0; i < sources.Count; i++)
            {
                var s = sources[i].Parameters;
                generator.AddResponse(s, whole, a, e, t);
                double[] row = [.. s.ToTableRow(), GalacticBinarySnr.Optimal(generator, s, context.Noise)];
                row.CopyTo(values, i * columns.Length);
            }
            return new TruthTable(Id, columns, sources.Select(x => x.Id), values);
        }

        // Quadrupole-order evolution (Peters 1964) for the frequency derivatives; amplitude from chirp mass and distance.
        private static GalacticBinaryParameters ToParameters(DrawnBinary b)
        {
            double fdot = QuadrupoleBinary.FrequencyDerivativeHzS(b.ChirpMassMsun, b.FrequencyHz);
            return new GalacticBinaryParameters(
                b.FrequencyHz, fdot, QuadrupoleBinary.Amplitude(b.ChirpMassMsun, b.FrequencyHz, b.DistanceM),
                b.BetaRad, b.LambdaRad, b.InclinationRad, b.PolarisationRad, b.InitialPhaseRad,
                QuadrupoleBinary.SecondFrequencyDerivativeHzS2(b.FrequencyHz, fdot));
        }
    }
}
