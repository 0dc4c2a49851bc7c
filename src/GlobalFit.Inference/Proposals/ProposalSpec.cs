using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Proposals;

/// <summary>One entry of a proposal mixture: a name for the statistics, a weight and a factory that builds
/// the proposal for each chain slot.</summary>
/// <param name="Name">Name reported in acceptance statistics; unique within a mixture.</param>
/// <param name="Weight">Relative selection weight, ≥ 0.</param>
/// <param name="Create">Builds a fresh proposal for one chain slot; called once per slot at construction and resume.</param>
public sealed record ProposalSpec(string Name, double Weight, Func<ProposalContext, IProposal> Create)
{
    /// <summary>Adaptive Gaussian from the chain covariance (Haario, Saksman &amp; Tamminen 2001).</summary>
    /// <param name="weight">Selection weight.</param>
    /// <returns>The entry.</returns>
    public static ProposalSpec AdaptiveGaussian(double weight) =>
        new("adaptive-gaussian", weight, static context => new AdaptiveGaussianProposal(context.Schema));

    /// <summary>Differential evolution from a history buffer (ter Braak 2006; ter Braak &amp; Vrugt 2008).</summary>
    /// <param name="weight">Selection weight.</param>
    /// <returns>The entry.</returns>
    public static ProposalSpec DifferentialEvolution(double weight) =>
        new("differential-evolution", weight, static context => new DifferentialEvolutionProposal(context));

    /// <summary>Independent draws from the prior.</summary>
    /// <param name="weight">Selection weight.</param>
    /// <returns>The entry.</returns>
    public static ProposalSpec PriorDraw(double weight) =>
        new("prior-draw", weight, static context => new PriorDrawProposal(context.Prior));

    /// <summary>Jumps along eigen-directions of the model's Fisher matrix.</summary>
    /// <param name="weight">Selection weight.</param>
    /// <param name="fisher">The model's Fisher information.</param>
    /// <param name="refreshInterval">Observations between recomputations at the current point; 0 = compute once.</param>
    /// <returns>The entry.</returns>
    public static ProposalSpec FisherEigen(double weight, IFisherInformation fisher, int refreshInterval = 0) =>
        new("fisher-eigen", weight, context => new FisherEigenProposal(fisher, context.Temperature, refreshInterval));

    /// <summary>The default mixture: adaptive Gaussian 0.5, differential evolution 0.4, prior draw 0.1.</summary>
    /// <remarks>On the 10-D correlated Gaussian test this gives bulk ESS ≈ 2 700–3 000 from 4 × 30 000 draws.</remarks>
    /// <returns>The entries.</returns>
    public static IReadOnlyList<ProposalSpec> DefaultMixture() =>
        [AdaptiveGaussian(0.5), DifferentialEvolution(0.4), PriorDraw(0.1)];
}
