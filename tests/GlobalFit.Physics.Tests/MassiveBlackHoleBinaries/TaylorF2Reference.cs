namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

/// <summary>An independent 3.5PN TaylorF2 phase for checks of the IMRPhenomD inspiral.</summary>
/// <remarks>
/// Written from Buonanno, Iyer, Ochsner, Pan &amp; Sathyaprakash 2009 (PRD 80, 084043, arXiv:0907.0700), Eq. (3.18)
/// (non-spinning, in v = (πMf)^{1/3} with the ln(v/v_lso) and ln(4v) forms), from memory. The 1.5PN spin–orbit term in
/// Kidder's form 4β v³ with β = (1/12) Σ_i (113 m_i²/M² + 75η) χ_i (Kidder 1995, PRD 52, 821; from memory) is included for
/// completeness; higher spin orders are not, so only non-spinning systems are compared in full.
/// </remarks>
internal static class TaylorF2Reference
{
    private const double EulerGamma = 0.5772156649015329;

    /// <summary>Ψ(Mf) without the 2πf t_c − φ_c − π/4 terms.</summary>
    public static double Phase(double mf, double eta, double m1, double m2, double spin1, double spin2)
    {
        double pi = Math.PI;
        double v = Math.Cbrt(pi * mf);
        double vLso = 1.0 / Math.Sqrt(6.0);
        double beta = (113.0 * m1 * m1 + 75.0 * eta) * spin1 / 12.0 + (113.0 * m2 * m2 + 75.0 * eta) * spin2 / 12.0;
        double sum = 1.0
            + (3715.0 / 756.0 + 55.0 / 9.0 * eta) * v * v
            + (-16.0 * pi + 4.0 * beta) * v * v * v
            + (15293365.0 / 508032.0 + 27145.0 / 504.0 * eta + 3085.0 / 72.0 * eta * eta) * Math.Pow(v, 4)
            + pi * (38645.0 / 756.0 - 65.0 / 9.0 * eta) * (1.0 + 3.0 * Math.Log(v / vLso)) * Math.Pow(v, 5)
            + (11583231236531.0 / 4694215680.0 - 640.0 / 3.0 * pi * pi - 6848.0 / 21.0 * EulerGamma - 6848.0 / 21.0 * Math.Log(4.0 * v)
               + (-15737765635.0 / 3048192.0 + 2255.0 / 12.0 * pi * pi) * eta + 76055.0 / 1728.0 * eta * eta - 127825.0 / 1296.0 * eta * eta * eta) * Math.Pow(v, 6)
            + pi * (77096675.0 / 254016.0 + 378515.0 / 1512.0 * eta - 74045.0 / 756.0 * eta * eta) * Math.Pow(v, 7);
        return 3.0 / (128.0 * eta * Math.Pow(v, 5)) * sum;
    }

    /// <summary>Residual of <paramref name="difference"/> after removing the least-squares constant and linear-in-f terms
    /// (a phase and time convention), largest absolute value.</summary>
    public static double ResidualAfterLinearFit(ReadOnlySpan<double> f, ReadOnlySpan<double> difference)
    {
        int n = f.Length;
        double sf = 0, sff = 0, sy = 0, sfy = 0;
        for (int i = 0; i < n; i++) { sf += f[i]; sff += f[i] * f[i]; sy += difference[i]; sfy += f[i] * difference[i]; }
        double slope = (n * sfy - sf * sy) / (n * sff - sf * sf);
        double offset = (sy - slope * sf) / n;
        double worst = 0;
        for (int i = 0; i < n; i++) worst = Math.Max(worst, Math.Abs(difference[i] - offset - slope * f[i]));
        return worst;
    }
}
