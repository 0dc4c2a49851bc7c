using System.Text.RegularExpressions;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Inference.Tests.Guide;

// The worked example of DEVELOPERS.md "Plugging a model into the sampler", kept compiling and correct here.
// The text between the markers must appear verbatim in DEVELOPERS.md (checked below).
public class DevelopersGuideExampleTests
{
    // --- example start ---
    // A sinusoid of unknown amplitude and phase in white Gaussian noise of unit variance.
    public sealed class SinusoidModel(double[] data, double frequency) : ITargetModel
    {
        public ParameterSchema Schema { get; } = new(
        [
            new ParameterSpec("amplitude", "1", 0.0, 10.0, BoundaryKind.Reflect),
            new ParameterSpec("phase_rad", "rad", 0.0, 2 * Math.PI, BoundaryKind.Periodic),
        ]);

        // Uniform prior, normalised: the evidence and reversible jump need normalised priors.
        public double LogPrior(ReadOnlySpan<double> theta) =>
            theta[0] is >= 0 and <= 10 ? -Math.Log(10 * 2 * Math.PI) : double.NegativeInfinity;

        public void DrawFromPrior(Span<double> theta, ref RandomStream random)
        {
            theta[0] = random.NextUniform(0, 10);
            theta[1] = random.NextUniform(0, 2 * Math.PI);
        }

        // Deterministic in θ, never throws, and allocates nothing: it runs millions of times.
        public double LogLikelihood(ReadOnlySpan<double> theta)
        {
            double sum = 0;
            for (int i = 0; i < data.Length; i++)
            {
                double residual = data[i] - theta[0] * Math.Sin(frequency * i + theta[1]);
                sum += residual * residual;
            }
            return -0.5 * sum;
        }
    }

    public static (double MeanAmplitude, byte[] State) RunExample(double[] data)
    {
        var settings = new ParallelTemperingSettings
        {
            Tempering = new TemperingSettings { TemperatureCount = 4, MaxTemperature = 50 },
            Seed = 20261201,      // the run seed
            StreamId = 7,         // this worker's id: streams derive from (seed, worker, chain)
        };
        var sampler = new ParallelTemperingSampler<SinusoidModel>(new SinusoidModel(data, 0.3), settings);
        sampler.Advance(2_000);   // burn-in; an actor calls Advance(K) once per Gibbs iteration
        double sum = 0;
        for (int i = 0; i < 2_000; i++)
        {
            sampler.Advance(1);
            sum += sampler.Position(0)[0];   // chain 0 is a cold (β = 1) chain
        }
        byte[] state = SamplerStateSerializer.Serialize(sampler.CaptureState());   // checkpoint
        return (sum / 2_000, state);
    }
    // --- example end ---

    [Fact]
    public void Worked_example_recovers_the_injected_amplitude_and_resumes_bit_identically()
    {
        var noise = RandomStream.FromSeed(5);
        var data = new double[400];
        for (int i = 0; i < data.Length; i++) data[i] = 2.0 * Math.Sin(0.3 * i + 1.0) + noise.NextGaussian();
        var (mean, state) = RunExample(data);
        // Posterior sd of the amplitude is ≈ √(2/N) = 0.07 for unit noise; 0.35 is five posterior widths.
        Assert.InRange(mean, 2.0 - 0.35, 2.0 + 0.35);

        var settings = new ParallelTemperingSettings { Tempering = new TemperingSettings { TemperatureCount = 4, MaxTemperature = 50 }, Seed = 20261201, StreamId = 7 };
        var model = new SinusoidModel(data, 0.3);
        var a = ParallelTemperingSampler<SinusoidModel>.Resume(model, settings, SamplerStateSerializer.DeserializeParallelTempering(state));
        var b = ParallelTemperingSampler<SinusoidModel>.Resume(model, settings, SamplerStateSerializer.DeserializeParallelTempering(state));
        a.Advance(100);
        b.Advance(100);
        Assert.Equal(a.Position(0).ToArray(), b.Position(0).ToArray());
    }

    [Fact]
    public void Developers_guide_shows_this_example_verbatim()
    {
        string source = File.ReadAllText(SourcePath());
        var example = Regex.Match(source, "// --- example start ---\n(?<body>.*?)    // --- example end ---", RegexOptions.Singleline).Groups["body"].Value;
        string guide = File.ReadAllText(Path.Combine(RepositoryRoot(), "DEVELOPERS.md"));
        string dedented = string.Join('\n', example.Split('\n').Select(l => l.Length >= 4 ? l[4..] : l.TrimStart()));
        Assert.Contains(dedented.Trim(), guide);
    }

    private static string SourcePath([System.Runtime.CompilerServices.CallerFilePath] string path = "") => path;

    private static string RepositoryRoot()
    {
        var folder = new DirectoryInfo(Path.GetDirectoryName(SourcePath())!);
        while (!File.Exists(Path.Combine(folder.FullName, "globalfit.sln"))) folder = folder.Parent!;
        return folder.FullName;
    }
}
