using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Orchestration;

/// <summary>The blocked-Gibbs walk without actors: every request is answered by hand, in the order each test chooses.</summary>
public sealed class StageMachineTests
{
    // Stage 0: two source workers that share no bin; stage 1: one source worker; stage 2: the noise worker.
    private static readonly WorkerDescriptor[] Workers =
    [
        new("s/0", new BinWindow(0, 10), "s0", false),
        new("s/2", new BinWindow(20, 10), "s2", false),
        new("s/1", new BinWindow(8, 14), "s1", false),
        new("noise", new BinWindow(0, 40), "noise", false, WorkerRole.Noise),
    ];

    private readonly RecordingStageHost _host = new();
    private readonly ManualTimeProvider _time = new();

    [Fact]
    public void A_stage_commits_only_when_all_its_workers_answered_whatever_their_order()
    {
        var machine = Machine(iterations: 1);
        machine.Start();
        Assert.Equal(["iteration 1", "stage 1.0", "update s/0", "update s/2"], _host.Calls);
        machine.OnUpdated("s/2", Result("s/2", 1));
        Assert.Empty(_host.Commits);
        machine.OnUpdated("s/0", Result("s/0", 1));
        Assert.Single(_host.Commits);
        Assert.Equal(["s/0", "s/2"], _host.Commits[0].Templates.Select(t => t.Key)); // ordinal, not arrival order
        machine.OnCommitted();
        Assert.Equal("update s/1", _host.Calls[^1]);
    }

    [Fact]
    public void An_iteration_appends_every_block_in_worker_order_and_refits_the_noise_last()
    {
        var machine = Machine(iterations: 1);
        machine.Start();
        RunIteration(machine, 1);
        var append = Assert.Single(_host.Appends);
        Assert.Equal(["noise", "s/0", "s/1", "s/2"], append.Blocks.Select(b => b.WorkerId));
        Assert.NotNull(_host.Commits[^1].Psd);          // the noise stage carries the PSD …
        Assert.Empty(_host.Commits[^1].Templates);       // … and no template
        Assert.All(_host.Commits.Take(2), c => Assert.Null(c.Psd));
        machine.OnAppended(1);
        Assert.Equal("checkpoint 1", _host.Calls[^1]);   // the last iteration is always checkpointed
        machine.OnCheckpointWritten(1, null);
        Assert.Equal(FitOutcomeKind.Completed, _host.Outcome!.Kind);
        Assert.Equal(1, _host.Outcome.CheckpointIteration);
        var report = Assert.Single(_host.Reports);
        Assert.Equal(["s"], report.SourcesPerClass.Keys); // the noise worker holds no sources
        Assert.Equal(3, report.SourcesPerClass["s"]);
    }

    [Fact]
    public void Handovers_are_delivered_before_the_commit_and_the_adopted_template_is_committed()
    {
        var machine = Machine(iterations: 1);
        machine.Start();
        var handover = new Handover("s/2", [1, 2, 3]);
        machine.OnUpdated("s/0", Result("s/0", 1) with { Handovers = [handover] });
        machine.OnUpdated("s/2", Result("s/2", 1));
        Assert.Empty(_host.Commits);
        var delivery = Assert.Single(_host.Deliveries);
        Assert.Equal("s/2", delivery.WorkerId);
        Assert.Equal([handover], delivery.Handovers);
        var adopted = Template("s/2", 7);
        machine.OnAdopted("s/2", new AdoptionResult(adopted, [9]));
        var commit = Assert.Single(_host.Commits);
        Assert.Same(adopted, commit.Templates.Single(t => t.Key == "s/2").Value);
    }

    [Fact]
    public void A_failed_worker_is_reloaded_from_its_committed_state_and_asked_again()
    {
        var machine = Machine(iterations: 2, maxFailures: 1);
        machine.Start();
        RunIteration(machine, 1);
        machine.OnAppended(1);
        _host.Loads.Clear();
        machine.OnUpdated("s/0", Result("s/0", 2));
        machine.OnWorkerFailed("s/2", new InvalidOperationException("boom"));
        var load = Assert.Single(_host.Loads);
        Assert.Equal("s/2", load.WorkerId);
        Assert.Equal(State("s/2", 1), load.State);
        Assert.Equal(("s/2", 2L, 0), _host.Updates[^1]);
        Assert.Contains("boom", Assert.Single(_host.Warnings), StringComparison.Ordinal);
        machine.OnUpdated("s/2", Result("s/2", 2));
        Assert.Equal(4, _host.Commits.Count); // the stage went on
    }

    [Fact]
    public void Repeated_failures_stop_the_run_after_checkpointing_the_last_complete_iteration()
    {
        var machine = Machine(iterations: 3, maxFailures: 1);
        machine.Start();
        RunIteration(machine, 1);
        machine.OnAppended(1);
        machine.OnWorkerFailed("s/0", new InvalidOperationException("first"));
        machine.OnWorkerFailed("s/0", new InvalidOperationException("second"));
        Assert.Equal(1, _host.Checkpoints[^1].Iteration);
        machine.OnUpdated("s/2", Result("s/2", 2)); // a late answer after the decision is ignored
        machine.OnCheckpointWritten(1, null);
        Assert.Equal(FitOutcomeKind.Failed, _host.Outcome!.Kind);
        Assert.Contains("s/0", _host.Outcome.Message, StringComparison.Ordinal);
        Assert.Contains("second", _host.Outcome.Message, StringComparison.Ordinal);
        Assert.Single(_host.Appends);
    }

    [Fact]
    public void A_stop_mid_stage_abandons_the_stage_and_keeps_the_last_complete_iteration()
    {
        var machine = Machine(iterations: 5);
        machine.Start();
        RunIteration(machine, 1);
        machine.OnAppended(1);
        machine.OnUpdated("s/0", Result("s/0", 2));
        machine.OnStopRequested();
        var checkpoint = _host.Checkpoints[^1];
        Assert.Equal(1, checkpoint.Iteration);
        Assert.Equal(State("s/0", 1), checkpoint.Workers.Single(w => w.WorkerId == "s/0").State); // not the abandoned update
        machine.OnCheckpointWritten(1, null);
        Assert.Equal(FitOutcomeKind.Interrupted, _host.Outcome!.Kind);
        Assert.Equal(1, _host.Outcome.IterationsCompleted);
    }

    [Fact]
    public void A_stop_before_the_start_finishes_at_the_start_without_running_anything()
    {
        var machine = Machine(iterations: 5);
        machine.OnStopRequested();
        Assert.Null(_host.Outcome);
        machine.Start();
        Assert.Equal(FitOutcomeKind.Interrupted, _host.Outcome!.Kind);
        Assert.Empty(_host.Updates);
    }

    [Fact]
    public void Checkpoints_follow_the_iteration_cadence_and_the_time_limit()
    {
        var machine = Machine(iterations: 10, checkpointEvery: 4, checkpointMinutes: 30);
        machine.Start();
        for (long i = 1; i <= 5; i++)
        {
            RunIteration(machine, i);
            if (i == 5) _time.Advance(TimeSpan.FromMinutes(31)); // since the checkpoint of iteration 4
            machine.OnAppended(i);
            if (_host.Calls[^1].StartsWith("checkpoint", StringComparison.Ordinal)) machine.OnCheckpointWritten(i, null);
        }
        Assert.Equal([4L, 5], _host.Checkpoints.Select(c => c.Iteration));
    }

    [Fact]
    public void A_failed_checkpoint_stops_the_run_naming_the_cause_and_keeping_the_previous_one()
    {
        var machine = Machine(iterations: 3, checkpointEvery: 1);
        machine.Start();
        RunIteration(machine, 1);
        machine.OnAppended(1);
        machine.OnCheckpointWritten(1, null);
        RunIteration(machine, 2);
        machine.OnAppended(2);
        machine.OnCheckpointWritten(2, "/run/checkpoints/latest.tmp: No space left on device");
        Assert.Equal(FitOutcomeKind.WriteFailed, _host.Outcome!.Kind);
        Assert.Equal(1, _host.Outcome.CheckpointIteration);
        Assert.Contains("No space left", _host.Outcome.Message, StringComparison.Ordinal);
        Assert.Equal("finished WriteFailed", _host.Calls[^1]); // no third iteration
    }

    [Fact]
    public void A_failed_sample_append_stops_the_run_at_once()
    {
        var machine = Machine(iterations: 3, checkpointEvery: 1);
        machine.Start();
        RunIteration(machine, 1);
        machine.OnAppendFailed(1, "/run/samples/s.0.samples: cannot be appended to: disk full");
        Assert.Equal(FitOutcomeKind.WriteFailed, _host.Outcome!.Kind);
        Assert.Equal(0, _host.Outcome.IterationsCompleted);
        Assert.Empty(_host.Checkpoints); // nothing is written after a failed write
        Assert.Contains("s.0.samples", _host.Outcome.Message, StringComparison.Ordinal);
        machine.OnStopRequested(); // a stop after the end is ignored
        Assert.Equal("finished WriteFailed", _host.Calls[^1]);
    }

    [Fact]
    public void A_stage_with_no_workers_is_passed_through_instead_of_waiting_forever()
    {
        var stages = ImmutableArray.Create(
            new Stage(["s.empty"], []),
            new Stage(["noise"], [new StageMember("noise", "noise", 1, WorkerRole.Noise)]));
        var machine = new StageMachine(new StagePlan(stages, 1, 1, 60, 1, "digest"), FitPosition.Fresh([Workers[3]]), _host, _time);
        machine.Start();
        Assert.Equal("commit", _host.Calls[^1]); // the empty stage commits nothing at once
        machine.OnCommitted();
        Assert.Equal("update noise", _host.Calls[^1]);
    }

    [Fact]
    public void A_resumed_machine_starts_at_the_next_iteration_from_the_given_states()
    {
        var fresh = FitPosition.Fresh(Workers);
        var start = fresh with { Iteration = 3, CheckpointIteration = 3, WorkerStates = fresh.WorkerStates.SetItem("s/0", [42]) };
        var machine = new StageMachine(Plan(5, 1, 10, 60), start, _host, _time);
        machine.Start();
        Assert.Equal([42], _host.Loads.Single(l => l.WorkerId == "s/0").State);
        Assert.Equal(("s/0", 4L, 0), _host.Updates[0]);
    }

    [Fact]
    public void A_plan_that_lists_a_worker_twice_is_refused()
    {
        var member = new StageMember("s/0", "s", 1, WorkerRole.Sources);
        var plan = new StagePlan([new Stage(["a"], [member]), new Stage(["b"], [member])], 1, 1, 60, 1, "digest");
        Assert.Throws<ArgumentException>(() => new StageMachine(plan, FitPosition.Fresh(Workers), _host, _time));
    }

    private StageMachine Machine(long iterations, int maxFailures = 3, long checkpointEvery = 100, double checkpointMinutes = 600) =>
        new(Plan(iterations, maxFailures, checkpointEvery, checkpointMinutes), FitPosition.Fresh(Workers), _host, _time);

    private static StagePlan Plan(long iterations, int maxFailures, long checkpointEvery, double checkpointMinutes)
    {
        StageMember Member(string id) => new(id, id == "noise" ? "noise" : "s", 1, id == "noise" ? WorkerRole.Noise : WorkerRole.Sources);
        var stages = ImmutableArray.Create(
            new Stage(["s.even"], [Member("s/0"), Member("s/2")]),
            new Stage(["s.odd"], [Member("s/1")]),
            new Stage(["noise"], [Member("noise")]));
        return new StagePlan(stages, iterations, checkpointEvery, checkpointMinutes, maxFailures, "digest");
    }

    // Answers every request of one iteration in stage order, up to (not including) the append acknowledgement.
    private void RunIteration(StageMachine machine, long iteration)
    {
        foreach (string[] stage in new[] { new[] { "s/0", "s/2" }, ["s/1"], ["noise"] })
        {
            foreach (string id in stage) machine.OnUpdated(id, Result(id, iteration));
            machine.OnCommitted();
        }
    }

    private static UpdateResult Result(string id, long iteration)
    {
        bool noise = id == "noise";
        var ones = Enumerable.Repeat(1.0, 40).ToArray();
        var block = new SampleBlock(id, noise ? "noise" : "s", iteration, ["x"], [1], [iteration], [0.0]);
        var update = new WorkerUpdate(noise ? null : Template(id, iteration), block,
            new WorkerStatistics(1, iteration, noise ? 0 : 1, -1, 0.5, TimeSpan.FromMilliseconds(iteration)), noise ? new InversePsd(ones, ones, ones) : null);
        return new UpdateResult(update, [], State(id, iteration));
    }

    private static byte[] State(string id, long iteration) => [.. System.Text.Encoding.ASCII.GetBytes(id), (byte)iteration];

    private static WindowSpectra Template(string id, long value)
    {
        var bins = Workers.Single(w => w.Id == id).Bins;
        var values = Enumerable.Repeat(new Complex(value, 0), bins.Count).ToArray();
        return new WindowSpectra(bins, values, values, null);
    }
}
