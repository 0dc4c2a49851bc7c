using System.Collections.Immutable;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The parameters of one galactic binary: frequency, drift, amplitude, sky position and orientation.</summary>
/// <remarks>
/// <para>Our conventions (leading quadrupole order, Peters 1964; several papers write <c>h× = −2A cos ι sin Φ</c>):
/// <c>Φ(t) = φ0 + 2π f0 t + π ḟ t² + (π/3) f̈ t³</c>
/// at the Sun, <c>h+ = A(1 + cos²ι) cos Φ</c>, <c>h× = 2A cos ι sin Φ</c>, with t on the data's time axis (f0 is the
/// frequency at t = 0). Column names are the project's parameter names (units in the name) and are exposed as constants for files,
/// JSON and configuration.</para>
/// <para>The struct does not validate: samplers propose values outside the prior and the prior, not the template,
/// rejects them. <see cref="Validate"/> checks a value read from user input. The default value is all zeros
/// (not a usable source: f0 must be positive).</para>
/// </remarks>
/// <param name="FrequencyHz">f0, gravitational-wave frequency at t = 0 (column <c>f0_hz</c>).</param>
/// <param name="FrequencyDerivativeHzS">ḟ, the frequency drift (column <c>fdot_hz_s</c>).</param>
/// <param name="Amplitude">A, dimensionless strain amplitude; face-on strain per polarisation is 2A (column <c>amplitude</c>).</param>
/// <param name="EclipticLatitudeRad">β in [−π/2, π/2] (column <c>beta_rad</c>).</param>
/// <param name="EclipticLongitudeRad">λ (column <c>lambda_rad</c>).</param>
/// <param name="InclinationRad">ι, orbital angular momentum to line of sight (column <c>iota_rad</c>).</param>
/// <param name="PolarisationRad">ψ (column <c>psi_rad</c>).</param>
/// <param name="InitialPhaseRad">φ0 (column <c>phi0_rad</c>).</param>
/// <param name="SecondFrequencyDerivativeHzS2">f̈, optional; 0 by default (column <c>fddot_hz_s2</c>).</param>
public readonly record struct GalacticBinaryParameters(
    double FrequencyHz,
    double FrequencyDerivativeHzS,
    double Amplitude,
    double EclipticLatitudeRad,
    double EclipticLongitudeRad,
    double InclinationRad,
    double PolarisationRad,
    double InitialPhaseRad,
    double SecondFrequencyDerivativeHzS2 = 0.0)
{
    /// <summary>Column name of <see cref="FrequencyHz"/>.</summary>
    public const string FrequencyColumn = "f0_hz";

    /// <summary>Column name of <see cref="FrequencyDerivativeHzS"/>.</summary>
    public const string FrequencyDerivativeColumn = "fdot_hz_s";

    /// <summary>Column name of <see cref="Amplitude"/>.</summary>
    public const string AmplitudeColumn = "amplitude";

    /// <summary>Column name of <see cref="EclipticLatitudeRad"/>.</summary>
    public const string EclipticLatitudeColumn = "beta_rad";

    /// <summary>Column name of <see cref="EclipticLongitudeRad"/>.</summary>
    public const string EclipticLongitudeColumn = "lambda_rad";

    /// <summary>Column name of <see cref="InclinationRad"/>.</summary>
    public const string InclinationColumn = "iota_rad";

    /// <summary>Column name of <see cref="PolarisationRad"/>.</summary>
    public const string PolarisationColumn = "psi_rad";

    /// <summary>Column name of <see cref="InitialPhaseRad"/>.</summary>
    public const string InitialPhaseColumn = "phi0_rad";

    /// <summary>Column name of the optional <see cref="SecondFrequencyDerivativeHzS2"/>.</summary>
    public const string SecondFrequencyDerivativeColumn = "fddot_hz_s2";

    /// <summary>The eight required columns in the order of the constructor.</summary>
    public static ImmutableArray<string> ColumnNames { get; } =
    [
        FrequencyColumn, FrequencyDerivativeColumn, AmplitudeColumn, EclipticLatitudeColumn,
        EclipticLongitudeColumn, InclinationColumn, PolarisationColumn, InitialPhaseColumn,
    ];

    /// <summary>The nine columns of truth tables and catalogues, in the order both files use: the eight of
    /// <see cref="ColumnNames"/> with <c>fddot_hz_s2</c> beside <c>fdot_hz_s</c>, so the frequency and its derivatives
    /// read together and a truth row and a catalogue row line up column for column.</summary>
    public static ImmutableArray<string> TableColumnNames { get; } =
    [
        FrequencyColumn, FrequencyDerivativeColumn, SecondFrequencyDerivativeColumn, AmplitudeColumn, EclipticLatitudeColumn,
        EclipticLongitudeColumn, InclinationColumn, PolarisationColumn, InitialPhaseColumn,
    ];

    /// <summary>The values of the nine <see cref="TableColumnNames"/>, in that order: the row of truth tables and catalogues.</summary>
    public double[] ToTableRow() =>
        [FrequencyHz, FrequencyDerivativeHzS, SecondFrequencyDerivativeHzS2, Amplitude, EclipticLatitudeRad, EclipticLongitudeRad, InclinationRad, PolarisationRad, InitialPhaseRad];

    /// <summary>The values of the eight <see cref="ColumnNames"/>, in that order: the one row layout of samples,
    /// handovers and catalogue rows.</summary>
    public double[] ToRow() =>
        [FrequencyHz, FrequencyDerivativeHzS, Amplitude, EclipticLatitudeRad, EclipticLongitudeRad, InclinationRad, PolarisationRad, InitialPhaseRad];

    /// <summary>The parameters of a row in <see cref="ColumnNames"/> order (f̈ = 0), the inverse of <see cref="ToRow"/>.</summary>
    /// <param name="row">At least eight values.</param>
    /// <exception cref="ArgumentException">The row holds fewer than eight values.</exception>
    public static GalacticBinaryParameters FromRow(ReadOnlySpan<double> row)
    {
        if (row.Length < 8) throw new ArgumentException($"a row needs the {ColumnNames.Length} columns {string.Join(", ", ColumnNames)}, got {row.Length} values", nameof(row));
        return new(row[0], row[1], row[2], row[3], row[4], row[5], row[6], row[7]);
    }

    /// <summary>Throws unless every value is finite, f0 is positive, A is not negative and |β| ≤ π/2.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A value is out of range; the parameter name is its column name.</exception>
    public void Validate()
    {
        if (!(FrequencyHz > 0) || !double.IsFinite(FrequencyHz))
            throw new ArgumentOutOfRangeException(FrequencyColumn, FrequencyHz, "frequency must be positive and finite");
        if (!(Amplitude >= 0) || !double.IsFinite(Amplitude))
            throw new ArgumentOutOfRangeException(AmplitudeColumn, Amplitude, "amplitude must be finite and not negative");
        if (!(Math.Abs(EclipticLatitudeRad) <= 0.5 * Math.PI))
            throw new ArgumentOutOfRangeException(EclipticLatitudeColumn, EclipticLatitudeRad, "ecliptic latitude must lie in [-pi/2, pi/2]");
        RequireFinite(FrequencyDerivativeHzS, FrequencyDerivativeColumn);
        RequireFinite(EclipticLongitudeRad, EclipticLongitudeColumn);
        RequireFinite(InclinationRad, InclinationColumn);
        RequireFinite(PolarisationRad, PolarisationColumn);
        RequireFinite(InitialPhaseRad, InitialPhaseColumn);
        RequireFinite(SecondFrequencyDerivativeHzS2, SecondFrequencyDerivativeColumn);
    }

    private static void RequireFinite(double value, string column)
    {
        if (!double.IsFinite(value))
            throw new ArgumentOutOfRangeException(column, value, "value must be finite");
    }
}
