using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Orchestration;

/// <summary>A worker's answer to an update request.</summary>
/// <param name="Update">Its template, samples, statistics and (noise) PSD.</param>
/// <param name="Handovers">Sources it gave up to other workers (already removed from the template).</param>
/// <param name="State">Its state after the update and the handovers.</param>
public sealed record UpdateResult(WorkerUpdate Update, IReadOnlyList<Handover> Handovers, byte[] State);

/// <summary>A worker's answer to handovers delivered between stages.</summary>
/// <param name="Template">Its template with the adopted sources.</param>
/// <param name="State">Its state after adopting.</param>
public sealed record AdoptionResult(WindowSpectra? Template, byte[] State);
