namespace GlobalFit.Physics.Detector;

/// <summary>Argument checks shared by the orbit models.</summary>
internal static class OrbitArguments
{
    /// <summary>First-order orbit expansions hold only for arms much shorter than the orbit radius.</summary>
    private const double LargestArmToRadius = 0.1;

    public static void CheckShape(double armLengthM, double orbitRadiusM, double periodSeconds)
    {
        if (!(armLengthM > 0) || !double.IsFinite(armLengthM))
            throw new ArgumentOutOfRangeException(nameof(armLengthM), armLengthM, "arm length must be positive and finite");
        if (!(orbitRadiusM > 0) || !double.IsFinite(orbitRadiusM))
            throw new ArgumentOutOfRangeException(nameof(orbitRadiusM), orbitRadiusM, "orbit radius must be positive and finite");
        if (armLengthM >= LargestArmToRadius * orbitRadiusM)
            throw new ArgumentOutOfRangeException(nameof(armLengthM), armLengthM,
                $"arm length must be below {LargestArmToRadius} of the orbit radius ({orbitRadiusM} m) for first-order orbits");
        if (!(periodSeconds > 0) || !double.IsFinite(periodSeconds))
            throw new ArgumentOutOfRangeException(nameof(periodSeconds), periodSeconds, "period must be positive and finite");
    }

    public static void CheckAngle(double angleRad, string parameterName)
    {
        if (!double.IsFinite(angleRad))
            throw new ArgumentOutOfRangeException(parameterName, angleRad, "angle must be finite");
    }
}
