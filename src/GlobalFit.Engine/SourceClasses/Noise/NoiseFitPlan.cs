using System.Collections.Immutable;
using System.Globalization;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise worker of one run: worker id and schedule group <c>noise</c>, over the bins of
/// [<c>f_min_hz</c>, <c>f_max_hz</c>].</summary>
internal sealed class NoiseFitPlan : IFitSourceClassPlan
{
    private readonly NoiseFitSettings _settings;
    private readonly FitDataShape _shape;

    public NoiseFitPlan(NoiseFitSettings settings, FitDataShape shape)
    {
        _settings = settings;
        _shape = shape;
        var worker = new WorkerDescriptor(NoiseClass.Id, settings.FittedBins(shape), "noise PSD", settings.IncludeT, WorkerRole.Noise);
        Groups = [new WorkerGroup(NoiseClass.Id, [worker])];
    }

    public string ClassId => NoiseClass.Id;

    public IReadOnlyList<WorkerGroup> Groups { get; }

    public int StepsPerUpdate => _settings.StepsPerUpdate;

    public IFitWorker CreateWorker(string workerId, ulong runSeed)
    {
        CheckId(workerId);
        return new NoiseWorker(_settings, _shape, runSeed);
    }

    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state)
    {
        CheckId(workerId);
        return NoiseWorker.Restore(_settings, _shape, state);
    }

    /// <summary>The noise posterior as one catalogue row, <c>noise</c>: medians, 90 % intervals and samples of the levels
    /// and the foreground amplitude (confidence 1, SNR NaN).</summary>
    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) => new NoiseCatalogue(burnInIterations);

    public void WriteResolved(ResolvedConfigWriter writer) => _settings.WriteResolved(writer);

    public IEnumerable<string> Describe() =>
    [
        _settings.Foreground
            ? string.Create(CultureInfo.InvariantCulture, $"noise model: confusion foreground of the {_settings.ForegroundFitYears}-year fit ({_settings.ForegroundFitYearsOrigin}), amplitude starting at {_settings.ForegroundAmplitude}")
            : "noise model: no confusion foreground ([noise.foreground] enabled = false)",
    ];

    private static void CheckId(string workerId)
    {
        if (workerId != NoiseClass.Id) throw new ArgumentException($"the noise module has one worker, '{NoiseClass.Id}', not '{workerId}'", nameof(workerId));
    }
}
