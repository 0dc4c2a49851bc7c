namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The parts a band update's time is split into (<see cref="BandUpdateClock"/>).</summary>
public enum BandUpdatePhase
{
    /// <summary>Rendering one source's template for the likelihood (the kernel's first half).</summary>
    Template,

    /// <summary>The band inner products of a newly rendered template with the data and itself (the kernel's second half).</summary>
    Likelihood,

    /// <summary>The rest of a log-likelihood evaluation: looking up cached templates and summing their terms.</summary>
    LikelihoodAssembly,

    /// <summary>The overlaps of pairs of templates in a configuration.</summary>
    PairTerms,

    /// <summary>Fisher matrices of one source, for the proposals that need them (16 templates each).</summary>
    Fisher,

    /// <summary>F-statistic evaluations of births, deaths and birth-density jumps.</summary>
    BirthDensity,

    /// <summary>Everything else in the sampler's steps: choosing moves, proposals' own arithmetic, priors, swaps.</summary>
    Proposals,

    /// <summary>Handing cold configurations to the sample collector.</summary>
    SampleCollection,

    /// <summary>Setup: the SNR scale, the model, the sampler settings and the sampler itself.</summary>
    ModelSetup,

    /// <summary>Setup: the F-statistic map of the residual over the core.</summary>
    FStatisticMap,

    /// <summary>Setup: the birth density and the Fisher information.</summary>
    ProposalSetup,

    /// <summary>Setup of a new worker: the greedy F-statistic search for its starting sources.</summary>
    GreedySearch,

    /// <summary>Setup: re-scoring every chain against the new residual.</summary>
    Rescoring,

    /// <summary>Copying the sampler's state out at the end of the update.</summary>
    StateCapture,

    /// <summary>Rendering the cold chain's summed template returned with the update.</summary>
    OutputTemplate,
}
