using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Samples;

/// <summary>The append-only sample store of a run: one checksummed sample file per worker in <c>RUN/samples/</c>, plus a
/// commit point naming the last iteration whose samples are all on disk (layout in Catalogue/LAYOUT.md).</summary>
/// <remarks>
/// <para>An iteration is committed in two steps: its records are appended to the workers' files and flushed to disk,
/// then the commit point is replaced atomically. A crash between the steps leaves bytes past the commit point; readers
/// ignore them and <see cref="TruncateAfter"/> (or the next <see cref="Append"/>) cuts them off. Inside the committed
/// part every record must verify, so damage is reported, never skipped.</para>
/// <para>One writer per run folder; any number of readers (also while the writer runs: they read up to the commit point
/// they found). Not thread-safe for concurrent writes.</para>
/// </remarks>
public sealed class SampleStore
{
    /// <summary>Name of the folder inside the run folder that holds the sample files.</summary>
    public const string SamplesFolderName = "samples";

    /// <summary>Opens the store of <paramref name="runFolder"/>; nothing is created until the first append.</summary>
    /// <param name="runFolder">The run folder.</param>
    public SampleStore(string runFolder)
    {
        ArgumentException.ThrowIfNullOrEmpty(runFolder);
        RunFolder = runFolder;
        SamplesFolder = Path.Combine(runFolder, SamplesFolderName);
    }

    /// <summary>The run folder.</summary>
    public string RunFolder { get; }

    /// <summary>The folder holding the sample files.</summary>
    public string SamplesFolder { get; }

    /// <summary>The last committed iteration (0 when nothing was committed).</summary>
    public long CommittedIteration => CommitManifest.Load(SamplesFolder).Iteration;

    /// <summary>Appends all the blocks of one iteration and commits the iteration: when this returns, the samples are on
    /// disk.</summary>
    /// <param name="blocks">One block per worker that drew samples in the iteration; all of the same iteration, later than
    /// <see cref="CommittedIteration"/>. An empty list does nothing.</param>
    /// <exception cref="ArgumentException">The blocks are of different iterations, of an iteration already committed, repeat a
    /// worker, or are inconsistent (value count not matching the sources and parameters).</exception>
    /// <exception cref="InvalidInputException">The run folder is missing or a sample file is shorter than its commit point.</exception>
    public void Append(IReadOnlyList<SampleBlock> blocks)
    {
        ArgumentNullException.ThrowIfNull(blocks);
        if (blocks.Count == 0) return;
        if (!Directory.Exists(RunFolder)) throw new InvalidInputException(RunFolder, null, "run folder does not exist");
        var manifest = CommitManifest.Load(SamplesFolder);
        long iteration = CheckIteration(blocks, manifest.Iteration);
        if (!Directory.Exists(SamplesFolder))
        {
            // The commit record exists before any sample file does, so a record missing beside sample files is a loss
            // (reported by every reader), never the state of a store that has not committed yet.
            Directory.CreateDirectory(SamplesFolder);
            CommitManifest.Empty.Save(SamplesFolder);
        }

        var lengths = new Dictionary<string, long>(manifest.Lengths, StringComparer.Ordinal);
        foreach (var block in blocks.OrderBy(b => b.WorkerId, StringComparer.Ordinal))
        {
            string fileName = WorkerFileName.FromWorkerId(block.WorkerId);
            lengths[fileName] = AppendRecord(Path.Combine(SamplesFolder, fileName), manifest.LengthOf(fileName), SampleRecordFormat.Encode(block));
        }
        new CommitManifest(iteration, lengths).Save(SamplesFolder);
    }

    /// <summary>Prepares a resume from the state of <paramref name="iteration"/>: removes every record of a later iteration
    /// and every byte past the commit point (a crash-torn append), and moves the commit point back.</summary>
    /// <param name="iteration">The last iteration to keep (that of the checkpoint resumed from); 0 empties the store.</param>
    /// <returns>What was removed, per worker file that lost anything.</returns>
    /// <exception cref="InvalidInputException">A committed record is damaged (file and byte offset named).</exception>
    public IReadOnlyList<SegmentTruncation> TruncateAfter(long iteration)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(iteration);
        if (!Directory.Exists(SamplesFolder)) return [];
        var manifest = CommitManifest.Load(SamplesFolder);
        long keep = Math.Min(iteration, manifest.Iteration);
        var cuts = new List<(string Path, long Length)>();
        var dropped = new List<SegmentTruncation>();
        var lengths = new Dictionary<string, long>(StringComparer.Ordinal);
        var files = ChainFiles().ToList();
        foreach (var (fileName, committedLength) in manifest.Lengths)
            if (committedLength > 0 && !files.Any(f => f.FileName == fileName))
                throw new InvalidInputException(Path.Combine(SamplesFolder, fileName), null, $"is missing but {committedLength} bytes of it were committed");
        foreach (var (workerId, fileName) in files)
        {
            string path = Path.Combine(SamplesFolder, fileName);
            long committed = manifest.LengthOf(fileName);
            long cut = 0;
            int recordsDropped = 0;
            long? firstDropped = null;
            foreach (var record in SampleSegmentReader.Records(path, workerId, committed))
            {
                if (record.Block.Iteration <= keep) cut = record.EndOffset;
                else
                {
                    recordsDropped++;
                    firstDropped ??= record.Block.Iteration;
                }
            }
            long fileLength = new FileInfo(path).Length;
            lengths[fileName] = cut;
            if (fileLength == cut) continue;
            cuts.Add((path, cut));
            dropped.Add(new SegmentTruncation(workerId, recordsDropped, firstDropped, fileLength - committed));
        }
        // The commit point moves back first: a crash before the files are cut leaves only uncommitted bytes.
        new CommitManifest(keep, lengths).Save(SamplesFolder);
        foreach (var (path, length) in cuts) CutFile(path, length);
        return dropped;
    }

    /// <summary>The committed blocks of one worker, in iteration order, each verified against its checksum.</summary>
    /// <param name="workerId">The worker id.</param>
    /// <returns>The blocks; none when the worker has no file.</returns>
    /// <exception cref="InvalidInputException">A committed record is damaged (file and byte offset named); thrown while
    /// enumerating.</exception>
    public IEnumerable<SampleBlock> Read(string workerId)
    {
        ArgumentException.ThrowIfNullOrEmpty(workerId);
        return ReadWorker(workerId, WorkerFileName.FromWorkerId(workerId), CommitManifest.Load(SamplesFolder));
    }

    /// <summary>Every committed block of every worker, ordered by iteration, then worker id (ordinal), each verified.</summary>
    /// <returns>The blocks, read lazily one file record at a time.</returns>
    /// <exception cref="InvalidInputException">A committed record is damaged (file and byte offset named); thrown while
    /// enumerating.</exception>
    public IEnumerable<SampleBlock> ReadAll()
    {
        if (!Directory.Exists(SamplesFolder)) yield break;
        var manifest = CommitManifest.Load(SamplesFolder);
        var cursors = new List<IEnumerator<SampleBlock>>();
        var queue = new PriorityQueue<IEnumerator<SampleBlock>, (long Iteration, string WorkerId)>(IterationThenWorker.Instance);
        try
        {
            foreach (var (workerId, fileName) in ChainFiles())
            {
                var cursor = ReadWorker(workerId, fileName, manifest).GetEnumerator();
                cursors.Add(cursor);
                if (cursor.MoveNext()) queue.Enqueue(cursor, (cursor.Current.Iteration, workerId));
            }
            while (queue.TryDequeue(out var cursor, out var key))
            {
                yield return cursor.Current;
                if (cursor.MoveNext()) queue.Enqueue(cursor, (cursor.Current.Iteration, key.WorkerId));
            }
        }
        finally
        {
            foreach (var cursor in cursors) cursor.Dispose();
        }
    }

    /// <summary>Committed samples per worker, for <c>status</c>.</summary>
    /// <returns>Worker id → number of samples, ordered by worker id.</returns>
    /// <exception cref="InvalidInputException">A committed record is damaged.</exception>
    public IReadOnlyDictionary<string, long> CountSamples()
    {
        var counts = new SortedDictionary<string, long>(StringComparer.Ordinal);
        if (!Directory.Exists(SamplesFolder)) return counts;
        var manifest = CommitManifest.Load(SamplesFolder);
        foreach (var (workerId, fileName) in ChainFiles())
        {
            long count = 0;
            foreach (var block in ReadWorker(workerId, fileName, manifest)) count += block.SampleCount;
            counts[workerId] = count;
        }
        return counts;
    }

    private IEnumerable<SampleBlock> ReadWorker(string workerId, string fileName, CommitManifest manifest)
    {
        string path = Path.Combine(SamplesFolder, fileName);
        long committed = manifest.LengthOf(fileName);
        if (!File.Exists(path))
        {
            if (committed > 0) throw new InvalidInputException(path, null, $"is missing but {committed} bytes of it were committed");
            return [];
        }
        return SampleSegmentReader.Records(path, workerId, committed).Select(r => r.Block);
    }

    private IEnumerable<(string WorkerId, string FileName)> ChainFiles()
    {
        if (!Directory.Exists(SamplesFolder)) return [];
        var files = new List<(string, string)>();
        foreach (string path in Directory.EnumerateFiles(SamplesFolder, "*" + WorkerFileName.Extension))
        {
            string fileName = Path.GetFileName(path);
            string workerId = WorkerFileName.ToWorkerId(fileName)
                ?? throw new InvalidInputException(path, null, "is not a sample file name globalfit writes; move it out of the samples folder");
            files.Add((workerId, fileName));
        }
        return files.OrderBy(f => f.Item1, StringComparer.Ordinal);
    }

    private static long CheckIteration(IReadOnlyList<SampleBlock> blocks, long committedIteration)
    {
        long iteration = blocks[0]?.Iteration ?? throw new ArgumentException("a sample block is null", nameof(blocks));
        if (iteration <= committedIteration)
            throw new ArgumentException($"iteration {iteration} is not after the committed iteration {committedIteration}", nameof(blocks));
        var workers = new HashSet<string>(StringComparer.Ordinal);
        foreach (var block in blocks)
        {
            if (block is null) throw new ArgumentException("a sample block is null", nameof(blocks));
            if (block.Iteration != iteration)
                throw new ArgumentException($"blocks of iterations {iteration} and {block.Iteration} in one append; append one iteration at a time", nameof(blocks));
            if (!workers.Add(block.WorkerId)) throw new ArgumentException($"worker {block.WorkerId} has two blocks in iteration {iteration}", nameof(blocks));
            CheckShape(block);
        }
        return iteration;
    }

    private static void CheckShape(SampleBlock block)
    {
        ArgumentException.ThrowIfNullOrEmpty(block.WorkerId, nameof(block.WorkerId));
        if (block.ParameterNames is null || block.SourcesPerSample is null || block.Values is null || block.LogLikelihoods is null)
            throw new ArgumentException($"the block of worker {block.WorkerId} has a null array");
        long sources = 0;
        foreach (int count in block.SourcesPerSample)
        {
            if (count < 0) throw new ArgumentException($"the block of worker {block.WorkerId} has a negative source count");
            sources += count;
        }
        if (sources * block.ParameterNames.Length != block.Values.Length || block.LogLikelihoods.Length != block.SampleCount)
            throw new ArgumentException($"the block of worker {block.WorkerId}, iteration {block.Iteration}: {block.Values.Length} values and {block.LogLikelihoods.Length} log-likelihoods do not fit {sources} sources of {block.ParameterNames.Length} parameters in {block.SampleCount} samples");
    }

    private static long AppendRecord(string path, long committedLength, byte[] record)
    {
        try
        {
            using var stream = WriteStreams.Open(path, FileMode.OpenOrCreate, FileAccess.Write, FileShare.Read);
            if (stream.Length < committedLength)
                throw new InvalidInputException(path, null, $"holds {stream.Length} bytes but {committedLength} were committed: the file was cut short");
            // Bytes past the commit point are the remains of an append a crash interrupted: never committed, so dropped.
            if (stream.Length > committedLength) stream.SetLength(committedLength);
            stream.Seek(committedLength, SeekOrigin.Begin);
            stream.Write(record);
            WriteStreams.FlushToDisk(stream);
            return committedLength + record.Length;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, null, $"cannot be appended to: {FileProblem.Describe(path, e)}", e);
        }
    }

    private static void CutFile(string path, long length)
    {
        using var stream = WriteStreams.Open(path, FileMode.Open, FileAccess.Write, FileShare.Read);
        stream.SetLength(length);
        WriteStreams.FlushToDisk(stream);
    }

    private sealed class IterationThenWorker : IComparer<(long Iteration, string WorkerId)>
    {
        public static readonly IterationThenWorker Instance = new();

        public int Compare((long Iteration, string WorkerId) x, (long Iteration, string WorkerId) y) =>
            x.Iteration != y.Iteration ? x.Iteration.CompareTo(y.Iteration) : string.CompareOrdinal(x.WorkerId, y.WorkerId);
    }
}
