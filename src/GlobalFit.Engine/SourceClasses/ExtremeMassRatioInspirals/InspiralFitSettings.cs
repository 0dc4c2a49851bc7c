using System.Collections.Immutable;
using GlobalFit.Physics.ExtremeMassRatioInspirals;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>One inspiral the fit is asked to follow: its id and the row it starts from (a catalogue row, or the
/// candidate of an earlier search).</summary>
/// <param name="Id">Label; the worker id is <c>extreme_mass_ratio_inspirals/</c> + this.</param>
/// <param name="Start">The starting parameters.</param>
public sealed record InspiralStart(string Id, ExtremeMassRatioInspiralParameters Start);

/// <summary>The checked <c>[extreme_mass_ratio_inspirals]</c> section of a run configuration.</summary>
/// <param name="Starts">The inspirals given by start rows, one worker each.</param>
/// <param name="StepsPerUpdate">Sampler steps per worker update (<c>steps_per_update</c>).</param>
/// <param name="Temperatures">Rungs of the temperature ladder (<c>temperatures</c>).</param>
/// <param name="MaxTemperature">Temperature of the hottest rung (<c>max_temperature</c>).</param>
/// <param name="MarginBins">Bins added on each side of the start's template to form the worker's window
/// (<c>margin_bins</c>).</param>
/// <param name="SearchEvaluations">Semi-coherent statistic evaluations of the start search (<c>search_evaluations</c>;
/// 0 starts the chains at the row as given).</param>
/// <param name="SearchSegments">Segments of the semi-coherent statistic (<c>search_segments</c>).</param>
/// <param name="SearchStepSigma">Largest step of the search, in posterior widths at the start (<c>search_step_sigma</c>).</param>
/// <param name="BoxSigma">Half-width of the sampled box around the start, in posterior widths (<c>box_sigma</c>).</param>
/// <param name="FisherRefreshSteps">Steps between recomputations of the Fisher matrix at each chain's point
/// (<c>fisher_refresh_steps</c>; 0 keeps the first).</param>
/// <param name="BlindWorkers">Workers with no start row, which search their residual blind (<c>count</c> minus the
/// start rows).</param>
/// <param name="Box">Where the blind workers search (the <c>search_…_min</c>/<c>_max</c> keys); null for the whole
/// prior.</param>
/// <param name="Blind">How much each blind search spends (<c>search_draws</c>, <c>search_chains</c>,
/// <c>search_chain_steps</c>, <c>search_blind_segments</c>); null for the defaults.</param>
/// <param name="SearchUpdates">Updates during which a blind worker that has found nothing searches its new residual
/// again (<c>search_updates</c>).</param>
/// <param name="DetectionSignificance">Significance the blind search's candidate must reach to become a source
/// (<c>detection_significance</c>; <see cref="InspiralBlindSearchResult.Significance"/>).</param>
public sealed record InspiralFitSettings(
    ImmutableArray<InspiralStart> Starts,
    int StepsPerUpdate = 100,
    int Temperatures = 4,
    double MaxTemperature = 30,
    int MarginBins = 32,
    int SearchEvaluations = 300,
    int SearchSegments = 8,
    double SearchStepSigma = 10,
    double BoxSigma = 1e4,
    int FisherRefreshSteps = 500,
    int BlindWorkers = 0,
    InspiralSearchBox? Box = null,
    InspiralBlindSearchSettings? Blind = null,
    int SearchUpdates = 2,
    double DetectionSignificance = InspiralFitSettings.DefaultDetectionSignificance)
{
    /// <summary>Default of <c>detection_significance</c>.</summary>
    public const double DefaultDetectionSignificance = 12;
}
