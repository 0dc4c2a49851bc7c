using System.Numerics;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>The data a fit runs on, as one-sided A/E/T spectra in the continuous-transform convention (the same
/// convention the templates are built in), plus the record's shape.</summary>
/// <remarks>Samples inside gaps are set to zero before the transform. No taper is applied at gap edges and the noise
/// model does not account for the lost time, so a record with long gaps is fitted with a slightly biased noise level;
/// <see cref="GapSeconds"/> lets the caller warn about it.</remarks>
public sealed class FitData
{
    private FitData(FitDataShape shape, Complex[] a, Complex[] e, Complex[] t, double gapSeconds)
    {
        Shape = shape;
        A = a;
        E = e;
        T = t;
        GapSeconds = gapSeconds;
    }

    /// <summary>The record's shape.</summary>
    public FitDataShape Shape { get; }

    /// <summary>Channel A, bins 0 … N/2.</summary>
    public Complex[] A { get; }

    /// <summary>Channel E.</summary>
    public Complex[] E { get; }

    /// <summary>Channel T.</summary>
    public Complex[] T { get; }

    /// <summary>Total time in gaps (zero-filled).</summary>
    public double GapSeconds { get; }

    /// <summary>Wraps spectra that are already transformed (simulations made in the frequency domain, benchmarks).</summary>
    /// <param name="shape">The record's shape; each array holds its <see cref="FitDataShape.BinCount"/> bins.</param>
    /// <param name="a">Channel A.</param>
    /// <param name="e">Channel E.</param>
    /// <param name="t">Channel T.</param>
    public static FitData FromSpectra(FitDataShape shape, Complex[] a, Complex[] e, Complex[] t) => new(shape, a, e, t, 0.0);

    /// <summary>Transforms an observation.</summary>
    /// <param name="observation">The observation.</param>
    /// <param name="sourceName">Its file, for messages.</param>
    public static FitData FromObservation(Observation observation, string sourceName)
    {
        ArgumentNullException.ThrowIfNull(observation);
        var data = observation.Data;
        var shape = new FitDataShape(sourceName, data.Count, data.DtSeconds, data.T0Seconds);
        var observed = new bool[data.Count];
        observation.Gaps.FillObservedMask(data.T0Seconds, data.DtSeconds, observed);
        var channels = new Complex[3][];
        var samples = new double[data.Count];
        for (int c = 0; c < 3; c++)
        {
            var series = data.Channels[c];
            for (int i = 0; i < samples.Length; i++) samples[i] = observed[i] ? series.Samples[i] : 0.0;
            channels[c] = new Complex[shape.BinCount];
            FourierTransform.Forward(samples, data.DtSeconds, channels[c]);
        }
        return new FitData(shape, channels[0], channels[1], channels[2], observation.Gaps.TotalSeconds);
    }
}
