using GlobalFit.Inference.Diagnostics;

namespace GlobalFit.Inference.Tests.Diagnostics;

public class SamplerStatisticsTests
{
    [Fact]
    public void Cold_acceptance_pools_every_proposal_of_the_cold_rung_only()
    {
        var statistics = new SamplerStatistics(10, [1.0, 0.5],
            [new ProposalAcceptance("fisher", 0, 30, 12), new ProposalAcceptance("de", 0, 10, 2), new ProposalAcceptance("fisher", 1, 40, 40)],
            [0.3], [0.0, 0.0]);
        Assert.Equal(14.0 / 40.0, statistics.ColdAcceptanceRate, 15); // (12 + 2) / (30 + 10); the hot rung's 40/40 left out
    }

    [Fact]
    public void Cold_acceptance_is_zero_before_any_proposal()
    {
        Assert.Equal(0.0, new SamplerStatistics(0, [1.0], [], [], [0.0]).ColdAcceptanceRate);
    }
}
