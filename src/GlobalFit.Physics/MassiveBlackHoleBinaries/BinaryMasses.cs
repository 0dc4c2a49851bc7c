namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>Conversions between chirp mass and mass ratio, component masses, total mass and source-frame masses.</summary>
/// <remarks>
/// Definitions (e.g. Cutler &amp; Flanagan 1994, PRD 49, 2658): <c>M = m1 + m2</c>, <c>q = m1/m2 ≥ 1</c>,
/// <c>η = m1 m2/M² = q/(1 + q)²</c>, chirp mass <c>𝓜 = (m1 m2)^{3/5} M^{−1/5} = η^{3/5} M</c>. Masses observed through a
/// cosmological distance are redshifted: detector-frame = (1 + z) × source-frame. All functions are pure and
/// thread-safe; units are whatever the caller uses (solar masses here).
/// </remarks>
public static class BinaryMasses
{
    /// <summary>η = q/(1 + q)².</summary>
    /// <exception cref="ArgumentOutOfRangeException">q is below 1 or not finite.</exception>
    public static double SymmetricMassRatio(double massRatio)
    {
        CheckMassRatio(massRatio);
        return massRatio / ((1.0 + massRatio) * (1.0 + massRatio));
    }

    /// <summary>Total mass <c>M = 𝓜 η^{−3/5}</c>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The chirp mass is not positive and finite, or q is out of range.</exception>
    public static double TotalMass(double chirpMass, double massRatio)
    {
        CheckPositive(chirpMass, nameof(chirpMass));
        return chirpMass * Math.Pow(SymmetricMassRatio(massRatio), -0.6);
    }

    /// <summary>Component masses <c>m1 = M q/(1 + q)</c>, <c>m2 = M/(1 + q)</c>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The chirp mass is not positive and finite, or q is out of range.</exception>
    public static (double Heavier, double Lighter) ComponentMasses(double chirpMass, double massRatio)
    {
        double total = TotalMass(chirpMass, massRatio);
        return (total * massRatio / (1.0 + massRatio), total / (1.0 + massRatio));
    }

    /// <summary>Chirp mass and mass ratio of two component masses (in either order).</summary>
    /// <exception cref="ArgumentOutOfRangeException">A mass is not positive and finite.</exception>
    public static (double ChirpMass, double MassRatio) FromComponents(double mass1, double mass2)
    {
        CheckPositive(mass1, nameof(mass1));
        CheckPositive(mass2, nameof(mass2));
        double heavy = Math.Max(mass1, mass2), light = Math.Min(mass1, mass2);
        double chirp = Math.Pow(heavy * light, 0.6) * Math.Pow(heavy + light, -0.2);
        return (chirp, heavy / light);
    }

    /// <summary>Source-frame mass of a detector-frame mass at redshift z: <c>m / (1 + z)</c>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The mass is not positive and finite or z is negative or not finite.</exception>
    public static double SourceFrame(double detectorFrameMass, double redshift)
    {
        CheckPositive(detectorFrameMass, nameof(detectorFrameMass));
        if (!(redshift >= 0) || !double.IsFinite(redshift))
            throw new ArgumentOutOfRangeException(nameof(redshift), redshift, "redshift must be finite and not negative");
        return detectorFrameMass / (1.0 + redshift);
    }

    /// <summary>Detector-frame mass of a source-frame mass at redshift z: <c>(1 + z) m</c>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The mass is not positive and finite or z is negative or not finite.</exception>
    public static double DetectorFrame(double sourceFrameMass, double redshift)
    {
        CheckPositive(sourceFrameMass, nameof(sourceFrameMass));
        if (!(redshift >= 0) || !double.IsFinite(redshift))
            throw new ArgumentOutOfRangeException(nameof(redshift), redshift, "redshift must be finite and not negative");
        return sourceFrameMass * (1.0 + redshift);
    }

    private static void CheckMassRatio(double massRatio)
    {
        if (!(massRatio >= 1.0) || !double.IsFinite(massRatio))
            throw new ArgumentOutOfRangeException(nameof(massRatio), massRatio, "mass ratio must be finite and at least 1");
    }

    private static void CheckPositive(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new ArgumentOutOfRangeException(name, value, "mass must be positive and finite");
    }
}
