using System.Collections.Immutable;
using GlobalFit.Inference.Proposals;
using GlobalFit.Inference.Tempering;

namespace GlobalFit.Inference.Transdimensional;

/// <summary>Settings of <see cref="ReversibleJumpSampler{TModel}"/>.</summary>
public sealed record ReversibleJumpSettings
{
    /// <summary>The temperature ladder; swaps exchange whole variable-size states.</summary>
    public TemperingSettings Tempering { get; init; } = new();

    /// <summary>The mixture of within-model proposals, each acting on one randomly chosen source.</summary>
    public ImmutableArray<ProposalSpec> WithinProposals { get; init; } = [.. ProposalSpec.DefaultMixture()];

    /// <summary>Cap on the number of sources in the window, ≥ 0.</summary>
    public int MaxSources { get; init; } = 10;

    /// <summary>Number of sources each chain starts with (drawn from the source prior), 0 ≤ value ≤ <see cref="MaxSources"/>.</summary>
    public int InitialSourceCount { get; init; }

    /// <summary>Probability that a step attempts a birth or death instead of a within-model move, in [0, 1].</summary>
    public double JumpProbability { get; init; } = 0.2;

    /// <summary>Probability that a step attempts a split or merge instead of a within-model move, in [0, 1]; together
    /// with <see cref="JumpProbability"/> at most 1. Default 0: no split/merge moves and no extra random draws, so a run
    /// without them is unchanged.</summary>
    public double SplitMergeProbability { get; init; }

    /// <summary>The split/merge map of the source class; required when <see cref="SplitMergeProbability"/> is positive.</summary>
    public ISourceSplitMerge? SplitMerge { get; init; }

    /// <summary>The run seed.</summary>
    public ulong Seed { get; init; }

    /// <summary>This sampler's stream id below the run seed (e.g. the worker id).</summary>
    public ulong StreamId { get; init; }

    /// <summary>Throws <see cref="ArgumentException"/> naming the first invalid field.</summary>
    /// <exception cref="ArgumentException">A field is out of range.</exception>
    public void Validate()
    {
        if (Tempering is null)
        {
            throw new ArgumentException("Tempering must be set.", nameof(Tempering));
        }

        Tempering.Validate();
        ProposalMixtureValidation.Validate(WithinProposals, nameof(WithinProposals));
        if (MaxSources < 0)
        {
            throw new ArgumentException("MaxSources must be non-negative.", nameof(MaxSources));
        }

        if (InitialSourceCount < 0 || InitialSourceCount > MaxSources)
        {
            throw new ArgumentException("InitialSourceCount must lie in [0, MaxSources].", nameof(InitialSourceCount));
        }

        if (!(JumpProbability >= 0.0 && JumpProbability <= 1.0))
        {
            throw new ArgumentException("JumpProbability must lie in [0, 1].", nameof(JumpProbability));
        }

        if (!(SplitMergeProbability >= 0.0 && JumpProbability + SplitMergeProbability <= 1.0))
        {
            throw new ArgumentException("SplitMergeProbability must be non-negative and at most 1 − JumpProbability.", nameof(SplitMergeProbability));
        }

        if (SplitMergeProbability > 0.0 && SplitMerge is null)
        {
            throw new ArgumentException("SplitMerge must be set when SplitMergeProbability is positive.", nameof(SplitMerge));
        }
    }
}
