namespace GlobalFit.Inference.Parameters;

/// <summary>What a sampler does with a proposed value outside a parameter's [lower, upper] range.</summary>
public enum BoundaryKind
{
    /// <summary>The parameter is an angle-like coordinate: values wrap modulo (upper − lower).</summary>
    Periodic = 0,

    /// <summary>Values are mirrored back into the range at the edges (symmetric proposals stay symmetric).</summary>
    Reflect = 1,

    /// <summary>Out-of-range proposals are rejected without evaluating the model.</summary>
    Reject = 2,
}
