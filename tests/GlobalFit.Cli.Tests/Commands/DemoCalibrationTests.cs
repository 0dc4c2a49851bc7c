using System.Text.Json;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

public class DemoCalibrationTests
{
    // The demo's own seeds (data 20261201, fit 7), its full 24 iterations: every galactic binary the catalogue matches to an
    // injection lies within 5 posterior σ of it in every parameter, and each parameter's 90 % interval covers at least 80 %
    // of the found truths. The run is deterministic (fixed seeds; results do not depend on thread timing, see
    // DEVELOPERS.md), so this test has no random false failures: it fails only when the code changes the result. As a
    // statistical statement the bounds are loose: for ~40 sources with true 90 % intervals, coverage below 0.8 has
    // binomial probability about 3 %, and |z| > 5 for a Gaussian posterior about 6e-7 per value (320 values: 2e-4).
    // Long: the demo takes 2–5 minutes on 2 cores.
    // Not met yet, so skipped rather than left failing: measured with the defaults of this commit (Doppler sky jump, galaxy
    // sky prior, 900 steps), 42 found, 90 % coverage f0 0.74, amplitude 0.79, beta 0.79, lambda 0.79, iota 0.69 (fdot 1.00,
    // psi and phi0 0.93), six sources beyond 5 σ (SNR 4.7–22, largest 27 σ), split R-hat up to 1.9 and bulk ESS of f0
    // ~12 in 1440 samples: the chains have not converged along the one-month Doppler ridge.
    [Fact(Skip = "not met yet: coverage 0.69-0.79 and six sources beyond 5 sigma on the demo's seed (see comment)")]
    [Trait("Category", "Long")]
    public void The_demo_catalogue_of_galactic_binaries_is_calibrated()
    {
        using var folder = new TempFolder();
        string demo = folder.File("demo");
        Assert.Equal(0, CliRun.Run("demo", "--out", demo).ExitCode);
        var compare = CliRun.Run("compare", Path.Combine(demo, "run"), "--truth", Path.Combine(demo, "data.h5"), "--json");
        Assert.Equal(0, compare.ExitCode);
        using var document = JsonDocument.Parse(compare.Out);
        var binaries = document.RootElement.GetProperty("classes").EnumerateArray().Single(c => c.GetProperty("class").GetString() == "galactic_binaries");
        Assert.True(binaries.GetProperty("found").GetArrayLength() >= 20);
        foreach (var found in binaries.GetProperty("found").EnumerateArray())
            foreach (var error in found.GetProperty("errors_in_sigma").EnumerateObject())
                if (error.Value.ValueKind == JsonValueKind.Number)
                    Assert.True(Math.Abs(error.Value.GetDouble()) <= 5,
                        $"{found.GetProperty("truth_id").GetString()} {error.Name}: {error.Value.GetDouble():F1} σ");
        foreach (var coverage in binaries.GetProperty("coverage").EnumerateArray())
            Assert.True(coverage.GetProperty("fraction").GetDouble() >= 0.8,
                $"{coverage.GetProperty("parameter").GetString()} coverage {coverage.GetProperty("fraction").GetDouble():F2}");
    }
}
