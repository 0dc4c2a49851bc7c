using Akka.Actor;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Actors;

/// <summary>Writes checkpoints atomically into the run folder. A failed write (full disk, permissions) is reported,
/// not thrown: the previous checkpoint stays intact, the temporary file is removed, and the coordinator stops the run.</summary>
public sealed class CheckpointerActor : ReceiveActor
{
    /// <summary>Creates the actor for <paramref name="runFolder"/>.</summary>
    public CheckpointerActor(string runFolder)
    {
        Receive<WriteCheckpoint>(m =>
        {
            string? problem = null;
            try
            {
                CheckpointFile.Write(runFolder, m.Checkpoint);
            }
            // Any failure is reported, whatever its type: an exception escaping here would restart the actor and leave
            // the coordinator waiting for a reply that never comes.
            catch (Exception e)
            {
                problem = e.Message;
            }
            Sender.Tell(new CheckpointWritten(m.Checkpoint.Iteration, problem));
        });
    }

    /// <summary>Props.</summary>
    public static Props Props(string runFolder) => Akka.Actor.Props.Create(() => new CheckpointerActor(runFolder));
}
