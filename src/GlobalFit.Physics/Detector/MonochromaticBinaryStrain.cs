namespace GlobalFit.Physics.Detector;

/// <summary>The plane wave of a circular binary with a linear frequency drift.</summary>
/// <remarks>
/// Leading quadrupole order (Peters 1964, Phys. Rev. 136, B1224; polarisation convention ours: several papers write
/// <c>h× = −2A cos ι sin Φ</c>, i.e. cos ι → −cos ι): <c>Φ(t) = φ0 + 2π f0 t + π ḟ t²</c>,
/// <c>h+ = A(1 + cos²ι) cos Φ</c>, <c>h× = 2A cos ι sin Φ</c>, with t the retarded time at the Sun. The second
/// derivative of the frequency is left out (it shifts the phase by <c>(π/3) f̈ t³</c>, below a milliradian over four
/// years for ordinary white-dwarf binaries; derived: <c>f̈ = (11/3) ḟ²/f</c> gives 1.3e-29 Hz/s² for Mc = 0.5 Msun at
/// 3 mHz, a phase of 3e-5 rad over four years). Immutable and thread-safe.
/// </remarks>
public sealed class MonochromaticBinaryStrain : IPlaneWaveStrain
{
    private readonly double _plusAmplitude;
    private readonly double _crossAmplitude;

    /// <summary>Creates the source.</summary>
    /// <param name="frequencyHz">f0, gravitational-wave frequency at t = 0; positive.</param>
    /// <param name="frequencyDerivativeHzS">ḟ.</param>
    /// <param name="amplitude">A, dimensionless; not negative.</param>
    /// <param name="inclinationRad">ι, angle between the orbital angular momentum and the line of sight.</param>
    /// <param name="polarisationRad">ψ.</param>
    /// <param name="initialPhaseRad">φ0.</param>
    /// <param name="sky">Ecliptic position of the source.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is not finite, f0 is not positive or A is negative.</exception>
    public MonochromaticBinaryStrain(
        double frequencyHz,
        double frequencyDerivativeHzS,
        double amplitude,
        double inclinationRad,
        double polarisationRad,
        double initialPhaseRad,
        SkyPosition sky)
    {
        if (!(frequencyHz > 0) || !double.IsFinite(frequencyHz))
            throw new ArgumentOutOfRangeException(nameof(frequencyHz), frequencyHz, "frequency must be positive and finite");
        if (!double.IsFinite(frequencyDerivativeHzS))
            throw new ArgumentOutOfRangeException(nameof(frequencyDerivativeHzS), frequencyDerivativeHzS, "frequency derivative must be finite");
        if (!(amplitude >= 0) || !double.IsFinite(amplitude))
            throw new ArgumentOutOfRangeException(nameof(amplitude), amplitude, "amplitude must be finite and not negative");
        OrbitArguments.CheckAngle(inclinationRad, nameof(inclinationRad));
        OrbitArguments.CheckAngle(polarisationRad, nameof(polarisationRad));
        OrbitArguments.CheckAngle(initialPhaseRad, nameof(initialPhaseRad));
        FrequencyHz = frequencyHz;
        FrequencyDerivativeHzS = frequencyDerivativeHzS;
        Amplitude = amplitude;
        InclinationRad = inclinationRad;
        PolarisationRad = polarisationRad;
        InitialPhaseRad = initialPhaseRad;
        Sky = sky;
        double cosIota = Math.Cos(inclinationRad);
        _plusAmplitude = amplitude * (1.0 + cosIota * cosIota);
        _crossAmplitude = 2.0 * amplitude * cosIota;
    }

    /// <summary>f0, gravitational-wave frequency at t = 0.</summary>
    /// <value>Hz.</value>
    public double FrequencyHz { get; }

    /// <summary>ḟ, the frequency drift.</summary>
    /// <value>Hz/s.</value>
    public double FrequencyDerivativeHzS { get; }

    /// <summary>A, the dimensionless amplitude (face-on strain per polarisation is 2A).</summary>
    public double Amplitude { get; }

    /// <summary>ι, the inclination.</summary>
    /// <value>rad.</value>
    public double InclinationRad { get; }

    /// <summary>ψ, the polarisation angle.</summary>
    /// <value>rad.</value>
    public double PolarisationRad { get; }

    /// <summary>φ0, the phase at t = 0.</summary>
    /// <value>rad.</value>
    public double InitialPhaseRad { get; }

    /// <summary>Ecliptic position of the source.</summary>
    public SkyPosition Sky { get; }

    /// <summary>The polarisation frame of this source.</summary>
    public PolarisationBasis Basis => new(Sky, PolarisationRad);

    /// <summary>Gravitational-wave phase Φ at retarded time <paramref name="retardedTimeSeconds"/>.</summary>
    /// <value>rad.</value>
    public double PhaseRad(double retardedTimeSeconds)
    {
        double t = retardedTimeSeconds;
        return InitialPhaseRad + Math.PI * t * (2.0 * FrequencyHz + FrequencyDerivativeHzS * t);
    }

    /// <inheritdoc/>
    public (double Plus, double Cross) At(double retardedTimeSeconds)
    {
        var (sin, cos) = Math.SinCos(PhaseRad(retardedTimeSeconds));
        return (_plusAmplitude * cos, _crossAmplitude * sin);
    }
}
