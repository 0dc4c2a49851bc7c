namespace GlobalFit.Inference.Targets;

/// <summary>A model template h(θ) sampled on K points (e.g. frequency bins), whitened or paired with weights.</summary>
/// <remarks>
/// With weights w_k (e.g. 4Δf / S_n(f_k) for a real-valued representation), the Fisher matrix is
/// F_ij = Σ_k w_k ∂h_k/∂θ_i ∂h_k/∂θ_j; a template that is already whitened uses unit weights.
/// </remarks>
public interface IWhitenedTemplate
{
    /// <summary>Number of parameters d.</summary>
    int Dimension { get; }

    /// <summary>Number of template samples K.</summary>
    int TemplateLength { get; }

    /// <summary>Writes h(θ) into <paramref name="template"/> (length K).</summary>
    /// <param name="theta">The parameters; may lie slightly outside the prior range during differencing.</param>
    /// <param name="template">Destination of length <see cref="TemplateLength"/>.</param>
    void Template(ReadOnlySpan<double> theta, Span<double> template);
}
