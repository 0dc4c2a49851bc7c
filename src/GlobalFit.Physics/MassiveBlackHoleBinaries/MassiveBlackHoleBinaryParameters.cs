using System.Collections.Immutable;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The parameters of one massive black-hole binary with aligned spins, in physical units.</summary>
/// <remarks>
/// <para>Masses are detector-frame (redshifted) masses, <c>(1 + z)</c> times the source-frame ones; the source-frame values
/// follow from the redshift of the luminosity distance (<see cref="BinaryMasses"/> and
/// <see cref="Cosmology.FlatLambdaCdm"/>). Body 1 is the heavier one. The (2,2) mode reaching the Sun is described by
/// <see cref="PhenomDWaveform"/>; t_c is the arrival time of its amplitude peak at the Sun on the data's time axis, and
/// <c>−2 φ_ref</c> is the phase of the (2,2) mode at that moment (<see cref="MassiveBlackHoleBinaryResponse"/>).
/// Column names are those of the project's naming scheme and are exposed as constants for files, JSON and configuration.</para>
/// <para>The struct does not validate (samplers propose values outside the prior, which rejects them);
/// <see cref="Validate"/> checks a value read from user input. The default value is all zeros (not a usable source).</para>
/// </remarks>
/// <param name="ChirpMassMsun">Detector-frame chirp mass <c>(m1 m2)^{3/5}/(m1 + m2)^{1/5}</c> in solar masses (column <c>chirp_mass_msun</c>).</param>
/// <param name="MassRatio">q = m1/m2 ≥ 1 (column <c>mass_ratio</c>).</param>
/// <param name="Spin1">Dimensionless spin of the heavier body along the orbital angular momentum, in [−1, 1] (column <c>spin1</c>).</param>
/// <param name="Spin2">Dimensionless spin of the lighter body along the orbital angular momentum, in [−1, 1] (column <c>spin2</c>).</param>
/// <param name="CoalescenceTimeS">t_c, arrival of the amplitude peak at the Sun (column <c>tc_s</c>).</param>
/// <param name="DistanceMpc">Luminosity distance (column <c>distance_mpc</c>).</param>
/// <param name="EclipticLatitudeRad">β in [−π/2, π/2] (column <c>beta_rad</c>).</param>
/// <param name="EclipticLongitudeRad">λ (column <c>lambda_rad</c>).</param>
/// <param name="InclinationRad">ι, orbital angular momentum to line of sight (column <c>iota_rad</c>).</param>
/// <param name="PolarisationRad">ψ (column <c>psi_rad</c>).</param>
/// <param name="ReferencePhaseRad">φ_ref, orbital phase at t_c (column <c>phi_ref_rad</c>).</param>
public readonly record struct MassiveBlackHoleBinaryParameters(
    double ChirpMassMsun,
    double MassRatio,
    double Spin1,
    double Spin2,
    double CoalescenceTimeS,
    double DistanceMpc,
    double EclipticLatitudeRad,
    double EclipticLongitudeRad,
    double InclinationRad,
    double PolarisationRad,
    double ReferencePhaseRad)
{
    /// <summary>Column name of <see cref="ChirpMassMsun"/>.</summary>
    public const string ChirpMassColumn = "chirp_mass_msun";

    /// <summary>Column name of <see cref="MassRatio"/>.</summary>
    public const string MassRatioColumn = "mass_ratio";

    /// <summary>Column name of <see cref="Spin1"/>.</summary>
    public const string Spin1Column = "spin1";

    /// <summary>Column name of <see cref="Spin2"/>.</summary>
    public const string Spin2Column = "spin2";

    /// <summary>Column name of <see cref="CoalescenceTimeS"/>.</summary>
    public const string CoalescenceTimeColumn = "tc_s";

    /// <summary>Column name of <see cref="DistanceMpc"/>.</summary>
    public const string DistanceColumn = "distance_mpc";

    /// <summary>Column name of <see cref="EclipticLatitudeRad"/>.</summary>
    public const string EclipticLatitudeColumn = "beta_rad";

    /// <summary>Column name of <see cref="EclipticLongitudeRad"/>.</summary>
    public const string EclipticLongitudeColumn = "lambda_rad";

    /// <summary>Column name of <see cref="InclinationRad"/>.</summary>
    public const string InclinationColumn = "iota_rad";

    /// <summary>Column name of <see cref="PolarisationRad"/>.</summary>
    public const string PolarisationColumn = "psi_rad";

    /// <summary>Column name of <see cref="ReferencePhaseRad"/>.</summary>
    public const string ReferencePhaseColumn = "phi_ref_rad";

    /// <summary>Column name of the derived detector-frame total mass.</summary>
    public const string TotalMassColumn = "total_mass_msun";

    /// <summary>Column name of the derived redshift.</summary>
    public const string RedshiftColumn = "redshift";

    /// <summary>The eleven parameter columns in the order of the constructor.</summary>
    public static ImmutableArray<string> ColumnNames { get; } =
    [
        ChirpMassColumn, MassRatioColumn, Spin1Column, Spin2Column, CoalescenceTimeColumn, DistanceColumn,
        EclipticLatitudeColumn, EclipticLongitudeColumn, InclinationColumn, PolarisationColumn, ReferencePhaseColumn,
    ];

    /// <summary>Detector-frame total mass <c>m1 + m2 = 𝓜 η^{−3/5}</c>.</summary>
    /// <value>Solar masses.</value>
    public double TotalMassMsun => BinaryMasses.TotalMass(ChirpMassMsun, MassRatio);

    /// <summary>Symmetric mass ratio <c>η = q/(1 + q)²</c>.</summary>
    public double SymmetricMassRatio => BinaryMasses.SymmetricMassRatio(MassRatio);

    /// <summary>Redshift of the luminosity distance (derived column <c>redshift</c>) in <paramref name="cosmology"/>, by default
    /// <see cref="Cosmology.FlatLambdaCdm.Planck2018"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The distance is negative, not finite or beyond the cosmology's range.</exception>
    public double Redshift(Cosmology.FlatLambdaCdm? cosmology = null) =>
        (cosmology ?? Cosmology.FlatLambdaCdm.Planck2018).Redshift(DistanceMpc);

    /// <summary>Source-frame total mass <c>M/(1 + z)</c> with z from <see cref="Redshift"/>.</summary>
    /// <value>Solar masses.</value>
    /// <exception cref="ArgumentOutOfRangeException">A mass, q or the distance is out of range.</exception>
    public double SourceFrameTotalMassMsun(Cosmology.FlatLambdaCdm? cosmology = null) =>
        BinaryMasses.SourceFrame(TotalMassMsun, Redshift(cosmology));

    /// <summary>The parameters as an array in the order of <see cref="ColumnNames"/>.</summary>
    public double[] ToArray() =>
    [
        ChirpMassMsun, MassRatio, Spin1, Spin2, CoalescenceTimeS, DistanceMpc,
        EclipticLatitudeRad, EclipticLongitudeRad, InclinationRad, PolarisationRad, ReferencePhaseRad,
    ];

    /// <summary>Builds parameters from values in the order of <see cref="ColumnNames"/>.</summary>
    /// <exception cref="ArgumentException">The span does not hold eleven values.</exception>
    public static MassiveBlackHoleBinaryParameters FromSpan(ReadOnlySpan<double> values)
    {
        if (values.Length != 11)
            throw new ArgumentException($"expected 11 values, got {values.Length}", nameof(values));
        return new(values[0], values[1], values[2], values[3], values[4], values[5], values[6], values[7], values[8], values[9], values[10]);
    }

    /// <summary>Throws unless the values describe a source the waveform accepts.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A value is out of range; the parameter name is its column name.</exception>
    public void Validate()
    {
        if (!(ChirpMassMsun > 0) || !double.IsFinite(ChirpMassMsun))
            throw new ArgumentOutOfRangeException(ChirpMassColumn, ChirpMassMsun, "chirp mass must be positive and finite");
        if (!(MassRatio >= 1) || !double.IsFinite(MassRatio))
            throw new ArgumentOutOfRangeException(MassRatioColumn, MassRatio, "mass ratio must be finite and at least 1");
        if (!(Math.Abs(Spin1) <= 1))
            throw new ArgumentOutOfRangeException(Spin1Column, Spin1, "spin must lie in [-1, 1]");
        if (!(Math.Abs(Spin2) <= 1))
            throw new ArgumentOutOfRangeException(Spin2Column, Spin2, "spin must lie in [-1, 1]");
        if (!double.IsFinite(CoalescenceTimeS))
            throw new ArgumentOutOfRangeException(CoalescenceTimeColumn, CoalescenceTimeS, "coalescence time must be finite");
        if (!(DistanceMpc > 0) || !double.IsFinite(DistanceMpc))
            throw new ArgumentOutOfRangeException(DistanceColumn, DistanceMpc, "distance must be positive and finite");
        if (!(Math.Abs(EclipticLatitudeRad) <= 0.5 * Math.PI))
            throw new ArgumentOutOfRangeException(EclipticLatitudeColumn, EclipticLatitudeRad, "ecliptic latitude must lie in [-pi/2, pi/2]");
        RequireFinite(EclipticLongitudeRad, EclipticLongitudeColumn);
        RequireFinite(InclinationRad, InclinationColumn);
        RequireFinite(PolarisationRad, PolarisationColumn);
        RequireFinite(ReferencePhaseRad, ReferencePhaseColumn);
    }

    private static void RequireFinite(double value, string column)
    {
        if (!double.IsFinite(value))
            throw new ArgumentOutOfRangeException(column, value, "value must be finite");
    }
}
