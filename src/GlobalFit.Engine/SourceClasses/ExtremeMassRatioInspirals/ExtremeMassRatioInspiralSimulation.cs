using System.Globalization;
using System.Numerics;
using System.Text;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;
using P = GlobalFit.Physics.ExtremeMassRatioInspirals.ExtremeMassRatioInspiralParameters;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Extreme-mass-ratio inspirals in a scenario: an optional invented population
/// (<c>[extreme_mass_ratio_inspirals.population]</c>) and any number of listed inspirals
/// (<c>[[extreme_mass_ratio_inspirals.inspiral]]</c>, keyed by the parameter column names plus <c>id</c>, with exactly
/// one of <c>orbital_frequency0_hz</c> and <c>plunge_time_s</c>).</summary>
/// <remarks>Each source is injected over the whole record with the fast template
/// (<see cref="ExtremeMassRatioInspiralTemplateGenerator"/>); T receives nothing, since the long-wavelength response
/// has no T channel. The truth table holds every parameter column (ν0 also for sources given by plunge time) and the
/// optimal SNR in A and E against the scenario's noise model.</remarks>
public sealed class ExtremeMassRatioInspiralSimulation : ISimulatedSourceClass
{
    private const string Id = ExtremeMassRatioInspiralClass.Id;

    /// <summary>The first element of the population's random-stream path under the scenario seed (the second is 0).
    /// Never reused: the noise uses 1, galactic binaries 2, massive black-hole binaries 3.</summary>
    internal const ulong PopulationStream = 4;

    /// <inheritdoc/>
    public ISourceInjection ReadScenario(ConfigTable section, ObservationSettings observation)
    {
        ArgumentNullException.ThrowIfNull(section);
        ExtremeMassRatioInspiralPopulationSettings? population = null;
        if (section.GetTable("population") is { } table) population = ExtremeMassRatioInspiralPopulationSettings.FromConfig(table);
        var listed = new List<Listed>();
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in section.GetTableArray("inspiral"))
        {
            var inspiral = ReadInspiral(entry, listed.Count);
            if (!ids.Add(inspiral.Id)) throw entry.Invalid("id", $"id \"{inspiral.Id}\" is used twice");
            listed.Add(inspiral);
        }
        section.RejectUnknownKeys(["population", "inspiral"]);
        return new Injection(population, listed);
    }

    /// <summary>One listed inspiral: its parameters (ν0 resolved) and the plunge time it was given by, if any.</summary>
    private sealed record Listed(string Id, P Parameters, double? PlungeTimeS);

    private static Listed ReadInspiral(ConfigTable t, int index)
    {
        string id = t.GetString("id", $"emri-e{index + 1:D4}");
        foreach (string required in new[] { P.CentralMassColumn, P.CompactMassColumn, P.DistanceColumn })
            if (!t.Has(required)) throw t.InvalidTable($"each inspiral needs '{required}'");
        bool byFrequency = t.Has(P.OrbitalFrequencyColumn), byPlunge = t.Has(P.PlungeTimeColumn);
        if (byFrequency == byPlunge)
            throw t.InvalidTable($"each inspiral needs exactly one of '{P.OrbitalFrequencyColumn}' and '{P.PlungeTimeColumn}'");
        double m = t.GetPositive(P.CentralMassColumn, 1e6);
        double mu = t.GetPositive(P.CompactMassColumn, 10);
        if (!(mu < m)) throw t.Invalid(P.CompactMassColumn, $"must be smaller than {P.CentralMassColumn} ({m}), got {mu}");
        double chi = t.GetInRange(P.CentralSpinColumn, 0, 0, 0.999);
        double e0 = t.GetInRange(P.EccentricityColumn, 0, 0, 0.9);
        double inclination = t.GetInRange(P.OrbitInclinationColumn, 0, 0, Math.PI);
        double beta = t.GetInRange(P.EclipticLatitudeColumn, 0, -Math.PI / 2, Math.PI / 2);
        double lambda = t.GetInRange(P.EclipticLongitudeColumn, 0, 0, 2 * Math.PI);
        double spinTheta = t.GetInRange(P.SpinThetaColumn, 0, 0, Math.PI);
        double spinPhi = t.GetInRange(P.SpinPhiColumn, 0, 0, 2 * Math.PI);
        double distance = t.GetPositive(P.DistanceColumn, 1000);
        double phi0 = t.GetInRange(P.Phi0Column, 0, 0, 2 * Math.PI);
        double gamma0 = t.GetInRange(P.Gamma0Column, 0, 0, 2 * Math.PI);
        double alpha0 = t.GetInRange(P.Alpha0Column, 0, 0, 2 * Math.PI);
        var equations = ExtremeMassRatioInspiralPopulation.Equations(m, mu, chi, inclination);
        double nu0;
        double? plunge = null;
        if (byFrequency)
        {
            nu0 = t.GetPositive(P.OrbitalFrequencyColumn, 1e-4);
            double limit = equations.PlungeFrequency(e0);
            if (!(nu0 < limit)) throw t.Invalid(P.OrbitalFrequencyColumn, $"must lie below the plunge frequency {limit} Hz of this source, got {nu0}");
        }
        else
        {
            // Up to 1e10 s (about 300 years): a later plunge starts below the band a mission of years can use, and its
            // trajectory would not fit the integrator's store.
            plunge = t.GetInRange(P.PlungeTimeColumn, 1e7, 1, 1e10);
            try
            {
                nu0 = new InspiralTrajectory().FrequencyForPlungeTime(equations, [0, 0, 0, e0, 0], plunge.Value);
            }
            catch (ArgumentOutOfRangeException error)
            {
                // A plunge so far off that no starting frequency of these masses reaches it (the search runs out of range).
                throw t.Invalid(P.PlungeTimeColumn, $"no orbit of these masses and eccentricity plunges after {plunge.Value} s ({error.Message})");
            }
        }
        t.RejectUnknownKeys(["id", .. P.ColumnNames, P.PlungeTimeColumn]);
        var parameters = new P(m, mu, chi, nu0, e0, inclination, beta, lambda, spinTheta, spinPhi, distance, phi0, gamma0, alpha0);
        try
        {
            parameters.Validate();
        }
        catch (ArgumentOutOfRangeException error)
        {
            throw t.Invalid(error.ParamName ?? P.CentralMassColumn, error.Message);
        }
        return new Listed(id, parameters, plunge);
    }

    private sealed class Injection(ExtremeMassRatioInspiralPopulationSettings? population, IReadOnlyList<Listed> listed) : ISourceInjection
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
                    central_mass_min_msun = {TomlText.Number(p.CentralMassMinMsun)}
                    central_mass_max_msun = {TomlText.Number(p.CentralMassMaxMsun)}
                    compact_mass_min_msun = {TomlText.Number(p.CompactMassMinMsun)}
                    compact_mass_max_msun = {TomlText.Number(p.CompactMassMaxMsun)}
                    spin_min = {TomlText.Number(p.SpinMin)}
                    spin_max = {TomlText.Number(p.SpinMax)}
                    eccentricity_min = {TomlText.Number(p.EccentricityMin)}
                    eccentricity_max = {TomlText.Number(p.EccentricityMax)}
                    plunge_time_min_s = {TomlText.Number(p.PlungeTimeMinS)}
                    plunge_time_max_s = {TomlText.Number(p.PlungeTimeMaxS)}
                    distance_min_mpc = {TomlText.Number(p.DistanceMinMpc)}
                    distance_max_mpc = {TomlText.Number(p.DistanceMaxMpc)}

                    """);
            }
            foreach (var (id, s, plunge) in listed)
            {
                text.Append(CultureInfo.InvariantCulture, $"[[{Id}.inspiral]]\nid = {TomlText.String(id)}\n");
                double[] row = ToRow(s);
                for (int c = 0; c < row.Length; c++)
                {
                    string column = P.ColumnNames[c];
                    // A source given by its plunge time keeps that form (ν0 follows from it).
                    if (column == P.OrbitalFrequencyColumn && plunge is { } tp)
                        text.Append(CultureInfo.InvariantCulture, $"{P.PlungeTimeColumn} = {TomlText.Number(tp)}\n");
                    else
                        text.Append(CultureInfo.InvariantCulture, $"{column} = {TomlText.Number(row[c])}\n");
                }
                text.Append('\n');
            }
            return text.ToString();
        }

        public TruthTable Inject(InjectionContext context, Complex[] a, Complex[] e, Complex[] t)
        {
            ArgumentNullException.ThrowIfNull(context);
            var sources = new List<(string Id, P Parameters)>(listed.Select(l => (l.Id, l.Parameters)));
            if (population is { } p)
            {
                var stream = RandomStream.ForPath(context.Seed, PopulationStream, 0);
                var drawn = ExtremeMassRatioInspiralPopulation.Draw(p, ref stream);
                for (int i = 0; i < drawn.Length; i++) sources.Add(($"emri-p{i + 1:D4}", drawn[i].Parameters));
            }
            var observation = context.Observation;
            var generator = new ExtremeMassRatioInspiralTemplateGenerator(
                observation.SampleCount * observation.CadenceS, observation.CadenceS, startSeconds: observation.StartS);
            var whole = new BinWindow(0, a.Length);
            string[] columns = [.. P.ColumnNames, "snr"];
            var values = new double[sources.Count * columns.Length];
            for (int i = 0; i < sources.Count; i++)
            {
                var s = sources[i].Parameters;
                // T stays untouched: the long-wavelength response has no T channel.
                generator.AddResponse(s, whole, a, e, Span<Complex>.Empty);
                double[] row = [.. ToRow(s), ExtremeMassRatioInspiralSnr.Optimal(generator, s, context.Noise)];
                row.CopyTo(values, i * columns.Length);
            }
            return new TruthTable(Id, columns, sources.Select(x => x.Id), values);
        }

        private static double[] ToRow(in P s) =>
        [
            s.CentralMassMsun, s.CompactMassMsun, s.CentralSpin, s.OrbitalFrequency0Hz, s.Eccentricity0, s.OrbitInclinationRad,
            s.EclipticLatitudeRad, s.EclipticLongitudeRad, s.SpinThetaRad, s.SpinPhiRad, s.DistanceMpc, s.Phi0Rad, s.Gamma0Rad, s.Alpha0Rad,
        ];
    }
}
