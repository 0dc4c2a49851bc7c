using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class TemplateGeneratorTests
{
    private static readonly MassiveBlackHoleBinaryParameters Source = new(4e5, 2, 0.3, 0.1, 1e6, 2e4, 0.5, 2.0, 0.7, 0.9, 1.4);

    [Fact]
    public void Added_response_is_the_rendered_response_on_top_of_what_was_there()
    {
        var generator = new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), 64);
        var window = new BinWindow(0, 64);
        const double df = 1e-4;
        var rendered = new[] { new Complex[64], new Complex[64], new Complex[64] };
        generator.RenderBins(Source, window, df, rendered[0], rendered[1], rendered[2]);
        var sum = new[] { new Complex[64], new Complex[64], new Complex[64] };
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < 64; k++) sum[c][k] = 2.0 * rendered[c][k];
        generator.AddResponse(Source, window, df, sum[0], sum[1], sum[2]);
        for (int c = 0; c < 3; c++)
            for (int k = 0; k < 64; k++)
                Assert.True((sum[c][k] - 3.0 * rendered[c][k]).Magnitude <= 1e-14 * rendered[c][k].Magnitude);
        Assert.Equal(Complex.Zero, rendered[0][0]);
    }

    [Fact]
    public void Frequencies_emitted_before_the_data_start_are_zero()
    {
        // t(f) < EarliestTimeS at 1e-5 Hz for a source merging 1e6 s in (its chirp time there is years).
        var generator = new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), 2, earliestTimeS: 0.0);
        var a = new Complex[2];
        var e = new Complex[2];
        generator.Render(Source, [1e-5, 5e-3], a, e, Span<Complex>.Empty);
        Assert.Equal(Complex.Zero, a[0]);
        Assert.NotEqual(Complex.Zero, a[1]);
    }

    [Fact]
    public void Too_many_frequencies_are_refused()
    {
        var generator = new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), 2);
        Assert.Throws<ArgumentException>(() => generator.Render(Source, [1e-3, 2e-3, 3e-3], new Complex[3], new Complex[3], Span<Complex>.Empty));
        Assert.Throws<ArgumentOutOfRangeException>(() => new MassiveBlackHoleBinaryTemplateGenerator(new RigidOrbits(), 0));
    }
}
