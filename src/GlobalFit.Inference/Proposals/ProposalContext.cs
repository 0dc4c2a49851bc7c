using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;

namespace GlobalFit.Inference.Proposals;

/// <summary>What a proposal factory may see when it builds the proposal for one chain slot.</summary>
/// <param name="Schema">The schema of the vectors being proposed.</param>
/// <param name="Prior">The prior over those vectors.</param>
/// <param name="Temperature">The chain slot's live inverse temperature.</param>
/// <param name="Random">A stream reserved for the factory's own initialisation draws (e.g. an initial DE
/// history); it is consumed only during construction.</param>
public sealed record ProposalContext(ParameterSchema Schema, IPriorDensity Prior, ChainTemperature Temperature, RandomStream Random);
