using System.Collections.Immutable;
using System.Globalization;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The galactic-binary catalogue of a run: <see cref="CatalogueBuilder"/> behind the class-neutral
/// <see cref="IClassCatalogue"/> seam.</summary>
/// <remarks>
/// <para>One builder per worker: a band worker owns the sources whose carrier lies in its core, so its samples are
/// complete configurations of those sources, and a source's confidence is the fraction of <em>its band's</em> samples it
/// appears in. One builder for all bands would count every band's samples in the denominator and divide each confidence
/// by the number of bands.</para>
/// <para>Blocks of iterations up to the burn-in are ignored. Entries of all bands are merged, those below the minimum
/// confidence left out, and the rest numbered <c>gb-0001</c>, <c>gb-0002</c>, … by median f0 (four digits at least, more
/// when needed). Deterministic for the same blocks in the same order. Not thread-safe.</para>
/// </remarks>
public sealed class GalacticBinaryClassCatalogue : IClassCatalogue
{
    private const string ClassId = GalacticBinaryClass.Id;

    /// <summary>Prefix of the entry ids.</summary>
    public const string IdPrefix = "gb-";

    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly BinWindow _bins;
    private readonly double[] _inverseA;
    private readonly double[] _inverseE;
    private readonly double _matchThreshold;
    private readonly SortedDictionary<string, CatalogueBuilder> _builders = new(StringComparer.Ordinal);

    /// <summary>Creates an empty catalogue.</summary>
    /// <param name="generator">Template generator of the data record.</param>
    /// <param name="bins">The analysed bins (every band's window lies inside).</param>
    /// <param name="noise">The noise model that weights overlaps and SNRs (the fit's final one).</param>
    /// <param name="burnInIterations">Blocks of iterations 1 … this are ignored.</param>
    /// <param name="minimumConfidence">Entries present in a smaller fraction of samples are left out, in [0, 1].</param>
    /// <param name="matchThreshold">The association overlap threshold of <see cref="CatalogueBuilder"/>.</param>
    /// <param name="minimumSnr">Entries whose median SNR lies below this are left out.</param>
    /// <exception cref="ArgumentOutOfRangeException">The burn-in is negative or the confidence outside [0, 1]. Bins
    /// where the noise PSD is not positive and finite get weight 0 (the rule of <see cref="Fitting.InversePsd"/>).</exception>
    public GalacticBinaryClassCatalogue(GalacticBinaryTemplateGenerator generator, BinWindow bins, IPsdSource noise,
        long burnInIterations = 0, double minimumConfidence = 0.0, double matchThreshold = 0.5, double minimumSnr = 0.0)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(noise);
        ArgumentOutOfRangeException.ThrowIfNegative(burnInIterations);
        if (!(minimumConfidence is >= 0 and <= 1)) throw new ArgumentOutOfRangeException(nameof(minimumConfidence), minimumConfidence, "must lie in [0, 1]");
        _generator = generator;
        _bins = bins;
        _inverseA = InversePsd(noise, AetChannel.A, bins);
        _inverseE = InversePsd(noise, AetChannel.E, bins);
        _matchThreshold = matchThreshold;
        BurnInIterations = burnInIterations;
        MinimumConfidence = minimumConfidence;
        MinimumSnr = minimumSnr;
        // Checks the threshold and the weights once, before any block arrives.
        _ = new CatalogueBuilder(generator, bins, _inverseA, _inverseE, matchThreshold);
    }

    /// <summary>Blocks of iterations up to this one are ignored.</summary>
    public long BurnInIterations { get; }

    /// <summary>Entries below this confidence are left out.</summary>
    public double MinimumConfidence { get; }

    /// <summary>Entries whose median SNR lies below this are left out.</summary>
    public double MinimumSnr { get; }

    /// <summary>Adds each sample of <paramref name="block"/> to its worker's builder, unless the block is burn-in.</summary>
    /// <param name="block">A galactic-binary worker's block: the eight columns of
    /// <see cref="GalacticBinaryParameters.ColumnNames"/> in any order, optionally <c>fddot_hz_s2</c>.</param>
    /// <exception cref="ArgumentException">The block is of another class, misses a column or its values do not fit its
    /// shape; the message names the worker and iteration.</exception>
    public void Add(SampleBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        if (block.ClassId != ClassId)
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: a block of class '{block.ClassId}' cannot join the {ClassId} catalogue", nameof(block));
        if (block.Iteration <= BurnInIterations) return;
        var columns = ColumnMap.For(block);
        if (!_builders.TryGetValue(block.WorkerId, out var builder))
        {
            builder = new CatalogueBuilder(_generator, _bins, _inverseA, _inverseE, _matchThreshold);
            _builders.Add(block.WorkerId, builder);
        }
        int width = block.ParameterNames.Length;
        int offset = 0;
        var sources = new List<GalacticBinaryParameters>();
        foreach (int count in block.SourcesPerSample)
        {
            sources.Clear();
            for (int s = 0; s < count; s++, offset += width) sources.Add(columns.Read(block.Values.AsSpan(offset, width)));
            builder.Add(sources);
        }
    }

    /// <summary>The sources of all workers, by median f0, numbered from <c>gb-0001</c>.</summary>
    /// <returns>The records; parameters are the nine columns of <see cref="GalacticBinaryParameters.TableColumnNames"/>, the
    /// order of the truth table (f̈ is what the samples hold: 0 while the fit keeps it fixed).</returns>
    public ImmutableArray<CatalogueRecord> Build()
    {
        var rows = _builders.Values.SelectMany(b => b.Build(MinimumConfidence, MinimumSnr)).OrderBy(e => e.Median.FrequencyHz).ToList();
        int digits = Math.Max(4, rows.Count.ToString(CultureInfo.InvariantCulture).Length);
        var records = ImmutableArray.CreateBuilder<CatalogueRecord>(rows.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var entry = rows[i];
            string id = IdPrefix + (i + 1).ToString(CultureInfo.InvariantCulture).PadLeft(digits, '0');
            var samples = ImmutableArray.CreateBuilder<double>(entry.Members.Length * GalacticBinaryParameters.TableColumnNames.Length);
            foreach (var member in entry.Members) samples.AddRange(member.ToTableRow());
            records.Add(new CatalogueRecord(id, ClassId, entry.Confidence, entry.MedianSnr, GalacticBinaryParameters.TableColumnNames,
                [.. entry.Median.ToTableRow()], [.. entry.Lower.ToTableRow()], [.. entry.Upper.ToTableRow()], samples.MoveToImmutable())
            {
                Convergence = entry.Convergence,
            });
        }
        return records.MoveToImmutable();
    }

    private static double[] InversePsd(IPsdSource noise, AetChannel channel, BinWindow bins)
    {
        var weights = new double[bins.Count];
        Fitting.InversePsd.Fill(noise, channel, bins, weights);
        return weights;
    }
}
