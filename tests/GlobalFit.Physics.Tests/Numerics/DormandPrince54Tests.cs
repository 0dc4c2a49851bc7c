using GlobalFit.Physics.Numerics;

namespace GlobalFit.Physics.Tests.Numerics;

public class DormandPrince54Tests
{
    private struct Decay : IOdeSystem
    {
        public readonly int Dimension => 1;
        public readonly void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates) => rates[0] = -state[0];
    }

    private struct Oscillator : IOdeSystem
    {
        public readonly int Dimension => 2;
        public readonly void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates)
        {
            rates[0] = state[1];
            rates[1] = -state[0];
        }
    }

    // y' = y(1 - y) with y(0) = 1/2: y(t) = 1/(1 + e^{-t}); non-linear, closed form.
    private struct Logistic : IOdeSystem
    {
        public readonly int Dimension => 1;
        public readonly void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates) => rates[0] = state[0] * (1 - state[0]);
    }

    // y' = 2t: exercises the explicit time argument of every stage.
    private struct Ramp : IOdeSystem
    {
        public readonly int Dimension => 1;
        public readonly void Evaluate(double time, ReadOnlySpan<double> state, Span<double> rates) => rates[0] = 2 * time;
    }

    private struct Everything : IOdeStepObserver
    {
        public int Count;
        public double LastTime;
        public bool Accept(double time, ReadOnlySpan<double> state, ReadOnlySpan<double> rates)
        {
            Count++;
            LastTime = time;
            return true;
        }
    }

    private struct StopAbove : IOdeStepObserver
    {
        public double Threshold;
        public bool Accept(double time, ReadOnlySpan<double> state, ReadOnlySpan<double> rates) => state[0] < Threshold;
    }

    [Theory]
    [InlineData(1e-6)]
    [InlineData(1e-10)]
    public void Exponential_decay_matches_its_closed_form_to_the_requested_tolerance(double rtol)
    {
        var solver = new DormandPrince54(1, rtol, [1e-14]);
        var system = new Decay();
        var observer = new Everything();
        double[] y = [1.0];
        var (outcome, time) = solver.Integrate(ref system, 0, y, 10, ref observer, 1e-3, 1.0);
        Assert.Equal(OdeOutcome.ReachedEnd, outcome);
        Assert.Equal(10.0, time);
        // Local error per step is held at rtol; over ~tens of steps the global relative error stays within 100 rtol.
        Assert.Equal(Math.Exp(-10), y[0], Math.Exp(-10) * 100 * rtol);
        Assert.Equal(solver.LastAcceptedSteps + 1, observer.Count);
    }

    [Fact]
    public void Harmonic_oscillator_keeps_phase_over_a_hundred_periods()
    {
        var solver = new DormandPrince54(2, 1e-11, [1e-13, 1e-13]);
        var system = new Oscillator();
        var observer = new Everything();
        double[] y = [1.0, 0.0];
        double end = 200 * Math.PI;
        solver.Integrate(ref system, 0, y, end, ref observer, 0.01, 0.5);
        // Closed form cos t, -sin t; 1e-11 per step over ~3000 steps of error that grows linearly: 1e-7.
        Assert.Equal(Math.Cos(end), y[0], 1e-7);
        Assert.Equal(-Math.Sin(end), y[1], 1e-7);
    }

    [Fact]
    public void Backward_integration_of_the_logistic_equation_returns_to_its_closed_form()
    {
        var solver = new DormandPrince54(1, 1e-12, [1e-15]);
        var system = new Logistic();
        var observer = new Everything();
        double[] y = [1.0 / (1.0 + Math.Exp(-6))];
        var (outcome, time) = solver.Integrate(ref system, 6, y, -4, ref observer, 0.1, 1.0);
        Assert.Equal(OdeOutcome.ReachedEnd, outcome);
        Assert.Equal(-4.0, time);
        Assert.Equal(1.0 / (1.0 + Math.Exp(4)), y[0], 1e-11);
    }

    [Fact]
    public void Time_dependent_rates_are_integrated_exactly_when_polynomial()
    {
        // A quadratic solution lies inside the fifth-order method's exactness: only round-off remains.
        var solver = new DormandPrince54(1, 1e-8, [1e-8]);
        var system = new Ramp();
        var observer = new Everything();
        double[] y = [0.0];
        solver.Integrate(ref system, 0, y, 3, ref observer, 0.1, 0.1);
        Assert.Equal(9.0, y[0], 1e-12);
    }

    [Fact]
    public void Observer_can_stop_the_integration()
    {
        var solver = new DormandPrince54(1, 1e-9, [1e-12]);
        var system = new Logistic();
        var observer = new StopAbove { Threshold = 0.9 };
        double[] y = [0.5];
        var (outcome, time) = solver.Integrate(ref system, 0, y, 100, ref observer, 0.01, 0.05);
        Assert.Equal(OdeOutcome.StoppedByObserver, outcome);
        // y = 0.9 at t = ln 9 = 2.197; the stop comes on the first step past it (steps ≤ 0.05).
        Assert.InRange(time, Math.Log(9), Math.Log(9) + 0.05);
        Assert.True(y[0] >= 0.9);
    }

    [Fact]
    public void Step_limit_is_reported()
    {
        var solver = new DormandPrince54(1, 1e-9, [1e-12]);
        var system = new Decay();
        var observer = new Everything();
        double[] y = [1.0];
        var (outcome, _) = solver.Integrate(ref system, 0, y, 1000, ref observer, 0.01, 0.01, maxSteps: 10);
        Assert.Equal(OdeOutcome.StepLimitReached, outcome);
    }

    [Fact]
    public void Bad_arguments_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new DormandPrince54(0, 1e-6, []));
        Assert.Throws<ArgumentOutOfRangeException>(() => new DormandPrince54(1, -1, [1e-6]));
        Assert.Throws<ArgumentOutOfRangeException>(() => new DormandPrince54(1, 0, [0.0]));
        Assert.Throws<ArgumentOutOfRangeException>(() => new DormandPrince54(2, 1e-6, [1e-6]));
        var solver = new DormandPrince54(1, 1e-6, [1e-9]);
        var system = new Decay();
        var observer = new Everything();
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() =>
        {
            double[] y = [1.0];
            solver.Integrate(ref system, 0, y, double.NaN, ref observer, 0.1, 1);
        });
        Assert.Contains("finite", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() =>
        {
            double[] y = [1.0, 2.0];
            solver.Integrate(ref system, 0, y, 1, ref observer, 0.1, 1);
        });
    }

    [Fact]
    public void Cubic_hermite_reproduces_a_cubic_and_its_derivative()
    {
        static double F(double t) => 2 * t * t * t - t * t + 3 * t - 1;
        static double D(double t) => 6 * t * t - 2 * t + 3;
        double t0 = 0.5, t1 = 2.0;
        foreach (double t in new[] { 0.5, 0.9, 1.3, 2.0 })
        {
            Assert.Equal(F(t), CubicHermite.Value(t0, F(t0), D(t0), t1, F(t1), D(t1), t), 1e-12);
            Assert.Equal(D(t), CubicHermite.Derivative(t0, F(t0), D(t0), t1, F(t1), D(t1), t), 1e-12);
        }
    }
}
