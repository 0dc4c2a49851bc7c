namespace GlobalFit.Inference.Parameters;

/// <summary>One sampled parameter: its name, unit, support and boundary behaviour.</summary>
/// <param name="Name">Parameter name as shown in diagnostics, e.g. <c>"frequency"</c>.</param>
/// <param name="Unit">Unit of the parameter value, e.g. <c>"Hz"</c>; empty for dimensionless.</param>
/// <param name="Lower">Lower end of the support; may be −∞ only for <see cref="BoundaryKind.Reject"/>.</param>
/// <param name="Upper">Upper end of the support; may be +∞ only for <see cref="BoundaryKind.Reject"/>.</param>
/// <param name="Boundary">What happens to proposals outside [Lower, Upper].</param>
public sealed record ParameterSpec(string Name, string Unit, double Lower, double Upper, BoundaryKind Boundary)
{
    /// <summary>Checks the invariants (finite range for periodic and reflecting parameters, Lower &lt; Upper).</summary>
    /// <exception cref="ArgumentException">The spec is inconsistent; the message names the parameter.</exception>
    public void Validate()
    {
        if (string.IsNullOrWhiteSpace(Name))
        {
            throw new ArgumentException("Parameter name must be non-empty.", nameof(Name));
        }

        if (double.IsNaN(Lower) || double.IsNaN(Upper) || !(Lower < Upper))
        {
            throw new ArgumentException($"Parameter '{Name}': Lower must be below Upper.", nameof(Lower));
        }

        if (Boundary != BoundaryKind.Reject && (double.IsInfinity(Lower) || double.IsInfinity(Upper)))
        {
            throw new ArgumentException(
                $"Parameter '{Name}': {Boundary} boundaries need a finite range.", nameof(Boundary));
        }
    }

    /// <summary>Width of the support, Upper − Lower (possibly +∞).</summary>
    public double Width => Upper - Lower;
}
