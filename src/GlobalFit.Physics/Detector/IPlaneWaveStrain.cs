namespace GlobalFit.Physics.Detector;

/// <summary>The two polarisations of a plane gravitational wave as functions of retarded time.</summary>
/// <remarks>The metric perturbation is <c>h_ab(t, x) = h+(ξ) ε+_ab(ψ) + h×(ξ) ε×_ab(ψ)</c> with
/// <c>ξ = t − k·x/c</c> (transverse-traceless gauge, e.g. Cornish &amp; Rubbo 2003, arXiv:gr-qc/0209011): <see cref="At"/> returns h+ and h× at the
/// Sun (x = 0), and the polarisation angle ψ enters through <see cref="PolarisationBasis"/>.
/// Implementations must be pure and thread-safe.</remarks>
public interface IPlaneWaveStrain
{
    /// <summary>h+ and h× (dimensionless strain) at retarded time <paramref name="retardedTimeSeconds"/>.</summary>
    (double Plus, double Cross) At(double retardedTimeSeconds);
}
