using System.Globalization;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Runs;

/// <summary>An exclusive lock on a run folder for the life of the process that fits it: <c>fit.lock</c> held open
/// with no sharing. The operating system releases it when the process dies, however it dies, so a killed run never
/// leaves a stale lock.</summary>
public sealed class RunLock : IDisposable
{
    private readonly FileStream _stream;

    private RunLock(FileStream stream) => _stream = stream;

    /// <summary>Takes the lock.</summary>
    /// <exception cref="InvalidInputException">Another process holds it.</exception>
    public static RunLock Acquire(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        try
        {
            var stream = new FileStream(layout.LockFile, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None);
            stream.SetLength(0);
            var pid = System.Text.Encoding.ASCII.GetBytes(Environment.ProcessId.ToString(CultureInfo.InvariantCulture) + "\n");
            stream.Write(pid);
            stream.Flush();
            return new RunLock(stream);
        }
        catch (IOException)
        {
            throw new InvalidInputException(layout.Root, null, "another globalfit process is running this fit (fit.lock is held); wait for it or stop it first");
        }
    }

    /// <summary>True when some process holds the lock of <paramref name="layout"/> now.</summary>
    public static bool IsHeld(RunFolderLayout layout)
    {
        ArgumentNullException.ThrowIfNull(layout);
        if (!File.Exists(layout.LockFile)) return false;
        try
        {
            using var probe = new FileStream(layout.LockFile, FileMode.Open, FileAccess.ReadWrite, FileShare.None);
            return false;
        }
        catch (IOException)
        {
            return true;
        }
    }

    /// <inheritdoc />
    public void Dispose() => _stream.Dispose();
}
