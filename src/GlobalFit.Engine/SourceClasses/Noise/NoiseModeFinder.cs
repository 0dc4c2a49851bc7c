using GlobalFit.Inference.LinearAlgebra;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>Finds the maximum-likelihood noise levels of one update by Fisher scoring and returns the Laplace
/// approximation there, for the proposals of <see cref="NoiseWorker"/>.</summary>
/// <remarks>
/// <para>Each group's PSD is linear in its coefficients, so the scoring runs in coefficient space (squared ASD
/// multipliers and the foreground amplitude): c ← c + F⁻¹ ∇ln L with the expected information F of
/// <see cref="WhittleLikelihood.AccumulateScore"/> (Fisher scoring; e.g. Lange, Numerical Analysis for
/// Statisticians, 2nd ed., §14.4), halving the step until ln L rises and clamping to the prior box. The A/E and T
/// groups share no parameter, so they are maximised separately. The precision in sampler coordinates is then
/// Jᵀ F J with J = ∂c/∂θ (2θ for a multiplier, 1 for the amplitude); the gradient term of the change of variables
/// vanishes at an interior mode.</para>
/// <para>A weak curvature 1/(prior width)² is added to each diagonal so that a shape that hardly reaches the fitted
/// bins (the foreground above its knee) still gives an invertible, prior-sized precision. Deterministic in its
/// inputs, as bit-identical resume requires.</para>
/// </remarks>
internal static class NoiseModeFinder
{
    private const int MaxIterations = 50;
    private const int MaxHalvings = 40;

    // Newton decrement below which ln L is within ~1e-7 of its maximum.
    private const double ConvergedDecrement = 2e-7;

    public static LaplaceApproximation Find(NoiseLevelModel model, NoiseParameterLayout layout, NoiseFitSettings settings, ReadOnlySpan<double> start)
    {
        int d = layout.Dimension;
        double[] mean = start.ToArray();
        double[] precision = new double[d * d];
        double levelLower = settings.LevelPriorMin * settings.LevelPriorMin;
        double levelUpper = settings.LevelPriorMax * settings.LevelPriorMax;

        int aeCount = model.Ae.ShapeCount;
        Span<double> coefficients = stackalloc double[3];
        Span<double> lower = stackalloc double[3];
        Span<double> upper = stackalloc double[3];
        Span<int> indices = stackalloc int[3];
        layout.AeCoefficients(start, coefficients);
        lower.Fill(levelLower);
        upper.Fill(levelUpper);
        indices[0] = layout.AccelerationAe;
        indices[1] = layout.OmsAe;
        if (aeCount == 3)
        {
            lower[2] = 0.0;
            upper[2] = settings.ForegroundAmplitudeMax;
            indices[2] = layout.Foreground;
        }
        MaximiseGroup(model.Ae, coefficients[..aeCount], lower[..aeCount], upper[..aeCount], mean, precision, indices[..aeCount], d);

        if (model.T is not null)
        {
            layout.TCoefficients(start, coefficients);
            lower.Fill(levelLower);
            upper.Fill(levelUpper);
            indices[0] = layout.AccelerationT;
            indices[1] = layout.OmsT;
            MaximiseGroup(model.T, coefficients[..2], lower[..2], upper[..2], mean, precision, indices[..2], d);
        }

        if (!SmallDenseMatrix.CholeskyInPlace(precision, d))
        {
            // Cannot happen with the regularised diagonal unless the data are degenerate; fall back to prior-sized steps.
            Array.Clear(precision);
            // The factor of a diagonal precision is its square root: σ_i = 1 % of the prior width.
            for (int i = 0; i < d; i++) precision[i * d + i] = 1.0 / (0.01 * layout.Schema.Parameters[i].Width);
        }
        return new LaplaceApproximation(mean, precision);
    }

    private static void MaximiseGroup(NoiseChannelGroup group, Span<double> coefficients, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper,
        double[] mean, double[] precision, ReadOnlySpan<int> indices, int d)
    {
        int m = coefficients.Length;
        Span<double> gradient = stackalloc double[m];
        Span<double> fisher = stackalloc double[m * m];
        Span<double> step = stackalloc double[m];
        Span<double> candidate = stackalloc double[m];
        for (int j = 0; j < m; j++) coefficients[j] = Math.Clamp(coefficients[j], lower[j], upper[j]);
        double logLikelihood = group.LogLikelihood(coefficients);
        for (int iteration = 0; iteration < MaxIterations; iteration++)
        {
            Score(group, coefficients, lower, upper, gradient, fisher);
            if (!SmallDenseMatrix.CholeskyInPlace(fisher, m)) break;
            Solve(fisher, m, gradient, step);
            double decrement = 0;
            for (int j = 0; j < m; j++) decrement += gradient[j] * step[j];
            if (!(decrement > ConvergedDecrement)) break;
            bool improved = false;
            double scale = 1.0;
            for (int halving = 0; halving < MaxHalvings && !improved; halving++, scale *= 0.5)
            {
                for (int j = 0; j < m; j++) candidate[j] = Math.Clamp(coefficients[j] + scale * step[j], lower[j], upper[j]);
                double trial = group.LogLikelihood(candidate);
                if (trial > logLikelihood)
                {
                    candidate.CopyTo(coefficients);
                    logLikelihood = trial;
                    improved = true;
                }
            }
            if (!improved) break;
        }

        Score(group, coefficients, lower, upper, gradient, fisher);
        Span<double> jacobian = stackalloc double[m];
        for (int j = 0; j < m; j++)
        {
            // Multipliers are square roots of their coefficients; the foreground amplitude (third) is its own.
            double value = j < 2 ? Math.Sqrt(coefficients[j]) : coefficients[j];
            mean[indices[j]] = value;
            jacobian[j] = j < 2 ? 2.0 * value : 1.0;
        }
        for (int j = 0; j < m; j++)
            for (int l = 0; l < m; l++)
                precision[indices[j] * d + indices[l]] = jacobian[j] * fisher[j * m + l] * jacobian[l];
    }

    private static void Score(NoiseChannelGroup group, ReadOnlySpan<double> coefficients, ReadOnlySpan<double> lower, ReadOnlySpan<double> upper,
        Span<double> gradient, Span<double> fisher)
    {
        int m = coefficients.Length;
        gradient.Clear();
        fisher.Clear();
        group.AccumulateScore(coefficients, gradient, fisher);
        for (int j = 0; j < m; j++)
        {
            double width = upper[j] - lower[j];
            fisher[j * m + j] += 1.0 / (width * width);
        }
    }

    // Solves (L Lᵀ) x = b for the Cholesky factor in the lower triangle of factor.
    private static void Solve(ReadOnlySpan<double> factor, int m, ReadOnlySpan<double> b, Span<double> x)
    {
        for (int i = 0; i < m; i++)
        {
            double sum = b[i];
            for (int k = 0; k < i; k++) sum -= factor[i * m + k] * x[k];
            x[i] = sum / factor[i * m + i];
        }
        for (int i = m - 1; i >= 0; i--)
        {
            double sum = x[i];
            for (int k = i + 1; k < m; k++) sum -= factor[k * m + i] * x[k];
            x[i] = sum / factor[i * m + i];
        }
    }
}
