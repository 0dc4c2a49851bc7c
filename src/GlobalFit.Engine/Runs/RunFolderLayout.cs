namespace GlobalFit.Engine.Runs;

/// <summary>The files of a run folder (see the README's "Files a run leaves").</summary>
/// <param name="Root">The run folder, absolute.</param>
public sealed record RunFolderLayout(string Root)
{
    /// <summary>The layout of an existing run folder: one that holds the <c>run.toml</c> a fit writes first.</summary>
    /// <param name="folder">The folder, absolute or relative.</param>
    /// <exception cref="Physics.Files.InvalidInputException">The folder holds no run.</exception>
    public static RunFolderLayout OpenExisting(string folder)
    {
        var layout = new RunFolderLayout(Path.GetFullPath(folder));
        if (!File.Exists(layout.ResolvedConfig))
            throw new Physics.Files.InvalidInputException(layout.Root, null, "not a run folder (no run.toml); start a fit with 'globalfit fit CONFIG.toml'");
        return layout;
    }

    /// <summary>Whether the folder holds a fit that never completed an iteration: a run.toml, but no checkpoint and no
    /// committed samples, and no process holding its lock. Such a folder holds nothing worth keeping.</summary>
    public bool HoldsUnstartedRun() =>
        File.Exists(ResolvedConfig) && !Checkpoints.CheckpointFile.Exists(Root)
        && new Samples.SampleStore(Root).CommittedIteration == 0 && !RunLock.IsHeld(this);

    /// <summary>Removes the files a fit that never completed an iteration leaves (and nothing else).</summary>
    public void ClearUnstartedRun()
    {
        foreach (string file in new[] { ResolvedConfig, StatusFile, TelemetryFile, DataIdentityFile, WorkerFailureLog })
            if (File.Exists(file)) File.Delete(file);
        foreach (string folder in new[] { Path.Combine(Root, Samples.SampleStore.SamplesFolderName), Checkpoints.CheckpointFile.Folder(Root) })
            if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
    }

    /// <summary>The resolved configuration.</summary>
    public string ResolvedConfig => Path.Combine(Root, "run.toml");

    /// <summary>Held open (locked) while a process runs the fit.</summary>
    public string LockFile => Path.Combine(Root, "fit.lock");

    /// <summary>Where the run stands, rewritten every iteration.</summary>
    public string StatusFile => Path.Combine(Root, "status.json");

    /// <summary>Size and SHA-256 of the observation file the run is fitted to (<see cref="DataIdentity"/>).</summary>
    public string DataIdentityFile => Path.Combine(Root, DataIdentity.FileName);

    /// <summary>Every worker failure with its stack trace (<see cref="Runs.WorkerFailureLog"/>).</summary>
    public string WorkerFailureLog => Path.Combine(Root, "worker-failures.log");

    /// <summary>Spans and metrics.</summary>
    public string TelemetryFile => Path.Combine(Root, Telemetry.TelemetryJsonLines.FileName);

    /// <summary>The catalogue table.</summary>
    public string CatalogueCsv => Path.Combine(Root, "catalogue.csv");

    /// <summary>The catalogue with posterior samples.</summary>
    public string CatalogueHdf5 => Path.Combine(Root, "catalogue.h5");
}
