using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;
using PureHDF;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

/// <summary>The accepted alternative input forms: Michelson X/Y/Z channels, and an explicit time_s axis instead of dt.</summary>
public class ObservationFileAlternativeInputTests
{
    private static string WriteTree(TempFolder folder, H5File tree)
    {
        string path = folder.File("alt.h5");
        tree.Write(path);
        return path;
    }

    [Fact]
    public void Michelson_channels_are_converted_to_aet_on_read()
    {
        // Source: A = (Z − X)/√2, E = (X − 2Y + Z)/√6, T = (X + Y + Z)/√3 (TdiCombination; Prince et al. 2002
        // pattern), evaluated by hand for round inputs. 1e-15 relative: one or two roundings.
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 3, channels: "XYZ");
        tree.Tdi()["X"] = new[] { 1.0, 0.0, 2e-21 };
        tree.Tdi()["Y"] = new[] { 2.0, 1.0, -1e-21 };
        tree.Tdi()["Z"] = new[] { 4.0, 0.0, 2e-21 };

        var data = ObservationFile.Read(WriteTree(folder, tree)).Data;

        double[] expectedA = [3 / Math.Sqrt(2), 0.0, 0.0];
        double[] expectedE = [1 / Math.Sqrt(6), -2 / Math.Sqrt(6), 6e-21 / Math.Sqrt(6)];
        double[] expectedT = [7 / Math.Sqrt(3), 1 / Math.Sqrt(3), 3e-21 / Math.Sqrt(3)];
        Assert.Equal(2.1213203435596424, data.A.Samples[0], 1e-15);
        Assert.Equal(0.40824829046386302, data.E.Samples[0], 1e-15);
        Assert.Equal(4.0414518843273806, data.T.Samples[0], 1e-15);
        for (int i = 0; i < 3; i++)
        {
            Assert.Equal(expectedA[i], data.A.Samples[i], Math.Abs(expectedA[i]) * 1e-15);
            Assert.Equal(expectedE[i], data.E.Samples[i], Math.Abs(expectedE[i]) * 1e-15);
            Assert.Equal(expectedT[i], data.T.Samples[i], Math.Abs(expectedT[i]) * 1e-15);
        }
    }

    [Fact]
    public void Michelson_conversion_on_read_matches_the_tdi_combination_sample_by_sample()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 32, channels: "XYZ");
        var x = (double[])tree.Tdi()["X"];
        var y = (double[])tree.Tdi()["Y"];
        var z = (double[])tree.Tdi()["Z"];
        // The extreme values in the sample fixture overflow A/E/T; ordinary values are what is checked here.
        for (int i = 0; i < 32; i++) (x[i], y[i], z[i]) = (1e-20 * Math.Sin(i), 1e-20 * Math.Cos(0.7 * i), 1e-20 * Math.Sin(1.3 * i + 0.2));

        var observation = ObservationFile.Read(WriteTree(folder, tree));

        for (int i = 0; i < 32; i++)
        {
            var (a, e, t) = TdiCombination.AetFromXyz(x[i], y[i], z[i]);
            Assert.Equal(a, observation.Data.A.Samples[i]);
            Assert.Equal(e, observation.Data.E.Samples[i]);
            Assert.Equal(t, observation.Data.T.Samples[i]);
            // Identity: the three coefficient rows are orthonormal, so the map preserves X² + Y² + Z².
            // 4e-15 relative: about ten roundings (coefficients, products, sums) of 2.2e-16 each, worst case.
            double before = x[i] * x[i] + y[i] * y[i] + z[i] * z[i];
            Assert.Equal(before, a * a + e * e + t * t, before * 4e-15);
        }
        Assert.Equal("XYZ", ObservationFile.ReadSummary(folder.File("alt.h5")).StoredChannels);
    }

    [Fact]
    public void Explicit_uniform_time_stamps_give_start_time_and_cadence()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("t0_s");
        tree.Tdi().Attributes.Remove("dt_s");
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => 1.9e9 + 0.25 * n).ToArray();

        var data = ObservationFile.Read(WriteTree(folder, tree)).Data;

        Assert.Equal(1.9e9, data.T0Seconds);
        // (t_last − t_0)/15 with both stamps exact in binary: the cadence comes out exact.
        Assert.Equal(0.25, data.DtSeconds);
    }

    [Fact]
    public void Time_stamps_with_rounding_jitter_below_the_tolerance_are_accepted()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("dt_s");
        var stamps = Enumerable.Range(0, 16).Select(n => 1000.0 + 5.0 * n).ToArray();
        stamps[7] += 2e-6; // 4e-7 of the cadence: inside the 1e-6 relative tolerance
        tree.Tdi()["time_s"] = stamps;

        var data = ObservationFile.Read(WriteTree(folder, tree)).Data;

        Assert.Equal(5.0, data.DtSeconds);
        Assert.Equal(1000.0, data.T0Seconds);
    }

    [Fact]
    public void Non_uniform_time_stamps_are_reported_at_the_first_offending_sample()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("t0_s");
        tree.Tdi().Attributes.Remove("dt_s");
        var stamps = Enumerable.Range(0, 16).Select(n => 1000.0 + 5.0 * n).ToArray();
        stamps[9] += 0.5;
        stamps[12] += 0.5;
        tree.Tdi()["time_s"] = stamps;

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s sample 9", "the time axis is not uniform");
    }

    [Fact]
    public void Slow_drift_in_time_stamps_is_caught_even_though_each_step_looks_fine()
    {
        // Stamps bow away from the straight line through the end points by c·n(15 − n), c = 2e-7 s: consecutive
        // steps differ by only 2c = 8e-8 of the cadence, but the bow reaches c·26 = 5.2e-6 s at n = 2, just above
        // the 1e-6 × 5 s tolerance (the 4-ulp rounding allowance at 1075 s is 9e-13 s).
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("dt_s");
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => 1000.0 + 5.0 * n + 2e-7 * n * (15 - n)).ToArray();

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s sample 2", "the time axis is not uniform");
    }

    [Fact]
    public void Non_finite_time_stamp_is_reported_at_its_index()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("dt_s");
        var stamps = Enumerable.Range(0, 16).Select(n => 5.0 * n).ToArray();
        stamps[15] = double.NaN;
        tree.Tdi()["time_s"] = stamps;

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s sample 15", "time stamp is NaN");
    }

    [Fact]
    public void Decreasing_time_stamps_are_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi().Attributes.Remove("dt_s");
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => -5.0 * n).ToArray();

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s", "time stamps do not increase");
    }

    [Fact]
    public void Time_stamps_of_the_wrong_length_are_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16);
        tree.Tdi()["time_s"] = Enumerable.Range(0, 15).Select(n => 1000.0 + 5.0 * n).ToArray();

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s", "has 15 time stamps for 16 samples");
    }

    [Fact]
    public void Single_sample_with_time_stamps_cannot_define_a_cadence()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 1);
        tree.Tdi().Attributes.Remove("dt_s");
        tree.Tdi()["time_s"] = new[] { 1000.0 };

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi/time_s", "at least two are needed");
    }

    [Fact]
    public void Cadence_attribute_that_disagrees_with_time_stamps_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16); // dt_s = 5
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => 1000.0 + 10.0 * n).ToArray();

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute dt_s", "is 5 s but the spacing of /tdi/time_s is 10 s");
    }

    [Fact]
    public void Start_time_attribute_that_disagrees_with_time_stamps_is_reported()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16); // t0_s = 1000
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => 2000.0 + 5.0 * n).ToArray();

        BadInputAssert.Read(WriteTree(folder, tree), "/tdi attribute t0_s", "is 1000 s but /tdi/time_s starts at 2000 s");
    }

    [Fact]
    public void Consistent_time_stamps_and_attributes_are_accepted_together()
    {
        using var folder = new TempFolder();
        var tree = ObservationSamples.ValidTree(count: 16); // t0_s = 1000, dt_s = 5
        tree.Tdi()["time_s"] = Enumerable.Range(0, 16).Select(n => 1000.0 + 5.0 * n).ToArray();

        var data = ObservationFile.Read(WriteTree(folder, tree)).Data;

        Assert.Equal((1000.0, 5.0), (data.T0Seconds, data.DtSeconds));
    }
}
