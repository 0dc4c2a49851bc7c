using GlobalFit.Physics.Files;
using OpenTelemetry;
using OpenTelemetry.Exporter;
using OpenTelemetry.Metrics;
using OpenTelemetry.Resources;
using OpenTelemetry.Trace;

namespace GlobalFit.Engine.Telemetry;

/// <summary>The telemetry of one fit process: spans and metrics of <see cref="FitTelemetry"/> go to
/// <c>RUN/telemetry.jsonl</c> always, and to an OTLP collector (gRPC) when an endpoint is given.</summary>
/// <remarks>
/// <para>An unreachable or silent collector must not stall the fit or its exit: the OTLP exporter's timeout is short and
/// disposing waits at most <see cref="ShutdownTimeoutMilliseconds"/> per provider (measured: a plain dispose blocked
/// for the full exporter timeout against a collector that never answers).</para>
/// <para>Listeners are process-wide: every span of the <c>GlobalFit.Engine</c> source in the process is exported,
/// whichever session is open.</para>
/// </remarks>
public sealed class TelemetrySession : IDisposable
{
    /// <summary>How long the OTLP exporter waits for the collector per export.</summary>
    public const int OtlpTimeoutMilliseconds = 2_000;

    /// <summary>The longest time disposing waits for each provider to flush.</summary>
    public const int ShutdownTimeoutMilliseconds = 3_000;

    /// <summary>How often metric points are written.</summary>
    public const int MetricIntervalMilliseconds = 10_000;

    // Spans reach the file within this delay; short enough that `trace` on a live run is nearly current.
    private const int SpanBatchDelayMilliseconds = 1_000;

    private readonly TracerProvider _tracing;
    private readonly MeterProvider _metrics;
    private readonly TelemetryJsonLines _file;
    private bool _disposed;

    private TelemetrySession(TracerProvider tracing, MeterProvider metrics, TelemetryJsonLines file)
    {
        _tracing = tracing;
        _metrics = metrics;
        _file = file;
    }

    /// <summary>The JSON-lines file.</summary>
    public string TelemetryPath => _file.Path;

    /// <summary>The first failed write to the JSON-lines file (file and cause), or null.</summary>
    public string? WriteFailure => _file.WriteFailure;

    /// <summary>Starts exporting.</summary>
    /// <param name="runFolder">The run folder (must exist); <c>telemetry.jsonl</c> is appended to there.</param>
    /// <param name="otlpEndpoint">An OTLP/gRPC collector, e.g. <c>http://localhost:4317</c>, or null for the file only.</param>
    /// <returns>The session; dispose it to flush and stop.</returns>
    /// <exception cref="InvalidInputException">The run folder does not exist or the file cannot be opened.</exception>
    public static TelemetrySession Start(string runFolder, Uri? otlpEndpoint)
    {
        ArgumentException.ThrowIfNullOrEmpty(runFolder);
        if (!Directory.Exists(runFolder)) throw new InvalidInputException(runFolder, null, "run folder does not exist");
        var file = new TelemetryJsonLines(Path.Combine(runFolder, TelemetryJsonLines.FileName));
        var resource = ResourceBuilder.CreateDefault().AddService("globalfit");

        var tracing = Sdk.CreateTracerProviderBuilder()
            .SetResourceBuilder(resource)
            .AddSource(FitTelemetry.SourceName)
            .AddProcessor(new BatchActivityExportProcessor(new JsonLinesActivityExporter(file), scheduledDelayMilliseconds: SpanBatchDelayMilliseconds));
        var metrics = Sdk.CreateMeterProviderBuilder()
            .SetResourceBuilder(resource)
            .AddMeter(FitTelemetry.SourceName)
            .AddReader(new PeriodicExportingMetricReader(new JsonLinesMetricExporter(file), MetricIntervalMilliseconds)
            {
                TemporalityPreference = MetricReaderTemporalityPreference.Delta,
            });
        if (otlpEndpoint is not null)
        {
            tracing.AddOtlpExporter(o => Configure(o, otlpEndpoint));
            metrics.AddOtlpExporter((o, _) => Configure(o, otlpEndpoint));
        }
        return new TelemetrySession(tracing.Build(), metrics.Build(), file);
    }

    /// <summary>Writes out pending spans and metric points now.</summary>
    /// <returns>True when both finished within the shutdown timeout.</returns>
    public bool Flush() =>
        _tracing.ForceFlush(ShutdownTimeoutMilliseconds) & _metrics.ForceFlush(ShutdownTimeoutMilliseconds);

    /// <summary>Flushes and stops, waiting at most <see cref="ShutdownTimeoutMilliseconds"/> per provider.</summary>
    public void Dispose()
    {
        if (_disposed) return;
        _disposed = true;
        _tracing.Shutdown(ShutdownTimeoutMilliseconds);
        _metrics.Shutdown(ShutdownTimeoutMilliseconds);
        _tracing.Dispose();
        _metrics.Dispose();
        _file.Dispose();
    }

    private static void Configure(OtlpExporterOptions options, Uri endpoint)
    {
        options.Endpoint = endpoint;
        options.Protocol = OtlpExportProtocol.Grpc;
        options.TimeoutMilliseconds = OtlpTimeoutMilliseconds;
    }
}
