using GlobalFit.Inference.Random;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>A Gaussian approximation N(μ, P⁻¹) of the noise-level posterior of one update: the mode μ and the
/// Cholesky factor L of the precision P = L Lᵀ.</summary>
/// <remarks>Built by <see cref="NoiseModeFinder"/> from the residual of the update and fixed for its duration, so the
/// proposals built on it are ordinary fixed Metropolis–Hastings proposals. Draws solve Lᵀ x = z (covariance
/// (L Lᵀ)⁻¹); densities use |Lᵀ(x − μ)|². Allocation-free given the caller's scratch.</remarks>
internal sealed class LaplaceApproximation
{
    public LaplaceApproximation(double[] mean, double[] precisionFactor)
    {
        Mean = mean;
        PrecisionFactor = precisionFactor;
    }

    /// <summary>μ, the mode.</summary>
    public double[] Mean { get; }

    /// <summary>L, lower triangular, row-major d×d.</summary>
    public double[] PrecisionFactor { get; }

    public int Dimension => Mean.Length;

    /// <summary>Writes an offset distributed as N(0, P⁻¹) times <paramref name="scale"/>.</summary>
    public void DrawOffset(Span<double> offset, double scale, ref RandomStream random)
    {
        int d = Dimension;
        for (int i = 0; i < d; i++) offset[i] = scale * random.NextGaussian();
        // Back substitution of Lᵀ x = z, in place.
        for (int i = d - 1; i >= 0; i--)
        {
            double sum = offset[i];
            for (int k = i + 1; k < d; k++) sum -= PrecisionFactor[k * d + i] * offset[k];
            offset[i] = sum / PrecisionFactor[i * d + i];
        }
    }

    /// <summary>(x − μ)ᵀ P (x − μ).</summary>
    public double Quadratic(ReadOnlySpan<double> x)
    {
        int d = Dimension;
        double total = 0;
        for (int i = 0; i < d; i++)
        {
            double projected = 0;
            for (int k = i; k < d; k++) projected += PrecisionFactor[k * d + i] * (x[k] - Mean[k]);
            total += projected * projected;
        }
        return total;
    }
}
