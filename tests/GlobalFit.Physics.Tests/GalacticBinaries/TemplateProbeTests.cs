using GlobalFit.Physics.GalacticBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public sealed class TemplateProbeTests(ITestOutputHelper output)
{
    [Fact]
    public void Probe_reports_a_positive_rate_and_a_large_speedup()
    {
        // Smoke test of the bench probe (timings on a shared machine are not asserted beyond sanity): the fast
        // template must beat the year-long brute force by at least a factor 1000 (measured ~1e6).
        var measurement = GalacticBinaryTemplateProbe.Measure(seconds: 0.2);
        output.WriteLine($"N = {measurement.EnvelopeLength}, {measurement.LikelihoodsPerSecond:F0} likelihoods/s, brute-force day {measurement.BruteForceSeconds:F3} s, speedup {measurement.SpeedupOverBruteForce:E2}");
        Assert.Equal(64, measurement.EnvelopeLength);
        Assert.True(measurement.LikelihoodsPerSecond > 0);
        Assert.True(measurement.SpeedupOverBruteForce > 1000);
    }
}
