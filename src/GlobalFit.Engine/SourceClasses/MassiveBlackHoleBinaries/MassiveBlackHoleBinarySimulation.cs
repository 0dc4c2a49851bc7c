using System.Globalization;
using System.Numerics;
using System.Text;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Massive black-hole binaries in a scenario: an optional invented population
/// (<c>[massive_black_hole_binaries.population]</c>) and any number of listed binaries
/// (<c>[[massive_black_hole_binaries.binary]]</c>, keyed by the parameter column names and an <c>id</c>).</summary>
/// <remarks>Each binary is rendered with <see cref="MassiveBlackHoleBinaryTemplateGenerator"/> (rigid orbits, the
/// simulator's constellation) on the bins of <see cref="MassiveBlackHoleBinaryBand.InData"/>: what it emits while the
/// data are taken. Its optimal SNR is that of the injected spectra over A, E and T against the scenario's noise PSD.</remarks>
public sealed class MassiveBlackHoleBinarySimulation : ISimulatedSourceClass
{
    private const string Id = MassiveBlackHoleBinaryClass.Id;

    /// <summary>The first element of the population's random-stream path under the scenario seed (the second is 0).
    /// Changing it changes every simulated population, so it is never reused; the noise uses 1, galactic binaries 2.</summary>
    internal const ulong PopulationStream = 3;

    /// <summary>Columns of the truth table: the parameters, the derived total mass and redshift, and the SNR.</summary>
    public static IReadOnlyList<string> TruthColumns { get; } =
        [.. MassiveBlackHoleBinaryParameters.ColumnNames, MassiveBlackHoleBinaryParameters.TotalMassColumn, MassiveBlackHoleBinaryParameters.RedshiftColumn, "snr"];

    /// <inheritdoc/>
    public ISourceInjection ReadScenario(ConfigTable section, ObservationSettings observation)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(observation);
        var population = section.GetTable("population") is { } table ? MassiveBlackHoleBinaryPopulationSettings.FromConfig(table, observation) : null;
        var listed = new List<(string Id, MassiveBlackHoleBinaryParameters Parameters)>();
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (var entry in section.GetTableArray("binary"))
        {
            var (id, parameters) = ReadBinary(entry, listed.Count);
            if (!ids.Add(id)) throw entry.Invalid("id", $"id \"{id}\" is used twice");
            listed.Add((id, parameters));
        }
        section.RejectUnknownKeys(["population", "binary"]);
        return new Injection(population, listed);
    }

    private static (string, MassiveBlackHoleBinaryParameters) ReadBinary(ConfigTable t, int index)
    {
        string id = t.GetString("id", $"mbhb-e{index + 1:D4}");
        foreach (string required in (string[])[MassiveBlackHoleBinaryParameters.ChirpMassColumn, MassiveBlackHoleBinaryParameters.CoalescenceTimeColumn, MassiveBlackHoleBinaryParameters.DistanceColumn])
            if (!t.Has(required)) throw t.InvalidTable($"each binary needs '{required}'");
        var p = new MassiveBlackHoleBinaryParameters(
            t.GetPositive(MassiveBlackHoleBinaryParameters.ChirpMassColumn, 1),
            t.GetInRange(MassiveBlackHoleBinaryParameters.MassRatioColumn, 1, 1, MassiveBlackHoleBinaryPopulationSettings.MaximumMassRatio),
            t.GetInRange(MassiveBlackHoleBinaryParameters.Spin1Column, 0, -1, 1),
            t.GetInRange(MassiveBlackHoleBinaryParameters.Spin2Column, 0, -1, 1),
            Finite(t, MassiveBlackHoleBinaryParameters.CoalescenceTimeColumn),
            t.GetPositive(MassiveBlackHoleBinaryParameters.DistanceColumn, 1),
            t.GetInRange(MassiveBlackHoleBinaryParameters.EclipticLatitudeColumn, 0, -Math.PI / 2, Math.PI / 2),
            t.GetInRange(MassiveBlackHoleBinaryParameters.EclipticLongitudeColumn, 0, 0, 2 * Math.PI),
            t.GetInRange(MassiveBlackHoleBinaryParameters.InclinationColumn, 0, 0, Math.PI),
            t.GetInRange(MassiveBlackHoleBinaryParameters.PolarisationColumn, 0, 0, Math.PI),
            t.GetInRange(MassiveBlackHoleBinaryParameters.ReferencePhaseColumn, 0, 0, 2 * Math.PI));
        try
        {
            p.Validate();
            p.Redshift();
        }
        catch (ArgumentOutOfRangeException e)
        {
            throw t.Invalid(e.ParamName ?? MassiveBlackHoleBinaryParameters.DistanceColumn, e.Message);
        }
        t.RejectUnknownKeys(["id", .. MassiveBlackHoleBinaryParameters.ColumnNames]);
        return (id, p);
    }

    private static double Finite(ConfigTable t, string key)
    {
        double v = t.GetDouble(key, 0);
        return double.IsFinite(v) ? v : throw t.Invalid(key, $"must be finite, got {v}");
    }

    private sealed class Injection(MassiveBlackHoleBinaryPopulationSettings? population, IReadOnlyList<(string Id, MassiveBlackHoleBinaryParameters Parameters)> listed)
        : ISourceInjection
    {
        public string ClassId => Id;

        public string ToToml()
        {
            var text = new StringBuilder();
            if (population is { } p) text.Append(CultureInfo.InvariantCulture, $"[{Id}.population]\n{p.ToTomlBody()}");
            foreach (var (id, b) in listed)
            {
                text.Append(CultureInfo.InvariantCulture, $"[[{Id}.binary]]\nid = {TomlText.String(id)}\n");
                var values = b.ToArray();
                for (int i = 0; i < values.Length; i++)
                    text.Append(CultureInfo.InvariantCulture, $"{MassiveBlackHoleBinaryParameters.ColumnNames[i]} = {TomlText.Number(values[i])}\n");
                text.Append('\n');
            }
            return text.ToString();
        }

        public TruthTable Inject(InjectionContext context, Complex[] a, Complex[] e, Complex[] t)
        {
            var sources = new List<(string Id, MassiveBlackHoleBinaryParameters Parameters)>(listed);
            if (population is { } p)
            {
                var stream = RandomStream.ForPath(context.Seed, PopulationStream, 0);
                var drawn = MassiveBlackHolePopulation.Draw(p, ref stream);
                for (int i = 0; i < drawn.Length; i++) sources.Add(($"mbhb-p{i + 1:D4}", drawn[i]));
            }
            var observation = context.Observation;
            double startS = observation.StartS, endS = observation.StartS + observation.SampleCount * observation.CadenceS;
            double dfHz = 1.0 / (observation.SampleCount * observation.CadenceS);
            var orbits = new RigidOrbits();
            var values = new double[sources.Count * TruthColumns.Count];
            for (int i = 0; i < sources.Count; i++)
            {
                var s = sources[i].Parameters;
                var window = MassiveBlackHoleBinaryBand.InData(s, dfHz, a.Length, startS, endS);
                double snr = window.Count == 0 ? 0 : AddAndMeasure(s, window, dfHz, orbits, startS, context.Noise, a, e, t);
                double[] row = [.. s.ToArray(), s.TotalMassMsun, s.Redshift(), snr];
                row.CopyTo(values, i * TruthColumns.Count);
            }
            return new TruthTable(Id, [.. TruthColumns], sources.Select(x => x.Id), values);
        }

        // Renders once on the window, takes the optimal SNR of that rendering, and adds it to the record's spectra.
        private static double AddAndMeasure(in MassiveBlackHoleBinaryParameters s, BinWindow window, double dfHz, IConstellationOrbits orbits,
            double startS, AetNoiseModel noise, Complex[] a, Complex[] e, Complex[] t)
        {
            var generator = new MassiveBlackHoleBinaryTemplateGenerator(orbits, window.Count, startS);
            var inverse = new double[3][];
            var channels = new[] { AetChannel.A, AetChannel.E, AetChannel.T };
            for (int c = 0; c < 3; c++)
            {
                inverse[c] = new double[window.Count];
                for (int k = 0; k < window.Count; k++) inverse[c][k] = 1.0 / noise.Psd(channels[c], (window.First + k) * dfHz);
            }
            var data = new MassiveBlackHoleBinaryData(window, dfHz, [new Complex[window.Count], new Complex[window.Count], new Complex[window.Count]], inverse);
            var likelihood = new MassiveBlackHoleBinaryLikelihood(generator, data);
            double snr = likelihood.OptimalSnr(s);
            var outputs = new[] { a, e, t };
            for (int c = 0; c < 3; c++)
            {
                var template = likelihood.LastTemplate(c);
                var target = outputs[c].AsSpan(window.First, window.Count);
                for (int k = 0; k < template.Length; k++) target[k] += template[k];
            }
            return snr;
        }
    }
}
