using System.Globalization;
using System.Numerics;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Simulation;

/// <summary>Turns a <see cref="SimulationScenario"/> into an <see cref="Observation"/>: coloured Gaussian noise in
/// A, E and T from the scenario's noise model, each channel from its own seeded stream.</summary>
/// <remarks>The same scenario gives bit-identical data on any machine: every draw comes from a
/// <see cref="RandomStream"/> derived from (seed, <see cref="SimulationStreams.Noise"/>, channel).</remarks>
public static class ObservationSimulator
{
    /// <summary>Provenance key holding the resolved scenario as TOML.</summary>
    public const string ScenarioProvenanceKey = "scenario_toml";

    /// <summary>Simulates the scenario.</summary>
    /// <param name="scenario">What to simulate.</param>
    /// <param name="generator">Name and version of the program, recorded in the file.</param>
    /// <param name="notes">Extra provenance notes (e.g. the command line).</param>
    /// <param name="progress">Receives the completed fraction; may be null.</param>
    public static Observation Simulate(SimulationScenario scenario, string generator, IReadOnlyDictionary<string, string> notes, IProgress<double>? progress)
    {
        var noise = scenario.Noise.Model();
        int n = scenario.Observation.SampleCount;
        double dt = scenario.Observation.CadenceS;
        int normalCount = NoiseSynthesis.RequiredNormalCount(n);
        var normals = new double[3][];
        for (int channel = 0; channel < 3; channel++)
        {
            var stream = RandomStream.ForPath(scenario.Seed, SimulationStreams.Noise, (ulong)channel);
            var draws = new double[normalCount];
            for (int i = 0; i < draws.Length; i++) draws[i] = stream.NextGaussian();
            normals[channel] = draws;
            progress?.Report(0.2 * (channel + 1));
        }
        AetTimeSeries data = NoiseSynthesis.SynthesiseAet(noise, n, dt, scenario.Observation.StartS, normals[0], normals[1], normals[2]);
        progress?.Report(0.7);
        var truth = InjectSources(scenario, noise, data);
        progress?.Report(0.9);

        var allNotes = new Dictionary<string, string>(notes)
        {
            ["scenario_name"] = scenario.Name,
            ["seed"] = scenario.Seed.ToString(CultureInfo.InvariantCulture),
            [ScenarioProvenanceKey] = scenario.ToToml(),
        };
        var provenance = new ObservationProvenance(generator, DateTimeOffset.UtcNow, allNotes);
        var observation = new Observation(data, GapList.None, truth, provenance);
        progress?.Report(1.0);
        return observation;
    }

    // Sources are summed in the frequency domain (continuous convention) and added to the noise after one inverse
    // transform per channel, so the cost is one FFT per channel whatever the number of sources.
    private static List<TruthTable> InjectSources(SimulationScenario scenario, AetNoiseModel noise, AetTimeSeries data)
    {
        var truth = new List<TruthTable>();
        if (scenario.Sources.Count == 0) return truth;
        int bins = FourierTransform.OneSidedLength(data.Count);
        var spectra = new[] { new Complex[bins], new Complex[bins], new Complex[bins] };
        var context = new InjectionContext(scenario.Observation, noise, scenario.Seed);
        foreach (var injection in scenario.Sources)
            truth.Add(injection.Inject(context, spectra[0], spectra[1], spectra[2]));
        var signal = new double[data.Count];
        var channels = data.Channels;
        for (int c = 0; c < 3; c++)
        {
            FourierTransform.Inverse(spectra[c], data.DtSeconds, signal);
            var samples = channels[c].Samples;
            for (int i = 0; i < samples.Length; i++) samples[i] += signal[i];
        }
        return truth;
    }
}
