namespace GlobalFit.Engine.Simulation;

/// <summary>Every source class the simulator knows, by class id.</summary>
public static class SimulatedSourceClasses
{
    /// <summary>The registered classes.</summary>
    public static IReadOnlyList<ISimulatedSourceClass> All { get; } =
    [
        new GalacticBinarySimulation(),
    ];

    /// <summary>The class with id <paramref name="classId"/>, or null.</summary>
    public static ISimulatedSourceClass? Find(string classId) => All.FirstOrDefault(c => c.ClassId == classId);
}
