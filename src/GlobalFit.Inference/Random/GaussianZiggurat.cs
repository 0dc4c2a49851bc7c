namespace GlobalFit.Inference.Random;

/// <summary>
/// The 256-layer ziggurat of the standard normal density, for <see cref="RandomStream.NextGaussian"/>: layer edges,
/// density values at the edges and the ratios that decide the fast path.
/// </summary>
/// <remarks>
/// <para>Marsaglia &amp; Tsang (2000), "The Ziggurat Method for Generating Random Variables", Journal of Statistical
/// Software 5(8), §2–§4. The unnormalised density f(x) = exp(−x²/2) on x ≥ 0 is covered by 255 horizontal layers of
/// equal area V and a base of area V made of the rectangle [0, r] × [0, f(r)] and the tail beyond r. With 256 layers
/// the paper gives r = 3.6541528853610088 and V = 4.92867323399e-3. Edges are built downwards from the paper's
/// recurrence x₁ = r, x_{i+1} = f⁻¹(V/x_i + f(x_i)); x₀ = V/f(r) is the width the base would have as a rectangle,
/// and x₂₅₆ = 0.</para>
/// <para>The tables are computed once, deterministically, from those two constants with IEEE arithmetic and the
/// runtime's exp and log (the generator's tail and wedge tests use the same functions, so its outputs depend on the
/// platform's libm exactly as much as before). Tests check that the top edge closes the recurrence (f(x₂₅₅) + V/x₂₅₅ = 1
/// to rounding) and that the draws follow Φ.</para>
/// </remarks>
internal static class GaussianZiggurat
{
    /// <summary>Number of layers, including the base; a power of two so that the layer index is a bit mask.</summary>
    public const int LayerCount = 256;

    /// <summary>r, where the tail starts.</summary>
    public const double TailStart = 3.6541528853610088;

    /// <summary>V, the common area of every layer and of the base (tail included).</summary>
    public const double LayerArea = 4.92867323399e-3;

    /// <summary>x_i for i = 0 … 256 (x₀ the base's rectangle-equivalent width, x₂₅₆ = 0).</summary>
    public static readonly double[] Edges = BuildEdges();

    /// <summary>f(x_i) for i = 0 … 256.</summary>
    public static readonly double[] Densities = BuildDensities(Edges);

    /// <summary>x_{i+1}/x_i for i = 0 … 255: a uniform |u| below it lies under the curve whatever the height.</summary>
    public static readonly double[] InnerRatios = BuildRatios(Edges);

    /// <summary>f(x) = exp(−x²/2), the unnormalised density.</summary>
    /// <param name="x">The abscissa.</param>
    /// <returns>The density.</returns>
    public static double Density(double x) => Math.Exp(-0.5 * x * x);

    private static double[] BuildEdges()
    {
        var edges = new double[LayerCount + 1];
        edges[0] = LayerArea / Density(TailStart);
        edges[1] = TailStart;
        for (int i = 1; i < LayerCount - 1; i++)
        {
            edges[i + 1] = Math.Sqrt(-2.0 * Math.Log(LayerArea / edges[i] + Density(edges[i])));
        }

        edges[LayerCount] = 0.0;
        return edges;
    }

    private static double[] BuildDensities(double[] edges)
    {
        var densities = new double[edges.Length];
        for (int i = 0; i < edges.Length; i++)
        {
            densities[i] = Density(edges[i]);
        }

        return densities;
    }

    private static double[] BuildRatios(double[] edges)
    {
        var ratios = new double[LayerCount];
        for (int i = 0; i < LayerCount; i++)
        {
            ratios[i] = edges[i + 1] / edges[i];
        }

        return ratios;
    }
}
