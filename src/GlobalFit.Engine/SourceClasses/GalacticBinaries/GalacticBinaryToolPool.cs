using System.Collections.Concurrent;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Template generators and F-statistics (with their scratch buffers, about 0.6 MB a pair at the default
/// envelope lengths) lent to band workers for the length of one call, so a fit holds one pair per thread that is
/// computing rather than one per window: a year-long fit of a thousand windows saves about 0.6 GB.</summary>
/// <remarks>A pair holds no state that outlives a call (the coarse geometry it shares is immutable), so which pair a
/// worker gets does not change its results. Thread-safe.</remarks>
public sealed class GalacticBinaryToolPool
{
    private readonly GalacticBinaryTemplateGenerator _prototype;
    private readonly ConcurrentBag<GalacticBinaryTools> _idle = [];

    /// <summary>Creates a pool for the record of <paramref name="generator"/>, which becomes its first pair.</summary>
    /// <param name="generator">A generator for the data record.</param>
    public GalacticBinaryToolPool(GalacticBinaryTemplateGenerator generator)
    {
        _prototype = generator ?? throw new ArgumentNullException(nameof(generator));
        _idle.Add(new GalacticBinaryTools(generator));
    }

    /// <summary>Bin spacing of the record.</summary>
    /// <value>Hz.</value>
    public double FrequencyResolutionHz => _prototype.FrequencyResolutionHz;

    /// <summary>Borrows a pair until the lease is disposed; makes a new one when all are lent.</summary>
    public Lease Rent() => new(this, _idle.TryTake(out var tools) ? tools : new GalacticBinaryTools(_prototype.WithOwnBuffers()));

    /// <summary>A borrowed pair; dispose it to give it back.</summary>
    public readonly struct Lease : IDisposable
    {
        private readonly GalacticBinaryToolPool _pool;
        private readonly GalacticBinaryTools _tools;

        internal Lease(GalacticBinaryToolPool pool, GalacticBinaryTools tools)
        {
            _pool = pool;
            _tools = tools;
        }

        /// <summary>The generator.</summary>
        public GalacticBinaryTemplateGenerator Generator => _tools.Generator;

        /// <summary>The F-statistic over the same generator.</summary>
        public FStatistic Statistic => _tools.Statistic;

        /// <inheritdoc />
        public void Dispose() => _pool._idle.Add(_tools);
    }
}

/// <summary>A template generator and the F-statistic that uses it.</summary>
internal sealed class GalacticBinaryTools(GalacticBinaryTemplateGenerator generator)
{
    public GalacticBinaryTemplateGenerator Generator { get; } = generator;

    public FStatistic Statistic { get; } = new(generator);
}
