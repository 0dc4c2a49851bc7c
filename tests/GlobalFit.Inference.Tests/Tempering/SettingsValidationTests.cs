using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Tempering;
using GlobalFit.Inference.Tests.Support;
using GlobalFit.Inference.Transdimensional;

namespace GlobalFit.Inference.Tests.Tempering;

public sealed class SettingsValidationTests
{
    public static TheoryData<string, ParallelTemperingSettings> BadParallelTemperingSettings => new()
    {
        { "TemperatureCount", new ParallelTemperingSettings { Tempering = new TemperingSettings { TemperatureCount = 0 } } },
        { "ChainsPerTemperature", new ParallelTemperingSettings { Tempering = new TemperingSettings { ChainsPerTemperature = 0 } } },
        { "MaxTemperature", new ParallelTemperingSettings { Tempering = new TemperingSettings { TemperatureCount = 3, MaxTemperature = 0.5 } } },
        { "SwapInterval", new ParallelTemperingSettings { Tempering = new TemperingSettings { SwapInterval = 0 } } },
        { "AdaptationLag", new ParallelTemperingSettings { Tempering = new TemperingSettings { AdaptationLag = -1 } } },
        { "Proposals", new ParallelTemperingSettings { Proposals = [] } },
        { "Proposals", new ParallelTemperingSettings { Proposals = [ProposalSpec.AdaptiveGaussian(-1.0)] } },
        { "Proposals", new ParallelTemperingSettings { Proposals = [ProposalSpec.AdaptiveGaussian(0.0)] } },
    };

    [Theory]
    [MemberData(nameof(BadParallelTemperingSettings))]
    public void Bad_parallel_tempering_settings_throw_naming_the_field(string field, ParallelTemperingSettings settings)
    {
        var exception = Assert.Throws<ArgumentException>(() => new ParallelTemperingSampler<BananaModel>(new BananaModel(), settings));
        Assert.Equal(field, exception.ParamName);
    }

    [Theory]
    [InlineData("MaxSources", -1, 0, 0.2)]
    [InlineData("InitialSourceCount", 2, 3, 0.2)]
    [InlineData("JumpProbability", 2, 0, 1.5)]
    public void Bad_reversible_jump_settings_throw_naming_the_field(string field, int maxSources, int initial, double jumpProbability)
    {
        var model = new LinearBumpsModel(2, 1.0, 1.0, 1.0, 0.0, 1);
        var settings = new ReversibleJumpSettings { MaxSources = maxSources, InitialSourceCount = initial, JumpProbability = jumpProbability };
        var exception = Assert.Throws<ArgumentException>(() =>
            new ReversibleJumpSampler<LinearBumpsModel>(model, new PriorBirthDensity(model.SourcePrior), settings));
        Assert.Equal(field, exception.ParamName);
    }
}
