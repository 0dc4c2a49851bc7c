using System.Collections.Immutable;
using GlobalFit.Inference.Proposals;

namespace GlobalFit.Inference.Tempering;

/// <summary>Settings of <see cref="ParallelTemperingSampler{TModel}"/>.</summary>
public sealed record ParallelTemperingSettings
{
    /// <summary>The temperature ladder.</summary>
    public TemperingSettings Tempering { get; init; } = new();

    /// <summary>The proposal mixture; weights ≥ 0 with a positive sum, names unique.</summary>
    public ImmutableArray<ProposalSpec> Proposals { get; init; } = [.. ProposalSpec.DefaultMixture()];

    /// <summary>The run seed.</summary>
    public ulong Seed { get; init; }

    /// <summary>This sampler's stream id below the run seed (e.g. the worker id); chains derive (Seed, StreamId, chain).</summary>
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
        ProposalMixtureValidation.Validate(Proposals, nameof(Proposals));
    }
}
