namespace GlobalFit.Physics.Noise;

/// <summary>
/// Sky- and polarisation-averaged response of the TDI channels for static, equal arms, normalised as
/// <c>R(x) = ⟨|channel|²⟩/(16x² sin²x)</c> for a unit-amplitude wave of one polarisation, <c>x = f/f*</c>.
/// </summary>
/// <remarks>
/// <para>Definition and reference values: shared/reference/detector-noise-gb.md §C.4 (R_X table, from
/// numerical quadrature) and §D.3. Low-frequency limits: <c>R_X → 3/20</c>, <c>R_A = R_E = (3/2) R_X</c>
/// at every x, and <c>R_T → 0</c>. Orbital motion does not change sky averages.</para>
/// <para>Values are computed here by quadrature (<see cref="SkyAverageQuadrature"/>), tabulated once on
/// <c>0 ≤ x ≤ 20</c> (f ≤ 0.38 Hz for 2.5 Gm arms) at spacing 0.05 and interpolated by four-point cubic
/// Lagrange interpolation (interpolation error below 1e-7, see the tests); above the table every call
/// integrates directly. Building the table takes a few tenths of a second on first use. Thread-safe.</para>
/// </remarks>
public static class SkyAveragedResponse
{
    private const double TableStep = 0.05;
    private const int TableIntervals = 400;

    /// <summary>Upper end of the tabulated range of x; calls above it integrate directly (slowly).</summary>
    public const double TabulatedMaximumX = TableStep * TableIntervals;

    private static readonly Lazy<Table> Tabulated = new(BuildTable, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>R_X of one Michelson channel.</summary>
    /// <param name="x">Dimensionless frequency f/f*, non-negative.</param>
    public static double MichelsonX(double x) => Lookup(x, Curve.X);

    /// <summary>R_A = R_E of channel A (or E).</summary>
    /// <param name="x">Dimensionless frequency f/f*, non-negative.</param>
    public static double ChannelAE(double x) => Lookup(x, Curve.AE);

    /// <summary>R_T of channel T.</summary>
    /// <param name="x">Dimensionless frequency f/f*, non-negative.</param>
    public static double ChannelT(double x) => Lookup(x, Curve.T);

    /// <summary>Robson et al.'s approximate two-channel (A+E) transfer function <c>(3/10)/(1 + 0.6x²)</c>,
    /// normalised to the X-channel noise (so it approximates <c>2 R_X</c>).</summary>
    /// <remarks>Robson, Cornish &amp; Liu 2019 (arXiv:1803.01944), as restated in §D.3. Against the exact
    /// average it is within 2 % below about 5 mHz, up to 13 % high near f* and poor above 2f* (§C.4 table).</remarks>
    public static double RobsonTwoChannelApproximation(double x) => 0.3 / (1.0 + 0.6 * x * x);

    /// <summary>The A-channel counterpart of <see cref="RobsonTwoChannelApproximation"/>: <c>(9/40)/(1 + 0.6x²)</c>,
    /// i.e. (3/2) times half the two-channel value, approximating <see cref="ChannelAE"/> with the same up-to-13 % error.</summary>
    public static double RobsonChannelAEApproximation(double x) => 0.225 / (1.0 + 0.6 * x * x);

    private static double Lookup(double x, Curve curve)
    {
        if (!(x >= 0) || !double.IsFinite(x))
            throw new ArgumentOutOfRangeException(nameof(x), x, "dimensionless frequency must be finite and non-negative");
        if (x > TabulatedMaximumX)
        {
            var direct = SkyAverageQuadrature.Average(x);
            return curve switch { Curve.X => direct.X, Curve.AE => direct.A, _ => direct.T };
        }
        var table = Tabulated.Value;
        double[] values = curve switch { Curve.X => table.X, Curve.AE => table.AE, _ => table.T };
        return Interpolate(values, x);
    }

    // Four-point Lagrange on the uniform grid, using the stencil [i−1, i+2] clamped to the table.
    private static double Interpolate(double[] values, double x)
    {
        int i = Math.Min((int)(x / TableStep), TableIntervals - 1);
        int start = Math.Clamp(i - 1, 0, TableIntervals - 3);
        double s = x / TableStep - start;
        double y0 = values[start], y1 = values[start + 1], y2 = values[start + 2], y3 = values[start + 3];
        return -y0 * (s - 1) * (s - 2) * (s - 3) / 6.0
            + y1 * s * (s - 2) * (s - 3) / 2.0
            - y2 * s * (s - 1) * (s - 3) / 2.0
            + y3 * s * (s - 1) * (s - 2) / 6.0;
    }

    private static Table BuildTable()
    {
        var x = new double[TableIntervals + 1];
        var ae = new double[TableIntervals + 1];
        var t = new double[TableIntervals + 1];
        for (int i = 0; i <= TableIntervals; i++)
        {
            var averages = SkyAverageQuadrature.Average(i * TableStep);
            x[i] = averages.X;
            // A and E are equal by symmetry; averaging the two halves the quadrature error of each.
            ae[i] = 0.5 * (averages.A + averages.E);
            t[i] = averages.T;
        }
        return new Table(x, ae, t);
    }

    private sealed record Table(double[] X, double[] AE, double[] T);

    private enum Curve { X, AE, T }
}
