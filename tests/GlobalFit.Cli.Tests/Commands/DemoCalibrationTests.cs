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
    // Not met yet, so skipped rather than left failing. Measured with the defaults of this commit (Doppler sky jump, galaxy
    // sky prior, 8 rungs up to temperature 10, 600 steps per update): 39 found, 0 spurious, 90 % coverage f0 0.77,
    // amplitude 0.72, beta 0.90, lambda 0.85, iota 0.74, fdot 1.00, psi 0.92, phi0 0.90; three sources beyond 5 σ: an
    // SNR-7.5 binary far from the Galactic centre held in the centre-side mode of its ridge (f0 +14 σ, lambda −17 σ), an
    // SNR-22 binary held in the ecliptic mirror of its true sky (beta −17 σ), an SNR-8 one at iota −5.4 σ; split R-hat
    // up to 1.5, median bulk ESS of f0 24 in 960 samples. Before this work: 21 of 37 sources beyond 5 σ, f0 coverage 0.30.
    [Fact(Skip = "not met yet: coverage 0.72-0.77 in three parameters and three sources beyond 5 sigma on the demo's seed (see comment)")]
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
