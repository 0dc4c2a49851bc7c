using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.GalacticBinaryBands;

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
        var band = new GalacticBinaryBand(residual.Bins, residual.DfHz, residual.A, residual.E, residual.InverseA, residual.InverseE,
            residual.T, residual.InverseT);
        var update = _worker.Update(band, steps);
        var template = new WindowSpectra(update.Template.Bins, update.Template.A, update.Template.E, update.Template.T);
        return new WorkerUpdate(template, ToBlock(update.Samples), ToStatistics(update.Statistics));
    }

    public WindowSpectra CurrentTemplate()
    {
        var template = _worker.CurrentTemplate();
        return new WindowSpectra(template.Bins, template.A, template.E, template.T);
    }

    public byte[] SaveState() => _worker.SaveState();

    public IReadOnlyList<Handover> TakeHandovers() =>
        [.. _worker.TakeDriftedSources().Select(d => new Handover(_workerIdOfWindow(d.TargetWindow),
            MessagePackSerializer.Serialize(new GalacticBinaryHandover(d.Chain, ToRow(d.Source)), MessagePackSerializerOptions.Standard)))];

    public void Accept(IReadOnlyList<Handover> handovers)
    {
        ArgumentNullException.ThrowIfNull(handovers);
        var drifted = handovers.Select(h =>
        {
            var payload = MessagePackSerializer.Deserialize<GalacticBinaryHandover>(h.Payload, MessagePackSerializerOptions.Standard);
            return new DriftedSource(payload.Chain, _worker.Window.Index, FromRow(payload.Parameters));
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
                ToRow(source).CopyTo(values, offset);
                offset += ParameterNames.Length;
            }
        }
        return new SampleBlock(Id, GalacticBinaryFitClass.Id, 0, ParameterNames, counts, values, logLikelihoods);
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
            proposed == 0 ? 0.0 : (double)accepted / proposed, statistics.WallTime);
    }

    internal static double[] ToRow(in GalacticBinaryParameters p) =>
        [p.FrequencyHz, p.FrequencyDerivativeHzS, p.Amplitude, p.EclipticLatitudeRad, p.EclipticLongitudeRad, p.InclinationRad, p.PolarisationRad, p.InitialPhaseRad];

    internal static GalacticBinaryParameters FromRow(ReadOnlySpan<double> row) =>
        new(row[0], row[1], row[2], row[3], row[4], row[5], row[6], row[7]);
}
