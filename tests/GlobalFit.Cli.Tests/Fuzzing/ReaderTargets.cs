using System.Buffers.Binary;
using System.Security.Cryptography;
using System.Text;
using GlobalFit.Cli.Tests.Support;
using GlobalFit.Engine.Checkpoints;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.Telemetry;
using MessagePack;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Every reader of untrusted bytes, wired for fuzzing: each input is written where the program expects the
/// file and read through the program's own entry point for it.</summary>
internal sealed class ReaderTargets(FuzzSeeds seeds, TempFolder scratch)
{
    public IEnumerable<FuzzTarget> All =>
        [ObservationFile, Scenario, RunConfiguration, Checkpoint, SampleFile, CommitRecord, Telemetry];

    public FuzzTarget ObservationFile => new("observation file (HDF5)", [seeds.ObservationFile], ByteMutations.Mutate, bytes =>
    {
        string path = Write("data.h5", bytes);
        GlobalFit.Physics.DataFiles.ObservationFile.Read(path);
        return null; // no checksum: damage to sample values is indistinguishable from other data
    })
    {
        // The HDF5 library allocates what a size field inside the file asks for before it can find the field damaged;
        // .NET caps one array at 2 GiB, and a larger request is refused as damage. Measured worst over 105,000 inputs:
        // 391 MB, transient.
        AllocationBound = 2L << 30,
    };

    public FuzzTarget Scenario => new("scenario configuration (TOML)", seeds.Scenario, TextMutations.Mutate, bytes =>
    {
        string path = Write("scenario.toml", bytes);
        SourceClassRegistry.Default.ReadScenario(ConfigDocument.Load(path));
        return null;
    });

    // Checked against a stated data shape (a month at 5 s) rather than a data file, so every input gets past the file
    // lookup and into the class sections.
    public FuzzTarget RunConfiguration => new("run configuration (TOML)", seeds.RunConfigurations, TextMutations.Mutate, bytes =>
    {
        string path = Write("fit.toml", bytes);
        RunPlan.FromConfig(ConfigDocument.Load(path), scratch.Path, new FitDataShape(path, 518_400, 5, 0));
        return null;
    });

    public FuzzTarget Checkpoint => new("checkpoint", seeds.Checkpoints, ByteMutations.Mutate, bytes =>
    {
        string run = Path.Combine(scratch.Path, "run");
        Directory.CreateDirectory(CheckpointFile.Folder(run));
        File.WriteAllBytes(CheckpointFile.LatestPath(run), bytes);
        var checkpoint = CheckpointFile.Read(run, _ => { });
        return Convert.ToHexString(SHA256.HashData(MessagePackSerializer.Serialize(checkpoint)));
    }, ResealCheckpoint);

    // The first worker's file is replaced by the input, the commit record left as the fit wrote it: what a damaged disk
    // does. The other workers' files are the donors of splices (records that are whole but belong elsewhere).
    public FuzzTarget SampleFile => new("sample file", [seeds.SampleFiles[0].Bytes], (seed, _, random) =>
        ByteMutations.Mutate(seed, seeds.SampleFiles[random.Next(seeds.SampleFiles.Count)].Bytes, random), bytes =>
    {
        string run = SampleRun(bytes, seeds.CommitRecord);
        return Fingerprint(new SampleStore(run).ReadAll());
    }, ResealSampleRecords);

    public FuzzTarget CommitRecord => new("sample commit record", [seeds.CommitRecord], TextMutations.Mutate, bytes =>
    {
        string run = SampleRun(seeds.SampleFiles[0].Bytes, bytes);
        new SampleStore(run).ReadAll().Count();
        return null; // plain text: a changed length that still points at a record boundary reads a shorter history
    });

    public FuzzTarget Telemetry => new("telemetry (JSON lines)", [seeds.Telemetry], TextMutations.Mutate, bytes =>
    {
        CriticalPathAnalysis.Read(Write("telemetry.jsonl", bytes));
        return null;
    });

    private string Write(string name, byte[] bytes)
    {
        string path = scratch.File(name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    private string SampleRun(byte[] firstWorkerFile, byte[] commitRecord)
    {
        string run = Path.Combine(scratch.Path, "samples-run");
        string folder = Path.Combine(run, SampleStore.SamplesFolderName);
        if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
        Directory.CreateDirectory(folder);
        for (int i = 0; i < seeds.SampleFiles.Count; i++)
            File.WriteAllBytes(Path.Combine(folder, seeds.SampleFiles[i].Name), i == 0 ? firstWorkerFile : seeds.SampleFiles[i].Bytes);
        File.WriteAllBytes(Path.Combine(folder, CommitManifest.FileName), commitRecord);
        return run;
    }

    private static string Fingerprint(IEnumerable<SampleBlock> blocks)
    {
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        foreach (var block in blocks) hash.AppendData(MessagePackSerializer.Serialize(block));
        return Convert.ToHexString(hash.GetHashAndReset());
    }

    /// <summary>Writes a true length and SHA-256 into a checkpoint header (48 bytes: magic, length, digest).</summary>
    private static byte[] ResealCheckpoint(byte[] bytes)
    {
        if (bytes.Length < 48) return bytes;
        byte[] copy = (byte[])bytes.Clone();
        BinaryPrimitives.WriteInt64LittleEndian(copy.AsSpan(8), copy.Length - 48);
        SHA256.HashData(copy.AsSpan(48), copy.AsSpan(16, 32));
        return copy;
    }

    /// <summary>Recomputes the CRC of every record whose stated length fits the file (12-byte header: magic, length, CRC).</summary>
    private static byte[] ResealSampleRecords(byte[] bytes)
    {
        byte[] copy = (byte[])bytes.Clone();
        int offset = 0;
        while (offset + SampleRecordFormat.HeaderLength <= copy.Length)
        {
            uint length = BinaryPrimitives.ReadUInt32LittleEndian(copy.AsSpan(offset + 4));
            if (length > copy.Length - offset - SampleRecordFormat.HeaderLength) break;
            var payload = copy.AsSpan(offset + SampleRecordFormat.HeaderLength, (int)length);
            BinaryPrimitives.WriteUInt32LittleEndian(copy.AsSpan(offset + 8), Crc32.Compute(payload));
            offset += SampleRecordFormat.HeaderLength + (int)length;
        }
        return copy;
    }
}
