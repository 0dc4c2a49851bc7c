using BenchmarkDotNet.Attributes;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Benchmarks.Engine;

/// <summary>The residual-data actor's work per worker and per noise update, for a year-long fit of 1000 band windows
/// (<see cref="OrchestrationWorkload"/>): the orchestration cost the ≤ 2 %-of-compute target is about.</summary>
[MemoryDiagnoser]
public class ResidualBookBenchmarks
{
    private OrchestrationWorkload _workload = null!;
    private string _id = "";
    private WindowSpectra _template = null!;

    /// <summary>Builds the book (about 0.2 GB).</summary>
    [GlobalSetup]
    public void Setup()
    {
        _workload = new OrchestrationWorkload();
        _id = _workload.Windows[500].Id;
        _template = _workload.Book.Template(_id);
    }

    /// <summary>One band worker's residual with its inverse PSDs (fresh arrays the worker keeps).</summary>
    [Benchmark]
    public WorkerResidual CutResidual() => _workload.Book.ResidualFor(_id);

    /// <summary>One template swapped in at a stage commit.</summary>
    [Benchmark]
    public void CommitTemplate() => _workload.Book.Replace(_id, _template);

    /// <summary>The noise worker's input: data minus all 1000 templates over 0.1–30 mHz.</summary>
    [Benchmark]
    public WorkerResidual FullResidual() => _workload.Book.ResidualFor(OrchestrationWorkload.NoiseWorkerId);
}
