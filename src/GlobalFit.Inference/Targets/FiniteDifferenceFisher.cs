namespace GlobalFit.Inference.Targets;

/// <summary>Fisher matrix of a template model by central finite differences.</summary>
/// <remarks>
/// <para>F_ij = Σ_k w_k ∂h_k/∂θ_i ∂h_k/∂θ_j, the linear-signal approximation of the likelihood Hessian
/// for Gaussian noise (Vallisneri 2008, Phys. Rev. D 77, 042001, eq. 5).</para>
/// <para>Step rule: derivative i uses the central difference [h(θ + δ_i e_i) − h(θ − δ_i e_i)] / (2 δ_i),
/// whose truncation error is O(δ_i²) ‖h'''‖; the caller supplies δ_i. A good default is a small fraction
/// (≈1e-5 to 1e-4) of the expected posterior width, or of the prior range when nothing better is known:
/// small enough that the truncation error is negligible and large enough that rounding error,
/// ~ε_machine ‖h‖ / δ_i, stays small. <see cref="StepsFromRanges"/> implements the prior-range version.</para>
/// <para>Allocation-free given a workspace of 2K doubles; not thread-safe across shared workspaces.</para>
/// </remarks>
public static class FiniteDifferenceFisher
{
    /// <summary>The default step as a fraction of each parameter's range used by <see cref="StepsFromRanges"/>.</summary>
    public const double DefaultRangeFraction = 1e-5;

    /// <summary>Fills <paramref name="steps"/> with <paramref name="rangeFraction"/> × (upper − lower) per parameter.</summary>
    /// <param name="schema">Parameter schema with finite ranges.</param>
    /// <param name="steps">Destination of length d.</param>
    /// <param name="rangeFraction">Fraction of the range; defaults to <see cref="DefaultRangeFraction"/>.</param>
    /// <exception cref="ArgumentException">A parameter has an infinite range.</exception>
    public static void StepsFromRanges(Parameters.ParameterSchema schema, Span<double> steps, double rangeFraction = DefaultRangeFraction)
    {
        ArgumentNullException.ThrowIfNull(schema);
        for (int i = 0; i < schema.Dimension; i++)
        {
            double width = schema.Parameters[i].Width;
            if (!double.IsFinite(width))
            {
                throw new ArgumentException($"Parameter '{schema.Parameters[i].Name}' has no finite range; pass explicit steps.", nameof(schema));
            }

            steps[i] = rangeFraction * width;
        }
    }

    /// <summary>Computes the Fisher matrix of <paramref name="template"/> at <paramref name="theta"/>.</summary>
    /// <typeparam name="TTemplate">The template type (generic so a struct template is devirtualised).</typeparam>
    /// <param name="template">The template model.</param>
    /// <param name="theta">The point (length d).</param>
    /// <param name="steps">Central-difference steps δ_i (length d), all positive.</param>
    /// <param name="weights">Per-sample weights w_k (length K), or empty for a whitened template (w_k = 1).</param>
    /// <param name="matrix">Destination d×d row-major.</param>
    /// <param name="derivatives">Workspace of d·K doubles that receives ∂h_k/∂θ_i row by row.</param>
    /// <param name="workspace">Workspace of at least d + 2K doubles.</param>
    public static void Compute<TTemplate>(
        TTemplate template,
        ReadOnlySpan<double> theta,
        ReadOnlySpan<double> steps,
        ReadOnlySpan<double> weights,
        Span<double> matrix,
        Span<double> derivatives,
        Span<double> workspace)
        where TTemplate : IWhitenedTemplate
    {
        ArgumentNullException.ThrowIfNull(template);
        int d = template.Dimension;
        int k = template.TemplateLength;
        if (theta.Length != d || steps.Length != d || matrix.Length < d * d || derivatives.Length < d * k
            || workspace.Length < d + 2 * k || (weights.Length != 0 && weights.Length != k))
        {
            throw new ArgumentException("Buffer lengths do not match the template's dimension and length.");
        }

        Span<double> shifted = workspace[..d];
        Span<double> plus = workspace.Slice(d, k);
        Span<double> minus = workspace.Slice(d + k, k);
        for (int i = 0; i < d; i++)
        {
            double step = steps[i];
            if (!(step > 0.0))
            {
                throw new ArgumentException($"Step {i} must be positive.", nameof(steps));
            }

            theta.CopyTo(shifted);
            shifted[i] = theta[i] + step;
            template.Template(shifted, plus);
            shifted[i] = theta[i] - step;
            template.Template(shifted, minus);
            Span<double> row = derivatives.Slice(i * k, k);
            double inverseTwoStep = 1.0 / (2.0 * step);
            for (int s = 0; s < k; s++)
            {
                row[s] = (plus[s] - minus[s]) * inverseTwoStep;
            }
        }

        for (int i = 0; i < d; i++)
        {
            ReadOnlySpan<double> rowI = derivatives.Slice(i * k, k);
            for (int j = i; j < d; j++)
            {
                ReadOnlySpan<double> rowJ = derivatives.Slice(j * k, k);
                double sum = 0.0;
                if (weights.IsEmpty)
                {
                    for (int s = 0; s < k; s++)
                    {
                        sum += rowI[s] * rowJ[s];
                    }
                }
                else
                {
                    for (int s = 0; s < k; s++)
                    {
                        sum += weights[s] * rowI[s] * rowJ[s];
                    }
                }

                matrix[i * d + j] = sum;
                matrix[j * d + i] = sum;
            }
        }
    }
}
