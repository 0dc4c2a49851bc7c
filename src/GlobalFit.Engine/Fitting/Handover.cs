namespace GlobalFit.Engine.Fitting;

/// <summary>A source leaving one worker for another of the same class between stages (e.g. a source whose
/// frequency drifted into the neighbouring band).</summary>
/// <param name="TargetWorkerId">The worker that should take it.</param>
/// <param name="Payload">Class-specific bytes only the target's class reads.</param>
public sealed record Handover(string TargetWorkerId, byte[] Payload);
