using GlobalFit.Engine.Orchestration;
using GlobalFit.Engine.SourceClasses;

namespace GlobalFit.Engine.Runs;

/// <summary>How to run a fit besides its configuration.</summary>
/// <param name="Progress">Receives progress and warnings.</param>
/// <param name="OtlpEndpoint">OTLP collector to export telemetry to as well, or null (telemetry.jsonl is always written).</param>
/// <param name="Cancellation">Cancelling checkpoints the last complete iteration and stops.</param>
public sealed record FitRunOptions(IFitProgress Progress, Uri? OtlpEndpoint, CancellationToken Cancellation)
{
    /// <summary>The modules the run's configuration may use (<see cref="SourceClassRegistry.Default"/> unless a test
    /// or an embedding program adds its own).</summary>
    public SourceClassRegistry Registry { get; init; } = SourceClassRegistry.Default;

    /// <summary>Resume with a data file other than the one the run was fitted to (<c>--accept-new-data</c>); without it
    /// such a resume is refused.</summary>
    public bool AcceptNewData { get; init; }
}
