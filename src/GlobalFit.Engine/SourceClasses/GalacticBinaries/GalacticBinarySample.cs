using System.Collections.Immutable;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>One cold-chain configuration of a band worker: the sources it held after a step.</summary>
/// <param name="Step">Sampler step (1-based, counted over the worker's whole life).</param>
/// <param name="Sources">The sources, in no particular order.</param>
/// <param name="LogLikelihood">ln L of the configuration against the residual of that update.</param>
public sealed record GalacticBinarySample(long Step, ImmutableArray<GalacticBinaryParameters> Sources, double LogLikelihood);
