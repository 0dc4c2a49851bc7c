using GlobalFit.Cli.Tests.Support;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Samples;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Valid files written by the program itself, the seeds every fuzzed input is mutated from: an observation file
/// from <c>simulate</c>, and the checkpoints, sample files, commit record and telemetry of a short <c>fit</c> of it with
/// a galactic-binary band and the noise model. Made once for all fuzz tests.</summary>
public sealed class FuzzSeeds : IDisposable
{
    private readonly TempFolder _folder = new();

    public FuzzSeeds()
    {
        string data = _folder.File("data.h5");
        string scenario = _folder.Write("scenario.toml", Scenarios.TwoDays + """

            [[galactic_binaries.binary]]
            id = "loud"
            f0_hz = 3.1e-3
            fdot_hz_s = 0
            amplitude = 2e-21
            beta_rad = 0.3
            lambda_rad = 1.2
            iota_rad = 0.9
            psi_rad = 1.2
            phi0_rad = 0.4
            """);
        Expect(CliRun.Run("simulate", scenario, "--out", data));
        RunFolder = _folder.File("run");
        string config = _folder.Write("fit.toml", $"""
            data = "{data}"
            run_folder = "{RunFolder}"
            iterations = 3
            checkpoint_every_iterations = 1
            [galactic_binaries]
            f_min_hz = 3.0e-3
            f_max_hz = 3.4e-3
            window_bins = 32
            steps_per_update = 10
            temperatures = 2
            [noise]
            steps_per_update = 5
            """);
        Expect(CliRun.Run("fit", config));
        ObservationFile = File.ReadAllBytes(data);
        Checkpoints = [File.ReadAllBytes(CheckpointFile.LatestPath(RunFolder)), File.ReadAllBytes(CheckpointFile.PreviousPath(RunFolder))];
        string samples = Path.Combine(RunFolder, SampleStore.SamplesFolderName);
        SampleFiles = Directory.GetFiles(samples, "*" + WorkerFileName.Extension).Order(StringComparer.Ordinal)
            .Select(f => (Path.GetFileName(f), File.ReadAllBytes(f))).ToList();
        CommitRecord = File.ReadAllBytes(Path.Combine(samples, CommitManifest.FileName));
        Telemetry = File.ReadAllBytes(Path.Combine(RunFolder, "telemetry.jsonl"));
        Scenario = Directory.GetFiles(RepositoryFiles.PathOf("configs"), "scenario-*.toml").Order(StringComparer.Ordinal).Select(File.ReadAllBytes).ToList();
        RunConfigurations = Directory.GetFiles(RepositoryFiles.PathOf("configs"), "fit-*.toml").Order(StringComparer.Ordinal).Select(File.ReadAllBytes).ToList();
    }

    /// <summary>The fit's run folder.</summary>
    public string RunFolder { get; }

    public byte[] ObservationFile { get; }

    public IReadOnlyList<byte[]> Checkpoints { get; }

    /// <summary>Each worker's sample file: its name and contents.</summary>
    public IReadOnlyList<(string Name, byte[] Bytes)> SampleFiles { get; }

    public byte[] CommitRecord { get; }

    public byte[] Telemetry { get; }

    /// <summary>The shipped example scenarios.</summary>
    public IReadOnlyList<byte[]> Scenario { get; }

    /// <summary>The shipped example run configurations.</summary>
    public IReadOnlyList<byte[]> RunConfigurations { get; }

    public void Dispose() => _folder.Dispose();

    private static void Expect(CliResult result)
    {
        if (result.ExitCode != 0) throw new InvalidOperationException($"seed run failed ({result.ExitCode}): {result.Error}");
    }
}
