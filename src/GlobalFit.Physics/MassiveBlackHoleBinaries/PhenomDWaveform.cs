using GlobalFit.Physics.Constants;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The IMRPhenomD (2,2) mode of one binary in physical units: amplitude, phase and stationary-phase time over a
/// frequency grid in Hz.</summary>
/// <remarks>
/// <para>With M the detector-frame (redshifted) total mass, <c>M_s = GM/c³</c>, <c>M_m = GM/c²</c> and D_L the luminosity
/// distance, the (2,2) mode is <c>h̃22(f) = a(f) e^{−iΨ(f)}</c> with <c>a(f) = (M_m M_s / D_L) A(M_s f)</c> (in s) and
/// <c>Ψ(f) = φ(M_s f) + 2π f t_c</c> (Khan et al. 2016, arXiv:1508.07253, in the transform convention
/// <c>h̃(f) = ∫ h(t) e^{−2πift} dt</c>). The time at which frequency f is emitted (stationary phase, arriving at the Sun) is
/// <c>t(f) = (1/2π) dΨ/df = t_c + M_s (1/2π) dφ/d(Mf)</c>, so <c>t(f_peak) = t_c</c>: the coalescence time is the arrival of the
/// amplitude peak at the Sun. Polarisations and the reference phase are applied by the response
/// (<see cref="MassiveBlackHoleBinaryResponse"/>). Immutable value; thread-safe.</para>
/// </remarks>
public readonly struct PhenomDWaveform
{
    /// <summary>Sets up the waveform.</summary>
    /// <param name="totalMassMsun">Detector-frame total mass m1 + m2 in solar masses.</param>
    /// <param name="massRatio">q = m1/m2 ≥ 1.</param>
    /// <param name="spin1">Aligned spin of the heavier body.</param>
    /// <param name="spin2">Aligned spin of the lighter body.</param>
    /// <param name="distanceMpc">Luminosity distance.</param>
    /// <param name="coalescenceTimeS">t_c, arrival time of the amplitude peak at the Sun on the data's time axis.</param>
    /// <exception cref="ArgumentOutOfRangeException">A mass or the distance is not positive and finite, t_c is not finite, or
    /// q or a spin is out of range.</exception>
    public PhenomDWaveform(double totalMassMsun, double massRatio, double spin1, double spin2, double distanceMpc, double coalescenceTimeS)
    {
        if (!(totalMassMsun > 0) || !double.IsFinite(totalMassMsun))
            throw new ArgumentOutOfRangeException(nameof(totalMassMsun), totalMassMsun, "total mass must be positive and finite");
        if (!(distanceMpc > 0) || !double.IsFinite(distanceMpc))
            throw new ArgumentOutOfRangeException(nameof(distanceMpc), distanceMpc, "distance must be positive and finite");
        if (!double.IsFinite(coalescenceTimeS))
            throw new ArgumentOutOfRangeException(nameof(coalescenceTimeS), coalescenceTimeS, "coalescence time must be finite");
        Model = new PhenomDModel(massRatio, spin1, spin2);
        TotalMassSeconds = totalMassMsun * PhysicalConstants.SolarMassSeconds;
        AmplitudeScaleSeconds = totalMassMsun * PhysicalConstants.SolarMassMetres * TotalMassSeconds / (distanceMpc * PhysicalConstants.MegaparsecM);
        CoalescenceTimeS = coalescenceTimeS;
    }

    /// <summary>The geometric-unit model.</summary>
    public PhenomDModel Model { get; }

    /// <summary>GM/c³ of the detector-frame total mass.</summary>
    /// <value>s.</value>
    public double TotalMassSeconds { get; }

    /// <summary><c>M_m M_s / D_L</c>, which turns the geometric amplitude into strain per Hz.</summary>
    /// <value>s.</value>
    public double AmplitudeScaleSeconds { get; }

    /// <summary>t_c, arrival of the amplitude peak at the Sun.</summary>
    /// <value>s.</value>
    public double CoalescenceTimeS { get; }

    /// <summary>Frequency above which the model is zero, <c>0.2/M_s</c>.</summary>
    /// <value>Hz.</value>
    public double MaximumFrequencyHz => PhenomDModel.MaximumFrequency / TotalMassSeconds;

    /// <summary>Frequency of the amplitude peak (arriving at t_c).</summary>
    /// <value>Hz.</value>
    public double PeakFrequencyHz => Model.PeakFrequency / TotalMassSeconds;

    /// <summary>Writes a(f) (s), Ψ(f) (rad) and t(f) (s) for the positive frequencies <paramref name="frequenciesHz"/> into the
    /// caller's spans. Allocation-free.</summary>
    /// <exception cref="ArgumentException">A span's length differs from the frequencies'.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A frequency is not positive and finite.</exception>
    public void Evaluate(ReadOnlySpan<double> frequenciesHz, Span<double> amplitude, Span<double> phase, Span<double> timeS)
    {
        int n = frequenciesHz.Length;
        if (amplitude.Length != n || phase.Length != n || timeS.Length != n)
            throw new ArgumentException("amplitude, phase and time spans must match the frequency count");
        var model = Model;
        double ms = TotalMassSeconds;
        double twoPiTc = 2.0 * Math.PI * CoalescenceTimeS;
        double timeScale = ms / (2.0 * Math.PI);
        for (int i = 0; i < n; i++)
        {
            double f = frequenciesHz[i];
            if (!(f > 0) || !double.IsFinite(f))
                throw new ArgumentOutOfRangeException(nameof(frequenciesHz), f, "frequencies must be positive and finite");
            double mf = ms * f;
            amplitude[i] = AmplitudeScaleSeconds * model.AmplitudeUnchecked(mf);
            var (psi, slope) = model.PhaseAndDerivativeUnchecked(mf);
            phase[i] = psi + twoPiTc * f;
            timeS[i] = CoalescenceTimeS + timeScale * slope;
        }
    }
}
