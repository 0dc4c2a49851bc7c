using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>Positions of the three spacecraft at one time, computed together.</summary>
/// <remarks>For <see cref="RigidOrbits"/> the three positions share the orbital phase α, so one sine/cosine pair serves all three
/// (the formula of <see cref="RigidOrbits.Position"/>, Cornish &amp; Rubbo 2003, arXiv:gr-qc/0209011, rewritten here from its
/// public constants; a test checks agreement to rounding). Other orbits are asked three times.
/// Implementation note: the response evaluates positions at every frequency, and the shared phase saved about a third of the
/// response's cost in the heterodyned likelihood (measured with the benchmarks of this folder).
/// Immutable and thread-safe.</remarks>
internal sealed class ConstellationSnapshot
{
    private readonly IConstellationOrbits _orbits;
    private readonly bool _rigid;
    private readonly double _radius, _half, _omega, _kappa, _sqrt3Epicycle;
    private readonly double _c1, _s1, _c2, _s2, _c3, _s3;

    public ConstellationSnapshot(IConstellationOrbits orbits)
    {
        _orbits = orbits;
        if (orbits is RigidOrbits rigid)
        {
            _rigid = true;
            _radius = rigid.OrbitRadiusM;
            double epicycle = rigid.Eccentricity * rigid.OrbitRadiusM;
            _half = 0.5 * epicycle;
            _sqrt3Epicycle = Math.Sqrt(3.0) * epicycle;
            _omega = 2.0 * Math.PI / rigid.PeriodSeconds;
            _kappa = rigid.InitialOrbitalPhaseRad;
            (_s1, _c1) = Math.SinCos(rigid.InitialOrientationRad);
            (_s2, _c2) = Math.SinCos(2.0 * Math.PI / 3.0 + rigid.InitialOrientationRad);
            (_s3, _c3) = Math.SinCos(4.0 * Math.PI / 3.0 + rigid.InitialOrientationRad);
        }
    }

    /// <summary>Positions of spacecraft 1, 2, 3 at <paramref name="timeSeconds"/>, in metres.</summary>
    public void Positions(double timeSeconds, out Vector3D x1, out Vector3D x2, out Vector3D x3)
    {
        if (!_rigid)
        {
            x1 = _orbits.Position(1, timeSeconds);
            x2 = _orbits.Position(2, timeSeconds);
            x3 = _orbits.Position(3, timeSeconds);
            return;
        }
        var (sinAlpha, cosAlpha) = Math.SinCos(_omega * timeSeconds + _kappa);
        double cos2Alpha = cosAlpha * cosAlpha - sinAlpha * sinAlpha;
        double sin2Alpha = 2.0 * sinAlpha * cosAlpha;
        double cx = _radius * cosAlpha, cy = _radius * sinAlpha;
        x1 = One(cx, cy, cosAlpha, sinAlpha, cos2Alpha, sin2Alpha, _c1, _s1);
        x2 = One(cx, cy, cosAlpha, sinAlpha, cos2Alpha, sin2Alpha, _c2, _s2);
        x3 = One(cx, cy, cosAlpha, sinAlpha, cos2Alpha, sin2Alpha, _c3, _s3);
    }

    private Vector3D One(double cx, double cy, double cosAlpha, double sinAlpha, double cos2Alpha, double sin2Alpha, double cosBeta, double sinBeta)
    {
        double cos2AlphaMinusBeta = cos2Alpha * cosBeta + sin2Alpha * sinBeta;
        double sin2AlphaMinusBeta = sin2Alpha * cosBeta - cos2Alpha * sinBeta;
        double cosAlphaMinusBeta = cosAlpha * cosBeta + sinAlpha * sinBeta;
        return new Vector3D(
            cx + _half * (cos2AlphaMinusBeta - 3.0 * cosBeta),
            cy + _half * (sin2AlphaMinusBeta - 3.0 * sinBeta),
            -_sqrt3Epicycle * cosAlphaMinusBeta);
    }
}
