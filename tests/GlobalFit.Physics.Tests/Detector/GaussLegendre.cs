namespace GlobalFit.Physics.Tests.Detector;

/// <summary>Gauss-Legendre nodes and weights on [-1, 1], for sky quadratures in tests.</summary>
/// <remarks>Newton iteration on P_n from the Chebyshev-like first guess cos(pi (i + 3/4)/(n + 1/2))
/// (Press et al. 2007, Numerical Recipes, 3rd ed., §4.6). Exact for polynomials of degree 2n - 1.</remarks>
internal static class GaussLegendre
{
    public static (double[] Nodes, double[] Weights) Rule(int n)
    {
        var nodes = new double[n];
        var weights = new double[n];
        for (int i = 0; i < n; i++)
        {
            double z = Math.Cos(Math.PI * (i + 0.75) / (n + 0.5));
            double derivative;
            while (true)
            {
                double p0 = 1.0, p1 = 0.0;
                for (int k = 1; k <= n; k++)
                {
                    double p2 = p1;
                    p1 = p0;
                    p0 = ((2.0 * k - 1.0) * z * p1 - (k - 1.0) * p2) / k;
                }
                derivative = n * (z * p0 - p1) / (z * z - 1.0);
                double step = p0 / derivative;
                z -= step;
                if (Math.Abs(step) < 1e-15) break;
            }
            nodes[i] = z;
            weights[i] = 2.0 / ((1.0 - z * z) * derivative * derivative);
        }
        return (nodes, weights);
    }
}
