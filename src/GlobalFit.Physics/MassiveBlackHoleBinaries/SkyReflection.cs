using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The reflection of a source through the plane of the constellation: the sky position that the triangular detector
/// cannot tell apart from the true one at low frequency, with the orientation and time that make the responses equal.</summary>
/// <remarks>
/// <para>Derived here. In the long-wavelength limit every link contraction is <c>n·P·n</c> with all arm directions n in the
/// constellation plane (unit normal m at time t_c), and the only other sky dependence is the delay <c>k·p₀/c</c> to the centre p₀.
/// The reflection <c>R = I − 2 m mᵀ</c> leaves every n fixed, so <c>n·P·n = n·(R P R)·n</c>. With the wave direction
/// <c>k' = R k</c> (so the source direction <c>n̂' = R n̂</c>) and the polarisation frame vector <c>p = cos ψ u + sin ψ v</c>
/// (<see cref="PolarisationBasis"/>), the pair <c>(R p, −R q)</c> is a right-handed transverse frame of k', in which
/// <c>R ε+ R = e+</c> and <c>R ε× R = −e×</c>. Hence the reflected source has</para>
/// <list type="bullet">
/// <item><c>β' = asin(n̂'_z)</c>, <c>λ' = atan2(n̂'_y, n̂'_x)</c> in [0, 2π);</item>
/// <item><c>ψ' = atan2(Rp·v', Rp·u')</c> in [0, π) with (u', v') the frame at (β', λ');</item>
/// <item><c>ι' = π − ι</c> (turns K× into −K× and keeps K+);</item>
/// <item><c>t_c' = t_c + (k − k')·p₀(t_c)/c</c> (same arrival time at the centre); every other parameter unchanged.</item>
/// </list>
/// <para>The argument holds beyond the long-wavelength limit for a frozen constellation: R also fixes every <c>k·(x_p − p₀)</c>
/// (the offsets lie in the plane) and every <c>k·n</c>, so the full link response at any frequency is unchanged (the tests find
/// agreement to 1e-13). The equality breaks only through the motion and rotation of the constellation during the signal, so this
/// is a proposal for samplers (exact for short signals), not a symmetry of the likelihood.
/// Jacobian: the reflection preserves area on the sphere and maps ψ and ι by unit-slope maps, and t_c by a shift that depends
/// on the sky, so in the coordinates (sin β, λ, cos ι, ψ, t_c) its determinant has modulus 1; in the parameters (β, λ, ι, ψ, t_c)
/// it is <c>|J| = cos β / cos β'</c>, up to a relative O(v/c) ≈ 1e-4 from the dependence of the plane and of p₀ on t_c (orbital
/// speed over light speed; the tests measure 1e-4). The map is its own inverse up to the rotation of the plane between t_c and t_c'
/// (|t_c' − t_c| ≤ 2 au/c ≈ 1000 s, i.e. 2e-4 rad of the yearly rotation). Stateless and thread-safe.</para>
/// </remarks>
public static class SkyReflection
{
    /// <summary>The reflected source and <c>ln |J|</c> of the map in the parameters of <see cref="MassiveBlackHoleBinaryParameters"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The latitude is outside [−π/2, π/2] or an angle is not finite.</exception>
    public static (MassiveBlackHoleBinaryParameters Reflected, double LogJacobian) Reflect(in MassiveBlackHoleBinaryParameters source, IConstellationOrbits orbits)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        var sky = new SkyPosition(source.EclipticLatitudeRad, source.EclipticLongitudeRad);
        double tc = source.CoalescenceTimeS;
        var x1 = orbits.Position(1, tc);
        var x2 = orbits.Position(2, tc);
        var x3 = orbits.Position(3, tc);
        var normal = (x2 - x1).Cross(x3 - x1).Normalized();
        var centre = (1.0 / 3.0) * (x1 + x2 + x3);

        var towards = sky.TowardsSource;
        var reflected = Reflect(towards, normal);
        double beta = Math.Asin(Math.Clamp(reflected.Z, -1.0, 1.0));
        double lambda = Math.Atan2(reflected.Y, reflected.X);
        if (lambda < 0) lambda += 2.0 * Math.PI;
        var reflectedSky = new SkyPosition(beta, lambda);

        var basis = new PolarisationBasis(sky, source.PolarisationRad);
        var (sinPsi, cosPsi) = Math.SinCos(source.PolarisationRad);
        var p = cosPsi * basis.U + sinPsi * basis.V;
        var rp = Reflect(p, normal);
        var newBasis = new PolarisationBasis(reflectedSky, 0.0);
        double psi = Math.Atan2(rp.Dot(newBasis.V), rp.Dot(newBasis.U));
        psi = ((psi % Math.PI) + Math.PI) % Math.PI;

        // k = −towards, so (k − k')·p₀ = (towards' − towards)·p₀.
        double shift = (reflected - towards).Dot(centre) / PhysicalConstants.SpeedOfLightMS;
        var result = source with
        {
            EclipticLatitudeRad = beta,
            EclipticLongitudeRad = lambda,
            PolarisationRad = psi,
            InclinationRad = Math.PI - source.InclinationRad,
            CoalescenceTimeS = tc + shift,
        };
        double logJacobian = Math.Log(Math.Cos(source.EclipticLatitudeRad)) - Math.Log(Math.Cos(beta));
        return (result, logJacobian);
    }

    private static Vector3D Reflect(Vector3D a, Vector3D unitNormal) => a - 2.0 * a.Dot(unitNormal) * unitNormal;
}
