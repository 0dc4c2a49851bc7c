namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>Bin edges for relative binning: equal steps of a bound on the phase difference between nearby templates.</summary>
/// <remarks>
/// Zackay, Dai &amp; Venumadhav 2018 (arXiv:1806.08792), Sec. III: the phase difference between the reference and any template
/// with posterior support is bounded by <c>δψ(f) = 2π Σ_α sgn(γ_α) (f/f_*α)^{γ_α}</c> with the post-Newtonian powers
/// <c>γ_α ∈ {−5/3, −2/3, 1, 5/3, 7/3}</c> and <c>f_*α = f_min</c> for γ_α &lt; 0, <c>f_max</c> for γ_α &gt; 0 (each term contributes
/// at most 2π over the band; from memory). δψ increases monotonically, and edges are placed where it crosses equal steps ε,
/// so within a bin no template's phase relative to the reference can turn by more than ε and the ratio h/h0 stays close to
/// linear. Edges are then snapped to the data's frequency grid.
/// </remarks>
public static class RelativeBinning
{
    private static readonly double[] Powers = [-5.0 / 3.0, -2.0 / 3.0, 1.0, 5.0 / 3.0, 7.0 / 3.0];

    /// <summary>The phase-difference bound δψ(f) over the band [<paramref name="lowHz"/>, <paramref name="highHz"/>].</summary>
    /// <value>rad.</value>
    public static double PhaseBound(double frequencyHz, double lowHz, double highHz)
    {
        double sum = 0;
        foreach (double gamma in Powers)
            sum += gamma < 0 ? -Math.Pow(frequencyHz / lowHz, gamma) : Math.Pow(frequencyHz / highHz, gamma);
        return 2.0 * Math.PI * sum;
    }

    /// <summary>Indices (into a uniform grid <c>f_k = (first + k) Δf</c>, k = 0 … count − 1) of the bin edges between grid points
    /// <paramref name="lowIndex"/> and <paramref name="highIndex"/> inclusive, in steps of at most <paramref name="phaseStepRad"/>
    /// of the bound (duplicates removed, so a bin holds at least one grid point).</summary>
    /// <param name="firstBin">Full-resolution bin number of grid point 0.</param>
    /// <param name="dfHz">Grid spacing.</param>
    /// <param name="lowIndex">Grid index of the lowest frequency to cover (f_min).</param>
    /// <param name="highIndex">Grid index of the highest frequency to cover (f_max).</param>
    /// <param name="phaseStepRad">ε.</param>
    /// <exception cref="ArgumentOutOfRangeException">The band is empty or starts at zero frequency, or ε is not positive.</exception>
    public static int[] EdgeIndices(int firstBin, double dfHz, int lowIndex, int highIndex, double phaseStepRad)
    {
        if (!(phaseStepRad > 0) || !double.IsFinite(phaseStepRad))
            throw new ArgumentOutOfRangeException(nameof(phaseStepRad), phaseStepRad, "phase step must be positive and finite");
        if (highIndex <= lowIndex || firstBin + lowIndex <= 0)
            throw new ArgumentOutOfRangeException(nameof(highIndex), highIndex, "band must be non-empty and above zero frequency");
        double low = (firstBin + lowIndex) * dfHz, high = (firstBin + highIndex) * dfHz;
        double start = PhaseBound(low, low, high), end = PhaseBound(high, low, high);
        int steps = Math.Max(1, (int)Math.Ceiling((end - start) / phaseStepRad));
        var edges = new List<int>(steps + 1) { lowIndex };
        for (int s = 1; s < steps; s++)
        {
            double target = start + (end - start) * s / steps;
            // Bisection in log f on the monotonic bound.
            double a = Math.Log(low), b = Math.Log(high);
            for (int iteration = 0; iteration < 60; iteration++)
            {
                double mid = 0.5 * (a + b);
                if (PhaseBound(Math.Exp(mid), low, high) < target) a = mid; else b = mid;
            }
            int index = (int)Math.Round(Math.Exp(0.5 * (a + b)) / dfHz) - firstBin;
            index = Math.Clamp(index, lowIndex, highIndex);
            if (index > edges[^1] && index < highIndex) edges.Add(index);
        }
        edges.Add(highIndex);
        return [.. edges];
    }
}
