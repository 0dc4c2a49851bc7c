namespace GlobalFit.Physics.Noise;

/// <summary>
/// Sky- and polarisation-averaged response of the TDI channels for static, equal arms, normalised as
/// <c>R(x) = ⟨|channel|²⟩/(16x² sin²x)</c> for a unit-amplitude wave of one polarisation, <c>x = f/f*</c>.
/// </summary>
/// <remarks>
/// <para>Definition as used with the sensitivity of Robson, Cornish &amp; Liu 2019 (their approximate transfer
/// function is <c>2 R_X</c>). Low-frequency limits (derived: long-wavelength response of a 60° Michelson):
/// <c>R_X → 3/20</c> (= sin²60° × 1/5), <c>R_A = R_E → (3/2) R_X</c>, and <c>R_T → 0</c>. Orbital motion does not
/// change sky averages.</para>
/// <para>Values are computed here by quadrature (<see cref="SkyAverageQuadrature"/>), tabulated once on
/// <c>0 ≤ x ≤ 20</c> (f ≤ 0.38 Hz for 2.5 Gm arms) at spacing 0.05 and interpolated by four-point cubic
/// Lagrange interpolation (interpolation error below 1e-7, see the tests); above the table every call
/// integrates directly (about a millisecond each). Table entries are computed on first use, a few milliseconds
/// each, so only the part of the band a process touches is ever integrated. Thread-safe.</para>
/// </remarks>
public static class SkyAveragedResponse
{
    private const double TableStep = 0.05;
    private const int TableIntervals = 400;

    /// <summary>Upper end of the tabulated range of x; calls above it integrate directly (slowly).</summary>
    public const double TabulatedMaximumX = TableStep * TableIntervals;

    // Entries are computed on first use, one grid point at a time, so a caller that only needs the
    // millihertz band pays for a few dozen quadratures rather than the whole table. Each entry is a pure
    // function of its index, so two threads racing on one entry store identical values; the ready flag is
    // published after the values (Volatile) so a reader never sees a half-written entry.
    private static readonly double[] TableX = new double[TableIntervals + 1];
    private static readonly double[] TableAE = new double[TableIntervals + 1];
    private static readonly double[] TableT = new double[TableIntervals + 1];
    private static readonly bool[] TableReady = new bool[TableIntervals + 1];

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
    /// <remarks>Robson, Cornish &amp; Liu 2019 (arXiv:1803.01944; form from memory). Against the exact average it is
    /// within 2 % below about 5 mHz, up to 13 % high near f* and poor above 2f* (derived: compared with this class's
    /// quadrature; see the tests).</remarks>
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
        int i = Math.Min((int)(x / TableStep), TableIntervals - 1);
        int start = Math.Clamp(i - 1, 0, TableIntervals - 3);
        for (int j = start; j < start + 4; j++) EnsureEntry(j);
        double[] values = curve switch { Curve.X => TableX, Curve.AE => TableAE, _ => TableT };
        // Every R is non-negative; the cubic can undershoot by ~1e-11 where R_T rises as x⁸ from zero.
        return Math.Max(0.0, Interpolate(values, start, x / TableStep - start));
    }

    // Four-point Lagrange on the uniform grid over the stencil [start, start + 3]; s is x in steps from start.
    private static double Interpolate(double[] values, int start, double s)
    {
        double y0 = values[start], y1 = values[start + 1], y2 = values[start + 2], y3 = values[start + 3];
        return -y0 * (s - 1) * (s - 2) * (s - 3) / 6.0
            + y1 * s * (s - 2) * (s - 3) / 2.0
            - y2 * s * (s - 1) * (s - 3) / 2.0
            + y3 * s * (s - 1) * (s - 2) / 6.0;
    }

    private static void EnsureEntry(int index)
    {
        if (Volatile.Read(ref TableReady[index])) return;
        var averages = SkyAverageQuadrature.Average(index * TableStep);
        TableX[index] = averages.X;
        // A and E are equal by symmetry; averaging the two halves the quadrature error of each.
        TableAE[index] = 0.5 * (averages.A + averages.E);
        TableT[index] = averages.T;
        Volatile.Write(ref TableReady[index], true);
    }

    private enum Curve { X, AE, T }
}
