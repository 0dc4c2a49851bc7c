using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

/// <summary>Test support: h+ and h× given as periodic samples, interpolated by a six-point Lagrange polynomial.</summary>
/// <remarks>Six points on a signal sampled at least 2.5 times faster than its highest frequency: the error of the
/// interpolant is ~(πf dt)^6/720-scaled, below 1e-5 relative for f dt ≤ 0.1 (derived: Lagrange remainder).</remarks>
internal sealed class SampledStrain(double[] plus, double[] cross, double dtSeconds) : IPlaneWaveStrain
{
    public (double Plus, double Cross) At(double retardedTimeSeconds)
    {
        int n = plus.Length;
        double position = retardedTimeSeconds / dtSeconds;
        int index = (int)Math.Floor(position);
        double x = position - index; // in [0, 1)
        double p = 0, c = 0;
        for (int a = -2; a <= 3; a++)
        {
            double weight = 1;
            for (int b = -2; b <= 3; b++)
                if (b != a) weight *= (x - b) / (a - b);
            int k = ((index + a) % n + n) % n;
            p += weight * plus[k];
            c += weight * cross[k];
        }
        return (p, c);
    }
}
