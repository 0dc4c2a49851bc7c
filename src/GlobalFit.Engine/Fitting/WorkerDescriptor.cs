using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Fitting;

/// <summary>One worker a source class plans: known before the worker exists, so the schedule and the residual-data
/// actor can be set up first.</summary>
/// <param name="Id">Stable id, unique in the run (<c>class_id/label</c>, or the class id for a single worker).</param>
/// <param name="Bins">Bins it reads (and, for <see cref="WorkerRole.Sources"/>, writes).</param>
/// <param name="Label">Short human description for progress and traces (e.g. a band's edges).</param>
/// <param name="IncludesT">Whether it uses channel T.</param>
/// <param name="Role">Whether it contributes a template or the noise model.</param>
public sealed record WorkerDescriptor(string Id, BinWindow Bins, string Label, bool IncludesT, WorkerRole Role = WorkerRole.Sources);
