namespace GlobalFit.Engine.Telemetry;

/// <summary>One part of the worker updates' time, summed over the updates that measured it.</summary>
/// <param name="Name">The part, as named in <c>globalfit.worker.phase.NAME_ms</c>.</param>
/// <param name="Milliseconds">Total time in it.</param>
/// <param name="Count">Total runs of it.</param>
public sealed record WorkerPhaseTotal(string Name, double Milliseconds, long Count);

/// <summary>Where the compute of the worker updates that measure their parts went, and the kernel's share of it.</summary>
/// <param name="Updates">Worker updates that carried a breakdown.</param>
/// <param name="ComputeMs">Their compute time (<c>globalfit.worker.wall_ms</c>), state serialisation included.</param>
/// <param name="KernelMs">Their time in the template + log-likelihood kernel (<c>globalfit.worker.kernel_ms</c>).</param>
/// <param name="StateMs">Their time serialising state (<c>globalfit.worker.state_ms</c>).</param>
/// <param name="Phases">Each part summed over them, in the order first seen.</param>
public sealed record WorkerTimeBreakdown(int Updates, double ComputeMs, double KernelMs, double StateMs, IReadOnlyList<WorkerPhaseTotal> Phases)
{
    /// <summary>Kernel time over compute time, in [0, 1]: (template + likelihood evaluations × their mean kernel time) over
    /// the workers' compute time; null without compute.</summary>
    public double? Efficiency => ComputeMs > 0 ? KernelMs / ComputeMs : null;

    /// <summary>Sums breakdowns.</summary>
    /// <param name="parts">Breakdowns (nulls skipped).</param>
    /// <returns>The sum, or null if every part is null.</returns>
    public static WorkerTimeBreakdown? Sum(IEnumerable<WorkerTimeBreakdown?> parts)
    {
        ArgumentNullException.ThrowIfNull(parts);
        WorkerTimeBreakdown? total = null;
        foreach (var part in parts)
        {
            if (part is null) continue;
            if (total is null)
            {
                total = part;
                continue;
            }
            var phases = total.Phases.ToList();
            foreach (var p in part.Phases)
            {
                int at = phases.FindIndex(q => q.Name == p.Name);
                if (at < 0) phases.Add(p);
                else phases[at] = phases[at] with { Milliseconds = phases[at].Milliseconds + p.Milliseconds, Count = phases[at].Count + p.Count };
            }
            total = new WorkerTimeBreakdown(total.Updates + part.Updates, total.ComputeMs + part.ComputeMs, total.KernelMs + part.KernelMs,
                total.StateMs + part.StateMs, phases);
        }
        return total;
    }
}
