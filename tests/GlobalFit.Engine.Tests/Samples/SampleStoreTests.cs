using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Samples;
using GlobalFit.Engine.Tests.Catalogue;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Tests.Samples;

public class SampleStoreTests
{
    private static readonly string[] Workers = ["galactic_binaries/0001", "galactic_binaries/0002", "noise"];

    // Values depend on worker and iteration, so a record read from the wrong place or iteration cannot pass for another.
    private static SampleBlock Block(string worker, long iteration)
    {
        int salt = worker.Length + (int)iteration * 7;
        return new SampleBlock(worker, worker == "noise" ? "noise" : "galactic_binaries", iteration, ["f0_hz", "amplitude"],
            [1, 2], [salt + 0.5, 1e-22, salt + 1.5, 2e-22, salt + 2.5, double.NaN], [-salt, -salt - 0.25]);
    }

    private static IReadOnlyList<SampleBlock> Iteration(long iteration) => [.. Workers.Select(w => Block(w, iteration))];

    private static void AssertSame(SampleBlock expected, SampleBlock actual)
    {
        Assert.Equal(expected.WorkerId, actual.WorkerId);
        Assert.Equal(expected.ClassId, actual.ClassId);
        Assert.Equal(expected.Iteration, actual.Iteration);
        Assert.Equal(expected.ParameterNames, actual.ParameterNames);
        Assert.Equal(expected.SourcesPerSample, actual.SourcesPerSample);
        Assert.Equal(expected.Values, actual.Values);   // exact: MessagePack stores float64 bit for bit, NaN included
        Assert.Equal(expected.LogLikelihoods, actual.LogLikelihoods);
    }

    private static string ChainFile(TemporaryRunFolder run, string worker) => run.File("samples", WorkerFileName.FromWorkerId(worker));

    [Fact]
    public void Appended_blocks_read_back_in_iteration_then_worker_order()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        for (long i = 1; i <= 3; i++) store.Append([.. Iteration(i).Reverse()]);

        var all = store.ReadAll().ToList();
        var expected = Enumerable.Range(1, 3).SelectMany(i => Workers.Select(w => Block(w, i))).ToList();
        Assert.Equal(expected.Count, all.Count);
        for (int k = 0; k < expected.Count; k++) AssertSame(expected[k], all[k]);
        Assert.Equal([1L, 2L, 3L], store.Read("noise").Select(b => b.Iteration));
        Assert.Equal(3, store.CommittedIteration);
        Assert.Equal(Workers.ToDictionary(w => w, _ => 6L), store.CountSamples());
        Assert.True(File.Exists(run.File("samples", "galactic_binaries.0001.samples")));
    }

    [Fact]
    public void A_torn_tail_left_by_a_crash_is_ignored_by_readers_and_cut_on_resume()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        store.Append(Iteration(2));
        string path = ChainFile(run, "galactic_binaries/0002");
        long committedLength = new FileInfo(path).Length;
        // A crash in the middle of appending iteration 3: half a record reached the disk, the commit point did not move.
        byte[] lastRecord = File.ReadAllBytes(path)[(int)(committedLength / 2)..];
        using (var stream = new FileStream(path, FileMode.Append)) stream.Write(lastRecord, 0, lastRecord.Length / 2);

        Assert.Equal([1L, 2L], store.Read("galactic_binaries/0002").Select(b => b.Iteration));
        var dropped = store.TruncateAfter(2);

        var only = Assert.Single(dropped);
        Assert.Equal("galactic_binaries/0002", only.WorkerId);
        Assert.Equal(0, only.RecordsDropped);
        Assert.Equal(lastRecord.Length / 2, only.UncommittedBytesDropped);
        Assert.Equal(committedLength, new FileInfo(path).Length);
        store.Append(Iteration(3));
        Assert.Equal([1L, 2L, 3L], store.Read("galactic_binaries/0002").Select(b => b.Iteration));
    }

    [Fact]
    public void An_append_interrupted_before_its_commit_is_dropped_by_the_next_append()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        string manifest = run.File("samples", "committed");
        byte[] committedManifest = File.ReadAllBytes(manifest);
        store.Append(Iteration(2));
        File.WriteAllBytes(manifest, committedManifest);   // the crash came after the records, before the commit point

        Assert.Equal(1, store.CommittedIteration);
        Assert.Equal(3, store.ReadAll().Count());
        store.Append(Iteration(2));
        Assert.Equal([1L, 2L], store.Read("noise").Select(b => b.Iteration));
    }

    [Fact]
    public void A_flipped_byte_in_a_committed_record_is_reported_with_file_and_offset()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        string path = ChainFile(run, "noise");
        long secondRecord = new FileInfo(path).Length;
        store.Append(Iteration(2));
        store.Append(Iteration(3));
        var bytes = File.ReadAllBytes(path);
        bytes[secondRecord + 20] ^= 0x10;   // inside the payload of the iteration-2 record; iteration 3 follows it
        File.WriteAllBytes(path, bytes);

        var error = Assert.Throws<InvalidInputException>(() => store.Read("noise").ToList());
        Assert.Equal(path, error.InputSource);
        Assert.Equal($"byte offset {secondRecord}", error.Location);
        Assert.Contains("checksum", error.Problem);
        Assert.Throws<InvalidInputException>(() => store.ReadAll().ToList());
        Assert.Throws<InvalidInputException>(() => store.TruncateAfter(1));
    }

    [Fact]
    public void A_chain_file_cut_short_or_deleted_below_its_commit_point_is_reported()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        store.Append(Iteration(2));
        string cut = ChainFile(run, "noise");
        using (var stream = new FileStream(cut, FileMode.Open)) stream.SetLength(stream.Length - 3);
        var shortened = Assert.Throws<InvalidInputException>(() => store.Read("noise").ToList());
        Assert.Equal(cut, shortened.InputSource);
        Assert.Contains("cut short", shortened.Problem);

        string gone = ChainFile(run, "galactic_binaries/0001");
        File.Delete(gone);
        Assert.Equal(gone, Assert.Throws<InvalidInputException>(() => store.Read("galactic_binaries/0001").ToList()).InputSource);
        Assert.Throws<InvalidInputException>(() => store.TruncateAfter(1));
    }

    [Fact]
    public void Truncating_after_an_iteration_drops_exactly_the_later_iterations()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        for (long i = 1; i <= 5; i++) store.Append(Iteration(i));

        var dropped = store.TruncateAfter(3);

        Assert.Equal(Workers, dropped.Select(d => d.WorkerId));
        Assert.All(dropped, d => Assert.Equal((2, 4L, 0L), (d.RecordsDropped, d.FirstIterationDropped!.Value, d.UncommittedBytesDropped)));
        Assert.Equal(3, store.CommittedIteration);
        Assert.Equal([1L, 2L, 3L], store.ReadAll().Select(b => b.Iteration).Distinct());
        Assert.Empty(store.TruncateAfter(3));
        store.Append(Iteration(4));
        Assert.Equal(4, store.CommittedIteration);
    }

    [Fact]
    public void Identical_input_gives_identical_bytes()
    {
        using var first = new TemporaryRunFolder();
        using var second = new TemporaryRunFolder();
        foreach (var run in new[] { first, second })
        {
            var store = new SampleStore(run.Path);
            for (long i = 1; i <= 2; i++) store.Append(Iteration(i));
        }
        foreach (string worker in Workers)
            Assert.Equal(File.ReadAllBytes(ChainFile(first, worker)), File.ReadAllBytes(ChainFile(second, worker)));
    }

    [Fact]
    public void Appends_that_mix_iterations_repeat_one_or_repeat_a_worker_are_refused()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        Assert.Throws<ArgumentException>(() => store.Append(Iteration(1)));
        Assert.Throws<ArgumentException>(() => store.Append([Block("noise", 2), Block("galactic_binaries/0001", 3)]));
        Assert.Throws<ArgumentException>(() => store.Append([Block("noise", 2), Block("noise", 2)]));
        Assert.Throws<ArgumentException>(() => store.Append([Block("noise", 2) with { Values = [1.0] }]));
        Assert.Equal(1, store.CommittedIteration);
    }

    [Fact]
    public void A_missing_chains_folder_reads_as_an_empty_store()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        Assert.Empty(store.ReadAll());
        Assert.Empty(store.CountSamples());
        Assert.Empty(store.TruncateAfter(0));
    }

    [Fact]
    public void A_missing_commit_record_beside_sample_files_is_an_error_for_every_reader_never_zero_samples()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        File.Delete(Path.Combine(store.SamplesFolder, "committed"));
        foreach (var read in new Action[] { () => store.ReadAll().ToList(), () => store.CountSamples(), () => store.TruncateAfter(0), () => _ = store.CommittedIteration })
        {
            var error = Assert.Throws<InvalidInputException>(read);
            Assert.Contains("committed", error.Message, StringComparison.Ordinal);
            Assert.Contains("missing", error.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void A_store_that_committed_nothing_yet_still_has_its_commit_record()
    {
        using var run = new TemporaryRunFolder();
        var store = new SampleStore(run.Path);
        store.Append(Iteration(1));
        Assert.True(File.Exists(Path.Combine(store.SamplesFolder, "committed")));
        Assert.Equal(1, store.CommittedIteration);
    }

    [Theory]
    [InlineData("galactic_binaries/0042", "galactic_binaries.0042.samples")]
    [InlineData("noise", "noise.samples")]
    [InlineData("Odd.id/x", "%4Fdd%2Eid.x.samples")]
    [InlineData("/lead", "%2Flead.samples")]
    public void Worker_ids_map_to_file_names_and_back(string workerId, string fileName)
    {
        Assert.Equal(fileName, WorkerFileName.FromWorkerId(workerId));
        Assert.Equal(workerId, WorkerFileName.ToWorkerId(fileName));
    }

    [Theory]
    [InlineData("noise.txt")]
    [InlineData(".samples")]
    [InlineData("%4fdd.samples")]   // lower-case hex is not the canonical spelling
    [InlineData("a b.samples")]
    public void File_names_the_store_never_writes_map_to_no_worker(string fileName) => Assert.Null(WorkerFileName.ToWorkerId(fileName));

    // The standard check value of CRC-32/ISO-HDLC (the CRC RevEng catalogue, "CRC-32/ISO-HDLC": check=0xcbf43926).
    [Fact]
    public void Crc32_matches_the_published_check_value() => Assert.Equal(0xCBF43926u, Crc32.Compute("123456789"u8));
}
