using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>Arm directions and midpoints of the constellation at the N coarse times <c>t_n = t0 + nT/N</c>, n = 0 … N (the last one closes the record).</summary>
/// <remarks>Precomputed once per envelope length because they do not depend on the source: a template call then
/// needs only dot products with the source's frame. Arm a joins spacecraft (1,2), (2,3), (3,1); its unit vector is
/// <c>n_12</c>, <c>n_23</c>, <c>n_31</c> (from the second to the first, as in <see cref="Detector.LinkGeometry"/>) and its midpoint is shared by the
/// two links along it. Midpoints are stored in light-seconds so that <c>k·x_mid/c</c> is one dot product.</remarks>
internal sealed class CoarseGeometry
{
    public CoarseGeometry(IConstellationOrbits orbits, double startSeconds, double durationSeconds, int length)
    {
        Length = length;
        // One point more than the grid: the sample at t0 + T closes the trapezoid rule (see the generator).
        ArmUnit = new Vector3D[3 * (length + 1)];
        MidpointLightSeconds = new Vector3D[3 * (length + 1)];
        ArmLightSeconds = new double[3 * (length + 1)];
        EqualArms = true;
        for (int n = 0; n <= length; n++)
        {
            double t = startSeconds + n * durationSeconds / length;
            var p1 = orbits.Position(1, t);
            var p2 = orbits.Position(2, t);
            var p3 = orbits.Position(3, t);
            Set(n, 0, p1, p2);
            Set(n, 1, p2, p3);
            Set(n, 2, p3, p1);
            // One delay per arm, the mean of its two senses: they differ by ~vL/c² ~ 1e-3 s (Sagnac and point-ahead),
            // a phase of 2e-5 rad at 20 mHz.
            ArmLightSeconds[3 * n] = 0.5 * (orbits.LightTimeSeconds(1, 2, t) + orbits.LightTimeSeconds(2, 1, t));
            ArmLightSeconds[3 * n + 1] = 0.5 * (orbits.LightTimeSeconds(2, 3, t) + orbits.LightTimeSeconds(3, 2, t));
            ArmLightSeconds[3 * n + 2] = 0.5 * (orbits.LightTimeSeconds(3, 1, t) + orbits.LightTimeSeconds(1, 3, t));
            for (int arm = 0; arm < 3; arm++)
                EqualArms &= ArmLightSeconds[3 * n + arm] == ArmLightSeconds[0];
        }
    }

    /// <summary>Index <c>3n + a</c>: light travel time along arm a at coarse time n.</summary>
    public double[] ArmLightSeconds { get; }

    /// <summary>True when every arm has the same constant light time (rigid orbits), so one delay serves all.</summary>
    public bool EqualArms { get; }

    public int Length { get; }

    /// <summary>Index <c>3n + a</c>: unit vector of arm a at coarse time n.</summary>
    public Vector3D[] ArmUnit { get; }

    /// <summary>Index <c>3n + a</c>: midpoint of arm a at coarse time n, divided by c.</summary>
    public Vector3D[] MidpointLightSeconds { get; }

    private void Set(int n, int arm, Vector3D receiver, Vector3D sender)
    {
        ArmUnit[3 * n + arm] = (receiver - sender).Normalized();
        MidpointLightSeconds[3 * n + arm] = (0.5 / PhysicalConstants.SpeedOfLightMS) * (receiver + sender);
    }
}
