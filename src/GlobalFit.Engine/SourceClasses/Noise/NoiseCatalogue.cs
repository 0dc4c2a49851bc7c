using System.Collections.Immutable;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise worker's posterior (instrument levels and foreground amplitude) as one catalogue row with id
/// <c>noise</c>, so that every export carries it beside the sources: confidence 1 (the noise is always there), SNR NaN,
/// medians and 5 %/95 % quantiles of each column, and every sample after the burn-in.</summary>
/// <remarks>Quantiles as the galactic-binary catalogue computes them: linear interpolation between order statistics
/// (position q·(n − 1) in the sorted samples). No row when no sample lies after the burn-in.</remarks>
internal sealed class NoiseCatalogue(long burnInIterations) : IClassCatalogue
{
    private readonly List<double> _values = [];
    private ImmutableArray<string> _names = [];

    public void Add(SampleBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        if (block.ClassId != NoiseClass.Id)
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: a block of class '{block.ClassId}' cannot join the noise posterior", nameof(block));
        if (block.Iteration <= burnInIterations) return;
        if (_names.IsDefaultOrEmpty) _names = [.. block.ParameterNames];
        else if (!_names.SequenceEqual(block.ParameterNames))
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: columns {string.Join(", ", block.ParameterNames)} differ from the earlier {string.Join(", ", _names)}", nameof(block));
        _values.AddRange(block.Values);
    }

    public ImmutableArray<CatalogueRecord> Build()
    {
        int width = _names.IsDefaultOrEmpty ? 0 : _names.Length;
        if (width == 0 || _values.Count == 0) return [];
        int count = _values.Count / width;
        var median = new double[width];
        var lower = new double[width];
        var upper = new double[width];
        var column = new double[count];
        for (int c = 0; c < width; c++)
        {
            for (int s = 0; s < count; s++) column[s] = _values[s * width + c];
            Array.Sort(column);
            median[c] = Quantile(column, 0.5);
            lower[c] = Quantile(column, 0.05);
            upper[c] = Quantile(column, 0.95);
        }
        return [new CatalogueRecord(NoiseClass.Id, NoiseClass.Id, 1.0, double.NaN, _names, [.. median], [.. lower], [.. upper], [.. _values])];
    }

    private static double Quantile(double[] sorted, double q)
    {
        double position = q * (sorted.Length - 1);
        int below = (int)Math.Floor(position);
        int above = Math.Min(below + 1, sorted.Length - 1);
        return sorted[below] + (position - below) * (sorted[above] - sorted[below]);
    }
}
