using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.Tests.Detector;

/// <summary>Complex amplitude of a sinusoid of known frequency, for tests.</summary>
internal static class SinusoidPower
{
    /// <summary>(a, b) with series ≈ a cos 2πft + b sin 2πft, exact for a pure sinusoid over whole periods.</summary>
    public static (double Cos, double Sin) Quadratures(TimeSeries series, double frequencyHz)
    {
        double c = 0, s = 0;
        for (int n = 0; n < series.Count; n++)
        {
            var (sin, cos) = Math.SinCos(2.0 * Math.PI * frequencyHz * series.TimeOf(n));
            c += series.Samples[n] * cos;
            s += series.Samples[n] * sin;
        }
        double scale = 2.0 / series.Count;
        return (scale * c, scale * s);
    }

    /// <summary>a² + b², the squared amplitude.</summary>
    public static double SquaredAmplitude(TimeSeries series, double frequencyHz)
    {
        var (c, s) = Quadratures(series, frequencyHz);
        return c * c + s * s;
    }
}
