using System.Numerics;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

/// <summary>The generator integrates a source's orbit once for consecutive requests of the same source (the segments of
/// a semi-coherent statistic); what it returns must not depend on what it built before.</summary>
public sealed class TemplateReuseTests
{
    [Fact]
    public void A_template_is_the_same_bit_for_bit_whatever_the_generator_built_before()
    {
        double duration = 20 * 86400.0, cadence = 20;
        var source = InspiralComparison.Source(0.2);
        var other = source with { CentralMassMsun = source.CentralMassMsun * 1.01, Eccentricity0 = 0.3 };
        var fresh = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var reused = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var window = fresh.TemplateBins(source);
        Complex[] Build(ExtremeMassRatioInspiralTemplateGenerator generator, in ExtremeMassRatioInspiralParameters p, double begin, double end)
        {
            var (a, e) = (new Complex[window.Count], new Complex[window.Count]);
            generator.AddSegmentResponse(p, begin, end, window, a, e);
            return [.. a, .. e];
        }
        var expected = Build(fresh, source, 0, duration / 2);
        // The same source after another one, and after a segment of itself (the cached orbit).
        Build(reused, other, 0, duration);
        Assert.Equal(expected, Build(reused, source, 0, duration / 2));
        Build(reused, source, duration / 2, duration);
        Assert.Equal(expected, Build(reused, source, 0, duration / 2));
        // Invalid parameters are still refused after a cached source, and leave no stale orbit behind.
        Assert.Throws<ArgumentOutOfRangeException>(() => Build(reused, source with { Eccentricity0 = 1.5 }, 0, duration));
        Assert.Equal(expected, Build(reused, source, 0, duration / 2));
    }
}
