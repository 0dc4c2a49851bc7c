using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Tests.Support;
using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Inference.Tests.State;

public sealed class ResumeTests
{
    [Fact]
    public void Parallel_tempering_resumed_from_serialised_state_continues_bit_identically()
    {
        var model = new BananaModel();
        var fisher = new GaussianTarget([1.0, 1.5], MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseIdentity(2), -10, 12);
        var settings = new ParallelTemperingSettings
        {
            Proposals = [.. ProposalSpec.DefaultMixture(), ProposalSpec.FisherEigen(0.2, fisher, refreshInterval: 50)],
            Tempering = new TemperingSettings { TemperatureCount = 3, ChainsPerTemperature = 2, MaxTemperature = 30.0, AdaptationLag = 50, AdaptationTime = 10 },
            Seed = 501,
            StreamId = 3,
        };
        const int n = 1_500;

        var straight = new ParallelTemperingSampler<BananaModel>(model, settings);
        straight.Advance(2 * n);

        var first = new ParallelTemperingSampler<BananaModel>(model, settings);
        first.Advance(n);
        byte[] bytes = SamplerStateSerializer.Serialize(first.CaptureState());
        var resumed = ParallelTemperingSampler<BananaModel>.Resume(model, settings, SamplerStateSerializer.DeserializeParallelTempering(bytes));
        resumed.Advance(n);

        Assert.Equal(straight.Step, resumed.Step);
        Assert.Equal(straight.InverseTemperatures.ToArray(), resumed.InverseTemperatures.ToArray());
        for (int c = 0; c < straight.ChainCount; c++)
        {
            Assert.Equal(straight.Position(c).ToArray(), resumed.Position(c).ToArray());
            Assert.Equal(straight.LogLikelihood(c), resumed.LogLikelihood(c));
            Assert.Equal(straight.ChainRandom(c), resumed.ChainRandom(c));
        }

        Assert.Equal(SamplerStateSerializer.Serialize(straight.CaptureState()), SamplerStateSerializer.Serialize(resumed.CaptureState()));
    }

    [Fact]
    public void Reversible_jump_resumed_from_serialised_state_continues_bit_identically()
    {
        var model = new LinearBumpsModel(maxSources: 4, amplitudeSigma: 1.0, noiseSigma: 1.0, trueA: 1.2, trueB: -0.5, seed: 77);
        var birth = new PriorBirthDensity(model.SourcePrior);
        var settings = new ReversibleJumpSettings
        {
            MaxSources = 4,
            InitialSourceCount = 1,
            Tempering = new TemperingSettings { TemperatureCount = 3, ChainsPerTemperature = 2, MaxTemperature = 10.0 },
            Seed = 502,
        };
        const int n = 2_000;

        var straight = new ReversibleJumpSampler<LinearBumpsModel>(model, birth, settings);
        straight.Advance(2 * n);

        var first = new ReversibleJumpSampler<LinearBumpsModel>(model, birth, settings);
        first.Advance(n);
        byte[] bytes = SamplerStateSerializer.Serialize(first.CaptureState());
        var resumed = ReversibleJumpSampler<LinearBumpsModel>.Resume(model, birth, settings, SamplerStateSerializer.DeserializeReversibleJump(bytes));
        resumed.Advance(n);

        for (int c = 0; c < straight.ChainCount; c++)
        {
            Assert.Equal(straight.SourceCount(c), resumed.SourceCount(c));
            Assert.Equal(straight.Sources(c).ToArray(), resumed.Sources(c).ToArray());
            Assert.Equal(straight.ChainRandom(c), resumed.ChainRandom(c));
        }

        Assert.Equal(SamplerStateSerializer.Serialize(straight.CaptureState()), SamplerStateSerializer.Serialize(resumed.CaptureState()));
    }
}
