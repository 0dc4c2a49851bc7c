using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>One worker's place in a stage.</summary>
/// <param name="WorkerId">The worker.</param>
/// <param name="ClassId">Its class (module id).</param>
/// <param name="Steps">Sampler steps per update.</param>
/// <param name="Role">Whether it holds sources or the noise model.</param>
public sealed record StageMember(string WorkerId, string ClassId, int Steps, WorkerRole Role);

/// <summary>Workers that update at the same time because their templates never share a bin.</summary>
/// <param name="Groups">The schedule groups the stage runs (for telemetry).</param>
/// <param name="Members">Its workers.</param>
public sealed record Stage(ImmutableArray<string> Groups, ImmutableArray<StageMember> Members);

/// <summary>Everything the stage machine needs to walk a run: the stages of one iteration and the run's limits.</summary>
/// <param name="Stages">The stages of every iteration, in order; every worker of the run appears in exactly one.</param>
/// <param name="Iterations">Iterations the run ends after.</param>
/// <param name="CheckpointEveryIterations">A checkpoint is written after every this many iterations …</param>
/// <param name="CheckpointMinutes">… or when this much time has passed since the last one, whichever comes first.</param>
/// <param name="MaxWorkerFailures">Failures of one worker within one iteration that are retried; one more stops the run.</param>
/// <param name="ConfigDigest">Digest of the resolved configuration, written into checkpoints.</param>
public sealed record StagePlan(ImmutableArray<Stage> Stages, long Iterations, long CheckpointEveryIterations, double CheckpointMinutes,
    int MaxWorkerFailures, string ConfigDigest)
{
    /// <summary>Every worker, by id.</summary>
    public IEnumerable<StageMember> Members => Stages.SelectMany(s => s.Members);
}
