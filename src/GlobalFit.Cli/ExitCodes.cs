namespace GlobalFit.Cli;

/// <summary>Process exit codes of the <c>globalfit</c> command.</summary>
public static class ExitCodes
{
    /// <summary>The command did what was asked.</summary>
    public const int Success = 0;

    /// <summary>An unexpected internal error (a bug): one line on standard error names it and the crash log that holds
    /// the stack trace.</summary>
    public const int InternalError = 1;

    /// <summary>Bad input: an unreadable or invalid file, option or value. Nothing was written.</summary>
    public const int BadInput = 2;

    /// <summary>A fit stopped because a worker failed repeatedly; its last complete iteration is checkpointed.</summary>
    public const int FitFailed = 3;

    /// <summary>A file could not be written (disk full, permission lost, I/O error); the message names the file and the
    /// cause, nothing half-written is left in its place, and a fit keeps its last good checkpoint.</summary>
    public const int WriteFailed = 4;

    /// <summary>Interrupted by the user (Ctrl-C).</summary>
    public const int Interrupted = 130;
}
