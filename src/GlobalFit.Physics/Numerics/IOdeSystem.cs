namespace GlobalFit.Physics.Numerics;

/// <summary>A first-order system of ordinary differential equations <c>dy/dt = f(t, y)</c>.</summary>
/// <remarks>Implement it on a struct and pass it by reference: the integrator is generic over the system, so the
/// call is not virtual and nothing is boxed.</remarks>
public interface IOdeSystem
{
    /// <summary>Number of components of the state y.</summary>
    int Dimension { get; }

    /// <summary>Writes <c>f(t, y)</c> into <paramref name="rates"/>.</summary>
    /// <param name="time">Independent variable t.</param>
    /// <param name="state">State y (length <see cref="Dimension"/>).</param>
    /// <param name="rates">Output dy/dt (length <see cref="Dimension"/>).</param>
    void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates);
}

/// <summary>Receives every accepted integration step, and may stop the integration.</summary>
public interface IOdeStepObserver
{
    /// <summary>Called with the initial point and after every accepted step.</summary>
    /// <param name="time">Time of the point.</param>
    /// <param name="state">State at <paramref name="time"/>.</param>
    /// <param name="rates">dy/dt at <paramref name="time"/>.</param>
    /// <returns>False to stop the integration after this point.</returns>
    bool Accept(double time, ReadOnlySpan<double> state, ReadOnlySpan<double> rates);
}

/// <summary>How an integration ended.</summary>
public enum OdeOutcome
{
    /// <summary>The end time was reached.</summary>
    ReachedEnd,

    /// <summary>The observer asked to stop.</summary>
    StoppedByObserver,

    /// <summary>The step limit was reached first.</summary>
    StepLimitReached,

    /// <summary>The step size fell below the resolution of the time variable (a singularity, or a tolerance
    /// that cannot be met in double precision).</summary>
    StepSizeUnderflow,
}
