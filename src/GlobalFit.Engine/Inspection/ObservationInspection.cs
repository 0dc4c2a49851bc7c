using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Engine.Inspection;

/// <summary>Injected sources of one class: how many, and the spread of their optimal SNRs when recorded.</summary>
/// <param name="ClassId">Source class id (the truth table's name).</param>
/// <param name="Count">Number of injected sources.</param>
/// <param name="SnrMin">Smallest optimal SNR, or null when the table has no <c>snr</c> column.</param>
/// <param name="SnrMedian">Median optimal SNR, or null.</param>
/// <param name="SnrMax">Largest optimal SNR, or null.</param>
public sealed record InjectedClassSummary(string ClassId, int Count, double? SnrMin, double? SnrMedian, double? SnrMax);

/// <summary>Everything <c>globalfit inspect</c> reports about an observation file.</summary>
/// <param name="Path">The file.</param>
/// <param name="Observation">The loaded observation.</param>
/// <param name="ModelDescription">Where the noise model came from (the file's scenario or the defaults).</param>
/// <param name="Model">The noise model compared against.</param>
/// <param name="Welch">Welch estimates of A, E, T in that order.</param>
/// <param name="Channels">Per-channel comparison with the model.</param>
/// <param name="CrossChannels">A-E, A-T, E-T coherences.</param>
/// <param name="Injected">Injected sources per class.</param>
public sealed record ObservationInspection(
    string Path, Observation Observation, string ModelDescription, AetNoiseModel Model,
    IReadOnlyList<WelchSpectrum> Welch, IReadOnlyList<ChannelNoiseCheck> Channels,
    IReadOnlyList<CrossChannelCheck> CrossChannels, IReadOnlyList<InjectedClassSummary> Injected)
{
    /// <summary>Reads and analyses the file at <paramref name="path"/>.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">The file cannot be read or is invalid.</exception>
    public static ObservationInspection Run(string path)
    {
        var observation = ObservationFile.Read(path);
        var (model, description) = ModelFor(observation, path);
        var data = observation.Data;
        int segment = NoiseConsistency.SegmentLength(data.Count);
        var channels = new[] { ("A", data.A, AetChannel.A), ("E", data.E, AetChannel.E), ("T", data.T, AetChannel.T) };
        var welch = channels.Select(c => WelchEstimator.Psd(c.Item2.Samples, data.DtSeconds, segment)).ToArray();
        var checks = channels.Select((c, i) => NoiseConsistency.Check(c.Item1, c.Item2.Samples, welch[i], f => model.Psd(c.Item3, f), data.DtSeconds)).ToArray();
        var cross = new[] { (0, 1), (0, 2), (1, 2) }.Select(p =>
            NoiseConsistency.Coherence($"{channels[p.Item1].Item1}-{channels[p.Item2].Item1}",
                WelchEstimator.Csd(channels[p.Item1].Item2.Samples, channels[p.Item2].Item2.Samples, data.DtSeconds, segment),
                welch[p.Item1], welch[p.Item2], data.DtSeconds)).ToArray();
        var injected = observation.Truth.Select(Summarise).ToArray();
        return new ObservationInspection(path, observation, description, model, welch, checks, cross, injected);
    }

    // A simulated file carries its resolved scenario, so its own noise model is the right reference;
    // otherwise compare with the default instrument noise.
    private static (AetNoiseModel Model, string Description) ModelFor(Observation observation, string path)
    {
        if (observation.Provenance.Entries.TryGetValue(ObservationSimulator.ScenarioProvenanceKey, out var toml))
        {
            var scenario = SourceClassRegistry.Default.ReadScenario(ConfigDocument.Parse(toml, $"{path} (provenance {ObservationSimulator.ScenarioProvenanceKey})"));
            string foreground = scenario.Noise.Foreground is { } f
                ? string.Create(System.Globalization.CultureInfo.InvariantCulture, $"foreground of the {f.ObservationYears}-year fit, amplitude {f.AmplitudeScale}; a fit of this file uses this foreground fit unless its [noise.foreground] sets fit_years")
                : "no foreground";
            return (scenario.Noise.Model(), $"noise model of the file's scenario \"{scenario.Name}\" ({foreground})");
        }
        var nearest = SourceClasses.Noise.NoiseFitSettings.NearestFitYears(observation.Data.Count * observation.Data.DtSeconds);
        return (new AetNoiseModel(InstrumentNoiseSettings.Default), string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"default instrument noise (the file records no scenario; a fit of it takes the {nearest}-year foreground fit, the one nearest its length, unless its [noise.foreground] sets fit_years)"));
    }

    private static InjectedClassSummary Summarise(TruthTable table)
    {
        if (!table.Columns.Contains("snr") || table.RowCount == 0)
            return new InjectedClassSummary(table.ClassId, table.RowCount, null, null, null);
        var snr = Enumerable.Range(0, table.RowCount).Select(r => table[r, "snr"]).Order().ToArray();
        double median = snr.Length % 2 == 1 ? snr[snr.Length / 2] : 0.5 * (snr[snr.Length / 2 - 1] + snr[snr.Length / 2]);
        return new InjectedClassSummary(table.ClassId, table.RowCount, snr[0], median, snr[^1]);
    }
}
