using System.Collections.Immutable;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The noise module: one worker that refits the instrument levels and the foreground amplitude on the residual
/// of every source and serves the new PSD to the others (<see cref="WorkerRole.Noise"/>). It runs in every fit, with
/// the defaults when the configuration has no <c>[noise]</c> section; its scenario section is the observation's own
/// noise, so it has no injections.</summary>
public sealed class NoiseClass : ISourceClass
{
    /// <summary>The module id: config section, worker id, schedule group and sample class.</summary>
    public const string Id = "noise";

    /// <inheritdoc />
    string ISourceClass.Id => Id;

    /// <inheritdoc />
    public bool RunsWithoutSection => true;

    /// <summary>Every column a noise sample may hold; a run holds those its settings fit (see
    /// <see cref="NoiseParameterLayout"/>).</summary>
    public ImmutableArray<string> ParameterColumns { get; } = ["acceleration_asd_ae_m_s2_rthz", "oms_asd_ae_m_rthz", "acceleration_asd_t_m_s2_rthz", "oms_asd_t_m_rthz", "foreground_amplitude_relative"];

    /// <inheritdoc />
    public ISimulatedSourceClass? Simulation => null;

    /// <inheritdoc />
    public IReadOnlyList<QuickBenchSuite> BenchSuites { get; } = [new("noise likelihood", NoiseLikelihoodBench.Run)];

    /// <summary>None: the demo's noise section is part of its observation and run configuration.</summary>
    public IDemoPart? Demo => null;

    /// <inheritdoc />
    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape) => new NoiseFitPlan(NoiseFitSettings.FromConfig(section, shape), shape);
}
