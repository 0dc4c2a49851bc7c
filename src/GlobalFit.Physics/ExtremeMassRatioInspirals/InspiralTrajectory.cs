using GlobalFit.Physics.Numerics;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The orbital evolution of one inspiral from the start of the data until the end of the data or the plunge,
/// stored at the integrator's own steps and interpolated between them.</summary>
/// <remarks>
/// <para>The five equations of <see cref="KludgeOrbitEquations"/> are integrated forwards from the state at the start
/// of the data with <see cref="DormandPrince54"/> (default rtol 1e-10; the steps are also capped, so that the stored
/// points are never further apart than <c>maxStepSeconds</c>). The integration stops at the plunge, where
/// <c>ν = ν_p(e)</c>; the plunge time is located by bisection on the cubic Hermite interpolant of the last step.
/// Between stored points every component is interpolated by the cubic Hermite polynomial built from the values and
/// the exact rates at both ends (<see cref="CubicHermite"/>): a C¹ cubic spline that needs no global solve and whose
/// error, h⁴ max|y⁗|/384, is far below the integrator's for the smooth, slow orbital elements (the accumulated phase
/// error of the interpolant is measured in the tests).</para>
/// <para>Initial conditions are given at the start of the data (t = 0). A source described instead by its plunge
/// time is converted by <see cref="FrequencyForPlungeTime"/>, which finds the initial frequency by root finding on
/// the forward integration (the plunge time is a monotonic decreasing function of the initial frequency).</para>
/// <para>Not thread-safe: an instance owns its buffers. After construction nothing is allocated.</para>
/// </remarks>
public sealed class InspiralTrajectory
{
    private const int N = KludgeOrbitEquations.StateSize;
    private readonly DormandPrince54 _solver;
    private readonly double[] _times;
    private readonly double[] _states;
    private readonly double[] _rates;
    private readonly double[] _work = new double[N];

    /// <summary>Creates an empty trajectory store.</summary>
    /// <param name="capacity">Largest number of stored points.</param>
    /// <param name="relativeTolerance">rtol of the integrator.</param>
    /// <exception cref="ArgumentOutOfRangeException">The capacity is below 2 or the tolerance not positive.</exception>
    public InspiralTrajectory(int capacity = 100_000, double relativeTolerance = 1e-10)
    {
        if (capacity < 2)
            throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "capacity must be at least 2");
        if (!(relativeTolerance > 0))
            throw new ArgumentOutOfRangeException(nameof(relativeTolerance), relativeTolerance, "relative tolerance must be positive");
        // Absolute tolerances: phases to 1e-7 rad, frequency to 1e-17 Hz, eccentricity to 1e-13; they matter only
        // where a component passes through zero.
        _solver = new DormandPrince54(N, relativeTolerance, [1e-7, 1e-17, 1e-7, 1e-13, 1e-7]);
        _times = new double[capacity];
        _states = new double[capacity * N];
        _rates = new double[capacity * N];
    }

    /// <summary>Number of stored points.</summary>
    public int Count { get; private set; }

    /// <summary>Times of the stored points, ascending; the first is 0.</summary>
    /// <value>s.</value>
    public ReadOnlySpan<double> Times => _times.AsSpan(0, Count);

    /// <summary>True when the last evolution ended at the plunge rather than at the requested end.</summary>
    public bool Plunged { get; private set; }

    /// <summary>Time of the last stored point: the plunge time if <see cref="Plunged"/>, else the requested end.</summary>
    /// <value>s.</value>
    public double EndSeconds => Count == 0 ? 0.0 : _times[Count - 1];

    /// <summary>The equations of the last evolution.</summary>
    public KludgeOrbitEquations Equations { get; private set; }

    /// <summary>Integrates from <paramref name="initialState"/> at t = 0 to <paramref name="durationSeconds"/> or to the
    /// plunge, whichever comes first.</summary>
    /// <param name="equations">The source's evolution equations.</param>
    /// <param name="initialState">[Φ, ν, γ̃, e, α] at t = 0 (see <see cref="KludgeOrbitEquations"/>).</param>
    /// <param name="durationSeconds">End time.</param>
    /// <param name="maxStepSeconds">Largest spacing of stored points.</param>
    /// <exception cref="ArgumentOutOfRangeException">The state has the wrong length, ν is not positive, e is outside
    /// [0, 1), the state is already past the plunge, or the duration or step is not positive.</exception>
    /// <exception cref="InvalidOperationException">The store is full or the integrator failed.</exception>
    public void Evolve(in KludgeOrbitEquations equations, ReadOnlySpan<double> initialState, double durationSeconds, double maxStepSeconds = 5e4)
    {
        if (initialState.Length != N)
            throw new ArgumentOutOfRangeException(nameof(initialState), initialState.Length, $"state needs {N} components");
        double nu = initialState[KludgeOrbitEquations.Frequency], e = initialState[KludgeOrbitEquations.Eccentricity];
        if (!(nu > 0) || !double.IsFinite(nu))
            throw new ArgumentOutOfRangeException(nameof(initialState), nu, "orbital frequency must be positive and finite");
        if (!(e >= 0 && e < 1))
            throw new ArgumentOutOfRangeException(nameof(initialState), e, "eccentricity must lie in [0, 1)");
        if (nu >= equations.PlungeFrequency(e))
            throw new ArgumentOutOfRangeException(nameof(initialState), nu, $"orbital frequency {nu} Hz is at or past the plunge frequency {equations.PlungeFrequency(e)} Hz");
        if (!(durationSeconds > 0) || !double.IsFinite(durationSeconds))
            throw new ArgumentOutOfRangeException(nameof(durationSeconds), durationSeconds, "duration must be positive and finite");
        if (!(maxStepSeconds > 0))
            throw new ArgumentOutOfRangeException(nameof(maxStepSeconds), maxStepSeconds, "maximum step must be positive");

        Equations = equations;
        Count = 0;
        Plunged = false;
        var system = equations;
        var observer = new Recorder(this);
        var state = _work.AsSpan();
        initialState.CopyTo(state);
        double firstStep = Math.Min(maxStepSeconds, 0.01 / nu);
        var (outcome, _) = _solver.Integrate(ref system, 0.0, state, durationSeconds, ref observer, firstStep, maxStepSeconds, maxSteps: 10 * _times.Length);
        if (observer.Overflow)
            throw new InvalidOperationException($"trajectory store of {_times.Length} points is full; raise the capacity or the maximum step");
        if (outcome == OdeOutcome.StoppedByObserver)
        {
            LocatePlunge();
            Plunged = true;
        }
        else if (outcome != OdeOutcome.ReachedEnd)
            throw new InvalidOperationException($"orbital integration ended with {outcome} at t = {EndSeconds} s");
    }

    /// <summary>Interpolated state at <paramref name="timeSeconds"/>; outside the stored span the first or last cubic is
    /// extrapolated (meant for the few hundred seconds of the barycentric delay, not for long stretches).</summary>
    /// <param name="timeSeconds">Time on the data axis.</param>
    /// <param name="state">Output [Φ, ν, γ̃, e, α].</param>
    /// <param name="rates">Optional output of the interpolant's derivative (empty to skip).</param>
    /// <param name="hint">Index of a stored point at or before the time, to start the search from (sequential
    /// calls pass back the returned value).</param>
    /// <returns>Index of the stored point that starts the interval used.</returns>
    /// <exception cref="InvalidOperationException">Nothing has been evolved.</exception>
    public int Evaluate(double timeSeconds, Span<double> state, Span<double> rates, int hint = 0)
    {
        if (Count < 2) throw new InvalidOperationException("the trajectory has not been evolved");
        int j = Locate(timeSeconds, hint);
        double t = timeSeconds;
        double t0 = _times[j], t1 = _times[j + 1];
        int a = j * N, b = a + N;
        for (int i = 0; i < N; i++)
        {
            state[i] = CubicHermite.Value(t0, _states[a + i], _rates[a + i], t1, _states[b + i], _rates[b + i], t);
            if (!rates.IsEmpty)
                rates[i] = CubicHermite.Derivative(t0, _states[a + i], _rates[a + i], t1, _states[b + i], _rates[b + i], t);
        }
        return j;
    }

    /// <summary>The stored state of point <paramref name="index"/>.</summary>
    public ReadOnlySpan<double> StateAt(int index) => _states.AsSpan(index * N, N);

    /// <summary>Initial frequency ν0 for which a source with the other initial values of
    /// <paramref name="initialState"/> plunges at <paramref name="plungeTimeSeconds"/>.</summary>
    /// <param name="equations">The source's evolution equations.</param>
    /// <param name="initialState">[Φ, ν, γ̃, e, α] at t = 0; ν is ignored.</param>
    /// <param name="plungeTimeSeconds">Time of the plunge after the start of the data.</param>
    /// <returns>ν0 in Hz, to a relative 1e-12.</returns>
    /// <remarks>Bisection in log ν0 between a frequency just below the plunge and one whose Newtonian circular
    /// time to plunge (Peters 1964) exceeds the target a hundred times; each trial integrates to the plunge with steps
    /// of up to 1e6 s. Allocation-free, but it costs about 50 integrations, and it overwrites the stored trajectory.</remarks>
    /// <exception cref="ArgumentOutOfRangeException">The plunge time is not positive and finite.</exception>
    public double FrequencyForPlungeTime(in KludgeOrbitEquations equations, ReadOnlySpan<double> initialState, double plungeTimeSeconds)
    {
        if (!(plungeTimeSeconds > 0) || !double.IsFinite(plungeTimeSeconds))
            throw new ArgumentOutOfRangeException(nameof(plungeTimeSeconds), plungeTimeSeconds, "plunge time must be positive and finite");
        Span<double> trial = stackalloc double[N];
        initialState.CopyTo(trial);
        double e0 = trial[KludgeOrbitEquations.Eccentricity];
        double high = equations.PlungeFrequency(e0) * (1 - 1e-9);
        // Newtonian circular time to plunge τ = (5/256)(M/μ) M y^{-8/3}; choose y so that τ = 100 T.
        double m = equations.CentralMassSeconds, mu = equations.CompactMassSeconds;
        double yLow = Math.Pow(5.0 / 256.0 * m * m / mu / (100.0 * plungeTimeSeconds), 3.0 / 8.0);
        double low = Math.Min(yLow / (2 * Math.PI * m), 0.5 * high);
        for (int iteration = 0; iteration < 60 && high / low - 1 > 1e-12; iteration++)
        {
            double mid = Math.Sqrt(low * high);
            trial[KludgeOrbitEquations.Frequency] = mid;
            // Only whether the plunge comes before the target matters, so each trial stops at the target time.
            Evolve(equations, trial, plungeTimeSeconds, maxStepSeconds: 1e6);
            if (Plunged) high = mid; else low = mid;
        }
        return Math.Sqrt(low * high);
    }

    private int Locate(double t, int hint)
    {
        int last = Count - 2;
        int j = Math.Clamp(hint, 0, last);
        if (_times[j] <= t && t <= _times[j + 1]) return j;
        if (j < last && _times[j + 1] <= t && t <= _times[j + 2]) return j + 1;
        int lo = 0, hi = last;
        if (t <= _times[0]) return 0;
        if (t >= _times[last + 1]) return last;
        while (lo < hi)
        {
            int mid = (lo + hi + 1) >> 1;
            if (_times[mid] <= t) lo = mid; else hi = mid - 1;
        }
        return lo;
    }

    // The last stored point is past the plunge: find the root of ν − ν_p(e) on the last step's Hermite cubic and
    // replace the point by the interpolated state there (rates recomputed from the equations).
    private void LocatePlunge()
    {
        var equations = Equations;
        int j = Count - 2;
        double lo = _times[j], hi = _times[j + 1];
        var state = _work.AsSpan();
        for (int iteration = 0; iteration < 80 && hi - lo > 1e-9 * Math.Max(1.0, hi); iteration++)
        {
            double mid = 0.5 * (lo + hi);
            Evaluate(mid, state, Span<double>.Empty, j);
            if (state[KludgeOrbitEquations.Frequency] >= equations.PlungeFrequency(state[KludgeOrbitEquations.Eccentricity])) hi = mid; else lo = mid;
        }
        double tp = 0.5 * (lo + hi);
        Evaluate(tp, state, Span<double>.Empty, j);
        int b = (j + 1) * N;
        state.CopyTo(_states.AsSpan(b, N));
        equations.Evaluate(tp, state, _rates.AsSpan(b, N));
        _times[j + 1] = tp;
    }

    private struct Recorder(InspiralTrajectory owner) : IOdeStepObserver
    {
        public bool Overflow;

        public bool Accept(double time, ReadOnlySpan<double> state, ReadOnlySpan<double> rates)
        {
            int i = owner.Count;
            if (i >= owner._times.Length)
            {
                Overflow = true;
                return false;
            }
            owner._times[i] = time;
            state.CopyTo(owner._states.AsSpan(i * N, N));
            rates.CopyTo(owner._rates.AsSpan(i * N, N));
            owner.Count = i + 1;
            double e = state[KludgeOrbitEquations.Eccentricity];
            return state[KludgeOrbitEquations.Frequency] < owner.Equations.PlungeFrequency(e) && e >= 0 && e < 1;
        }
    }
}
