using System.Collections.Immutable;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The analysed frequency range split into windows, one worker each, alternating between two stages.</summary>
/// <remarks>
/// <para>The range [f_min, f_max] is rounded outwards to whole bins and cut into cores of <c>window_bins</c> bins; the
/// last core takes the remainder (so it holds between one and two window widths). Each core is padded by
/// <c>margin_bins</c> on both sides. A source's template spans N bins centred on its carrier bin
/// (<see cref="GalacticBinaryTemplateGenerator.TemplateBins"/>), so padding ≥ N/2 keeps the template of every source the
/// core owns inside the padded window; the spare padding − N/2 bins (at most half a core) become the drift margin of
/// <see cref="GalacticBinaryBandWindow.SourceRange"/>. Cores at least N wide keep the templates of two same-stage
/// windows (two cores apart) from sharing a bin, so a stage's windows are independent given the rest of the fit
/// (the blocked-Gibbs schedule described in DEVELOPERS.md, "Data flow of one iteration").</para>
/// <para>Building the plan and every look-up are linear in the number of windows (look-up by frequency is O(1)).
/// Immutable.</para>
/// </remarks>
public sealed class GalacticBinaryBandPlan
{
    private readonly int _windowBins;

    private GalacticBinaryBandPlan(ImmutableArray<GalacticBinaryBandWindow> windows, int templateBins, double dfHz, int windowBins)
    {
        Windows = windows;
        TemplateBins = templateBins;
        DfHz = dfHz;
        _windowBins = windowBins;
    }

    /// <summary>The windows in frequency order.</summary>
    public ImmutableArray<GalacticBinaryBandWindow> Windows { get; }

    /// <summary>The largest template length N the plan was checked against.</summary>
    public int TemplateBins { get; }

    /// <summary>Bin spacing.</summary>
    /// <value>Hz.</value>
    public double DfHz { get; }

    /// <summary>The windows of stage <paramref name="stage"/> (0 or 1).</summary>
    /// <param name="stage">The stage.</param>
    public IEnumerable<GalacticBinaryBandWindow> Stage(int stage) => Windows.Where(w => w.Stage == stage);

    /// <summary>Index of the window whose core holds <paramref name="frequencyHz"/>, or −1 outside the analysed range.</summary>
    /// <param name="frequencyHz">f0.</param>
    public int WindowOf(double frequencyHz)
    {
        if (!double.IsFinite(frequencyHz) || Windows.IsEmpty) return -1;
        double offset = Math.Floor(frequencyHz / DfHz) - Windows[0].Core.First;
        if (offset < 0 || frequencyHz >= Windows[^1].CoreEndHz) return -1;
        return (int)Math.Min(Windows.Length - 1, offset / _windowBins);
    }

    /// <summary>Splits the range of <paramref name="settings"/> for the record of <paramref name="generator"/>.</summary>
    /// <param name="settings">The settings.</param>
    /// <param name="generator">The record's template generator.</param>
    /// <returns>The plan.</returns>
    /// <exception cref="ArgumentException">A setting is inconsistent with itself or with the record; the parameter name
    /// is the configuration key (<c>f_max_hz</c>, <c>window_bins</c>, <c>margin_bins</c>, …).</exception>
    public static GalacticBinaryBandPlan Create(GalacticBinaryBandSettings settings, GalacticBinaryTemplateGenerator generator)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(generator);
        double df = generator.FrequencyResolutionHz;
        int nyquistBin = generator.OneSidedBinCount - 1;
        if (!(settings.MaxFrequencyHz > settings.MinFrequencyHz))
            throw new ArgumentException($"must exceed f_min_hz ({settings.MinFrequencyHz} Hz), got {settings.MaxFrequencyHz} Hz", "f_max_hz");
        if (!(settings.MaxFrequencyDerivativeHzS > settings.MinFrequencyDerivativeHzS))
            throw new ArgumentException($"must exceed fdot_min_hz_s ({settings.MinFrequencyDerivativeHzS}), got {settings.MaxFrequencyDerivativeHzS}", "fdot_max_hz_s");
        if (!(settings.JumpProbability + settings.SplitMergeProbability <= 1.0))
            throw new ArgumentException($"with jump_probability {settings.JumpProbability} must not exceed {1.0 - settings.JumpProbability}, got {settings.SplitMergeProbability}", "split_merge_probability");
        if (!(settings.SplitMergeBins > 0) || !double.IsFinite(settings.SplitMergeBins))
            throw new ArgumentException($"must be positive, got {settings.SplitMergeBins}", "split_merge_bins");
        if (!(settings.SnrMax > settings.SnrPriorPeak))
            throw new ArgumentException($"must exceed snr_prior_peak ({settings.SnrPriorPeak}), got {settings.SnrMax}", "snr_max");
        if (settings.MaxFrequencyHz >= nyquistBin * df)
            throw new ArgumentException($"must lie below the Nyquist frequency {nyquistBin * df} Hz of the data", "f_max_hz");
        int firstBin = (int)Math.Floor(settings.MinFrequencyHz / df);
        int endBin = (int)Math.Ceiling(settings.MaxFrequencyHz / df);
        if (endBin + settings.MarginBins > nyquistBin)
            throw new ArgumentException($"with {settings.MarginBins} padding bins the last window reaches above the Nyquist frequency {nyquistBin * df} Hz", "f_max_hz");
        if (firstBin - settings.MarginBins < 1)
            throw new ArgumentException($"with {settings.MarginBins} padding bins the first window reaches below the first bin above DC", "f_min_hz");
        int totalBins = endBin - firstBin;
        if (settings.WindowBins > totalBins)
            throw new ArgumentException($"window of {settings.WindowBins} bins is wider than the band's {totalBins} bins", "window_bins");
        int templateBins = Math.Max(
            generator.EnvelopeLength(settings.MaxFrequencyHz, settings.MaxFrequencyDerivativeHzS),
            generator.EnvelopeLength(settings.MaxFrequencyHz, settings.MinFrequencyDerivativeHzS));
        if (settings.MarginBins < templateBins / 2)
            throw new ArgumentException($"{settings.MarginBins} bins cannot hold half a template ({templateBins / 2} of its {templateBins} bins at f_max_hz)", "margin_bins");
        if (settings.WindowBins < templateBins)
            throw new ArgumentException($"{settings.WindowBins} bins is narrower than one template ({templateBins} bins), so windows of one stage would share data", "window_bins");
        int count = totalBins / settings.WindowBins;
        // Drift margin: at most half a core, so a drifted source always lands in the neighbour's core.
        int drift = Math.Min(settings.MarginBins - templateBins / 2, settings.WindowBins / 2);
        var windows = ImmutableArray.CreateBuilder<GalacticBinaryBandWindow>(count);
        for (int i = 0; i < count; i++)
        {
            int first = firstBin + i * settings.WindowBins;
            int end = i == count - 1 ? endBin : first + settings.WindowBins;
            var core = new BinWindow(first, end - first);
            int sourceFirst = i == 0 ? first : first - drift;
            int sourceEnd = i == count - 1 ? end : end + drift;
            windows.Add(new GalacticBinaryBandWindow(i, i % 2, core, new BinWindow(sourceFirst, sourceEnd - sourceFirst),
                new BinWindow(first - settings.MarginBins, end - first + 2 * settings.MarginBins), df));
        }
        return new GalacticBinaryBandPlan(windows.MoveToImmutable(), templateBins, df, settings.WindowBins);
    }
}
