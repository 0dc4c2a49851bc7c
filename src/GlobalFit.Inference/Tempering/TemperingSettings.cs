namespace GlobalFit.Inference.Tempering;

/// <summary>Settings of the temperature ladder shared by the fixed-dimension and reversible-jump samplers.</summary>
/// <remarks>Defaults: a single cold chain (no tempering). The ladder starts geometric between T = 1 and
/// <see cref="MaxTemperature"/>.</remarks>
public sealed record TemperingSettings
{
    /// <summary>Number of rungs, ≥ 1. Rung 0 is the cold chain (β = 1).</summary>
    public int TemperatureCount { get; init; } = 1;

    /// <summary>Independent chains per rung, ≥ 1; each cold replica contributes samples.</summary>
    public int ChainsPerTemperature { get; init; } = 1;

    /// <summary>Temperature of the hottest rung, &gt; 1 when <see cref="TemperatureCount"/> &gt; 1; may be +∞ (β = 0, prior).</summary>
    public double MaxTemperature { get; init; } = 100.0;

    /// <summary>Steps between swap rounds, ≥ 1.</summary>
    public int SwapInterval { get; init; } = 1;

    /// <summary>Whether the intermediate rungs adapt to equalise swap rates (Vousden, Farr &amp; Mandel 2016).</summary>
    public bool AdaptLadder { get; init; } = true;

    /// <summary>Swap rounds during which the ladder adapts, ≥ 0; freeze it before estimating evidence.</summary>
    public long LadderAdaptationRounds { get; init; } = long.MaxValue;

    /// <summary>Lag t₀ of the hyperbolic decay κ(t) = t₀ / (ν (t + t₀)), &gt; 0 (ptemcee default 10⁴).</summary>
    public double AdaptationLag { get; init; } = 10_000.0;

    /// <summary>Time scale ν of κ(t), &gt; 0 (ptemcee default 100).</summary>
    public double AdaptationTime { get; init; } = 100.0;

    /// <summary>Throws <see cref="ArgumentException"/> naming the first invalid field.</summary>
    /// <exception cref="ArgumentException">A field is out of range.</exception>
    public void Validate()
    {
        if (TemperatureCount < 1)
        {
            throw new ArgumentException("TemperatureCount must be at least 1.", nameof(TemperatureCount));
        }

        if (ChainsPerTemperature < 1)
        {
            throw new ArgumentException("ChainsPerTemperature must be at least 1.", nameof(ChainsPerTemperature));
        }

        if (double.IsNaN(MaxTemperature) || (TemperatureCount > 1 && !(MaxTemperature > 1.0)))
        {
            throw new ArgumentException("MaxTemperature must exceed 1 when there is more than one temperature.", nameof(MaxTemperature));
        }

        if (SwapInterval < 1)
        {
            throw new ArgumentException("SwapInterval must be at least 1.", nameof(SwapInterval));
        }

        if (LadderAdaptationRounds < 0)
        {
            throw new ArgumentException("LadderAdaptationRounds must be non-negative.", nameof(LadderAdaptationRounds));
        }

        if (!(AdaptationLag > 0.0) || double.IsInfinity(AdaptationLag))
        {
            throw new ArgumentException("AdaptationLag must be positive and finite.", nameof(AdaptationLag));
        }

        if (!(AdaptationTime > 0.0) || double.IsInfinity(AdaptationTime))
        {
            throw new ArgumentException("AdaptationTime must be positive and finite.", nameof(AdaptationTime));
        }
    }
}
