using System.Numerics;
using GlobalFit.Physics.Constants;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>The reference ("direct") inspiral response: the strain sampled at every data time, projected on the
/// long-wavelength A and E channels, Fourier transformed, and multiplied by the Michelson transfer factor.</summary>
/// <remarks>
/// <para>At each sample time t the orbit is evaluated at the barycentric time t + N̂·x_c(t)/c from a densely stored
/// trajectory (stored points at most <see cref="DenseStepSeconds"/> apart), and the strain is the closed-form Kepler
/// quadrupole of <see cref="KeplerQuadrupole"/>: all harmonics, no truncation, no stationary-phase step. It is the
/// yardstick for <see cref="ExtremeMassRatioInspiralTemplateGenerator"/>. The strain is zero after the plunge. The
/// response model is <see cref="LongWavelengthResponse"/>; T is zero in it.</para>
/// <para>Not thread-safe (owns its trajectory); allocates its output spectra. Cost: about a microsecond per sample
/// plus one FFT of the record.</para>
/// </remarks>
public sealed class ExtremeMassRatioInspiralDirectWaveform
{
    /// <summary>Largest spacing of the stored trajectory points.</summary>
    /// <value>s.</value>
    public const double DenseStepSeconds = 2000;

    private readonly LongWavelengthResponse _response;
    private readonly InspiralTrajectory _trajectory = new(capacity: 200_000, relativeTolerance: 1e-11);

    /// <summary>Creates the waveform for <paramref name="sampleCount"/> samples every <paramref name="cadenceSeconds"/>,
    /// the first at <paramref name="startSeconds"/> on the orbits' time axis.</summary>
    /// <exception cref="ArgumentOutOfRangeException">Fewer than 4 samples, or a cadence or start time that is not finite
    /// (cadence also positive).</exception>
    public ExtremeMassRatioInspiralDirectWaveform(int sampleCount, double cadenceSeconds, IConstellationOrbits? orbits = null, double startSeconds = 0)
    {
        if (sampleCount < 4)
            throw new ArgumentOutOfRangeException(nameof(sampleCount), sampleCount, "need at least 4 samples");
        if (!(cadenceSeconds > 0) || !double.IsFinite(cadenceSeconds))
            throw new ArgumentOutOfRangeException(nameof(cadenceSeconds), cadenceSeconds, "cadence must be positive and finite");
        if (!double.IsFinite(startSeconds))
            throw new ArgumentOutOfRangeException(nameof(startSeconds), startSeconds, "start time must be finite");
        SampleCount = sampleCount;
        CadenceSeconds = cadenceSeconds;
        StartSeconds = startSeconds;
        Orbits = orbits ?? new RigidOrbits();
        _response = new LongWavelengthResponse(Orbits);
    }

    /// <summary>Number of samples.</summary>
    public int SampleCount { get; }

    /// <summary>Sampling interval.</summary>
    /// <value>s.</value>
    public double CadenceSeconds { get; }

    /// <summary>Time of the first sample on the orbits' time axis; the source's initial state is given there.</summary>
    /// <value>s.</value>
    public double StartSeconds { get; }

    /// <summary>The constellation.</summary>
    public IConstellationOrbits Orbits { get; }

    /// <summary>Bin spacing 1/(N Δt).</summary>
    /// <value>Hz.</value>
    public double FrequencyResolutionHz => 1.0 / (SampleCount * CadenceSeconds);

    /// <summary>Writes the long-wavelength strain projections <c>D_A : h</c> and <c>D_E : h</c> (before the TDI transfer
    /// factor) at every sample.</summary>
    /// <exception cref="ArgumentException">An output does not hold <see cref="SampleCount"/> values.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid.</exception>
    public void StrainProjections(in ExtremeMassRatioInspiralParameters parameters, Span<double> a, Span<double> e)
    {
        if (a.Length != SampleCount || e.Length != SampleCount)
            throw new ArgumentException($"outputs must hold {SampleCount} samples");
        var source = new KludgeSource(parameters);
        Span<double> state = stackalloc double[KludgeOrbitEquations.StateSize];
        source.InitialState(state);
        double duration = SampleCount * CadenceSeconds;
        _trajectory.Evolve(source.Equations, state, duration + 2 * PhysicalConstants.AstronomicalUnitM / PhysicalConstants.SpeedOfLightMS, DenseStepSeconds);
        double end = _trajectory.EndSeconds;
        double scale = 2 * source.MassOverDistance;
        double m = source.Equations.CentralMassSeconds;
        int hint = 0;
        for (int i = 0; i < SampleCount; i++)
        {
            double t = StartSeconds + i * CadenceSeconds;
            var (centre, da, de) = _response.At(t);
            double barycentric = i * CadenceSeconds + source.TowardsSource.Dot(centre) / PhysicalConstants.SpeedOfLightMS;
            if (barycentric > end)
            {
                a[i] = 0;
                e[i] = 0;
                continue;
            }
            hint = _trajectory.Evaluate(barycentric, state, Span<double>.Empty, hint);
            double nu = state[KludgeOrbitEquations.Frequency];
            double y = 2 * Math.PI * m * nu;
            var strain = (scale * Math.Cbrt(y * y)) * Strain(source, state);
            a[i] = da.TransverseTraceless(source.TowardsSource).Contract(strain);
            e[i] = de.TransverseTraceless(source.TowardsSource).Contract(strain);
        }
    }

    /// <summary>The Kepler quadrupole tensor of the orbit in <paramref name="state"/>, in units of 2A.</summary>
    internal static SymmetricTensor Strain(KludgeSource source, ReadOnlySpan<double> state)
    {
        var (node, ahead) = source.Orientation.PlaneAxes(state[KludgeOrbitEquations.Precession]);
        var (sg, cg) = Math.SinCos(state[KludgeOrbitEquations.Pericentre]);
        return KeplerQuadrupole.ScaledSecondDerivative(
            state[KludgeOrbitEquations.Phase], state[KludgeOrbitEquations.Eccentricity], cg * node + sg * ahead, -sg * node + cg * ahead);
    }

    /// <summary>One-sided A and E spectra (bins 0 … N/2, continuous-transform convention of
    /// <see cref="FourierTransform"/>) including the TDI transfer factor. T is identically zero in this model.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The parameters are invalid.</exception>
    public (Complex[] A, Complex[] E) Spectra(in ExtremeMassRatioInspiralParameters parameters)
    {
        var a = new double[SampleCount];
        var e = new double[SampleCount];
        StrainProjections(parameters, a, e);
        var spectrumA = new Complex[FourierTransform.OneSidedLength(SampleCount)];
        var spectrumE = new Complex[spectrumA.Length];
        FourierTransform.Forward(a, CadenceSeconds, spectrumA);
        FourierTransform.Forward(e, CadenceSeconds, spectrumE);
        double df = FrequencyResolutionHz;
        for (int k = 0; k < spectrumA.Length; k++)
        {
            var transfer = _response.Transfer(k * df);
            spectrumA[k] *= transfer;
            spectrumE[k] *= transfer;
        }
        return (spectrumA, spectrumE);
    }
}
