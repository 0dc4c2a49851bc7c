using System.Globalization;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The massive black-hole binary workers of one run: worker <c>massive_black_hole_binaries/NN</c> (NN = 01, 02, …)
/// for each binary, each in its own group <c>massive_black_hole_binaries.NN</c>, since every worker reads and writes the same
/// broadband window and no two may update in one stage.</summary>
internal sealed class MassiveBlackHoleBinaryFitPlan : IFitSourceClassPlan
{
    private const string Prefix = MassiveBlackHoleBinaryClass.Id + "/";
    private readonly FitDataShape _shape;
    private readonly IConstellationOrbits _orbits = new RigidOrbits();

    public MassiveBlackHoleBinaryFitPlan(MassiveBlackHoleBinaryFitSettings settings, FitDataShape shape)
    {
        Settings = settings;
        _shape = shape;
        var window = settings.Window(shape);
        string label = string.Create(CultureInfo.InvariantCulture, $"binary {{0}}, {settings.MinFrequencyHz * 1e3:G3}-{settings.MaxFrequencyHz * 1e3:G3} mHz");
        Groups =
        [
            .. Enumerable.Range(1, settings.Count).Select(i => new WorkerGroup(MassiveBlackHoleBinaryClass.Id + "." + Number(i),
                [new WorkerDescriptor(WorkerIdOf(i), window, string.Format(CultureInfo.InvariantCulture, label, i), settings.IncludeT)])),
        ];
    }

    /// <summary>The settings.</summary>
    public MassiveBlackHoleBinaryFitSettings Settings { get; }

    public string ClassId => MassiveBlackHoleBinaryClass.Id;

    public IReadOnlyList<WorkerGroup> Groups { get; }

    public int StepsPerUpdate => Settings.StepsPerUpdate;

    public IFitWorker CreateWorker(string workerId, ulong runSeed) =>
        new MassiveBlackHoleBinaryFitWorker(workerId, Index(workerId), Settings, _shape, _orbits,
            new MassiveBlackHoleBinaryWorkerState(runSeed, 0, null, double.NaN, 0, null));

    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state) =>
        MassiveBlackHoleBinaryFitWorker.Restore(workerId, Index(workerId), Settings, _shape, _orbits, state);

    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) =>
        new MassiveBlackHoleBinaryClassCatalogue(_orbits, _shape, Settings.Window(_shape), noise, burnInIterations);

    public ISourceMatcher CreateMatcher(IPsdSource noise) => new MassiveBlackHoleBinaryMatcher(_orbits, _shape, Settings, noise);

    public void WriteResolved(ResolvedConfigWriter writer) => Settings.WriteResolved(writer);

    internal static string WorkerIdOf(int number) => Prefix + Number(number);

    private static string Number(int number) => number.ToString("D2", CultureInfo.InvariantCulture);

    // Worker NN has index NN − 1 (its random stream).
    private int Index(string workerId)
    {
        if (workerId.StartsWith(Prefix, StringComparison.Ordinal)
            && int.TryParse(workerId.AsSpan(Prefix.Length), NumberStyles.None, CultureInfo.InvariantCulture, out int number)
            && number >= 1 && number <= Settings.Count && WorkerIdOf(number) == workerId)
            return number - 1;
        throw new ArgumentException($"no massive black-hole binary worker is called '{workerId}'", nameof(workerId));
    }
}
