using GlobalFit.Inference.Random;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>Draws inspirals from an <see cref="ExtremeMassRatioInspiralPopulationSettings"/>.</summary>
/// <remarks>Per inspiral, in this order from one stream: M log-uniform; μ, χ, e0 and the plunge time uniform; D with
/// density ∝ D² (uniform in Euclidean volume, inverse CDF); orbit inclination with cos λ uniform on [−1, 1]; sky
/// isotropic (sin β uniform, longitude uniform); spin direction isotropic (cos θ_K uniform, φ_K uniform); Φ0, γ̃0, α0
/// uniform on [0, 2π). The plunge time becomes ν0 through <see cref="InspiralTrajectory.FrequencyForPlungeTime"/>.
/// Deterministic for a given stream.</remarks>
public static class ExtremeMassRatioInspiralPopulation
{
    /// <summary>Draws <see cref="ExtremeMassRatioInspiralPopulationSettings.Count"/> inspirals; each comes with the
    /// plunge time it was drawn for.</summary>
    public static (ExtremeMassRatioInspiralParameters Parameters, double PlungeTimeS)[] Draw(
        ExtremeMassRatioInspiralPopulationSettings settings, ref RandomStream random)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var trajectory = new InspiralTrajectory();
        var result = new (ExtremeMassRatioInspiralParameters, double)[settings.Count];
        for (int i = 0; i < result.Length; i++) result[i] = DrawOne(settings, trajectory, ref random);
        return result;
    }

    private static (ExtremeMassRatioInspiralParameters, double) DrawOne(
        ExtremeMassRatioInspiralPopulationSettings s, InspiralTrajectory trajectory, ref RandomStream random)
    {
        double m = s.CentralMassMinMsun * Math.Pow(s.CentralMassMaxMsun / s.CentralMassMinMsun, random.NextDouble());
        double mu = random.NextUniform(s.CompactMassMinMsun, s.CompactMassMaxMsun);
        double chi = random.NextUniform(s.SpinMin, s.SpinMax);
        double e0 = random.NextUniform(s.EccentricityMin, s.EccentricityMax);
        double plunge = random.NextUniform(s.PlungeTimeMinS, s.PlungeTimeMaxS);
        double lo3 = Math.Pow(s.DistanceMinMpc, 3), hi3 = Math.Pow(s.DistanceMaxMpc, 3);
        double distance = Math.Cbrt(lo3 + random.NextDouble() * (hi3 - lo3));
        double inclination = Math.Acos(random.NextUniform(-1, 1));
        double beta = Math.Asin(random.NextUniform(-1, 1));
        double lambda = random.NextUniform(0, 2 * Math.PI);
        double spinTheta = Math.Acos(random.NextUniform(-1, 1));
        double spinPhi = random.NextUniform(0, 2 * Math.PI);
        double phi0 = random.NextUniform(0, 2 * Math.PI);
        double gamma0 = random.NextUniform(0, 2 * Math.PI);
        double alpha0 = random.NextUniform(0, 2 * Math.PI);
        var equations = Equations(m, mu, chi, inclination);
        double nu0 = trajectory.FrequencyForPlungeTime(equations, [0, 0, 0, e0, 0], plunge);
        return (new ExtremeMassRatioInspiralParameters(m, mu, chi, nu0, e0, inclination, beta, lambda, spinTheta, spinPhi,
            distance, phi0, gamma0, alpha0), plunge);
    }

    /// <summary>The orbit equations of a source with these masses (solar masses), spin and orbit inclination.</summary>
    internal static KludgeOrbitEquations Equations(double centralMassMsun, double compactMassMsun, double spin, double inclinationRad) =>
        new(centralMassMsun * PhysicalConstants.SolarMassSeconds, compactMassMsun * PhysicalConstants.SolarMassSeconds, spin, Math.Cos(inclinationRad));
}
