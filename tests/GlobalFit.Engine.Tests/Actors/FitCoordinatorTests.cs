using Akka.Configuration;
using GlobalFit.Engine.Actors;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;

namespace GlobalFit.Engine.Tests.Actors;

public sealed class FitCoordinatorTests : Akka.TestKit.Xunit2.TestKit
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(30);

    public FitCoordinatorTests()
        : base(ConfigurationFactory.ParseString($$"""
            akka.loglevel = WARNING
            akka.stdout-loglevel = OFF
            {{FitActorSystem.ComputeDispatcher}} { type = ForkJoinDispatcher, throughput = 1, dedicated-thread-pool.thread-count = 2 }
            """), "coordinator-tests")
    {
    }

    [Fact]
    public void Stages_run_in_schedule_order_and_each_stage_sees_the_templates_the_previous_one_committed()
    {
        var harness = new CoordinatorHarness(Sys, iterations: 3);
        harness.Coordinator.Tell(new StartFit(), TestActor);
        var finished = ExpectMsg<FitFinished>(Patience);
        Assert.Equal(FitOutcomeKind.Completed, finished.Outcome.Kind);
        Assert.Equal(3, finished.Outcome.IterationsCompleted);

        var log = harness.Class.Log.ToList();
        Assert.Equal(12, log.Count); // 3 iterations × (2 even + 1 odd + noise)
        for (int iteration = 0; iteration < 3; iteration++)
        {
            var block = log.Skip(4 * iteration).Take(4).ToList();
            Assert.Equal(["stub/0", "stub/2"], block.Take(2).Select(r => r.WorkerId).Order(StringComparer.Ordinal));
            Assert.Equal("stub/1", block[2].WorkerId);
            Assert.Equal("noise", block[3].WorkerId);
        }
        // Residual values follow from data 10 and templates (update number + index/10), see StubSourceClass:
        // stub/1's first bin (25) lies under stub/0 only; stub/2's first bin (50) lies under stub/1 only.
        System.Numerics.Complex At(string id, long update) => log.Single(r => r.WorkerId == id && r.UpdateNumber == update).FirstResidualBin;
        Assert.Equal(new System.Numerics.Complex(9, 0), At("stub/1", 1));      // 10 − (1 + 0.0), stub/0 committed in stage 0
        Assert.Equal(new System.Numerics.Complex(10, 0), At("stub/2", 1));     // stub/1 still zero in iteration 1
        Assert.Equal(new System.Numerics.Complex(10 - 1.1, 0), At("stub/2", 2)); // stub/1's iteration-1 template (1 + 0.1)
        Assert.Equal(new System.Numerics.Complex(10, 0), At("noise", 1));     // bin 0 holds no template
    }

    [Fact]
    public void Samples_are_appended_once_per_iteration_in_worker_order_and_checkpoints_follow_the_cadence()
    {
        var harness = new CoordinatorHarness(Sys, iterations: 5);
        harness.Coordinator.Tell(new StartFit(), TestActor);
        ExpectMsg<FitFinished>(Patience);
        var appended = harness.Appended.ToList();
        Assert.Equal([1L, 2, 3, 4, 5], appended.Select(a => a.Iteration));
        Assert.All(appended, a => Assert.Equal(["noise", "stub/0", "stub/1", "stub/2"], a.Blocks.Select(b => b.WorkerId)));
        Assert.All(appended, a => Assert.All(a.Blocks, b => Assert.Equal(a.Iteration, b.Iteration)));
        // checkpoint_every_iterations = 2 and the final iteration.
        Assert.Equal([2L, 4, 5], harness.Checkpoints.Select(c => c.Checkpoint.Iteration));
        Assert.Equal(5, harness.Progress.Reports.Count);
    }

    [Fact]
    public void A_failing_worker_is_restarted_from_its_committed_state_and_the_run_gives_the_same_samples()
    {
        var clean = new CoordinatorHarness(Sys, iterations: 4);
        clean.Coordinator.Tell(new StartFit(), TestActor);
        ExpectMsg<FitFinished>(Patience);

        var faulty = new CoordinatorHarness(Sys, iterations: 4);
        faulty.Class.FailFromIteration = 3;
        faulty.Class.FailuresToThrow["stub/1"] = 2;
        faulty.Coordinator.Tell(new StartFit(), TestActor);
        var finished = ExpectMsg<FitFinished>(Patience);

        Assert.Equal(FitOutcomeKind.Completed, finished.Outcome.Kind);
        Assert.Equal(2, faulty.Progress.Warnings.Count(w => w.Contains("stub/1", StringComparison.Ordinal)));
        // The terminal gets one line per failure; the failure log gets the exception with its stack trace.
        Assert.All(faulty.Progress.Warnings, w => Assert.DoesNotContain('\n', w));
        Assert.Equal(["stub/1", "stub/1"], faulty.Failures.Select(f => f.WorkerId));
        Assert.All(faulty.Failures, f => Assert.Contains("StubSourceClass", f.Error.StackTrace, StringComparison.Ordinal));
        var expected = clean.Appended.SelectMany(a => a.Blocks).Select(b => (b.WorkerId, b.Iteration, b.Values[0])).ToList();
        var actual = faulty.Appended.SelectMany(a => a.Blocks).Select(b => (b.WorkerId, b.Iteration, b.Values[0])).ToList();
        Assert.Equal(expected, actual);
    }

    [Fact]
    public void Repeated_failures_stop_the_run_with_the_last_complete_iteration_checkpointed_and_the_worker_named()
    {
        var harness = new CoordinatorHarness(Sys, iterations: 6, maxWorkerFailures: 2);
        harness.Class.FailFromIteration = 4;
        harness.Class.FailuresToThrow["stub/2"] = 100;
        harness.Coordinator.Tell(new StartFit(), TestActor);
        var finished = ExpectMsg<FitFinished>(Patience);

        Assert.Equal(FitOutcomeKind.Failed, finished.Outcome.Kind);
        Assert.Equal(3, finished.Outcome.IterationsCompleted);
        Assert.Equal(3, finished.Outcome.CheckpointIteration);
        Assert.Contains("stub/2", finished.Outcome.Message, StringComparison.Ordinal);
        Assert.Contains("stub failure", finished.Outcome.Message, StringComparison.Ordinal);
        Assert.Equal([2L, 3], harness.Checkpoints.Select(c => c.Checkpoint.Iteration));
        Assert.Equal([1L, 2, 3], harness.Appended.Select(a => a.Iteration));
    }

    [Fact]
    public void A_stop_request_ends_the_run_with_the_last_complete_iteration_checkpointed()
    {
        var harness = new CoordinatorHarness(Sys, iterations: 1_000_000);
        harness.Coordinator.Tell(new StartFit(), TestActor);
        AwaitCondition(() => harness.Progress.Reports.Count >= 3, Patience);
        harness.Coordinator.Tell(new StopFit(), TestActor);
        var finished = ExpectMsg<FitFinished>(Patience);
        Assert.Equal(FitOutcomeKind.Interrupted, finished.Outcome.Kind);
        Assert.Equal(finished.Outcome.IterationsCompleted, finished.Outcome.CheckpointIteration);
        Assert.Equal(finished.Outcome.IterationsCompleted, harness.Checkpoints.Last().Checkpoint.Iteration);
        Assert.Equal(finished.Outcome.IterationsCompleted, harness.Appended.Last().Iteration);
    }
}
