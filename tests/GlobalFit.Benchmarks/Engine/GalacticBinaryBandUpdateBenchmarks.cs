using BenchmarkDotNet.Attributes;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Benchmarks.Engine;

/// <summary>One steady-state band-window update (a worker past its first update, restored from its state each time):
/// a month at 5 s with the demo's settings (200 steps, 4 temperatures, 40 invented binaries per window) and a Julian
/// year at 5 s with those of <c>configs/fit-year-multiday.toml</c> (500 steps, 6 temperatures, 320 binaries per window),
/// both on <see cref="GalacticBinaryBandSlice"/> data. Each update takes a second or more, so few iterations are run.</summary>
[MemoryDiagnoser]
[SimpleJob(launchCount: 1, warmupCount: 1, iterationCount: 3, invocationCount: 1)]
public class GalacticBinaryBandUpdateBenchmarks
{
    private GalacticBinaryBandSlice _slice = null!;
    private GalacticBinaryBandWorker _worker = null!;
    private GalacticBinaryBand _residual = null!;
    private int _steps;

    /// <summary>The record: month or year.</summary>
    [Params("month", "year")]
    public string Record { get; set; } = "month";

    /// <summary>Builds two windows and runs their first update (greedy search included) so that the timed update is a
    /// steady-state one.</summary>
    [GlobalSetup]
    public void Setup()
    {
        if (Record == "year")
        {
            _slice = new GalacticBinaryBandSlice(GalacticBinaryYearProjection.YearSettings, 365.25, 5.0, 2, 320, 2027);
            _steps = 500;
        }
        else
        {
            var month = new GalacticBinaryBandSettings
            {
                MinFrequencyHz = 2.4e-3, MaxFrequencyHz = 3e-3, WindowBins = 256, MarginBins = 64, MaxSourcesPerWindow = 15,
                StepsPerUpdate = 200, TemperatureCount = 4,
            };
            _slice = new GalacticBinaryBandSlice(month, 30, 5.0, 2, 40, 2027);
            _steps = 200;
        }
        _slice.Run(1, _steps, 1);
    }

    /// <summary>A fresh copy of window 0's worker before each update.</summary>
    [IterationSetup]
    public void Copy()
    {
        _worker = _slice.CopyOfWorker(0);
        _residual = _slice.ResidualOf(0);
    }

    /// <summary>One update of window 0.</summary>
    [Benchmark]
    public GalacticBinaryBandUpdate Update() => _worker.Update(_residual, _steps);
}
