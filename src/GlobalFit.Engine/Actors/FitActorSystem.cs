using System.Globalization;
using Akka.Actor;
using Akka.Configuration;

namespace GlobalFit.Engine.Actors;

/// <summary>Creates the actor system of one fit: compute-heavy actors (workers, noise) on a dedicated dispatcher with
/// <c>threads</c> threads, everything else on the default dispatcher so it stays responsive while workers compute.</summary>
public static class FitActorSystem
{
    /// <summary>The dispatcher id workers and the noise actor run on.</summary>
    public const string ComputeDispatcher = "globalfit-compute";

    /// <summary>Creates the system.</summary>
    /// <param name="threads">Threads of the compute dispatcher.</param>
    public static ActorSystem Create(int threads)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(threads);
        // throughput = 1: a worker thread takes one update, then lets the next actor in, so a stage's workers share
        // the threads fairly instead of one actor draining its mailbox.
        string hocon = $$"""
            akka {
              loglevel = WARNING
              stdout-loglevel = WARNING
              log-dead-letters = off
              log-dead-letters-during-shutdown = off
              actor.default-dispatcher.throughput = 5
            }
            {{ComputeDispatcher}} {
              type = ForkJoinDispatcher
              throughput = 1
              dedicated-thread-pool {
                thread-count = {{threads.ToString(CultureInfo.InvariantCulture)}}
                threadtype = background
              }
            }
            """;
        return ActorSystem.Create("globalfit", ConfigurationFactory.ParseString(hocon));
    }
}
