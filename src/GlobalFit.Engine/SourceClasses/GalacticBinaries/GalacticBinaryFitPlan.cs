using System.Collections.Immutable;
using System.Globalization;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The galactic-binary windows of one run: worker ids <c>galactic_binaries/NNNN</c> by window index, groups
/// <c>galactic_binaries.even</c> and <c>galactic_binaries.odd</c>.</summary>
internal sealed class GalacticBinaryFitPlan : IFitSourceClassPlan
{
    private const string Prefix = GalacticBinaryClass.Id + "/";
    private readonly GalacticBinaryBandSettings _settings;
    private readonly GalacticBinaryBandPlan _plan;
    private readonly GalacticBinaryTemplateGenerator _prototype;
    private readonly GalacticBinaryToolPool _tools;

    // Workers borrow generators from one pool built on `prototype` (sharing its coarse geometry), so a fit of a thousand
    // windows holds as many generators as threads compute at once, not a thousand.
    public GalacticBinaryFitPlan(GalacticBinaryBandSettings settings, GalacticBinaryBandPlan plan, GalacticBinaryTemplateGenerator prototype)
    {
        _settings = settings;
        _plan = plan;
        _prototype = prototype;
        _tools = new GalacticBinaryToolPool(prototype);
        Groups =
        [
            new WorkerGroup(GalacticBinaryClass.Id + ".even", [.. plan.Stage(0).Select(w => Describe(w, settings.IncludeT))]),
            new WorkerGroup(GalacticBinaryClass.Id + ".odd", [.. plan.Stage(1).Select(w => Describe(w, settings.IncludeT))]),
        ];
    }

    public string ClassId => GalacticBinaryClass.Id;

    public IReadOnlyList<WorkerGroup> Groups { get; }

    public int StepsPerUpdate => _settings.StepsPerUpdate;

    public IFitWorker CreateWorker(string workerId, ulong runSeed)
    {
        var window = Window(workerId);
        return new GalacticBinaryFitWorker(workerId, new GalacticBinaryBandWorker(_settings, window, _tools, runSeed), WorkerIdOf);
    }

    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state)
    {
        var window = Window(workerId);
        return new GalacticBinaryFitWorker(workerId, GalacticBinaryBandWorker.Restore(_settings, window, _tools, state), WorkerIdOf);
    }

    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence)
    {
        var first = _plan.Windows[0].Padded;
        var last = _plan.Windows[^1].Padded;
        return new GalacticBinaryClassCatalogue(_prototype.WithOwnBuffers(), new BinWindow(first.First, last.End - first.First),
            noise, burnInIterations, minimumConfidence, minimumSnr: _settings.CatalogueMinSnr);
    }

    public ISourceMatcher CreateMatcher(IPsdSource noise)
    {
        var first = _plan.Windows[0];
        var last = _plan.Windows[^1];
        return new GalacticBinaryMatcher(_prototype.WithOwnBuffers(), new BinWindow(first.Padded.First, last.Padded.End - first.Padded.First),
            first.CoreStartHz, last.CoreEndHz, noise);
    }

    public void WriteResolved(ResolvedConfigWriter writer) => GalacticBinaryBandSettingsWriter.Write(_settings, writer);

    internal static string WorkerIdOf(int windowIndex) => Prefix + windowIndex.ToString("D4", CultureInfo.InvariantCulture);

    private static WorkerDescriptor Describe(GalacticBinaryBandWindow window, bool includeT) => new(
        WorkerIdOf(window.Index), window.Padded,
        string.Create(CultureInfo.InvariantCulture, $"{window.CoreStartHz * 1e3:F4}-{window.CoreEndHz * 1e3:F4} mHz"), includeT);

    private GalacticBinaryBandWindow Window(string workerId)
    {
        if (workerId.StartsWith(Prefix, StringComparison.Ordinal)
            && int.TryParse(workerId.AsSpan(Prefix.Length), NumberStyles.None, CultureInfo.InvariantCulture, out int index)
            && index < _plan.Windows.Length)
            return _plan.Windows[index];
        throw new ArgumentException($"no galactic-binary worker is called '{workerId}'", nameof(workerId));
    }
}
