using System.Numerics;
using GlobalFit.Engine.Configuration;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Noise;

namespace GlobalFit.Engine.Simulation;

/// <summary>A source class as the simulator sees it: it reads its own scenario section and injects its sources.
/// The simulator never switches on the class; the class's module (<see cref="SourceClasses.ISourceClass"/>) gives it.</summary>
public interface ISimulatedSourceClass
{
    /// <summary>Reads and validates the class's scenario section against the observation it will be injected into.</summary>
    /// <exception cref="Physics.Files.InvalidInputException">A key is unknown, missing or invalid.</exception>
    ISourceInjection ReadScenario(ConfigTable section, ObservationSettings observation);
}

/// <summary>The resolved sources of one class in a scenario.</summary>
public interface ISourceInjection
{
    /// <summary>The class id.</summary>
    string ClassId { get; }

    /// <summary>The section as TOML with every default written out, without the section header.</summary>
    string ToToml();

    /// <summary>Adds the sources' A, E, T spectra (continuous convention, one-sided, full length) and returns their
    /// truth table including each source's optimal SNR against <see cref="InjectionContext.Noise"/>.</summary>
    TruthTable Inject(InjectionContext context, Complex[] a, Complex[] e, Complex[] t);
}

/// <summary>What an injection needs to know about the simulation.</summary>
/// <param name="Observation">The time axis.</param>
/// <param name="Noise">The noise model, for optimal SNRs.</param>
/// <param name="Seed">The scenario seed; each class derives its own streams from it.</param>
public sealed record InjectionContext(ObservationSettings Observation, AetNoiseModel Noise, ulong Seed);
