using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>A jump to the sky position mirrored through the constellation's plane (<see cref="SkyReflection"/>), with the
/// inclination, polarisation and coalescence time that keep the response: the secondary sky mode a triangular detector
/// leaves for a short signal.</summary>
/// <remarks>The map is deterministic and (to 2e-4 rad of the plane's yearly turn) its own inverse, so the log proposal
/// ratio returned is <c>ln |J|</c> of the map (Green 1995, Biometrika 82, 711, for deterministic moves). Since the map is
/// not exactly an involution for a moving constellation, the move is kept at a small weight in the mixture.
/// Allocation-free; one instance per chain slot.</remarks>
public sealed class SkyReflectionProposal(IConstellationOrbits orbits) : IProposal
{
    /// <summary>Name in acceptance statistics.</summary>
    public const string Name = "sky-reflection";

    /// <inheritdoc />
    public double Propose(ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        var source = MassiveBlackHoleBinaryParameters.FromSpan(current);
        if (!(Math.Abs(source.EclipticLatitudeRad) < 0.5 * Math.PI))
        {
            current.CopyTo(candidate);
            return 0.0;
        }
        var (reflected, logJacobian) = SkyReflection.Reflect(source, orbits);
        candidate[0] = reflected.ChirpMassMsun;
        candidate[1] = reflected.MassRatio;
        candidate[2] = reflected.Spin1;
        candidate[3] = reflected.Spin2;
        candidate[4] = reflected.CoalescenceTimeS;
        candidate[5] = reflected.DistanceMpc;
        candidate[6] = reflected.EclipticLatitudeRad;
        candidate[7] = reflected.EclipticLongitudeRad;
        candidate[8] = reflected.InclinationRad;
        candidate[9] = reflected.PolarisationRad;
        candidate[10] = reflected.ReferencePhaseRad;
        return double.IsFinite(logJacobian) ? logJacobian : double.NegativeInfinity;
    }
}
