using System.Text.RegularExpressions;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Engine.SourceClasses.Noise;
using GlobalFit.Engine.Tests.Runs;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Engine.Tests.Guide;

/// <summary>The "add a source class" example of DEVELOPERS.md, registered through a <see cref="SourceClassRegistry"/> like
/// the real classes, simulated, fitted with the noise worker by the real runner and catalogued.</summary>
public sealed class AddSourceClassExampleTests : IDisposable
{
    private const int FirstBin = 40;
    private const int Spacing = 50;
    private static readonly SourceClassRegistry Registry = new([new SpectralLineClass(), new NoiseClass()]);
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "globalfit-guide-" + Guid.NewGuid().ToString("N"));

    public AddSourceClassExampleTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void A_class_registered_once_is_simulated_fitted_and_catalogued_with_the_truth_inside_its_intervals()
    {
        // Two days at 10 s: Δf = 5.8 µHz, so bins 40 and 90 lie at 0.23 and 0.52 mHz. Each line gets SNR 25 against the
        // scenario's instrument noise (no foreground), with its phase set by hand.
        const double durationS = 2 * 86_400, cadenceS = 10;
        double df = 1 / (Math.Floor(durationS / cadenceS) * cadenceS);
        var noise = new AetNoiseModel(InstrumentNoiseSettings.Default);
        (double Re, double Im) Line(int bin, double phase)
        {
            double f = bin * df;
            double magnitude = 25 / Math.Sqrt(4 * df * (1 / noise.Psd(AetChannel.A, f) + 1 / noise.Psd(AetChannel.E, f)));
            return (magnitude * Math.Cos(phase), magnitude * Math.Sin(phase));
        }
        var lines = new[] { (Bin: FirstBin, Value: Line(FirstBin, 0.7)), (Bin: FirstBin + Spacing, Value: Line(FirstBin + Spacing, -2.1)) };
        string scenario = $"""
            name = "two spectral lines"
            seed = 5
            [observation]
            duration_s = {durationS}
            cadence_s = {cadenceS}
            [noise.foreground]
            enabled = false
            """ + string.Concat(lines.Select((l, i) => $"""

            [[spectral_lines.line]]
            id = "line-{i}"
            bin = {l.Bin}
            re_s = {TomlText.Number(l.Value.Re)}
            im_s = {TomlText.Number(l.Value.Im)}
            """));
        string data = Path.Combine(_folder, "data.h5");
        var parsed = Registry.ReadScenario(ConfigDocument.Parse(scenario, "scenario"));
        ObservationFile.Write(ObservationSimulator.Simulate(parsed, "globalfit tests", new Dictionary<string, string>(), null), data, overwrite: false);
        var truth = ObservationFile.Read(data).FindTruth(SpectralLineClass.Id);
        Assert.NotNull(truth);
        Assert.Equal(25.0, truth[0, "snr"], 9); // the injection's SNR is the one asked for

        string config = Path.Combine(_folder, "fit.toml");
        File.WriteAllText(config, $"""
            data = "data.h5"
            run_folder = "run"
            seed = 3
            iterations = 6
            burn_in = 2
            [spectral_lines]
            first_bin = {FirstBin}
            count = 2
            spacing_bins = {Spacing}
            steps_per_update = 300
            [noise]
            steps_per_update = 10
            [noise.foreground]
            enabled = false
            """);
        var outcome = FitRunner.Start(config, new FitRunOptions(new CollectingProgress(), null, CancellationToken.None) { Registry = Registry });

        Assert.Equal(FitOutcomeKind.Completed, outcome.Kind);
        var rows = outcome.Catalogue.Where(r => r.ClassId == SpectralLineClass.Id).ToList();
        Assert.Equal(2, rows.Count);
        for (int i = 0; i < 2; i++)
        {
            Assert.Equal(lines[i].Bin, rows[i].Median[0]);
            foreach (var (column, value) in new[] { (1, lines[i].Value.Re), (2, lines[i].Value.Im) })
            {
                // σ from the 90 % interval (width 3.29σ for a Gaussian posterior, which this one is exactly); 4σ leaves a
                // false-failure rate of about 4 × 6e-5 over the four checks for a calibrated posterior.
                double sigma = (rows[i].Upper[column] - rows[i].Lower[column]) / 3.29;
                Assert.InRange(value, rows[i].Median[column] - 4 * sigma, rows[i].Median[column] + 4 * sigma);
            }
        }
        string resolved = File.ReadAllText(Path.Combine(_folder, "run", "run.toml"));
        Assert.Contains("[spectral_lines]", resolved, StringComparison.Ordinal);
        Assert.Contains("spectral_lines", File.ReadAllText(Path.Combine(_folder, "run", "catalogue.csv")), StringComparison.Ordinal);
    }

    [Fact]
    public void A_section_of_a_class_the_registry_lacks_is_an_unknown_key()
    {
        string config = Path.Combine(_folder, "fit.toml");
        File.WriteAllText(config, "data = \"data.h5\"\nrun_folder = \"run\"\n[spectral_lines]\ncount = 1\n");
        var root = ConfigDocument.Load(config);
        var shape = new GlobalFit.Engine.Fitting.FitDataShape("data.h5", 1000, 10, 0);
        var error = Assert.Throws<Physics.Files.InvalidInputException>(() => { RunPlan.FromConfig(root, _folder, shape, SourceClassRegistry.Default); });
        Assert.Contains("spectral_lines", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Developers_guide_shows_this_example_verbatim()
    {
        string source = File.ReadAllText(Path.Combine(Path.GetDirectoryName(SourcePath())!, "SpectralLineClass.cs"));
        string example = Regex.Match(source, "// --- example start ---\n(?<body>.*?)// --- example end ---", RegexOptions.Singleline).Groups["body"].Value;
        Assert.NotEmpty(example);
        string guide = File.ReadAllText(Path.Combine(RepositoryRoot(), "DEVELOPERS.md"));
        Assert.Contains(example.Trim(), guide, StringComparison.Ordinal);
    }

    private static string SourcePath([System.Runtime.CompilerServices.CallerFilePath] string path = "") => path;

    private static string RepositoryRoot()
    {
        var folder = new DirectoryInfo(Path.GetDirectoryName(SourcePath())!);
        while (!File.Exists(Path.Combine(folder.FullName, "globalfit.sln"))) folder = folder.Parent!;
        return folder.FullName;
    }
}
