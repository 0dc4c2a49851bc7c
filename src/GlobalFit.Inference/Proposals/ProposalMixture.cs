using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Proposals;

/// <summary>The proposals of one chain slot, their selection weights and their acceptance counters.</summary>
internal sealed class ProposalMixture
{
    private readonly IProposal[] _proposals;
    private readonly IAdaptiveProposal?[] _adaptive;
    private readonly double[] _weights;

    public ProposalMixture(IReadOnlyList<ProposalSpec> specs, ProposalContext context, ulong runSeed, ulong streamId, ulong chainIndex)
    {
        _proposals = new IProposal[specs.Count];
        _adaptive = new IAdaptiveProposal?[specs.Count];
        _weights = new double[specs.Count];
        for (int j = 0; j < specs.Count; j++)
        {
            // Each factory gets its own initialisation stream so that adding a proposal to the mixture does
            // not shift the draws of the others.
            ReadOnlySpan<ulong> path = [streamId, chainIndex, 0x5052_4F50UL, (ulong)j];
            IProposal proposal = specs[j].Create(context with { Random = RandomStream.ForPath(runSeed, path) })
                ?? throw new InvalidOperationException($"Proposal factory '{specs[j].Name}' returned null.");
            _proposals[j] = proposal;
            _adaptive[j] = proposal as IAdaptiveProposal;
            _weights[j] = specs[j].Weight;
        }

        Proposed = new long[specs.Count];
        Accepted = new long[specs.Count];
    }

    public int Count => _proposals.Length;

    public long[] Proposed { get; }

    public long[] Accepted { get; }

    public int Choose(ref RandomStream random) => _proposals.Length == 1 ? 0 : random.NextCategorical(_weights);

    public double Propose(int index, ReadOnlySpan<double> current, Span<double> candidate, ref RandomStream random)
    {
        Proposed[index]++;
        return _proposals[index].Propose(current, candidate, ref random);
    }

    public void RecordAcceptance(int index) => Accepted[index]++;

    public void Observe(ReadOnlySpan<double> position)
    {
        foreach (IAdaptiveProposal? adaptive in _adaptive)
        {
            adaptive?.Observe(position);
        }
    }

    public ProposalState?[] CaptureStates()
    {
        var states = new ProposalState?[_proposals.Length];
        for (int j = 0; j < _proposals.Length; j++)
        {
            states[j] = (_proposals[j] as IStatefulProposal)?.CaptureState();
        }

        return states;
    }

    public void RestoreStates(ProposalState?[] states, ReadOnlySpan<long> proposed, ReadOnlySpan<long> accepted)
    {
        if (states.Length != _proposals.Length)
        {
            throw new ArgumentException("Saved proposal states do not match the configured mixture.", nameof(states));
        }

        for (int j = 0; j < _proposals.Length; j++)
        {
            if (_proposals[j] is IStatefulProposal stateful)
            {
                stateful.RestoreState(states[j] ?? throw new ArgumentException($"Missing state for proposal {j}.", nameof(states)));
            }
        }

        proposed.CopyTo(Proposed);
        accepted.CopyTo(Accepted);
    }
}
