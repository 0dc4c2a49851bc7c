using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Numerics;

namespace GlobalFit.Physics.Tests.ExtremeMassRatioInspirals;

public class OrbitEvolutionTests
{
    private const double Msun = PhysicalConstants.SolarMassSeconds;

    private struct Ignore : IOdeStepObserver
    {
        public readonly bool Accept(double time, ReadOnlySpan<double> state, ReadOnlySpan<double> rates) => true;
    }

    [Fact]
    public void Circular_newtonian_frequency_follows_the_quadrupole_chirp()
    {
        // Peters 1964 (Phys. Rev. 136, B1224), circular orbit: ν(t) = ν0 (1 − t/τ)^{-3/8} with
        // τ = (5/256)(M/μ) M y0^{-8/3}; for M = 1e6, μ = 10 M_sun, ν0 = 1 mHz, τ = 1.018985e8 s
        // (derived: the closed form evaluated with G M_sun/c³ = 4.925490947e-6 s).
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0, 1, corrections: false);
        double nu0 = 1e-3;
        double y0 = 2 * Math.PI * 1e6 * Msun * nu0;
        double tau = 5.0 / 256.0 * 1e5 * 1e6 * Msun * Math.Pow(y0, -8.0 / 3.0);
        Assert.Equal(1.018985e8, tau, 1e2);
        var trajectory = new InspiralTrajectory();
        trajectory.Evolve(equations, [0, nu0, 0, 0, 0], 0.8 * tau);
        Assert.False(trajectory.Plunged);
        Span<double> state = stackalloc double[5];
        foreach (double fraction in new[] { 0.3, 0.6, 0.8 })
        {
            trajectory.Evaluate(fraction * tau, state, Span<double>.Empty);
            double expected = nu0 * Math.Pow(1 - fraction, -3.0 / 8.0);
            // rtol 1e-10 per step; a few hundred steps: 1e-8 relative is ample.
            Assert.Equal(expected, state[KludgeOrbitEquations.Frequency], expected * 1e-8);
            Assert.Equal(0.0, state[KludgeOrbitEquations.Eccentricity]);
        }
        // The phase: Φ = 2π ∫ν dt = (16π/5) ν0 τ [1 − (1 − t/τ)^{5/8}].
        trajectory.Evaluate(0.8 * tau, state, Span<double>.Empty);
        double phase = 16 * Math.PI / 5 * nu0 * tau * (1 - Math.Pow(0.2, 5.0 / 8.0));
        Assert.Equal(phase, state[KludgeOrbitEquations.Phase], 1e-3);
    }

    [Fact]
    public void Newtonian_eccentric_evolution_follows_the_peters_semi_major_axis_relation()
    {
        // Peters 1964, Eq. 5.11 (equation number from memory): a(e) ∝ e^{12/19} (1 − e²)^{-1} (1 + 121/304 e²)^{870/2299}; ν ∝ a^{-3/2}.
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0, 1, corrections: false);
        var trajectory = new InspiralTrajectory();
        double nu0 = 2e-4, e0 = 0.6;
        // Run to the plunge (ν = ν_p(e)), where e has fallen well below its start.
        trajectory.Evolve(equations, [0, nu0, 0, e0, 0], 1e11, maxStepSeconds: 1e7);
        Assert.True(trajectory.Plunged);
        static double A(double e) => Math.Pow(e, 12.0 / 19) / (1 - e * e) * Math.Pow(1 + 121.0 / 304 * e * e, 870.0 / 2299);
        // The last integrator point before the plunge (the plunge point itself is interpolated).
        var end = trajectory.StateAt(trajectory.Count - 2);
        double e1 = end[KludgeOrbitEquations.Eccentricity];
        Assert.InRange(e1, 0.01, 0.3);
        double expected = nu0 * Math.Pow(A(e1) / A(e0), -1.5);
        Assert.Equal(expected, end[KludgeOrbitEquations.Frequency], expected * 1e-8);
    }

    [Fact]
    public void Circular_chirp_at_first_post_newtonian_order_is_the_test_mass_chirp_in_the_azimuthal_frequency()
    {
        // The azimuthal frequency is ω_φ = 2πν + dγ̃/dt. For a test mass, dω_φ/dt = (96/5)(μ/M) M^{-2} x_φ^{11/2}... written
        // as (96/5) μ M^{2/3} ω_φ^{11/3} [1 − (743/336) x_φ + O(x_φ^{3/2})], x_φ = (M ω_φ)^{2/3}
        // (Blanchet 2014, Living Rev. Relativ. 17, 2, the η → 0 limit of the 1PN chirp; from memory).
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0, 1);
        double m = 1e6 * Msun, mu = 10 * Msun;
        foreach (double x in new[] { 1e-4, 3e-4 })
        {
            double nu = Math.Pow(x, 1.5) / (2 * Math.PI * m);
            double nuDot = equations.FrequencyRate(nu, 0);
            double h = nu * 1e-6;
            double gammaDotSlope = (equations.PericentreRate(nu + h, 0) - equations.PericentreRate(nu - h, 0)) / (2 * h);
            double omega = 2 * Math.PI * nu + equations.PericentreRate(nu, 0);
            double omegaDot = (2 * Math.PI + gammaDotSlope) * nuDot;
            double xPhi = Math.Cbrt(m * omega * m * omega);
            double ratio = omegaDot / (96.0 / 5 * mu * Math.Cbrt(m * m) * Math.Pow(omega, 11.0 / 3));
            double coefficient = (ratio - 1) / xPhi;
            // The remainder is O(x) relative to the coefficient; with x ≤ 3e-4 and 2PN coefficients of order 10, 1e-2.
            Assert.Equal(-743.0 / 336, coefficient, 1e-2);
        }
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.3)]
    [InlineData(0.6)]
    public void Periapsis_precession_reduces_to_the_first_post_newtonian_rate(double e)
    {
        // 1PN periastron advance per radial period: Δω = 6πM/(a(1 − e²)) (Robertson 1938, Ann. Math. 39, 101; textbook; reference from memory), i.e.
        // dγ̃/dt / (2πν) = 3x/(1 − e²) with x = (2πMν)^{2/3} = M/a.
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0, 1);
        double m = 1e6 * Msun;
        double x = 1e-5;
        double nu = Math.Pow(x, 1.5) / (2 * Math.PI * m);
        double ratio = equations.PericentreRate(nu, e) / (2 * Math.PI * nu) / (3 * x / (1 - e * e));
        // Next order is (x/4)(26 − 15e²)/(1 − e²) ≤ 2e-4 at x = 1e-5.
        Assert.Equal(1.0, ratio, 2e-4);
    }

    [Fact]
    public void Circular_periapsis_advance_matches_the_schwarzschild_expansion_to_second_order()
    {
        // Exact circular Schwarzschild geodesics: (ω_φ − ω_r)/ω_r = (1 − 6u)^{-1/2} − 1 with y^{2/3} = u(1 − 6u)^{1/3}
        // (derived: epicyclic frequency ω_r = ω_φ √(1 − 6u), Kepler's law ω_φ = M^{1/2} r^{-3/2});
        // its expansion is 3x + 19.5x² + O(x³), so the residual of the kludge rate falls as x³.
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0, 1);
        double m = 1e6 * Msun;
        foreach (double u in new[] { 1e-3, 3e-3 })
        {
            double x = u * Math.Cbrt(1 - 6 * u);
            double nu = Math.Pow(x, 1.5) / (2 * Math.PI * m);
            double kludge = equations.PericentreRate(nu, 0) / (2 * Math.PI * nu);
            double exact = 1 / Math.Sqrt(1 - 6 * u) - 1;
            // Third-order coefficient of the exact expansion is 157.5 (derived: u = x + 2x² + 12x³ substituted into
            // 3u + 13.5u² + 67.5u³); with the O(x⁴) remainder, 200 x³ bounds the residual.
            Assert.Equal(exact, kludge, 200 * x * x * x);
        }
    }

    [Fact]
    public void Spin_terms_are_the_classical_lense_thirring_rates()
    {
        // Lense & Thirring 1918: dΩ/dt = 2S/(a³(1 − e²)^{3/2}), dω/dt = −6 S cos i/(a³(1 − e²)^{3/2}) (textbook
        // secular rates), with S = χM², a³ = M/(2πν)².
        double m = 1e6 * Msun;
        double chi = 0.7, cosI = 0.4, e = 0.35, nu = 2e-4;
        var spinning = new KludgeOrbitEquations(m, 10 * Msun, chi, cosI);
        var still = new KludgeOrbitEquations(m, 10 * Msun, 0, cosI);
        double a3 = m / Math.Pow(2 * Math.PI * nu, 2);
        double factor = chi * m * m / (a3 * Math.Pow(1 - e * e, 1.5));
        Assert.Equal(2 * factor, spinning.PrecessionRate(nu, e), 2 * factor * 1e-12);
        Assert.Equal(-6 * factor * cosI, spinning.PericentreRate(nu, e) - still.PericentreRate(nu, e), 6 * factor * 1e-10);
    }

    [Fact]
    public void Evolution_stops_on_the_schwarzschild_separatrix()
    {
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0.5, 0.5);
        var trajectory = new InspiralTrajectory();
        trajectory.Evolve(equations, [0, 9.783227e-4, 0, 0.437219, 0], 2 * PhysicalConstants.JulianYearS);
        Assert.True(trajectory.Plunged);
        var end = trajectory.StateAt(trajectory.Count - 1);
        double e = end[KludgeOrbitEquations.Eccentricity];
        double x = Math.Cbrt(Math.Pow(2 * Math.PI * 1e6 * Msun * end[KludgeOrbitEquations.Frequency], 2));
        // p/M = (1 − e²)/x = 6 + 2e at the plunge (bisection to 1e-9 of the time).
        Assert.Equal(6 + 2 * e, (1 - e * e) / x, 1e-6);
        // The backward regression below started at e = 0.3 one year before: the forward run must come back there.
        // Inputs carry 7 digits; dt_plunge/dν0 ≈ (8/3) τ/ν0 turns 5e-11 Hz into ~ 400 s.
        Assert.Equal(0.3, e, 1e-5);
        Assert.Equal(PhysicalConstants.JulianYearS, trajectory.EndSeconds, 2000.0);
    }

    [Theory]
    // Derived: backward integration of the same equations from the plunge (e = 0.3, Φ = γ̃ = α = 0), M = 1e6 M_sun,
    // μ = 10 M_sun, Julian year, with an independent eighth-order Runge–Kutta at rtol 1e-11 (7 significant digits kept).
    [InlineData(0.5, Math.PI / 3, 1.0, 9.783227e-4, 0.437219, 38893.2, 157992.829, 11896.321)]
    [InlineData(0.0, 0.0, 1.0, 9.365492e-4, 0.456512, 37949.9, 169988.617, 0.0)]
    [InlineData(0.5, Math.PI / 3, 3.0, 6.109290e-4, 0.561730, 86880.8, 303577.083, 23040.426)]
    public void Backward_integration_from_the_plunge_reproduces_independent_values(
        double chi, double lambda, double years, double nuStart, double eStart, double orbits, double gammaAdvance, double alphaAdvance)
    {
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, chi, Math.Cos(lambda));
        double nuPlunge = equations.PlungeFrequency(0.3);
        Assert.Equal(1.654310e-3, nuPlunge, 1e-9);
        var solver = new DormandPrince54(5, 1e-12, [1e-9, 1e-18, 1e-9, 1e-14, 1e-9]);
        var observer = new Ignore();
        double[] state = [0, nuPlunge, 0, 0.3, 0];
        var (outcome, _) = solver.Integrate(ref equations, 0, state, -years * PhysicalConstants.JulianYearS, ref observer, 1.0, 1e5);
        Assert.Equal(OdeOutcome.ReachedEnd, outcome);
        Assert.Equal(nuStart, state[1], 1e-10);
        Assert.Equal(eStart, state[3], 1e-6);
        Assert.Equal(orbits, -state[0] / (2 * Math.PI), 0.1);
        Assert.Equal(gammaAdvance, -state[2], 2e-3);
        Assert.Equal(alphaAdvance, -state[4], 2e-3);
    }

    [Fact]
    public void Plunge_time_parameter_converts_to_the_initial_frequency()
    {
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0.5, 0.5);
        var trajectory = new InspiralTrajectory();
        double nu0 = trajectory.FrequencyForPlungeTime(equations, [0, 0, 0, 0.437219, 0], PhysicalConstants.JulianYearS);
        Assert.Equal(9.783227e-4, nu0, 1e-9);
        trajectory.Evolve(equations, [0, nu0, 0, 0.437219, 0], 2 * PhysicalConstants.JulianYearS);
        Assert.Equal(PhysicalConstants.JulianYearS, trajectory.EndSeconds, 1.0);
    }

    [Fact]
    public void Interpolated_phase_between_coarse_points_matches_a_dense_integration()
    {
        // Stored points up to 1e5 s apart against points 500 s apart: the Hermite interpolant must keep the orbital
        // phase to far better than 0.01 rad, the scale at which a template's match starts to suffer.
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0.5, 0.5);
        var coarse = new InspiralTrajectory();
        var dense = new InspiralTrajectory();
        double[] start = [0, 9.8e-4, 0.3, 0.43, 0.2];
        coarse.Evolve(equations, start, PhysicalConstants.JulianYearS, maxStepSeconds: 1e5);
        dense.Evolve(equations, start, PhysicalConstants.JulianYearS, maxStepSeconds: 500);
        Span<double> a = stackalloc double[5], b = stackalloc double[5];
        double worst = 0;
        int hintA = 0, hintB = 0;
        for (double t = 1234.5; t < coarse.EndSeconds; t += 7919)
        {
            hintA = coarse.Evaluate(t, a, Span<double>.Empty, hintA);
            hintB = dense.Evaluate(t, b, Span<double>.Empty, hintB);
            worst = Math.Max(worst, Math.Abs(a[0] - b[0]));
        }
        Assert.True(worst < 1e-3, $"worst phase difference {worst} rad");
    }

    [Fact]
    public void Bad_sources_and_states_are_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new KludgeOrbitEquations(-1, 1e-5, 0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new KludgeOrbitEquations(5, 1e-5, 1.0, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new KludgeOrbitEquations(5, 1e-5, 0.5, 1.5));
        var equations = new KludgeOrbitEquations(1e6 * Msun, 10 * Msun, 0.5, 0.5);
        var trajectory = new InspiralTrajectory();
        var past = Assert.Throws<ArgumentOutOfRangeException>(() => trajectory.Evolve(equations, [0, 1e-2, 0, 0.2, 0], 1e6));
        Assert.Contains("plunge", past.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => trajectory.Evolve(equations, [0, 1e-3, 0, 1.0, 0], 1e6));
        Assert.Throws<ArgumentOutOfRangeException>(() => trajectory.Evolve(equations, [0, 1e-3, 0, 0.1, 0], -1));
        Assert.Throws<InvalidOperationException>(() => trajectory.Evaluate(0, new double[5], Span<double>.Empty));
    }
}
