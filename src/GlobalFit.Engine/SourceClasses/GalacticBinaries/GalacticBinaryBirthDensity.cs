using System.Numerics;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Transdimensional;
using GlobalFit.Physics.GalacticBinaries;
using static GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinarySourceVector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Births of galactic binaries from the F-statistic of the window's residual: intrinsic parameters from the
/// map, then the four amplitudes from their exact conditional Gaussian.</summary>
/// <remarks>
/// <para>For fixed (f0, ḟ, β, λ) the template is linear in the complex amplitudes x = (P, Q) of
/// <see cref="FStatisticAmplitudes"/>, and ln L = Re(x^H n) − ½ x^H G x with <c>G = [[U, W*], [W, V]]</c>
/// (the 2×2 form of <see cref="FStatistic"/>). So x is drawn from the Gaussian N(G⁻¹n, G⁻¹) — the likelihood's own
/// shape — via x = G⁻¹n + L^{−H} ξ with G = L L^H and ξ four standard normals; its density in the four real components
/// is <c>(2π)^−2 det G e^{−ξ^Hξ/2}</c> (the real 4 × 4 form of a Hermitian G has determinant (det G)²).</para>
/// <para>x is mapped to (A, cos ι, ψ, φ0) by <see cref="FStatisticAmplitudes.ToExtrinsics"/>. The map is two-to-one on
/// the prior's ψ ∈ [0, π), φ0 ∈ [0, 2π) ((ψ + π/2, φ0 + π) is the same signal), so one of the two copies is picked
/// with probability ½. Its Jacobian: with R± = |P ± iQ| = A(1 ± cos ι)² and arg(P ± iQ) = φ0 ± 2ψ (the inversion of
/// <see cref="FStatisticAmplitudes"/>), and
/// d⁴(P ± iQ) = 4 d⁴x, one finds <c>d⁴x = 4 A³ (1 − cos²ι)³ dA d(cos ι) dψ dφ0</c> (derived here; the tests
/// compare it with a finite-difference determinant). Finally ρ̂ = A s adds 1/s. The density therefore is
/// <c>b = b_map(f0, ḟ, sin β, λ) · (2π)^−2 det G e^{−ξ^Hξ/2} · 4A³(1 − cos²ι)³ / (2 s)</c>.</para>
/// <para>It depends on the residual only, never on the chain, as <see cref="IBirthDensity"/> requires. Not
/// thread-safe (the F-statistic owns scratch buffers).</para>
/// </remarks>
public sealed class GalacticBinaryBirthDensity : IBirthDensity
{
    private static readonly double LogTwoPiSquared = 2.0 * Math.Log(2.0 * Math.PI);

    private readonly FStatistic _statistic;
    private readonly GalacticBinaryBand _band;
    private readonly FStatisticCellDensity _map;
    private readonly double _snrScale;

    /// <summary>Creates the density.</summary>
    /// <param name="statistic">The worker's F-statistic.</param>
    /// <param name="band">The residual.</param>
    /// <param name="map">The intrinsic-parameter density, on a grid inside the prior's (f0, ḟ, sin β, λ) box (the worker
    /// uses the core: a source in a drift margin can then be neither born nor killed there, a consistent pair of zero
    /// probabilities, and leaves by the hand-off instead).</param>
    /// <param name="snrScale">s of the window.</param>
    public GalacticBinaryBirthDensity(FStatistic statistic, GalacticBinaryBand band, FStatisticCellDensity map, double snrScale)
    {
        _statistic = statistic ?? throw new ArgumentNullException(nameof(statistic));
        _band = band ?? throw new ArgumentNullException(nameof(band));
        _map = map ?? throw new ArgumentNullException(nameof(map));
        _snrScale = snrScale;
    }

    /// <summary>Where the density's F-statistic evaluations are timed.</summary>
    internal BandUpdateClock Clock { get; set; } = new();

    /// <inheritdoc />
    public double Draw(Span<double> source, ref RandomStream random)
    {
        long started = BandUpdateClock.Now();
        double logDensity = DrawUntimed(source, ref random);
        Clock.Add(BandUpdatePhase.BirthDensity, started);
        return logDensity;
    }

    /// <inheritdoc />
    public double LogDensity(ReadOnlySpan<double> source)
    {
        long started = BandUpdateClock.Now();
        double logDensity = LogDensityUntimed(source);
        Clock.Add(BandUpdatePhase.BirthDensity, started);
        return logDensity;
    }

    private double DrawUntimed(Span<double> source, ref RandomStream random)
    {
        var point = _map.Draw(random.NextDouble(), random.NextDouble(), random.NextDouble(), random.NextDouble(), random.NextDouble());
        double logExtrinsic = DrawExtrinsics(point, 1.0, source, ref random);
        return logExtrinsic > double.NegativeInfinity ? _map.LogDensity(point) + logExtrinsic : double.NegativeInfinity;
    }

    private double LogDensityUntimed(ReadOnlySpan<double> source)
    {
        var point = GalacticBinaryIntrinsics.Of(ToParameters(source, _snrScale));
        double logMap = _map.LogDensity(point);
        if (!(logMap > double.NegativeInfinity)) return double.NegativeInfinity;
        double logExtrinsic = LogExtrinsicDensity(source, 1.0);
        return logExtrinsic > double.NegativeInfinity ? logMap + logExtrinsic : double.NegativeInfinity;
    }

    /// <summary>Writes a source with the intrinsic parameters of <paramref name="point"/> and the four amplitudes drawn
    /// from their conditional Gaussian at inverse temperature <paramref name="inverseTemperature"/>, N(G⁻¹n, (βG)⁻¹)
    /// (the tempered likelihood β ln L has the same mean and a β times sharper precision).</summary>
    /// <param name="point">f0, ḟ, β, λ of the source.</param>
    /// <param name="inverseTemperature">β in (0, 1].</param>
    /// <param name="source">Destination: the 8 sampled coordinates.</param>
    /// <param name="random">Stream for four normals and one uniform.</param>
    /// <returns>ln of the density of (ρ̂, cos ι, ψ, φ0) given the intrinsic parameters; −∞ where the F-statistic is
    /// undefined (no bin of the template inside the band).</returns>
    public double DrawExtrinsics(in GalacticBinaryIntrinsics point, double inverseTemperature, Span<double> source, ref RandomStream random)
    {
        var result = _statistic.Evaluate(point, _band);
        if (!result.IsDefined) return double.NegativeInfinity;
        var (l11, l21, l22) = Cholesky(result);
        double spread = 1.0 / Math.Sqrt(inverseTemperature);
        Complex xi1 = new(random.NextGaussian(), random.NextGaussian());
        Complex xi2 = new(random.NextGaussian(), random.NextGaussian());
        // Solve L^H ζ = ξ: L^H = [[l11, conj(l21)], [0, l22]]; then ζ/√β has covariance (βG)⁻¹.
        Complex zeta2 = xi2 / l22;
        Complex zeta1 = (xi1 - Complex.Conjugate(l21) * zeta2) / l11;
        var amplitudes = FStatisticAmplitudes.FromComplex(result.Amplitudes.P + spread * zeta1, result.Amplitudes.Q + spread * zeta2);
        var extrinsics = amplitudes.ToExtrinsics();
        double psi = extrinsics.PolarisationRad, phi = extrinsics.InitialPhaseRad;
        if (random.NextDouble() < 0.5)
        {
            psi += 0.5 * Math.PI;
            phi = phi >= Math.PI ? phi - Math.PI : phi + Math.PI;
        }
        source[Frequency] = point.FrequencyHz;
        source[FrequencyDerivative] = point.FrequencyDerivativeHzS;
        source[Snr] = extrinsics.Amplitude * _snrScale;
        source[SinLatitude] = Math.Sin(point.EclipticLatitudeRad);
        source[Longitude] = point.EclipticLongitudeRad;
        source[CosInclination] = extrinsics.CosInclination;
        source[Polarisation] = psi;
        source[Phase] = phi;
        double quadratic = xi1.Real * xi1.Real + xi1.Imaginary * xi1.Imaginary + xi2.Real * xi2.Real + xi2.Imaginary * xi2.Imaginary;
        return LogGaussian(result, quadratic, inverseTemperature) + LogJacobian(extrinsics.Amplitude, extrinsics.CosInclination);
    }

    /// <summary>ln of the density with which <see cref="DrawExtrinsics"/> at the intrinsic parameters of
    /// <paramref name="source"/> would draw its (ρ̂, cos ι, ψ, φ0).</summary>
    /// <param name="source">The 8 sampled coordinates.</param>
    /// <param name="inverseTemperature">β in (0, 1].</param>
    /// <returns>The log density; −∞ where the F-statistic is undefined.</returns>
    public double LogExtrinsicDensity(ReadOnlySpan<double> source, double inverseTemperature)
    {
        var parameters = ToParameters(source, _snrScale);
        var point = GalacticBinaryIntrinsics.Of(parameters);
        var result = _statistic.Evaluate(point, _band);
        if (!result.IsDefined) return double.NegativeInfinity;
        var x = FStatisticAmplitudes.FromExtrinsics(new GalacticBinaryExtrinsics(parameters.Amplitude, source[CosInclination],
            parameters.PolarisationRad, parameters.InitialPhaseRad));
        Complex dp = x.P - result.Amplitudes.P, dq = x.Q - result.Amplitudes.Q;
        // ζ^H G ζ with G = [[U, W*], [W, V]]; the draw's ξ^H ξ is β ζ^H G ζ.
        double quadratic = result.U * (dp.Real * dp.Real + dp.Imaginary * dp.Imaginary)
            + result.V * (dq.Real * dq.Real + dq.Imaginary * dq.Imaginary)
            + 2.0 * (Complex.Conjugate(dq) * result.W * dp).Real;
        return LogGaussian(result, inverseTemperature * quadratic, inverseTemperature) + LogJacobian(parameters.Amplitude, source[CosInclination]);
    }

    /// <summary>ln of |∂(Re P, Im P, Re Q, Im Q)/∂(A, cos ι, ψ, φ0)| = ln 4A³(1 − cos²ι)³.</summary>
    /// <param name="amplitude">A.</param>
    /// <param name="cosInclination">cos ι.</param>
    public static double LogAmplitudeJacobian(double amplitude, double cosInclination)
    {
        double sinSquared = 1.0 - cosInclination * cosInclination;
        return Math.Log(4.0) + 3.0 * Math.Log(amplitude) + 3.0 * Math.Log(sinSquared);
    }

    private double LogJacobian(double amplitude, double cosInclination) =>
        LogAmplitudeJacobian(amplitude, cosInclination) - Math.Log(2.0) - Math.Log(_snrScale);

    // The real 4 × 4 precision of βG has determinant β⁴ (det G)², so the normalisation gains 2 ln β.
    private static double LogGaussian(in FStatisticResult result, double quadratic, double inverseTemperature)
    {
        double determinant = result.U * result.V - (result.W.Real * result.W.Real + result.W.Imaginary * result.W.Imaginary);
        return -0.5 * quadratic - LogTwoPiSquared + Math.Log(determinant) + 2.0 * Math.Log(inverseTemperature);
    }

    private static (double L11, Complex L21, double L22) Cholesky(in FStatisticResult result)
    {
        double l11 = Math.Sqrt(result.U);
        Complex l21 = result.W / l11;
        double l22 = Math.Sqrt(result.V - (l21.Real * l21.Real + l21.Imaginary * l21.Imaginary));
        return (l11, l21, l22);
    }
}
