using BenchmarkDotNet.Attributes;
using GlobalFit.Physics.Detector;

namespace GlobalFit.Benchmarks.Detector;

/// <summary>Cost of the brute-force TDI response: one day of data at 5 s cadence (17 280 samples).</summary>
[MemoryDiagnoser]
public class SlowReferenceResponseBenchmarks
{
    private const double CadenceSeconds = 5.0;
    private const int SamplesPerDay = 17_280;

    private readonly MonochromaticBinaryStrain _source = new(
        frequencyHz: 2e-3, frequencyDerivativeHzS: 1e-17, amplitude: 1e-22, inclinationRad: 0.8,
        polarisationRad: 0.6, initialPhaseRad: 0.25, sky: new SkyPosition(0.4, 1.9));

    private readonly RigidOrbits _rigid = new(initialOrbitalPhaseRad: 0.3, initialOrientationRad: 0.7);
    private readonly EccentricOrbits _eccentric = new(initialOrbitalPhaseRad: 0.3);

    /// <summary>Rigid orbits: constant light times.</summary>
    [Benchmark(Baseline = true)]
    public TdiResponse OneDayRigidOrbits() => SlowReferenceResponse.Compute(_source, _rigid, 0.0, CadenceSeconds, SamplesPerDay);

    /// <summary>Flexing orbits: Kepler solves and iterated light times.</summary>
    [Benchmark]
    public TdiResponse OneDayEccentricOrbits() => SlowReferenceResponse.Compute(_source, _eccentric, 0.0, CadenceSeconds, SamplesPerDay);
}
