using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;
using GlobalFit.Engine.SourceClasses.GalacticBinaries;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Engine.SourceClasses.Noise;

namespace GlobalFit.Engine.SourceClasses;

/// <summary>The modules a run may use, in the order their worker groups enter the default schedule. Everything that
/// needs the set of classes (run plans, scenarios, catalogues, bench, demo) reads it from a registry, so adding a class
/// is one line in <see cref="Default"/>, its folder, and its config section.</summary>
/// <param name="Classes">The modules, ids unique.</param>
public sealed record SourceClassRegistry(IReadOnlyList<ISourceClass> Classes)
{
    /// <summary>What this build implements: the one registration list.</summary>
    /// <remarks>The broadband classes come first because the default schedule runs groups in this order: the loud chirps
    /// are then fitted before the galactic-binary band workers first see the residual, rather than the band workers
    /// fitting pieces of a chirp as binaries (measured on the demo: with the binaries first the joint fit stayed in a
    /// mode ~600 lower in ln L, the chirp mass 8 % off).</remarks>
    public static SourceClassRegistry Default { get; } =
        new([new MassiveBlackHoleBinaryClass(), new ExtremeMassRatioInspiralClass(), new GalacticBinaryClass(), new NoiseClass()]);

    /// <summary>The module with id <paramref name="id"/>, or null.</summary>
    public ISourceClass? Find(string id) => Classes.FirstOrDefault(c => c.Id == id);

    /// <summary>The classes the simulator can inject, by id, in registration order.</summary>
    public IReadOnlyList<KeyValuePair<string, ISimulatedSourceClass>> Simulated =>
        [.. Classes.Where(c => c.Simulation is not null).Select(c => new KeyValuePair<string, ISimulatedSourceClass>(c.Id, c.Simulation!))];

    /// <summary>Reads a scenario whose class sections are this registry's.</summary>
    /// <param name="root">The scenario file's root table.</param>
    public SimulationScenario ReadScenario(ConfigTable root) => SimulationScenario.FromConfig(root, Simulated);

    /// <summary>The ids, in order.</summary>
    public IEnumerable<string> Ids => Classes.Select(c => c.Id);
}
