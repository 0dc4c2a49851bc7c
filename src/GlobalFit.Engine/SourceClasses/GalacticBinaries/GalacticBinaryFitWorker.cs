using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A <see cref="GalacticBinaryBandWorker"/> behind the engine's worker contract: converts residuals, samples
/// and handovers between the engine's class-neutral shapes and the band worker's own.</summary>
internal sealed class GalacticBinaryFitWorker : IFitWorker
{
    private static readonly string[] ParameterNames = [.. GalacticBinaryParameters.ColumnNames];
    private readonly GalacticBinaryBandWorker _worker;
    private readonly Func<int, string> _workerIdOfWindow;

    public GalacticBinaryFitWorker(string id, GalacticBinaryBandWorker worker, Func<int, string> workerIdOfWindow)
    {
        Id = id;
        _worker = worker;
        _workerIdOfWindow = workerIdOfWindow;
    }

    public string Id { get; }

    public BinWindow Bins => _worker.Window.Padded;

    public bool IncludesT => _worker.IncludesT;

    public WorkerUpdate Update(WorkerResidual residual, int steps)
    {
        ArgumentNullException.ThrowIfNull(residual);
        var spectra = residual.Spectra;
        var band = new GalacticBinaryBand(spectra.Bins, residual.DfHz, spectra.A, spectra.E, residual.InverseA, residual.InverseE,
            spectra.T, residual.InverseT);
        var update = _worker.Update(band, steps);
        return new WorkerUpdate(update.Template, ToBlock(update.Samples), ToStatistics(update.Statistics));
    }

    public WindowSpectra? CurrentTemplate() => _worker.CurrentTemplate();

    public byte[] SaveState() => _worker.SaveState();

    public IReadOnlyList<Handover> TakeHandovers() =>
        [.. _worker.TakeDriftedSources().Select(d => new Handover(_workerIdOfWindow(d.TargetWindow),
            MessagePackSerializer.Serialize(new GalacticBinaryHandover(d.Chain, d.Source.ToRow()), MessagePackSerializerOptions.Standard)))];

    public void Accept(IReadOnlyList<Handover> handovers)
    {
        ArgumentNullException.ThrowIfNull(handovers);
        var drifted = handovers.Select(h =>
        {
            var payload = MessagePackSerializer.Deserialize<GalacticBinaryHandover>(h.Payload, MessagePackSerializerOptions.Standard);
            return new DriftedSource(payload.Chain, _worker.Window.Index, GalacticBinaryParameters.FromRow(payload.Parameters));
        });
        _worker.Adopt(drifted.ToList());
    }

    private SampleBlock ToBlock(ImmutableArray<GalacticBinarySample> samples)
    {
        int total = samples.Sum(s => s.Sources.Length);
        var values = new double[total * ParameterNames.Length];
        var counts = new int[samples.Length];
        var logLikelihoods = new double[samples.Length];
        int offset = 0;
        for (int i = 0; i < samples.Length; i++)
        {
            counts[i] = samples[i].Sources.Length;
            logLikelihoods[i] = samples[i].LogLikelihood;
            foreach (var source in samples[i].Sources)
            {
                source.ToRow().CopyTo(values, offset);
                offset += ParameterNames.Length;
            }
        }
        return new SampleBlock(Id, GalacticBinaryClass.Id, 0, ParameterNames, counts, values, logLikelihoods);
    }

    private static WorkerStatistics ToStatistics(GalacticBinaryBandStatistics statistics)
    {
        long proposed = 0, accepted = 0;
        foreach (var p in statistics.Sampler.Proposals)
        {
            if (p.TemperatureIndex != 0) continue;
            proposed += p.Proposed;
            accepted += p.Accepted;
        }
        return new WorkerStatistics(statistics.StepsThisUpdate, statistics.TotalSteps, statistics.SourceCount, statistics.LogLikelihood,
            proposed == 0 ? 0.0 : (double)accepted / proposed, statistics.WallTime) { Phases = statistics.Phases };
    }
}
