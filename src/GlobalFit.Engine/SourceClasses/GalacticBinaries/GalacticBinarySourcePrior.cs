using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using static GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinarySourceVector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The normalised prior of one galactic binary in a band window, in the coordinates of
/// <see cref="GalacticBinarySourceVector"/>.</summary>
/// <remarks>
/// f0 uniform over the window's source range, ḟ uniform, ρ̂ from <see cref="SnrAmplitudePrior"/>, sin β, cos ι uniform on
/// [−1, 1] (isotropic sky and orientation), λ, φ0 uniform on [0, 2π), ψ uniform on [0, π) (the signal has period π in
/// ψ); with <see cref="WithSky"/> the sky follows a <see cref="GalacticSkyDensity"/> instead. Angles wrap; sin β and cos ι reflect; f0, ḟ and ρ̂ reject proposals outside their range. Immutable.
/// </remarks>
public sealed class GalacticBinarySourcePrior : IPriorDensity
{
    private static readonly double LogIsotropicSky = -Math.Log(4.0 * Math.PI);
    private readonly double _logUniformPart;

    /// <summary>Creates the prior.</summary>
    /// <param name="minFrequencyHz">Lower edge of f0.</param>
    /// <param name="maxFrequencyHz">Upper edge of f0.</param>
    /// <param name="minDerivativeHzS">Lower edge of ḟ.</param>
    /// <param name="maxDerivativeHzS">Upper edge of ḟ.</param>
    /// <param name="snr">The SNR prior.</param>
    /// <exception cref="ArgumentException">A range is empty.</exception>
    public GalacticBinarySourcePrior(double minFrequencyHz, double maxFrequencyHz, double minDerivativeHzS, double maxDerivativeHzS, SnrAmplitudePrior snr)
    {
        Snr = snr ?? throw new ArgumentNullException(nameof(snr));
        Schema = new ParameterSchema(
        [
            new ParameterSpec("f0", "Hz", minFrequencyHz, maxFrequencyHz, BoundaryKind.Reject),
            new ParameterSpec("fdot", "Hz/s", minDerivativeHzS, maxDerivativeHzS, BoundaryKind.Reflect),
            new ParameterSpec("snr", "", 0.0, snr.MaxSnr, BoundaryKind.Reject),
            new ParameterSpec("sin_beta", "", -1.0, 1.0, BoundaryKind.Reflect),
            new ParameterSpec("lambda", "rad", 0.0, 2.0 * Math.PI, BoundaryKind.Periodic),
            new ParameterSpec("cos_iota", "", -1.0, 1.0, BoundaryKind.Reflect),
            new ParameterSpec("psi", "rad", 0.0, Math.PI, BoundaryKind.Periodic),
            new ParameterSpec("phi0", "rad", 0.0, 2.0 * Math.PI, BoundaryKind.Periodic),
        ]);
        // Everything but the sky: f0, ḟ, cos ι, ψ, φ0 (the sky's −ln 4π, or the sky density, is added in LogPrior).
        _logUniformPart = -Math.Log(maxFrequencyHz - minFrequencyHz) - Math.Log(maxDerivativeHzS - minDerivativeHzS)
            - Math.Log(2.0) - Math.Log(Math.PI) - Math.Log(2.0 * Math.PI);
    }

    private GalacticBinarySourcePrior(GalacticBinarySourcePrior isotropic, GalacticSkyDensity sky)
    {
        Snr = isotropic.Snr;
        Schema = isotropic.Schema;
        _logUniformPart = isotropic._logUniformPart;
        Sky = sky;
    }

    /// <summary>The sky density; null for the isotropic sky.</summary>
    public GalacticSkyDensity? Sky { get; }

    /// <summary>This prior with <paramref name="sky"/> in place of the isotropic sky (a new instance; this one is unchanged).</summary>
    /// <param name="sky">The sky density.</param>
    public GalacticBinarySourcePrior WithSky(GalacticSkyDensity sky) => new(this, sky ?? throw new ArgumentNullException(nameof(sky)));

    /// <summary>The schema of the sampled coordinates.</summary>
    public ParameterSchema Schema { get; }

    /// <summary>The SNR prior.</summary>
    public SnrAmplitudePrior Snr { get; }

    /// <inheritdoc />
    public double LogPrior(ReadOnlySpan<double> theta)
    {
        if (!Schema.Contains(theta)) return double.NegativeInfinity;
        double logSky = Sky is null ? LogIsotropicSky : Sky.LogDensity(theta[GalacticBinarySourceVector.SinLatitude], theta[GalacticBinarySourceVector.Longitude]);
        return _logUniformPart + logSky + Snr.LogDensity(theta[GalacticBinarySourceVector.Snr]);
    }

    /// <inheritdoc />
    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        var parameters = Schema.Parameters;
        for (int i = 0; i < Dimension; i++)
            theta[i] = random.NextUniform(parameters[i].Lower, parameters[i].Upper);
        theta[GalacticBinarySourceVector.Snr] = Snr.Quantile(random.NextDouble());
        if (Sky is null) return;
        // Rejection from the isotropic draw: accept with probability density/maximum.
        while (Math.Log(random.NextDoubleNonZero()) > Sky.LogDensity(theta[GalacticBinarySourceVector.SinLatitude], theta[GalacticBinarySourceVector.Longitude]) - Sky.MaxLogDensity)
        {
            theta[GalacticBinarySourceVector.SinLatitude] = random.NextUniform(-1.0, 1.0);
            theta[GalacticBinarySourceVector.Longitude] = random.NextUniform(0.0, 2.0 * Math.PI);
        }
    }
}
