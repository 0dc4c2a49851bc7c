namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The IMRPhenomD (2,2)-mode amplitude and phase of one aligned-spin binary, in geometric units (total mass M = 1).</summary>
/// <remarks>
/// <para>Khan et al. 2016, PRD 93, 044007 (arXiv:1508.07253), Secs. IV–V and App. B, with the final state of Husa et al. 2016,
/// PRD 93, 044006 (arXiv:1508.07250). Frequencies are dimensionless, <c>Mf</c> (f in Hz times GM/c³). The frequency-domain
/// (2,2) mode is <c>h̃(f) = A(f) e^{−iφ(f)}</c> in the transform convention <c>h̃(f) = ∫ h(t) e^{−2πift} dt</c> (the project's),
/// in units of M²/D.</para>
/// <para>Regions. Amplitude: inspiral for <c>Mf &lt; 0.014</c> (TaylorF2 amplitude to 3PN, Khan16 Eq. B2, plus ρ1..ρ3 terms),
/// intermediate quartic in Mf up to the peak frequency (fixed by collocation: value and slope at both ends and the fitted v2 at the
/// midpoint), merger–ringdown Lorentzian beyond. Phase: inspiral for <c>Mf &lt; 0.018</c> (3.5PN TaylorF2 with aligned spin–orbit
/// terms to 3.5PN and spin–spin at 2PN, Khan16 Eq. B6, plus σ1..σ4), intermediate <c>β</c> ansatz up to <c>0.5 f_RD</c>,
/// merger–ringdown <c>α</c> ansatz beyond. The β0, β1, α0, α1 are fixed by continuity of φ and dφ/df (C1), so the separately
/// fitted β1 and α1 are not used; the amplitude is C1 by its collocation.</para>
/// <para>Time and phase convention (ours; the papers leave the origin free): the phase is shifted by a constant and a
/// linear term so that at the amplitude peak f_peak both φ and dφ/df vanish. With <c>t(f) = (1/2π) dφ/df</c> (the stationary-phase
/// time in this transform convention), the amplitude peak therefore arrives at t = 0 and the time-domain (2,2) phase is zero there.</para>
/// <para>Above <c>Mf = 0.2</c> (<see cref="MaximumFrequency"/>) the amplitude is set to zero (the model's usual cut-off; the
/// signal there is negligible). Immutable value; thread-safe.</para>
/// </remarks>
public readonly struct PhenomDModel
{
    /// <summary>Upper end of the model, <c>Mf = 0.2</c>; the amplitude is zero above it.</summary>
    public const double MaximumFrequency = 0.2;

    /// <summary>End of the inspiral phase region, <c>Mf = 0.018</c> (Khan16 Sec. V).</summary>
    public const double InspiralPhaseEnd = 0.018;

    /// <summary>End of the inspiral amplitude region, <c>Mf = 0.014</c> (Khan16 Sec. V).</summary>
    public const double InspiralAmplitudeEnd = 0.014;

    private const double EulerGamma = 0.57721566490153286;

    private readonly double _phaseScale;    // 3/(128 η)
    private readonly double _p2, _p3, _p4, _p5, _p6Constant, _p6Log, _p7;
    private readonly double _sigma1, _sigma2, _sigma3, _sigma4;
    private readonly double _beta0, _beta1, _beta2, _beta3;
    private readonly double _alpha0, _alpha1, _alpha2, _alpha3, _alpha4, _alpha5;
    private readonly double _shiftConstant, _shiftLinear;
    private readonly double _amplitudeScale; // sqrt(2η/3) π^(−1/6)
    private readonly double _a2, _a3, _a4, _a5, _a6, _rho1, _rho2, _rho3;
    private readonly double _d0, _d1, _d2, _d3, _d4;
    private readonly double _gamma1, _gamma2, _gamma3;

    /// <summary>Sets up the model for one binary.</summary>
    /// <param name="massRatio">q = m1/m2 ≥ 1 (m1 the heavier body).</param>
    /// <param name="spin1">χ1, aligned spin of the heavier body, in [−1, 1].</param>
    /// <param name="spin2">χ2, aligned spin of the lighter body, in [−1, 1].</param>
    /// <exception cref="ArgumentOutOfRangeException">q is below 1 or not finite, or a spin lies outside [−1, 1].</exception>
    public PhenomDModel(double massRatio, double spin1, double spin2)
    {
        if (!(massRatio >= 1.0) || !double.IsFinite(massRatio))
            throw new ArgumentOutOfRangeException(nameof(massRatio), massRatio, "mass ratio must be finite and at least 1");
        if (!(Math.Abs(spin1) <= 1.0))
            throw new ArgumentOutOfRangeException(nameof(spin1), spin1, "spin must lie in [-1, 1]");
        if (!(Math.Abs(spin2) <= 1.0))
            throw new ArgumentOutOfRangeException(nameof(spin2), spin2, "spin must lie in [-1, 1]");

        double eta = massRatio / ((1.0 + massRatio) * (1.0 + massRatio));
        double delta = (massRatio - 1.0) / (massRatio + 1.0);
        double chiS = 0.5 * (spin1 + spin2), chiA = 0.5 * (spin1 - spin2);
        // Khan16 Sec. II after Ajith 2011 (arXiv:1107.1267): χ_PN = χ_eff − (38η/113)(χ1 + χ2).
        double chiPn = chiS * (1.0 - 76.0 * eta / 113.0) + delta * chiA;
        SymmetricMassRatio = eta;
        ReducedSpin = chiPn;
        double eta2 = eta * eta, eta3 = eta2 * eta;
        double pi = Math.PI, pi2 = pi * pi;

        // Final state and ringdown (Husa16 Sec. VII; QNM table), frequencies in units of the initial M.
        FinalSpin = RemnantFits.FinalSpin(eta, spin1, spin2);
        FinalMass = RemnantFits.FinalMass(eta, spin1, spin2);
        var (omegaReal, omegaDamping) = KerrQuasinormalModes.Fundamental22(FinalSpin);
        RingdownFrequency = omegaReal / (2.0 * pi) / FinalMass;
        DampingFrequency = omegaDamping / (2.0 * pi) / FinalMass;

        double Fit(PhenomDCoefficient c) => PhenomDCoefficientTable.Evaluate(c, eta, chiPn);

        // TaylorF2 phase coefficients, Khan16 Eq. B6 (non-spinning part: Buonanno et al. 2009, arXiv:0907.0700;
        // spin–orbit to 3.5PN: Bohé et al. 2013, arXiv:1212.5520). Multiplied by (πf)^{(i−5)/3} and 3/(128η).
        _phaseScale = 3.0 / (128.0 * eta);
        _p2 = 3715.0 / 756.0 + 55.0 * eta / 9.0;
        _p3 = -16.0 * pi + 113.0 / 3.0 * delta * chiA + (113.0 / 3.0 - 76.0 * eta / 3.0) * chiS;
        _p4 = 15293365.0 / 508032.0 + 27145.0 * eta / 504.0 + 3085.0 * eta2 / 72.0
            + (-405.0 / 8.0 + 200.0 * eta) * chiA * chiA - 405.0 / 4.0 * delta * chiA * chiS
            + (-405.0 / 8.0 + 5.0 * eta / 2.0) * chiS * chiS;
        _p5 = 38645.0 * pi / 756.0 - 65.0 * pi * eta / 9.0
            + delta * (-732985.0 / 2268.0 - 140.0 * eta / 9.0) * chiA
            + (-732985.0 / 2268.0 + 24260.0 * eta / 81.0 + 340.0 * eta2 / 9.0) * chiS;
        _p6Constant = 11583231236531.0 / 4694215680.0 - 6848.0 * EulerGamma / 21.0 - 640.0 * pi2 / 3.0
            + (-15737765635.0 / 3048192.0 + 2255.0 * pi2 / 12.0) * eta + 76055.0 * eta2 / 1728.0 - 127825.0 * eta3 / 1296.0
            + 2270.0 * pi / 3.0 * delta * chiA + (2270.0 * pi / 3.0 - 520.0 * pi * eta) * chiS;
        _p6Log = -6848.0 / 63.0;
        _p7 = 77096675.0 * pi / 254016.0 + 378515.0 * pi * eta / 1512.0 - 74045.0 * pi * eta2 / 756.0
            + delta * (-25150083775.0 / 3048192.0 + 26804935.0 * eta / 6048.0 - 1985.0 * eta2 / 48.0) * chiA
            + (-25150083775.0 / 3048192.0 + 10566655595.0 * eta / 762048.0 - 1042165.0 * eta2 / 3024.0 + 5345.0 * eta3 / 36.0) * chiS;

        _sigma1 = Fit(PhenomDCoefficient.Sigma1);
        _sigma2 = Fit(PhenomDCoefficient.Sigma2);
        _sigma3 = Fit(PhenomDCoefficient.Sigma3);
        _sigma4 = Fit(PhenomDCoefficient.Sigma4);
        _beta2 = Fit(PhenomDCoefficient.Beta2);
        _beta3 = Fit(PhenomDCoefficient.Beta3);
        _alpha2 = Fit(PhenomDCoefficient.Alpha2);
        _alpha3 = Fit(PhenomDCoefficient.Alpha3);
        _alpha4 = Fit(PhenomDCoefficient.Alpha4);
        _alpha5 = Fit(PhenomDCoefficient.Alpha5);
        FittedBeta1 = Fit(PhenomDCoefficient.Beta1);
        FittedAlpha1 = Fit(PhenomDCoefficient.Alpha1);

        // Amplitude: TaylorF2 3PN amplitude coefficients (Khan16 Eq. B2), pre-multiplied by π^{i/3}.
        _amplitudeScale = Math.Sqrt(2.0 * eta / 3.0) * Math.Pow(pi, -1.0 / 6.0);
        double piThird = Math.Cbrt(pi);
        _a2 = (-323.0 / 224.0 + 451.0 * eta / 168.0) * piThird * piThird;
        _a3 = (27.0 / 8.0 * delta * chiA + (27.0 / 8.0 - 11.0 * eta / 6.0) * chiS) * pi;
        _a4 = (-27312085.0 / 8128512.0 - 1975055.0 * eta / 338688.0 + 105271.0 * eta2 / 24192.0
            + (-81.0 / 32.0 + 8.0 * eta) * chiA * chiA - 81.0 / 16.0 * delta * chiA * chiS
            + (-81.0 / 32.0 + 17.0 * eta / 8.0) * chiS * chiS) * pi * piThird;
        _a5 = (-85.0 * pi / 64.0 + 85.0 * pi * eta / 16.0
            + delta * (285197.0 / 16128.0 - 1579.0 * eta / 4032.0) * chiA
            + (285197.0 / 16128.0 - 15317.0 * eta / 672.0 - 2227.0 * eta2 / 1008.0) * chiS) * pi * piThird * piThird;
        _a6 = (-177520268561.0 / 8583708672.0 + (545384828789.0 / 5007163392.0 - 205.0 * pi2 / 48.0) * eta
            - 3248849057.0 * eta2 / 178827264.0 + 34473079.0 * eta3 / 6386688.0
            + (1614569.0 / 64512.0 - 1873643.0 * eta / 16128.0 + 2167.0 * eta2 / 42.0) * chiA * chiA
            + (31.0 * pi / 12.0 - 7.0 * pi * eta / 3.0) * chiS
            + (1614569.0 / 64512.0 - 61391.0 * eta / 1344.0 + 57451.0 * eta2 / 4032.0) * chiS * chiS
            + delta * chiA * (31.0 * pi / 12.0 + (1614569.0 / 32256.0 - 165961.0 * eta / 2688.0) * chiS)) * pi2;
        _rho1 = Fit(PhenomDCoefficient.Rho1);
        _rho2 = Fit(PhenomDCoefficient.Rho2);
        _rho3 = Fit(PhenomDCoefficient.Rho3);
        _gamma1 = Fit(PhenomDCoefficient.Gamma1);
        _gamma2 = Fit(PhenomDCoefficient.Gamma2);
        _gamma3 = Fit(PhenomDCoefficient.Gamma3);
        double v2 = Fit(PhenomDCoefficient.V2);

        // Peak of the merger–ringdown Lorentzian (root of its derivative nearest f_RD). For γ2 ≥ 1 the ansatz has no
        // interior maximum; the limit γ2 → 1 of the formula is used there (our safeguard, not from the paper).
        double fRd = RingdownFrequency, fDecay = DampingFrequency;
        PeakFrequency = _gamma2 < 1.0
            ? Math.Abs(fRd + fDecay * _gamma3 * (Math.Sqrt(1.0 - _gamma2 * _gamma2) - 1.0) / _gamma2)
            : Math.Abs(fRd - fDecay * _gamma3 / _gamma2);

        // Intermediate amplitude: collocation (Khan16 Sec. V) on the reduced amplitude A/A0.
        _d0 = _d1 = _d2 = _d3 = _d4 = 0;
        {
            double f1 = InspiralAmplitudeEnd, f3 = PeakFrequency, f2 = 0.5 * (f1 + f3);
            Span<double> matrix = stackalloc double[25];
            Span<double> rhs = stackalloc double[5];
            Row(matrix, 0, f1, derivative: false); rhs[0] = InspiralReducedAmplitude(f1);
            Row(matrix, 1, f1, derivative: true); rhs[1] = InspiralReducedAmplitudeDerivative(f1);
            Row(matrix, 2, f2, derivative: false); rhs[2] = v2;
            Row(matrix, 3, f3, derivative: false); rhs[3] = MergerReducedAmplitude(f3);
            Row(matrix, 4, f3, derivative: true); rhs[4] = MergerReducedAmplitudeDerivative(f3);
            SolveInPlace(matrix, rhs, 5);
            (_d0, _d1, _d2, _d3, _d4) = (rhs[0], rhs[1], rhs[2], rhs[3], rhs[4]);
        }

        // C1 connection of the phase (Khan16 Sec. V): β0, β1 at 0.018 and α0, α1 at 0.5 f_RD, in η-scaled form.
        _shiftConstant = _shiftLinear = 0;
        _beta0 = _beta1 = _alpha0 = _alpha1 = 0;
        double fJoin1 = InspiralPhaseEnd;
        _beta1 = eta * InspiralPhaseDerivative(fJoin1) - _beta2 / fJoin1 - _beta3 / (fJoin1 * fJoin1 * fJoin1 * fJoin1);
        _beta0 = eta * InspiralPhase(fJoin1) - _beta1 * fJoin1 - _beta2 * Math.Log(fJoin1) + _beta3 / (3.0 * fJoin1 * fJoin1 * fJoin1);
        double fJoin2 = MergerPhaseStart;
        _alpha1 = eta * IntermediatePhaseDerivative(fJoin2) - _alpha2 / (fJoin2 * fJoin2) - _alpha3 * Math.Pow(fJoin2, -0.25)
            - _alpha4 * fDecay / (fDecay * fDecay + (fJoin2 - _alpha5 * fRd) * (fJoin2 - _alpha5 * fRd));
        _alpha0 = eta * IntermediatePhase(fJoin2) - _alpha1 * fJoin2 + _alpha2 / fJoin2 - 4.0 / 3.0 * _alpha3 * Math.Pow(fJoin2, 0.75)
            - _alpha4 * Math.Atan((fJoin2 - _alpha5 * fRd) / fDecay);

        // Our time and phase origin: φ = dφ/df = 0 at the amplitude peak.
        double peakSlope = RawPhaseDerivative(PeakFrequency);
        double peakPhase = RawPhase(PeakFrequency);
        _shiftLinear = -peakSlope;
        _shiftConstant = -peakPhase + peakSlope * PeakFrequency;
    }

    /// <summary>Symmetric mass ratio η = m1 m2 / M².</summary>
    public double SymmetricMassRatio { get; }

    /// <summary>Reduced spin χ_PN at which the coefficient fits are evaluated.</summary>
    public double ReducedSpin { get; }

    /// <summary>Dimensionless spin of the remnant.</summary>
    public double FinalSpin { get; }

    /// <summary>Remnant mass in units of the initial total mass.</summary>
    public double FinalMass { get; }

    /// <summary>Ringdown frequency <c>M f_RD</c> (real part of the (2,2,0) mode over 2π, in units of the initial mass).</summary>
    public double RingdownFrequency { get; }

    /// <summary>Damping frequency <c>M f_damp</c> (imaginary part of the (2,2,0) mode over 2π, in units of the initial mass).</summary>
    public double DampingFrequency { get; }

    /// <summary>Frequency <c>M f_peak</c> where the intermediate amplitude hands over to the merger–ringdown one; time origin.</summary>
    public double PeakFrequency { get; }

    /// <summary>Start of the merger–ringdown phase region, <c>0.5 M f_RD</c>.</summary>
    public double MergerPhaseStart => 0.5 * RingdownFrequency;

    /// <summary>β1 from the coefficient fit (replaced in the model by the C1 value; kept for consistency checks).</summary>
    internal double FittedBeta1 { get; }

    /// <summary>α1 from the coefficient fit (replaced in the model by the C1 value; kept for consistency checks).</summary>
    internal double FittedAlpha1 { get; }

    /// <summary>β1 fixed by C1 continuity at 0.018.</summary>
    internal double ConnectedBeta1 => _beta1;

    /// <summary>α1 fixed by C1 continuity at 0.5 f_RD.</summary>
    internal double ConnectedAlpha1 => _alpha1;

    /// <summary>Amplitude A(Mf) of the (2,2) mode, in units of M²/D (zero above <see cref="MaximumFrequency"/>).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The frequency is not positive and finite.</exception>
    public double Amplitude(double frequency)
    {
        CheckFrequency(frequency);
        return AmplitudeUnchecked(frequency);
    }

    /// <summary>Phase φ(Mf) in rad, with φ = dφ/df = 0 at <see cref="PeakFrequency"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The frequency is not positive and finite.</exception>
    public double Phase(double frequency)
    {
        CheckFrequency(frequency);
        return RawPhase(frequency) + _shiftConstant + _shiftLinear * frequency;
    }

    /// <summary>dφ/d(Mf); the stationary-phase time is <c>t/M = (1/2π) dφ/d(Mf)</c>, zero at the amplitude peak.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The frequency is not positive and finite.</exception>
    public double PhaseDerivative(double frequency)
    {
        CheckFrequency(frequency);
        return RawPhaseDerivative(frequency) + _shiftLinear;
    }

    /// <summary>Evaluates amplitude, phase and phase derivative over <paramref name="frequencies"/> (Mf, positive) into the
    /// caller's spans (same length). Allocation-free.</summary>
    /// <exception cref="ArgumentException">The spans' lengths differ from the frequencies'.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A frequency is not positive and finite.</exception>
    public void Evaluate(ReadOnlySpan<double> frequencies, Span<double> amplitude, Span<double> phase, Span<double> phaseDerivative)
    {
        int n = frequencies.Length;
        if (amplitude.Length != n || phase.Length != n || phaseDerivative.Length != n)
            throw new ArgumentException("amplitude, phase and derivative spans must match the frequency count");
        for (int i = 0; i < n; i++)
        {
            double f = frequencies[i];
            CheckFrequency(f);
            amplitude[i] = AmplitudeUnchecked(f);
            var (value, slope) = RawPhaseAndDerivative(f);
            phase[i] = value + _shiftConstant + _shiftLinear * f;
            phaseDerivative[i] = slope + _shiftLinear;
        }
    }

    /// <summary>Phase and its derivative at one frequency without argument checks (for hot loops that checked their grid).</summary>
    internal (double Phase, double Derivative) PhaseAndDerivativeUnchecked(double frequency)
    {
        var (value, slope) = RawPhaseAndDerivative(frequency);
        return (value + _shiftConstant + _shiftLinear * frequency, slope + _shiftLinear);
    }

    /// <summary>Amplitude at one frequency without argument checks.</summary>
    internal double AmplitudeUnchecked(double f)
    {
        if (f > MaximumFrequency) return 0.0;
        // f^{−7/6} = 1/(f √(f^{1/3})): a cube root and a square root are cheaper than Math.Pow.
        double leading = _amplitudeScale / (f * Math.Sqrt(Math.Cbrt(f)));
        if (f < InspiralAmplitudeEnd) return leading * InspiralReducedAmplitude(f);
        if (f < PeakFrequency) return leading * IntermediateReducedAmplitude(f);
        return leading * MergerReducedAmplitude(f);
    }

    /// <summary>Reduced amplitude A/A0 of the inspiral region (for continuity tests and the collocation).</summary>
    internal double InspiralReducedAmplitude(double f)
    {
        double v = Math.Cbrt(f); // f^{1/3}; π^{i/3} is in the coefficients
        double v2 = v * v, v3 = f, v4 = v3 * v, v5 = v4 * v, v6 = f * f;
        return 1.0 + _a2 * v2 + _a3 * v3 + _a4 * v4 + _a5 * v5 + _a6 * v6
            + _rho1 * v6 * v + _rho2 * v6 * v2 + _rho3 * v6 * v3;
    }

    internal double InspiralReducedAmplitudeDerivative(double f)
    {
        double v = Math.Cbrt(f);
        double v2 = v * v, v4 = f * v, v5 = v4 * v;
        return (2.0 / 3.0 * _a2 * v2 + _a3 * f + 4.0 / 3.0 * _a4 * v4 + 5.0 / 3.0 * _a5 * v5 + 2.0 * _a6 * f * f) / f
            + 7.0 / 3.0 * _rho1 * v4 + 8.0 / 3.0 * _rho2 * v5 + 3.0 * _rho3 * f * f;
    }

    internal double IntermediateReducedAmplitude(double f) => _d0 + f * (_d1 + f * (_d2 + f * (_d3 + f * _d4)));

    internal double MergerReducedAmplitude(double f)
    {
        double width = _gamma3 * DampingFrequency;
        double offset = f - RingdownFrequency;
        return _gamma1 * width / (offset * offset + width * width) * Math.Exp(-_gamma2 * offset / width);
    }

    internal double MergerReducedAmplitudeDerivative(double f)
    {
        double width = _gamma3 * DampingFrequency;
        double offset = f - RingdownFrequency;
        return MergerReducedAmplitude(f) * (-2.0 * offset / (offset * offset + width * width) - _gamma2 / width);
    }

    /// <summary>Phase before the alignment shift, from the region containing <paramref name="f"/>.</summary>
    internal double RawPhase(double f) =>
        f < InspiralPhaseEnd ? InspiralPhase(f) : f < MergerPhaseStart ? IntermediatePhase(f) : MergerPhase(f);

    internal double RawPhaseDerivative(double f) =>
        f < InspiralPhaseEnd ? InspiralPhaseDerivative(f) : f < MergerPhaseStart ? IntermediatePhaseDerivative(f) : MergerPhaseDerivative(f);

    private (double Phase, double Derivative) RawPhaseAndDerivative(double f)
    {
        if (f < InspiralPhaseEnd) return InspiralPhaseAndDerivative(f);
        if (f < MergerPhaseStart) return (IntermediatePhase(f), IntermediatePhaseDerivative(f));
        return (MergerPhase(f), MergerPhaseDerivative(f));
    }

    internal double InspiralPhase(double f) => InspiralPhaseAndDerivative(f).Phase;

    internal double InspiralPhaseDerivative(double f) => InspiralPhaseAndDerivative(f).Derivative;

    internal double IntermediatePhase(double f) =>
        (_beta0 + _beta1 * f + _beta2 * Math.Log(f) - _beta3 / (3.0 * f * f * f)) / SymmetricMassRatio;

    internal double IntermediatePhaseDerivative(double f) =>
        (_beta1 + _beta2 / f + _beta3 / (f * f * f * f)) / SymmetricMassRatio;

    internal double MergerPhase(double f)
    {
        double fDecay = DampingFrequency;
        return (_alpha0 + _alpha1 * f - _alpha2 / f + 4.0 / 3.0 * _alpha3 * Math.Pow(f, 0.75)
            + _alpha4 * Math.Atan((f - _alpha5 * RingdownFrequency) / fDecay)) / SymmetricMassRatio;
    }

    internal double MergerPhaseDerivative(double f)
    {
        double fDecay = DampingFrequency;
        double offset = f - _alpha5 * RingdownFrequency;
        return (_alpha1 + _alpha2 / (f * f) + _alpha3 / Math.Sqrt(Math.Sqrt(f))
            + _alpha4 * fDecay / (fDecay * fDecay + offset * offset)) / SymmetricMassRatio;
    }

    /// <summary>TaylorF2 phase plus the σ terms (Khan16 Eq. B6 and Sec. IV), and its derivative.</summary>
    private (double Phase, double Derivative) InspiralPhaseAndDerivative(double f)
    {
        double piF = Math.PI * f;
        double v = Math.Cbrt(piF);
        double logV = Math.Log(v);
        double v2 = v * v, v3 = piF, v4 = v3 * v, v5 = v4 * v, v6 = v3 * v3, v7 = v6 * v;
        double p5 = _p5 * (1.0 + 3.0 * logV);                                  // (1 + ln πf)
        double p6 = _p6Constant + _p6Log * (Math.Log(64.0) + 3.0 * logV);      // ln(64 πf)
        double series = 1.0 + _p2 * v2 + _p3 * v3 + _p4 * v4 + p5 * v5 + p6 * v6 + _p7 * v7;
        double phase = _phaseScale * series / v5;
        // d/df of Σ φ_i (πf)^{(i−5)/3}: ((i−5)/3) v^{i−5}/f, plus the derivatives of the logarithms.
        double derivativeSeries = -5.0 / 3.0 - _p2 * v2 - 2.0 / 3.0 * _p3 * v3 - 1.0 / 3.0 * _p4 * v4
            + _p5 * v5 + (p6 / 3.0 + _p6Log) * v6 + 2.0 / 3.0 * _p7 * v7;
        double derivative = _phaseScale * derivativeSeries / (v5 * f);

        double fThird = Math.Cbrt(f);
        double fFourThirds = f * fThird, fFiveThirds = fFourThirds * fThird;
        double eta = SymmetricMassRatio;
        phase += (_sigma1 * f + 0.75 * _sigma2 * fFourThirds + 0.6 * _sigma3 * fFiveThirds + 0.5 * _sigma4 * f * f) / eta;
        derivative += (_sigma1 + _sigma2 * fThird + _sigma3 * fThird * fThird + _sigma4 * f) / eta;
        return (phase, derivative);
    }

    private static void Row(Span<double> matrix, int row, double f, bool derivative)
    {
        var r = matrix.Slice(row * 5, 5);
        if (derivative)
        {
            r[0] = 0; r[1] = 1; r[2] = 2 * f; r[3] = 3 * f * f; r[4] = 4 * f * f * f;
        }
        else
        {
            r[0] = 1; r[1] = f; r[2] = f * f; r[3] = f * f * f; r[4] = f * f * f * f;
        }
    }

    /// <summary>Gaussian elimination with partial pivoting; the solution replaces <paramref name="rhs"/>.</summary>
    private static void SolveInPlace(Span<double> a, Span<double> rhs, int n)
    {
        for (int col = 0; col < n; col++)
        {
            int pivot = col;
            for (int r = col + 1; r < n; r++)
                if (Math.Abs(a[r * n + col]) > Math.Abs(a[pivot * n + col])) pivot = r;
            if (pivot != col)
            {
                for (int c = 0; c < n; c++) (a[col * n + c], a[pivot * n + c]) = (a[pivot * n + c], a[col * n + c]);
                (rhs[col], rhs[pivot]) = (rhs[pivot], rhs[col]);
            }
            for (int r = col + 1; r < n; r++)
            {
                double factor = a[r * n + col] / a[col * n + col];
                for (int c = col; c < n; c++) a[r * n + c] -= factor * a[col * n + c];
                rhs[r] -= factor * rhs[col];
            }
        }
        for (int r = n - 1; r >= 0; r--)
        {
            double sum = rhs[r];
            for (int c = r + 1; c < n; c++) sum -= a[r * n + c] * rhs[c];
            rhs[r] = sum / a[r * n + r];
        }
    }

    private static void CheckFrequency(double f)
    {
        if (!(f > 0) || !double.IsFinite(f))
            throw new ArgumentOutOfRangeException(nameof(f), f, "dimensionless frequency Mf must be positive and finite");
    }
}
