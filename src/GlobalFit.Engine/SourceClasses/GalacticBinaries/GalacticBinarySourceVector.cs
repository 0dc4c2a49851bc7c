using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The coordinates a band worker samples for one galactic binary, and their conversion to physical parameters.</summary>
/// <remarks>
/// Vector order: f0 (Hz), ḟ (Hz/s), ρ̂ (the amplitude expressed as a reference SNR, <c>ρ̂ = A·s</c> with the window's
/// SNR scale s), sin β, λ (rad), cos ι, ψ (rad), φ0 (rad). sin β and cos ι make the isotropic sky and orientation
/// priors flat; ρ̂ carries the SNR prior of <see cref="SnrAmplitudePrior"/>. The SNR scale is the sky- and
/// orientation-averaged optimal SNR of a unit-amplitude source at the window's centre (see
/// <see cref="GalacticBinaryBandModel.AverageSnrPerUnitAmplitude"/>), so ρ̂ is the SNR of an average-oriented source.
/// </remarks>
public static class GalacticBinarySourceVector
{
    /// <summary>Number of sampled coordinates per source.</summary>
    public const int Dimension = 8;

    /// <summary>Index of f0.</summary>
    public const int Frequency = 0;

    /// <summary>Index of ḟ.</summary>
    public const int FrequencyDerivative = 1;

    /// <summary>Index of ρ̂.</summary>
    public const int Snr = 2;

    /// <summary>Index of sin β.</summary>
    public const int SinLatitude = 3;

    /// <summary>Index of λ.</summary>
    public const int Longitude = 4;

    /// <summary>Index of cos ι.</summary>
    public const int CosInclination = 5;

    /// <summary>Index of ψ.</summary>
    public const int Polarisation = 6;

    /// <summary>Index of φ0.</summary>
    public const int Phase = 7;

    /// <summary>The physical parameters of sampled vector <paramref name="values"/>.</summary>
    /// <param name="values">The 8 sampled coordinates.</param>
    /// <param name="snrScale">s, optimal SNR per unit amplitude.</param>
    public static GalacticBinaryParameters ToParameters(ReadOnlySpan<double> values, double snrScale) =>
        new(values[Frequency], values[FrequencyDerivative], values[Snr] / snrScale,
            Math.Asin(Math.Clamp(values[SinLatitude], -1.0, 1.0)), values[Longitude],
            Math.Acos(Math.Clamp(values[CosInclination], -1.0, 1.0)), values[Polarisation], values[Phase]);

    /// <summary>Writes the sampled coordinates of <paramref name="source"/>, with λ, ψ and φ0 wrapped to [0, 2π), [0, π), [0, 2π).</summary>
    /// <param name="source">The physical parameters.</param>
    /// <param name="snrScale">s.</param>
    /// <param name="values">Destination of length 8.</param>
    public static void FromParameters(in GalacticBinaryParameters source, double snrScale, Span<double> values)
    {
        values[Frequency] = source.FrequencyHz;
        values[FrequencyDerivative] = source.FrequencyDerivativeHzS;
        values[Snr] = source.Amplitude * snrScale;
        values[SinLatitude] = Math.Sin(source.EclipticLatitudeRad);
        values[Longitude] = Wrap(source.EclipticLongitudeRad, 2.0 * Math.PI);
        values[CosInclination] = Math.Cos(source.InclinationRad);
        values[Polarisation] = Wrap(source.PolarisationRad, Math.PI);
        values[Phase] = Wrap(source.InitialPhaseRad, 2.0 * Math.PI);
    }

    private static double Wrap(double value, double period)
    {
        double wrapped = value - period * Math.Floor(value / period);
        return wrapped >= period ? 0.0 : wrapped;
    }
}
