namespace GlobalFit.Engine.Fitting;

/// <summary>The shape of the data record a fit runs on: enough for a source class to plan its workers and build its
/// templates without the data themselves (so a worker can be placed on any node).</summary>
/// <param name="SourceName">The data file, for error messages.</param>
/// <param name="SampleCount">Time samples per channel.</param>
/// <param name="CadenceS">Sampling interval Δt.</param>
/// <param name="StartS">Time of the first sample.</param>
public sealed record FitDataShape(string SourceName, int SampleCount, double CadenceS, double StartS)
{
    /// <summary>The foreground fit (years) of the scenario the observation file records it was simulated with, or null
    /// when the file records no scenario or one without a foreground. The noise model's default.</summary>
    public double? ScenarioForegroundFitYears { get; init; }

    /// <summary>Record length N Δt.</summary>
    public double DurationS => SampleCount * CadenceS;

    /// <summary>Bin spacing 1/(N Δt).</summary>
    public double DfHz => 1.0 / DurationS;

    /// <summary>One-sided bins 0 … N/2.</summary>
    public int BinCount => SampleCount / 2 + 1;

    /// <summary>The Nyquist frequency 1/(2Δt).</summary>
    public double NyquistHz => 0.5 / CadenceS;
}
