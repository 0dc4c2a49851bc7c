using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The bins of a record that hold a binary's signal: frequencies emitted between the data's start and end,
/// below the waveform's cut-off and the Nyquist frequency.</summary>
/// <remarks>The emission time t(f) of the (2,2) mode rises with f up to the amplitude peak (stationary phase), so the
/// frequencies at the start and at the end of the data are found by bisection below the peak. A binary that merges
/// before the data start contributes nothing (its ringdown before the start is not in the data either); one that merges
/// after the end contributes its inspiral up to the frequency reached at the end. Cutting sharply in frequency at the
/// ends of the record is the frequency-domain form of a rectangular window; the ringdown that outlasts the record by a
/// few <c>M</c> when t_c lies just before the end is kept whole.</remarks>
public static class MassiveBlackHoleBinaryBand
{
    /// <summary>The window of one-sided bins (spacing <paramref name="dfHz"/>, <paramref name="binCount"/> bins from 0)
    /// whose frequencies are emitted between <paramref name="startS"/> and <paramref name="endS"/>; empty (count 0) when none are.</summary>
    public static BinWindow InData(in MassiveBlackHoleBinaryParameters source, double dfHz, int binCount, double startS, double endS)
    {
        var waveform = MassiveBlackHoleBinaryTemplateGenerator.Waveform(source);
        double fLow = dfHz, fPeak = waveform.PeakFrequencyHz;
        double fHigh = Math.Min(waveform.MaximumFrequencyHz, (binCount - 1) * dfHz);
        if (fPeak <= fLow || fHigh < fLow) return new BinWindow(1, 0);
        if (EmissionTime(waveform, fPeak) < startS) return new BinWindow(1, 0);
        if (EmissionTime(waveform, fLow) < startS) fLow = Bisect(waveform, fLow, fPeak, startS);
        if (EmissionTime(waveform, fLow) > endS) return new BinWindow(1, 0);
        if (EmissionTime(waveform, fPeak) > endS) fHigh = Math.Min(fHigh, Bisect(waveform, fLow, fPeak, endS));
        int first = Math.Max(1, (int)Math.Ceiling(fLow / dfHz));
        int last = Math.Min(binCount - 1, (int)Math.Floor(fHigh / dfHz));
        return last < first ? new BinWindow(1, 0) : new BinWindow(first, last - first + 1);
    }

    private static double EmissionTime(in PhenomDWaveform waveform, double fHz)
    {
        Span<double> f = [fHz];
        Span<double> amplitude = [0.0], phase = [0.0], time = [0.0];
        waveform.Evaluate(f, amplitude, phase, time);
        return time[0];
    }

    // t(lo) < target ≤ t(hi); 200 halvings reach double precision from any bracket.
    private static double Bisect(in PhenomDWaveform waveform, double lo, double hi, double targetS)
    {
        for (int i = 0; i < 200 && hi - lo > 1e-12 * hi; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (EmissionTime(waveform, mid) < targetS) lo = mid; else hi = mid;
        }
        return hi;
    }
}
