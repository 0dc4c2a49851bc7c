using GlobalFit.Physics.MassiveBlackHoleBinaries;
using Xunit.Abstractions;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

public sealed class PhenomDModelTests(ITestOutputHelper output)
{
    public static TheoryData<double, double, double> Systems => new()
    {
        { 1.0, 0.0, 0.0 },
        { 3.0, 0.5, -0.3 },
        { 8.0, 0.9, 0.0 },
        { 1.5, -0.8, -0.6 },
        { 18.0, 0.4, 0.4 },
    };

    [Theory]
    [MemberData(nameof(Systems))]
    public void Amplitude_is_continuous_with_continuous_slope_at_both_transitions(double q, double spin1, double spin2)
    {
        var model = new PhenomDModel(q, spin1, spin2);
        foreach (double boundary in new[] { PhenomDModel.InspiralAmplitudeEnd, model.PeakFrequency })
            AssertC1(model.Amplitude, boundary, $"amplitude at {boundary}");
    }

    [Theory]
    [MemberData(nameof(Systems))]
    public void Phase_is_continuous_with_continuous_slope_at_both_transitions(double q, double spin1, double spin2)
    {
        var model = new PhenomDModel(q, spin1, spin2);
        foreach (double boundary in new[] { PhenomDModel.InspiralPhaseEnd, model.MergerPhaseStart })
            AssertC1(model.Phase, boundary, $"phase at {boundary}");
    }

    [Theory]
    [MemberData(nameof(Systems))]
    public void Phase_derivative_is_the_derivative_of_the_phase(double q, double spin1, double spin2)
    {
        // Central differences with h = 1e-5 f: truncation ~h² φ''' ≪ 1e-6 of φ' away from the transitions.
        var model = new PhenomDModel(q, spin1, spin2);
        foreach (double f in new[] { 1e-3, 0.01, 0.03, 0.07, 0.12 })
        {
            double h = 1e-5 * f;
            double numeric = (model.Phase(f + h) - model.Phase(f - h)) / (2 * h);
            Assert.Equal(numeric, model.PhaseDerivative(f), 1e-6 * Math.Max(1.0, Math.Abs(numeric)));
        }
    }

    [Theory]
    [MemberData(nameof(Systems))]
    public void Peak_time_and_phase_are_zero_at_the_amplitude_peak(double q, double spin1, double spin2)
    {
        var model = new PhenomDModel(q, spin1, spin2);
        Assert.Equal(0.0, model.Phase(model.PeakFrequency), 1e-9);
        Assert.Equal(0.0, model.PhaseDerivative(model.PeakFrequency), 1e-9);
    }

    [Fact]
    public void Intermediate_amplitude_passes_through_the_fitted_midpoint_value()
    {
        // Khan et al. 2016 (arXiv:1508.07253), Sec. V: the collocation makes A/A0 equal v2 at the midpoint.
        var model = new PhenomDModel(3.0, 0.5, -0.3);
        double mid = 0.5 * (PhenomDModel.InspiralAmplitudeEnd + model.PeakFrequency);
        double v2 = PhenomDCoefficientTable.Evaluate(PhenomDCoefficient.V2, model.SymmetricMassRatio, model.ReducedSpin);
        Assert.Equal(v2, model.IntermediateReducedAmplitude(mid), 1e-10);
    }

    [Fact]
    public void Amplitude_at_low_frequency_tends_to_the_leading_order_amplitude()
    {
        // Derived: A → A0 = sqrt(2η/3) π^{-1/6} f^{-7/6} as f → 0; the first correction is the 1PN term
        // (−323/224 + 451η/168)(πf)^{2/3} ≈ −3e-4 at Mf = 1e-6, so 1e-3 relative.
        foreach (double q in new[] { 1.0, 4.0 })
        {
            var model = new PhenomDModel(q, 0.3, -0.2);
            double eta = model.SymmetricMassRatio;
            double f = 1e-6;
            double leading = Math.Sqrt(2 * eta / 3) * Math.Pow(Math.PI, -1.0 / 6) * Math.Pow(f, -7.0 / 6);
            Assert.Equal(1.0, model.Amplitude(f) / leading, 1e-3);
        }
    }

    [Fact]
    public void Amplitude_is_zero_above_the_model_cut_off() =>
        Assert.Equal(0.0, new PhenomDModel(2, 0.1, 0.1).Amplitude(0.21));

    [Theory]
    [InlineData(1.0)]
    [InlineData(4.0)]
    [InlineData(10.0)]
    public void Inspiral_phase_is_taylorf2_plus_the_fitted_higher_order_terms(double q)
    {
        // The inspiral is TaylorF2 plus (1/η)(σ1 f + ¾σ2 f^{4/3} + ⅗σ3 f^{5/3} + ½σ4 f²) (Khan et al. 2016, Sec. IV).
        // Against an independent TaylorF2 (Buonanno et al. 2009, arXiv:0907.0700) the difference minus the σ terms must be
        // a constant plus a linear term (phase and time conventions) to rounding: 1e-6 rad on phases up to ~1e5 rad.
        var model = new PhenomDModel(q, 0, 0);
        double eta = model.SymmetricMassRatio, m1 = q / (1 + q), m2 = 1 / (1 + q);
        double s2 = PhenomDCoefficientTable.Evaluate(PhenomDCoefficient.Sigma2, eta, model.ReducedSpin);
        double s3 = PhenomDCoefficientTable.Evaluate(PhenomDCoefficient.Sigma3, eta, model.ReducedSpin);
        double s4 = PhenomDCoefficientTable.Evaluate(PhenomDCoefficient.Sigma4, eta, model.ReducedSpin);
        var f = Grid(1e-4, 0.0179, 400);
        var difference = new double[f.Length];
        for (int i = 0; i < f.Length; i++)
        {
            double sigmaTerms = (0.75 * s2 * Math.Pow(f[i], 4.0 / 3) + 0.6 * s3 * Math.Pow(f[i], 5.0 / 3) + 0.5 * s4 * f[i] * f[i]) / eta;
            difference[i] = model.Phase(f[i]) - TaylorF2Reference.Phase(f[i], eta, m1, m2, 0, 0) - sigmaTerms;
        }
        double residual = TaylorF2Reference.ResidualAfterLinearFit(f, difference);
        output.WriteLine($"q = {q}: residual {residual:E2} rad");
        Assert.True(residual < 1e-6, $"residual {residual}");
    }

    [Fact]
    public void Inspiral_dephasing_from_taylorf2_is_small_far_from_merger()
    {
        // Khan et al. 2016 describe the inspiral as TaylorF2 plus higher-order terms calibrated to hybrids, with model
        // mismatches below 1 % against the hybrids (abstract). We record the size of the calibrated correction far from
        // merger, q = 1, non-spinning: below 0.1 rad after alignment for Mf in [1e-5, 3e-4] (measured, printed).
        var model = new PhenomDModel(1, 0, 0);
        var f = Grid(1e-5, 3e-4, 400);
        var difference = new double[f.Length];
        for (int i = 0; i < f.Length; i++)
            difference[i] = model.Phase(f[i]) - TaylorF2Reference.Phase(f[i], 0.25, 0.5, 0.5, 0, 0);
        double residual = TaylorF2Reference.ResidualAfterLinearFit(f, difference);
        output.WriteLine($"PhenomD − TaylorF2 over [1e-5, 3e-4]: {residual:E3} rad");
        Assert.True(residual < 0.1, $"residual {residual}");
    }

    // Source: consistency of Khan et al. 2016 Table V (from memory). Derived: β1 and α1 are fitted to the same hybrids as
    // the other phase coefficients, so their C1 values must agree with the fits up to the fits' own error; a time offset
    // Δβ1/(2πη) of a few M is that error (a wrong spin variable or a mis-remembered leading digit gives ~100 M).
    [Theory]
    [InlineData(1.0, -0.5)]
    [InlineData(1.0, 0.0)]
    [InlineData(1.0, 0.5)]
    [InlineData(1.0, 0.9)]
    [InlineData(4.0, 0.5)]
    [InlineData(4.0, -0.9)]
    public void Connected_phase_coefficients_agree_with_their_fits(double q, double spin)
    {
        var model = new PhenomDModel(q, spin, spin);
        double eta = model.SymmetricMassRatio;
        double betaOffsetM = (model.ConnectedBeta1 - model.FittedBeta1) / (2 * Math.PI * eta);
        double alphaOffsetM = (model.ConnectedAlpha1 - model.FittedAlpha1) / (2 * Math.PI * eta);
        output.WriteLine($"q = {q}, chi = {spin}: dt(beta1) = {betaOffsetM:F2} M, dt(alpha1) = {alphaOffsetM:F2} M");
        Assert.InRange(betaOffsetM, -10, 10);
        Assert.InRange(alphaOffsetM, -10, 10);
    }

    [Theory]
    [InlineData(0.5, 0.0, 0.0)]
    [InlineData(double.NaN, 0.0, 0.0)]
    [InlineData(2.0, 1.1, 0.0)]
    [InlineData(2.0, 0.0, -1.01)]
    public void Out_of_range_parameters_are_refused(double q, double spin1, double spin2) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new PhenomDModel(q, spin1, spin2));

    [Fact]
    public void Non_positive_frequency_is_refused()
    {
        var model = new PhenomDModel(2, 0, 0);
        Assert.Throws<ArgumentOutOfRangeException>(() => model.Amplitude(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => model.Phase(-1e-3));
    }

    /// <summary>Value continuity to 1e-9 relative and slope continuity from second-order one-sided differences on each side
    /// (h = 1e-6 of the boundary; truncation h² f''' is below 1e-8 relative here).</summary>
    private void AssertC1(Func<double, double> function, double boundary, string label)
    {
        double h = 1e-6 * boundary;
        double below = function(boundary - 1e-13 * boundary), at = function(boundary);
        double scale = Math.Max(1.0, Math.Abs(at));
        Assert.True(Math.Abs(below - at) <= 1e-9 * scale, $"{label}: value jumps from {below} to {at}");
        double leftSlope = (3 * function(boundary - 1e-13 * boundary) - 4 * function(boundary - h) + function(boundary - 2 * h)) / (2 * h);
        double rightSlope = (-3 * at + 4 * function(boundary + h) - function(boundary + 2 * h)) / (2 * h);
        double slopeScale = Math.Max(Math.Abs(leftSlope), Math.Abs(rightSlope)) + 1e-300;
        output.WriteLine($"{label}: slopes {leftSlope:E8} | {rightSlope:E8}");
        Assert.True(Math.Abs(leftSlope - rightSlope) <= 1e-5 * slopeScale + 1e-9 * scale / boundary, $"{label}: slope jumps from {leftSlope} to {rightSlope}");
    }

    private static double[] Grid(double low, double high, int count)
    {
        var f = new double[count];
        for (int i = 0; i < count; i++) f[i] = low * Math.Pow(high / low, i / (count - 1.0));
        return f;
    }
}
