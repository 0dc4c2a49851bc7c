namespace GlobalFit.Engine.Simulation;

/// <summary>How much memory simulating a record takes, checked against what the process may use before anything is
/// allocated, so an oversized scenario is refused with its key rather than ending in an out-of-memory abort.</summary>
public static class SimulationMemory
{
    /// <summary>Peak bytes per sample of the three channels. Measured: <c>simulate</c> of noise-only records at 5 s peaks
    /// at 120 bytes per sample for 120 days and 163 for 480 days (time series, spectra, transform scratch and the write
    /// buffer; the resident set above the 60 MB of an idle process); 200 leaves a margin for the sources' buffers.</summary>
    public const double BytesPerSample = 200;

    /// <summary>Estimated peak bytes to simulate <paramref name="samplesPerChannel"/> samples.</summary>
    public static double EstimatedBytes(double samplesPerChannel) => samplesPerChannel * BytesPerSample;

    /// <summary>The memory this process may use: the container or machine limit the runtime reports.</summary>
    public static long AvailableBytes => GC.GetGCMemoryInfo().TotalAvailableMemoryBytes;
}
