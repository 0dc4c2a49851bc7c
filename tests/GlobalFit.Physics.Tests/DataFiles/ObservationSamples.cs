using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;
using PureHDF;

namespace GlobalFit.Physics.Tests.DataFiles;

/// <summary>Small observations and hand-built HDF5 trees used across the data-file tests.</summary>
internal static class ObservationSamples
{
    public const double T0Seconds = 1_000.0;
    public const double DtSeconds = 5.0;

    /// <summary>Deterministic, awkward-but-finite samples: signed zeros, subnormals, extremes and ordinary values.</summary>
    public static double[] Channel(int count, int salt)
    {
        var special = new[] { -0.0, double.Epsilon, -double.MaxValue, double.MaxValue, 1e-21, -3.5e-20 };
        var random = new Random(1234 + salt);
        var samples = new double[count];
        for (int i = 0; i < count; i++)
            samples[i] = i < special.Length ? special[(i + salt) % special.Length] : (random.NextDouble() - 0.5) * 1e-20;
        return samples;
    }

    public static AetTimeSeries Data(int count) => new(
        new TimeSeries(T0Seconds, DtSeconds, Channel(count, 0)),
        new TimeSeries(T0Seconds, DtSeconds, Channel(count, 1)),
        new TimeSeries(T0Seconds, DtSeconds, Channel(count, 2)));

    public static TruthTable GalacticBinaries() => new(
        "galactic_binaries",
        ["f0_hz", "fdot_hz_s", "amplitude", "beta_rad", "lambda_rad", "iota_rad", "psi_rad", "phi0_rad", "snr"],
        ["gb-0001", "gb-0002"],
        [
            3.1e-3, 1.2e-17, 2.5e-22, 0.3, 1.7, 0.9, 0.4, 2.2, 15.5,
            4.7e-3, -3e-18, 7.0e-23, -0.8, 5.9, 2.1, 1.3, 0.1, double.NaN,
        ]);

    public static TruthTable EmptyMassiveBlackHoles() => new("massive_black_hole_binaries", ["mchirp_msun", "q", "snr"], [], []);

    public static ObservationProvenance Provenance() => new(
        "globalfit 0.1.0-test",
        new DateTimeOffset(2026, 12, 1, 22, 5, 7, TimeSpan.Zero).AddTicks(1234567),
        new Dictionary<string, string>
        {
            ["scenario"] = "two-binaries µHz–mHz",
            ["seed"] = "42",
            ["command_line"] = "globalfit simulate --config \"a b.toml\"",
            ["note"] = "",
        });

    public static Observation Observation(int count = 64) => new(
        Data(count),
        new GapList([new Gap(T0Seconds + 20, T0Seconds + 42.5), new Gap(T0Seconds + 100, T0Seconds + 150)]),
        [GalacticBinaries(), EmptyMassiveBlackHoles()],
        Provenance());

    /// <summary>The HDF5 tree of a valid version-1 file with <paramref name="count"/> samples per channel,
    /// built by hand (not by the writer) so tests can break one piece at a time.</summary>
    public static H5File ValidTree(int count = 16, string channels = "AET")
    {
        var tdi = new H5Group
        {
            Attributes =
            {
                ["t0_s"] = T0Seconds,
                ["dt_s"] = DtSeconds,
                ["units"] = "fractional frequency",
                ["channels"] = channels,
            },
        };
        for (int c = 0; c < channels.Length; c++)
            tdi[channels[c].ToString()] = Channel(count, c);
        return new H5File
        {
            Attributes =
            {
                ["format_version"] = 2,
                ["created_utc"] = "2026-12-01T22:05:07Z",
                ["generator"] = "hand-built test tree",
            },
            ["tdi"] = tdi,
        };
    }

    public static H5Group Tdi(this H5File file) => (H5Group)file["tdi"];

    public static H5Dataset Matrix(double[] rowMajor, int columns) =>
        new(rowMajor, fileDims: [(ulong)(rowMajor.Length / columns), (ulong)columns]);
}
