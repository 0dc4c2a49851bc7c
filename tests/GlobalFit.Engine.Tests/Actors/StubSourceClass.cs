using System.Collections.Concurrent;
using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Actors;

/// <summary>A stand-in source class for engine tests: each worker's template is the constant (iteration + index/10) over
/// its window, and every update is logged with the residual it saw, so the schedule and the residual arithmetic can be
/// checked exactly.</summary>
internal sealed class StubSourceClass : IFitSourceClassPlan
{
    public const string Id = "stub";
    private readonly Dictionary<string, (int Index, BinWindow Bins)> _workers = [];

    public StubSourceClass(params (string Group, int Index, BinWindow Bins)[] workers)
    {
        foreach (var (_, index, bins) in workers) _workers[WorkerId(index)] = (index, bins);
        Groups = [.. workers.GroupBy(w => w.Group).Select(g => new WorkerGroup($"{Id}.{g.Key}",
            [.. g.Select(w => new WorkerDescriptor(WorkerId(w.Index), w.Bins, $"stub {w.Index}", false))]))];
    }

    public ConcurrentQueue<UpdateRecord> Log { get; } = new();

    /// <summary>Failures still to throw, per worker id: each update of that worker throws while its count is positive.</summary>
    public ConcurrentDictionary<string, int> FailuresToThrow { get; } = new();

    /// <summary>Iteration at which the failures start.</summary>
    public long FailFromIteration { get; set; } = long.MaxValue;

    public string ClassId => Id;

    public IReadOnlyList<WorkerGroup> Groups { get; }

    public int StepsPerUpdate => 3;

    public static string WorkerId(int index) => $"{Id}/{index}";

    public IFitWorker CreateWorker(string workerId, ulong runSeed) => new StubWorker(this, workerId, _workers[workerId].Index, _workers[workerId].Bins, 0);

    public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state) =>
        new StubWorker(this, workerId, _workers[workerId].Index, _workers[workerId].Bins, BitConverter.ToInt64(state.Span));

    public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) => throw new NotSupportedException();

    public void WriteResolved(ResolvedConfigWriter writer) { }

    public sealed record UpdateRecord(string WorkerId, long UpdateNumber, Complex FirstResidualBin);

    private sealed class StubWorker(StubSourceClass owner, string id, int index, BinWindow bins, long updates) : IFitWorker
    {
        private long _updates = updates;

        public string Id => id;

        public BinWindow Bins => bins;

        public bool IncludesT => false;

        public WorkerUpdate Update(WorkerResidual residual, int steps)
        {
            long next = _updates + 1;
            if (next >= owner.FailFromIteration && owner.FailuresToThrow.TryGetValue(id, out int left) && left > 0)
            {
                owner.FailuresToThrow[id] = left - 1;
                _updates = -1000; // a half-changed state the restart must discard
                throw new InvalidOperationException($"stub failure of {id}");
            }
            _updates = next;
            owner.Log.Enqueue(new UpdateRecord(id, _updates, residual.Spectra.A[0]));
            var block = new SampleBlock(id, Id, 0, ["x"], [1], [_updates + index / 10.0], [0.0]);
            return new WorkerUpdate(CurrentTemplate(), block, new WorkerStatistics(steps, _updates * steps, 1, -1.0, 0.5, TimeSpan.FromMilliseconds(1)));
        }

        public WindowSpectra CurrentTemplate()
        {
            var value = new Complex(_updates + index / 10.0, 0);
            return new WindowSpectra(bins, Enumerable.Repeat(value, bins.Count).ToArray(), Enumerable.Repeat(value, bins.Count).ToArray(), null);
        }

        public byte[] SaveState() => BitConverter.GetBytes(_updates);

        public IReadOnlyList<Handover> TakeHandovers() => [];

        public void Accept(IReadOnlyList<Handover> handovers) { }
    }
}
