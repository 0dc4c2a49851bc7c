using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.GalacticBinaries;
using static GlobalFit.Engine.SourceClasses.GalacticBinaries.GalacticBinarySourceVector;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Moves one galactic binary to another sky position, shifts its f0 so that its mean observed frequency stays
/// where it was, and draws its four amplitude parameters afresh from their conditional Gaussian at the new position.</summary>
/// <remarks>
/// <para>Why: over a month the detector's velocity barely turns, so the Doppler shift <c>f0 n̂·v/c</c> (|v|/c ≈ 1e-4,
/// about a bin at 3 mHz over 30 days) is a near-constant offset that f0 absorbs: the likelihood has a long ridge through
/// (f0, sky), and at each sky point on it ι, ψ and φ0 take other values. A move of the sky alone (the
/// antipodal or mirror move of β and λ only) leaves f0 and the amplitudes behind and is refused; a Gaussian step is too short
/// to travel the ridge. This move carries all three along.</para>
/// <para>Sky kernel (probabilities fixed, independent of the point, so each choice is its own reverse): the same sky
/// (a pure refresh of the amplitudes from their conditional, which mixes the ρ̂–cos ι and ψ–φ0 degeneracies that
/// Gaussian steps cross slowly) 0.25; reflection through the constellation plane at mid-record (the direction and its
/// mirror image give the same long-wavelength response) 0.1; antipode 0.05; reflection in the ecliptic 0.1; a uniform
/// draw on the sphere 0.05; a Gaussian step of σ = (0.1, 0.2 rad) in (sin β, λ), folded at sin β = ±1 and wrapped in λ,
/// 0.45 (the walk along the ridge: on the demo, with 0.2 of it and steps of (0.15, 0.3), f0 and sky kept a bulk ESS of
/// ~15 in 1440 samples). Each is symmetric in the
/// sphere's area measure d(sin β) dλ. f0 then becomes <c>f0′ = f0 (1 + k)/(1 + k′)</c>, with k = n̂·v̄/c for the
/// mean velocity v̄ of the constellation's centre over the record and n̂ the direction to the source, which keeps
/// f0(1 + k) fixed; its Jacobian is (1 + k)/(1 + k′). Last, (ρ̂, cos ι, ψ, φ0) are drawn by
/// <see cref="GalacticBinaryBirthDensity.DrawExtrinsics"/> at the chain's inverse temperature, and the reverse density of
/// the current ones is <see cref="GalacticBinaryBirthDensity.LogExtrinsicDensity"/> at the current intrinsic point:
/// <c>ln q(x|x′) − ln q(x′|x) = ln[(1 + k)/(1 + k′)] + ln p_ext(x) − ln p_ext(x′)</c> (Green 1995, Biometrika 82, 711,
/// for a deterministic map with auxiliary draws). The Gaussian uses the worker's residual, which holds the chain's other
/// sources too; that makes the draw less apt in a crowd, never wrong, since it depends on the residual only.</para>
/// <para>Not thread-safe (the F-statistic's scratch space); one instance per chain slot.</para>
/// </remarks>
public sealed class DopplerSkyJumpProposal : IProposal
{
    private const double StayProbability = 0.25;
    private const double DetectorPlaneProbability = 0.1;
    private const double AntipodeProbability = 0.05;
    private const double EclipticProbability = 0.1;
    private const double UniformProbability = 0.05;
    private const double LatitudeStep = 0.1;
    private const double LongitudeStep = 0.2;

    private readonly GalacticBinaryBirthDensity _extrinsics;
    private readonly ChainTemperature _temperature;
    private readonly double _snrScale;
    private readonly double _minFrequencyHz;
    private readonly double _maxFrequencyHz;
    private readonly Vector3D _velocityOverC;
    private readonly Vector3D _planeNormal;

    /// <summary>Creates the proposal.</summary>
    /// <param name="extrinsics">The window's birth density, whose conditional amplitude Gaussian draws ρ̂, cos ι, ψ, φ0.</param>
    /// <param name="geometry">Mean velocity and mid-record plane of the constellation (<see cref="Geometry"/>).</param>
    /// <param name="snrScale">s of the window.</param>
    /// <param name="minFrequencyHz">Lower edge of the f0 prior; a shift outside the prior is refused.</param>
    /// <param name="maxFrequencyHz">Upper edge of the f0 prior.</param>
    /// <param name="temperature">The chain slot's live inverse temperature.</param>
    public DopplerSkyJumpProposal(GalacticBinaryBirthDensity extrinsics, (Vector3D VelocityOverC, Vector3D PlaneNormal) geometry,
        double snrScale, double minFrequencyHz, double maxFrequencyHz, ChainTemperature temperature)
    {
        _extrinsics = extrinsics ?? throw new ArgumentNullException(nameof(extrinsics));
        _temperature = temperature ?? throw new ArgumentNullException(nameof(temperature));
        _snrScale = snrScale;
        _minFrequencyHz = minFrequencyHz;
        _maxFrequencyHz = maxFrequencyHz;
        (_velocityOverC, _planeNormal) = geometry;
    }

    /// <summary>The mixture entry for this proposal.</summary>
    /// <param name="weight">Selection weight.</param>
    /// <param name="extrinsics">The window's birth density.</param>
    /// <param name="geometry">Mean velocity and mid-record plane of the constellation (<see cref="Geometry"/>).</param>
    /// <param name="snrScale">s of the window.</param>
    /// <param name="minFrequencyHz">Lower edge of the f0 prior.</param>
    /// <param name="maxFrequencyHz">Upper edge of the f0 prior.</param>
    public static ProposalSpec Spec(double weight, GalacticBinaryBirthDensity extrinsics, (Vector3D VelocityOverC, Vector3D PlaneNormal) geometry,
        double snrScale, double minFrequencyHz, double maxFrequencyHz) =>
        new("doppler-sky-jump", weight, context => new DopplerSkyJumpProposal(extrinsics, geometry, snrScale, minFrequencyHz, maxFrequencyHz, context.Temperature));

    /// <summary>The mean velocity of the constellation's centre over the record, in units of c, and the unit normal of the
    /// constellation's plane at mid-record.</summary>
    /// <param name="orbits">The orbits.</param>
    /// <param name="startSeconds">Start of the record.</param>
    /// <param name="durationSeconds">Its length.</param>
    public static (Vector3D VelocityOverC, Vector3D PlaneNormal) Geometry(IConstellationOrbits orbits, double startSeconds, double durationSeconds)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(durationSeconds);
        Vector3D Centre(double t) => (orbits.Position(1, t) + orbits.Position(2, t) + orbits.Position(3, t)) / 3.0;
        var velocity = (Centre(startSeconds + durationSeconds) - Centre(startSeconds)) / (durationSeconds * PhysicalConstants.SpeedOfLightMS);
        double middle = startSeconds + 0.5 * durationSeconds;
        var p1 = orbits.Position(1, middle);
        var normal = (orbits.Position(2, middle) - p1).Cross(orbits.Position(3, middle) - p1).Normalized();
        return (velocity, normal);
    }

    /// <summary>k = n̂·v̄/c for the sky position (sin β, λ): the fractional Doppler shift of the mean observed frequency.</summary>
    /// <param name="sinLatitude">sin β.</param>
    /// <param name="longitudeRad">λ.</param>
    public double DopplerFactor(double sinLatitude, double longitudeRad)
    {
        double cosLatitude = Math.Sqrt(Math.Max(0.0, 1.0 - sinLatitude * sinLatitude));
        return _velocityOverC.Dot(new Vector3D(cosLatitude * Math.Cos(longitudeRad), cosLatitude * Math.Sin(longitudeRad), sinLatitude));
    }

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        current.CopyTo(candidate);
        var (sinLatitude, longitude) = NewSky(current[SinLatitude], current[Longitude], ref random);
        double k = DopplerFactor(current[SinLatitude], current[Longitude]);
        double kNew = DopplerFactor(sinLatitude, longitude);
        double frequency = current[Frequency] * (1.0 + k) / (1.0 + kNew);
        if (!(frequency >= _minFrequencyHz && frequency <= _maxFrequencyHz)) return double.NegativeInfinity;
        double beta = Math.Clamp(_temperature.InverseTemperature, 1e-6, 1.0);
        var point = new GalacticBinaryIntrinsics(frequency, current[FrequencyDerivative], Math.Asin(sinLatitude), longitude);
        double logForward = _extrinsics.DrawExtrinsics(point, beta, candidate, ref random);
        if (!(logForward > double.NegativeInfinity)) return double.NegativeInfinity;
        // DrawExtrinsics wrote sin(asin(sin β)) and λ; keep the exact values the map produced.
        candidate[SinLatitude] = sinLatitude;
        candidate[Longitude] = longitude;
        double logReverse = _extrinsics.LogExtrinsicDensity(current, beta);
        if (!(logReverse > double.NegativeInfinity)) return double.NegativeInfinity;
        return Math.Log((1.0 + k) / (1.0 + kNew)) + logReverse - logForward;
    }

    private (double SinLatitude, double Longitude) NewSky(double sinLatitude, double longitude, ref RandomStream random)
    {
        double choice = random.NextDouble();
        if (choice < StayProbability) return (sinLatitude, longitude);
        choice -= StayProbability;
        if (choice < DetectorPlaneProbability)
        {
            double cosLatitude = Math.Sqrt(Math.Max(0.0, 1.0 - sinLatitude * sinLatitude));
            var n = new Vector3D(cosLatitude * Math.Cos(longitude), cosLatitude * Math.Sin(longitude), sinLatitude);
            var mirrored = n - 2.0 * n.Dot(_planeNormal) * _planeNormal;
            return (Math.Clamp(mirrored.Z, -1.0, 1.0), WrapLongitude(Math.Atan2(mirrored.Y, mirrored.X)));
        }
        choice -= DetectorPlaneProbability;
        if (choice < AntipodeProbability) return (-sinLatitude, WrapLongitude(longitude + Math.PI));
        choice -= AntipodeProbability;
        if (choice < EclipticProbability) return (-sinLatitude, longitude);
        choice -= EclipticProbability;
        if (choice < UniformProbability) return (random.NextUniform(-1.0, 1.0), random.NextUniform(0.0, 2.0 * Math.PI));
        double latitude = sinLatitude + LatitudeStep * random.NextGaussian();
        // Fold at ±1 (a reflecting boundary keeps a symmetric kernel symmetric).
        while (latitude > 1.0 || latitude < -1.0) latitude = latitude > 1.0 ? 2.0 - latitude : -2.0 - latitude;
        return (latitude, WrapLongitude(longitude + LongitudeStep * random.NextGaussian()));
    }

    private static double WrapLongitude(double value)
    {
        const double period = 2.0 * Math.PI;
        double wrapped = value - period * Math.Floor(value / period);
        return wrapped >= period ? 0.0 : wrapped;
    }
}
