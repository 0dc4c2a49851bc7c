using System.Numerics;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>A, E, T of a massive black-hole binary over a frequency grid: IMRPhenomD (2,2) mode times the constellation's
/// frequency-domain response.</summary>
/// <remarks>
/// <para><c>c̃(f) = T_c(f) a(f) e^{−iΨ(f)}</c> with the waveform of <see cref="PhenomDWaveform"/> and the transfer functions of
/// <see cref="MassiveBlackHoleBinaryResponse"/> evaluated at the emission time t(f). Frequencies emitted before
/// <see cref="EarliestTimeS"/> (the data's start, when given) are set to zero, since the data cannot contain them; frequencies above
/// the model's cut-off <c>0.2/M</c> are zero.</para>
/// <para>Holds scratch buffers of <see cref="Capacity"/> frequencies, so one instance serves one thread at a time
/// (use <see cref="WithOwnBuffers"/> for another thread). No allocation after construction.</para>
/// </remarks>
public sealed class MassiveBlackHoleBinaryTemplateGenerator
{
    private readonly double[] _frequencies;
    private readonly double[] _amplitude;
    private readonly double[] _phase;
    private readonly double[] _time;
    private readonly Complex[] _transferA;
    private readonly Complex[] _transferE;
    private readonly Complex[] _transferT;

    /// <summary>Creates a generator.</summary>
    /// <param name="orbits">The constellation.</param>
    /// <param name="capacity">Largest number of frequencies rendered at once.</param>
    /// <param name="earliestTimeS">Start of the data: frequencies emitted earlier are set to zero (default: none).</param>
    /// <exception cref="ArgumentOutOfRangeException">The capacity is not positive or the earliest time is NaN.</exception>
    public MassiveBlackHoleBinaryTemplateGenerator(IConstellationOrbits orbits, int capacity, double earliestTimeS = double.NegativeInfinity)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        if (capacity <= 0)
            throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "capacity must be positive");
        if (double.IsNaN(earliestTimeS))
            throw new ArgumentOutOfRangeException(nameof(earliestTimeS), earliestTimeS, "earliest time must not be NaN");
        Response = new MassiveBlackHoleBinaryResponse(orbits);
        Capacity = capacity;
        EarliestTimeS = earliestTimeS;
        _frequencies = new double[capacity];
        _amplitude = new double[capacity];
        _phase = new double[capacity];
        _time = new double[capacity];
        _transferA = new Complex[capacity];
        _transferE = new Complex[capacity];
        _transferT = new Complex[capacity];
    }

    /// <summary>The response model.</summary>
    public MassiveBlackHoleBinaryResponse Response { get; }

    /// <summary>Largest number of frequencies rendered at once.</summary>
    public int Capacity { get; }

    /// <summary>Frequencies emitted before this time are set to zero.</summary>
    /// <value>s.</value>
    public double EarliestTimeS { get; }

    /// <summary>A generator with the same settings and its own buffers (for another thread).</summary>
    public MassiveBlackHoleBinaryTemplateGenerator WithOwnBuffers() => new(Response.Orbits, Capacity, EarliestTimeS);

    /// <summary>Writes A, E and T (T may be empty) at the positive <paramref name="frequenciesHz"/> into the caller's spans.</summary>
    /// <exception cref="ArgumentException">Lengths differ or exceed <see cref="Capacity"/>.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of the waveform's range or a frequency is not positive.</exception>
    public void Render(in MassiveBlackHoleBinaryParameters source, ReadOnlySpan<double> frequenciesHz, Span<Complex> a, Span<Complex> e, Span<Complex> t) =>
        RenderCore(source, frequenciesHz, a, e, t, accumulate: false);

    /// <summary>Adds A, E and T (T may be empty) on the uniform bins of <paramref name="window"/> into the caller's spans (bin k at
    /// <c>k Δf</c>; bin 0 receives nothing): the form the engine's residual bookkeeping uses.</summary>
    /// <exception cref="ArgumentException">Lengths differ from the window's count or exceed <see cref="Capacity"/>.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The spacing is not positive or a parameter is out of range.</exception>
    public void AddResponse(in MassiveBlackHoleBinaryParameters source, BinWindow window, double dfHz, Span<Complex> a, Span<Complex> e, Span<Complex> t) =>
        RenderBinsCore(source, window, dfHz, a, e, t, accumulate: true);

    private void RenderCore(in MassiveBlackHoleBinaryParameters source, ReadOnlySpan<double> frequenciesHz, Span<Complex> a, Span<Complex> e, Span<Complex> t, bool accumulate)
    {
        int n = frequenciesHz.Length;
        if (n > Capacity)
            throw new ArgumentException($"{n} frequencies exceed the capacity {Capacity}", nameof(frequenciesHz));
        if (a.Length != n || e.Length != n || (t.Length != n && !t.IsEmpty))
            throw new ArgumentException("output spans must match the frequency count (T may be empty)");
        var waveform = Waveform(source);
        var amplitude = _amplitude.AsSpan(0, n);
        var phase = _phase.AsSpan(0, n);
        var time = _time.AsSpan(0, n);
        waveform.Evaluate(frequenciesHz, amplitude, phase, time);
        var transferA = _transferA.AsSpan(0, n);
        var transferE = _transferE.AsSpan(0, n);
        var transferT = t.IsEmpty ? Span<Complex>.Empty : _transferT.AsSpan(0, n);
        Response.Transfer(frequenciesHz, time, new SkyPosition(source.EclipticLatitudeRad, source.EclipticLongitudeRad),
            source.PolarisationRad, source.InclinationRad, source.ReferencePhaseRad, transferA, transferE, transferT);
        for (int i = 0; i < n; i++)
        {
            Complex h = amplitude[i] == 0.0 || time[i] < EarliestTimeS
                ? Complex.Zero
                : Complex.FromPolarCoordinates(amplitude[i], -phase[i]);
            if (accumulate)
            {
                a[i] += transferA[i] * h;
                e[i] += transferE[i] * h;
                if (!t.IsEmpty) t[i] += transferT[i] * h;
            }
            else
            {
                a[i] = transferA[i] * h;
                e[i] = transferE[i] * h;
                if (!t.IsEmpty) t[i] = transferT[i] * h;
            }
        }
    }

    /// <summary>Writes A, E and T (T may be empty) on the uniform bins of <paramref name="window"/> (bin k at <c>k Δf</c>).
    /// Bin 0 (zero frequency) is set to zero.</summary>
    /// <exception cref="ArgumentException">Lengths differ from the window's count or exceed <see cref="Capacity"/>.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The spacing is not positive or a parameter is out of range.</exception>
    public void RenderBins(in MassiveBlackHoleBinaryParameters source, BinWindow window, double dfHz, Span<Complex> a, Span<Complex> e, Span<Complex> t) =>
        RenderBinsCore(source, window, dfHz, a, e, t, accumulate: false);

    private void RenderBinsCore(in MassiveBlackHoleBinaryParameters source, BinWindow window, double dfHz, Span<Complex> a, Span<Complex> e, Span<Complex> t, bool accumulate)
    {
        if (!(dfHz > 0) || !double.IsFinite(dfHz))
            throw new ArgumentOutOfRangeException(nameof(dfHz), dfHz, "bin spacing must be positive and finite");
        int skip = window.First == 0 ? 1 : 0;
        int n = window.Count - skip;
        if (n > Capacity)
            throw new ArgumentException($"{n} bins exceed the capacity {Capacity}", nameof(window));
        if (a.Length != window.Count || e.Length != window.Count || (t.Length != window.Count && !t.IsEmpty))
            throw new ArgumentException("output spans must match the window (T may be empty)");
        var frequencies = _frequencies.AsSpan(0, n);
        for (int i = 0; i < n; i++) frequencies[i] = (window.First + skip + i) * dfHz;
        if (skip == 1 && !accumulate)
        {
            a[0] = e[0] = Complex.Zero;
            if (!t.IsEmpty) t[0] = Complex.Zero;
        }
        RenderCore(source, frequencies, a[skip..], e[skip..], t.IsEmpty ? t : t[skip..], accumulate);
    }

    /// <summary>The waveform of <paramref name="source"/> (total mass from chirp mass and mass ratio).</summary>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of the waveform's range.</exception>
    public static PhenomDWaveform Waveform(in MassiveBlackHoleBinaryParameters source) =>
        new(BinaryMasses.TotalMass(source.ChirpMassMsun, source.MassRatio), source.MassRatio, source.Spin1, source.Spin2,
            source.DistanceMpc, source.CoalescenceTimeS);
}
