using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.Detector;

/// <summary>Geometry of the laser links: unit vectors, midpoints and light travel times.</summary>
/// <remarks>Our convention (papers differ in the order of the indices): link ij is received at spacecraft i and sent
/// by spacecraft j, and <c>n_ij = (x_i − x_j)/|x_i − x_j|</c> points from sender to receiver.</remarks>
public static class LinkGeometry
{
    private const int MaxLightTimeIterations = 50;

    /// <summary>Unit vector <c>n_ij</c> from sender j to receiver i, both positions taken at the same time.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The labels do not name a link.</exception>
    public static Vector3D UnitVector(IConstellationOrbits orbits, int receiver, int sender, double timeSeconds)
    {
        SpacecraftLabel.CheckLink(receiver, sender);
        return (orbits.Position(receiver, timeSeconds) - orbits.Position(sender, timeSeconds)).Normalized();
    }

    /// <summary>Midpoint <c>(x_i + x_j)/2</c> of the link at one time.</summary>
    /// <value>m.</value>
    /// <exception cref="ArgumentOutOfRangeException">The labels do not name a link.</exception>
    public static Vector3D Midpoint(IConstellationOrbits orbits, int receiver, int sender, double timeSeconds)
    {
        SpacecraftLabel.CheckLink(receiver, sender);
        return 0.5 * (orbits.Position(receiver, timeSeconds) + orbits.Position(sender, timeSeconds));
    }

    /// <summary>Distance between the two spacecraft at one time.</summary>
    /// <value>m.</value>
    /// <exception cref="ArgumentOutOfRangeException">The labels do not name a link.</exception>
    public static double ArmLengthM(IConstellationOrbits orbits, int receiver, int sender, double timeSeconds)
    {
        SpacecraftLabel.CheckLink(receiver, sender);
        return (orbits.Position(receiver, timeSeconds) - orbits.Position(sender, timeSeconds)).Length;
    }

    /// <summary>Light travel time τ of the beam received at <paramref name="receiver"/> at
    /// <paramref name="receptionTimeSeconds"/>: the root of <c>|x_i(t) − x_j(t − τ)| = cτ</c>.</summary>
    /// <value>s.</value>
    /// <remarks>Fixed-point iteration from the instantaneous distance. Each step shrinks the error by the
    /// sender's speed over c (~1e-4 for heliocentric orbits), so four or five steps reach the 1e-13 relative stopping point.</remarks>
    /// <exception cref="ArgumentOutOfRangeException">The labels do not name a link.</exception>
    /// <exception cref="InvalidOperationException">The iteration does not converge (the sender moves near light speed).</exception>
    public static double SolveLightTimeSeconds(IConstellationOrbits orbits, int receiver, int sender, double receptionTimeSeconds)
    {
        SpacecraftLabel.CheckLink(receiver, sender);
        var receiverPosition = orbits.Position(receiver, receptionTimeSeconds);
        double tau = (receiverPosition - orbits.Position(sender, receptionTimeSeconds)).Length / PhysicalConstants.SpeedOfLightMS;
        for (int iteration = 0; iteration < MaxLightTimeIterations; iteration++)
        {
            double next = (receiverPosition - orbits.Position(sender, receptionTimeSeconds - tau)).Length / PhysicalConstants.SpeedOfLightMS;
            double change = Math.Abs(next - tau);
            tau = next;
            // Positions near 1 au carry ~1e-5 m of rounding, i.e. ~1e-14 of an arm; 1e-13 is safely above that noise.
            if (change <= 1e-13 * tau)
                return tau;
        }
        throw new InvalidOperationException($"light time of link {receiver}{sender} did not converge at t = {receptionTimeSeconds} s");
    }
}
