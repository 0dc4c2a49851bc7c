using System.Globalization;
using System.Text;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Files;

namespace GlobalFit.Cli.Commands;

/// <summary>The columns written by <c>globalfit sensitivity</c>, one row per log-spaced frequency.</summary>
internal sealed record SensitivityTable(
    double[] FrequencyHz, double[] PsdA, double[] PsdE, double[] PsdT,
    double[] ExactStrainPsd, double[] RobsonStrainPsd, double[] ForegroundStrainPsd)
{
    /// <summary>CSV header: frequency, A/E/T PSDs in fractional frequency, and strain PSDs.</summary>
    public const string Header = "f_hz,psd_a_per_hz,psd_e_per_hz,psd_t_per_hz,sky_averaged_strain_psd_per_hz,approx_strain_psd_per_hz,foreground_strain_psd_per_hz";

    public static SensitivityTable Compute(AetNoiseModel noise, SensitivityCurve curve, double fMin, double fMax, int points)
    {
        var f = new double[points];
        double logMin = Math.Log10(fMin), step = (Math.Log10(fMax) - logMin) / (points - 1);
        for (int i = 0; i < points; i++) f[i] = Math.Pow(10, logMin + i * step);
        return new SensitivityTable(
            f,
            f.Select(noise.PsdA).ToArray(),
            f.Select(noise.PsdE).ToArray(),
            f.Select(noise.PsdT).ToArray(),
            f.Select(curve.ExactStrainPsd).ToArray(),
            f.Select(curve.RobsonStrainPsd).ToArray(),
            f.Select(x => curve.Foreground?.StrainPsd(x) ?? 0.0).ToArray());
    }

    public (double FrequencyHz, double StrainPsd) Minimum()
    {
        int best = 0;
        for (int i = 1; i < FrequencyHz.Length; i++)
            if (ExactStrainPsd[i] < ExactStrainPsd[best]) best = i;
        return (FrequencyHz[best], ExactStrainPsd[best]);
    }

    public string ToCsv()
    {
        var text = new StringBuilder(Header).Append('\n');
        for (int i = 0; i < FrequencyHz.Length; i++)
        {
            text.Append(string.Join(',', new[] { FrequencyHz[i], PsdA[i], PsdE[i], PsdT[i], ExactStrainPsd[i], RobsonStrainPsd[i], ForegroundStrainPsd[i] }
                .Select(NumberText.RoundTrip)));
            text.Append('\n');
        }
        return text.ToString();
    }
}
