using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public sealed class FastTemplateAccuracyTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(0.0)]
    [InlineData(0.2)]
    [InlineData(0.4)]
    public void Fast_template_matches_the_direct_path_over_one_month(double e0)
    {
        double duration = 30 * 86400.0, cadence = 10.0;
        var fast = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var direct = new ExtremeMassRatioInspiralDirectWaveform(fast.SampleCount, cadence);
        var (match, overlap, snrFast, snrDirect) = InspiralComparison.Compare(fast, direct, InspiralComparison.Source(e0));
        output.WriteLine($"e0={e0}: match {match:F5}, overlap {overlap:F5}, SNR fast {snrFast:F2} direct {snrDirect:F2}, harmonics {fast.LastHarmonicCount}, sidebands {fast.LastSidebandCount}, evaluations {fast.LastBinEvaluations}");
        Assert.True(match >= 0.99, $"match {match}");
    }
}

public sealed class FastTemplateYearTests(ITestOutputHelper output)
{
    [Theory]
    [InlineData(0.0)]
    public void Fast_template_matches_the_direct_path_over_one_year(double e0)
    {
        double duration = PhysicalConstants.JulianYearS, cadence = 10.0;
        var fast = new ExtremeMassRatioInspiralTemplateGenerator(duration, cadence);
        var direct = new ExtremeMassRatioInspiralDirectWaveform(fast.SampleCount, cadence);
        var watch = System.Diagnostics.Stopwatch.StartNew();
        var (match, overlap, snrFast, snrDirect) = InspiralComparison.Compare(fast, direct, InspiralComparison.Source(e0));
        output.WriteLine($"e0={e0}: match {match:F5}, overlap {overlap:F5}, SNR fast {snrFast:F2} direct {snrDirect:F2}, harmonics {fast.LastHarmonicCount}, sidebands {fast.LastSidebandCount}, evaluations {fast.LastBinEvaluations}, {watch.Elapsed.TotalSeconds:F1} s");
        Assert.True(match >= 0.99, $"match {match}");
    }
}
