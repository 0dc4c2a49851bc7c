namespace GlobalFit.Physics.Numerics;

/// <summary>Adaptive, error-controlled explicit Runge–Kutta integrator of order 5 with an embedded order-4 error
/// estimate (Dormand–Prince 5(4)).</summary>
/// <remarks>
/// <para>Coefficients of Dormand &amp; Prince 1980, J. Comput. Appl. Math. 6, 19, Table 2 ("RK5(4)7M"; reference details from memory); the step
/// advances with the fifth-order solution (local extrapolation) and the last stage is the first stage of the next
/// step ("first same as last"), so an accepted step costs six evaluations. Error norm and step-size rule as in
/// Hairer, Nørsett &amp; Wanner, Solving Ordinary Differential Equations I (2nd ed. 1993), §II.4, Eqs. 4.11–4.13 (equation numbers from memory):
/// <c>err = sqrt(mean_i (δ_i / (atol_i + rtol max(|y_i|, |y_i,new|)))²)</c>, accept when err ≤ 1, next step
/// <c>h · min(5, max(0.2, 0.9 err^(-1/5)))</c> (the safety factor 0.9 and the bounds are common practice).</para>
/// <para>The integration runs forwards or backwards (end time before the start). Not thread-safe: an instance owns
/// its stage buffers; nothing is allocated after construction.</para>
/// </remarks>
public sealed class DormandPrince54
{
    private const double C2 = 1.0 / 5, C3 = 3.0 / 10, C4 = 4.0 / 5, C5 = 8.0 / 9;
    private const double A21 = 1.0 / 5;
    private const double A31 = 3.0 / 40, A32 = 9.0 / 40;
    private const double A41 = 44.0 / 45, A42 = -56.0 / 15, A43 = 32.0 / 9;
    private const double A51 = 19372.0 / 6561, A52 = -25360.0 / 2187, A53 = 64448.0 / 6561, A54 = -212.0 / 729;
    private const double A61 = 9017.0 / 3168, A62 = -355.0 / 33, A63 = 46732.0 / 5247, A64 = 49.0 / 176, A65 = -5103.0 / 18656;
    private const double B1 = 35.0 / 384, B3 = 500.0 / 1113, B4 = 125.0 / 192, B5 = -2187.0 / 6784, B6 = 11.0 / 84;
    // Fifth-order minus fourth-order weights (b - b*), b* = (5179/57600, 0, 7571/16695, 393/640, -92097/339200, 187/2100, 1/40).
    private const double E1 = 71.0 / 57600, E3 = -71.0 / 16695, E4 = 71.0 / 1920, E5 = -17253.0 / 339200, E6 = 22.0 / 525, E7 = -1.0 / 40;

    private readonly double[] _k1, _k2, _k3, _k4, _k5, _k6, _k7, _stage, _next, _absoluteTolerance;

    /// <summary>Creates an integrator for systems of <paramref name="dimension"/> components.</summary>
    /// <param name="dimension">Number of state components.</param>
    /// <param name="relativeTolerance">rtol, the relative local error allowed per step.</param>
    /// <param name="absoluteTolerance">atol per component (length <paramref name="dimension"/>).</param>
    /// <exception cref="ArgumentOutOfRangeException">The dimension is not positive, a tolerance is negative or not
    /// finite, both tolerances of a component are zero, or the tolerance array has the wrong length.</exception>
    public DormandPrince54(int dimension, double relativeTolerance, ReadOnlySpan<double> absoluteTolerance)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(dimension);
        if (!(relativeTolerance >= 0) || !double.IsFinite(relativeTolerance))
            throw new ArgumentOutOfRangeException(nameof(relativeTolerance), relativeTolerance, "relative tolerance must be finite and not negative");
        if (absoluteTolerance.Length != dimension)
            throw new ArgumentOutOfRangeException(nameof(absoluteTolerance), absoluteTolerance.Length, $"absolute tolerance needs {dimension} components");
        for (int i = 0; i < dimension; i++)
        {
            double a = absoluteTolerance[i];
            if (!(a >= 0) || !double.IsFinite(a) || (a == 0 && relativeTolerance == 0))
                throw new ArgumentOutOfRangeException(nameof(absoluteTolerance), a, $"absolute tolerance of component {i} must be finite, not negative, and not zero when the relative tolerance is zero");
        }
        Dimension = dimension;
        RelativeTolerance = relativeTolerance;
        _absoluteTolerance = absoluteTolerance.ToArray();
        _k1 = new double[dimension]; _k2 = new double[dimension]; _k3 = new double[dimension]; _k4 = new double[dimension];
        _k5 = new double[dimension]; _k6 = new double[dimension]; _k7 = new double[dimension];
        _stage = new double[dimension]; _next = new double[dimension];
    }

    /// <summary>Number of state components.</summary>
    public int Dimension { get; }

    /// <summary>rtol.</summary>
    public double RelativeTolerance { get; }

    /// <summary>Rate evaluations made by the last call of <see cref="Integrate{TSystem, TObserver}"/>.</summary>
    public int LastEvaluationCount { get; private set; }

    /// <summary>Steps accepted by the last call of <see cref="Integrate{TSystem, TObserver}"/>.</summary>
    public int LastAcceptedSteps { get; private set; }

    /// <summary>Integrates <paramref name="system"/> from <paramref name="startTime"/> to <paramref name="endTime"/>
    /// (or until the observer stops it), updating <paramref name="state"/> in place.</summary>
    /// <param name="system">The equations.</param>
    /// <param name="startTime">Initial time.</param>
    /// <param name="state">Initial state on entry; the state at the returned time on exit.</param>
    /// <param name="endTime">Final time; before <paramref name="startTime"/> to integrate backwards.</param>
    /// <param name="observer">Sees the initial point and every accepted step.</param>
    /// <param name="initialStep">Magnitude of the first trial step.</param>
    /// <param name="maxStep">Largest step magnitude allowed (caps the spacing of the observed points).</param>
    /// <param name="maxSteps">Largest number of attempted steps.</param>
    /// <returns>How the integration ended and the time reached.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A time is not finite, a step is not positive, the state has the
    /// wrong length, or <paramref name="maxSteps"/> is not positive.</exception>
    public (OdeOutcome Outcome, double Time) Integrate<TSystem, TObserver>(
        ref TSystem system, double startTime, Span<double> state, double endTime, ref TObserver observer,
        double initialStep, double maxStep, int maxSteps = 1_000_000)
        where TSystem : struct, IOdeSystem
        where TObserver : struct, IOdeStepObserver
    {
        if (!double.IsFinite(startTime) || !double.IsFinite(endTime))
            throw new ArgumentOutOfRangeException(nameof(endTime), endTime, "start and end times must be finite");
        if (!(initialStep > 0) || !(maxStep > 0))
            throw new ArgumentOutOfRangeException(nameof(initialStep), initialStep, "initial and maximum steps must be positive");
        if (state.Length != Dimension || system.Dimension != Dimension)
            throw new ArgumentOutOfRangeException(nameof(state), state.Length, $"state and system must have {Dimension} components");
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(maxSteps);

        int n = Dimension;
        double direction = endTime >= startTime ? 1.0 : -1.0;
        double t = startTime;
        double h = Math.Min(initialStep, maxStep);
        var k1 = _k1.AsSpan(); var k2 = _k2.AsSpan(); var k3 = _k3.AsSpan(); var k4 = _k4.AsSpan();
        var k5 = _k5.AsSpan(); var k6 = _k6.AsSpan(); var k7 = _k7.AsSpan();
        var stage = _stage.AsSpan(); var next = _next.AsSpan();
        system.Evaluate(t, state, k1);
        int evaluations = 1, accepted = 0;
        LastEvaluationCount = 0;
        LastAcceptedSteps = 0;
        if (!observer.Accept(t, state, k1)) return Finish(OdeOutcome.StoppedByObserver, t);
        if (t == endTime) return Finish(OdeOutcome.ReachedEnd, t);

        for (int attempt = 0; attempt < maxSteps; attempt++)
        {
            double remaining = Math.Abs(endTime - t);
            bool last = h >= remaining;
            if (last) h = remaining;
            double hs = direction * h;
            if (t + hs == t) return Finish(OdeOutcome.StepSizeUnderflow, t);

            for (int i = 0; i < n; i++) stage[i] = state[i] + hs * A21 * k1[i];
            system.Evaluate(t + C2 * hs, stage, k2);
            for (int i = 0; i < n; i++) stage[i] = state[i] + hs * (A31 * k1[i] + A32 * k2[i]);
            system.Evaluate(t + C3 * hs, stage, k3);
            for (int i = 0; i < n; i++) stage[i] = state[i] + hs * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
            system.Evaluate(t + C4 * hs, stage, k4);
            for (int i = 0; i < n; i++) stage[i] = state[i] + hs * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
            system.Evaluate(t + C5 * hs, stage, k5);
            for (int i = 0; i < n; i++) stage[i] = state[i] + hs * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
            double tNext = last ? endTime : t + hs;
            system.Evaluate(t + hs, stage, k6);
            for (int i = 0; i < n; i++) next[i] = state[i] + hs * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
            system.Evaluate(tNext, next, k7);
            evaluations += 6;

            double sum = 0;
            for (int i = 0; i < n; i++)
            {
                double delta = hs * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
                double scale = _absoluteTolerance[i] + RelativeTolerance * Math.Max(Math.Abs(state[i]), Math.Abs(next[i]));
                double r = delta / scale;
                sum += r * r;
            }
            double error = Math.Sqrt(sum / n);
            if (!double.IsFinite(error)) error = 1e10;
            double factor = error == 0 ? 5.0 : Math.Min(5.0, Math.Max(0.2, 0.9 * Math.Pow(error, -0.2)));
            if (error <= 1.0)
            {
                t = tNext;
                next.CopyTo(state);
                k7.CopyTo(k1);
                accepted++;
                if (!observer.Accept(t, state, k1)) return Finish(OdeOutcome.StoppedByObserver, t);
                if (last) return Finish(OdeOutcome.ReachedEnd, t);
                h = Math.Min(maxStep, h * factor);
            }
            else
            {
                h *= Math.Min(1.0, factor);
            }
        }
        return Finish(OdeOutcome.StepLimitReached, t);

        (OdeOutcome, double) Finish(OdeOutcome outcome, double time)
        {
            LastEvaluationCount = evaluations;
            LastAcceptedSteps = accepted;
            return (outcome, time);
        }
    }
}
