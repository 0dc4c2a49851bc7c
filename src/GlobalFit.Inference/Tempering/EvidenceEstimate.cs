namespace GlobalFit.Inference.Tempering;

/// <summary>A thermodynamic-integration evidence estimate.</summary>
/// <param name="LogEvidence">ln Z (natural log).</param>
/// <param name="QuadratureError">Estimated discretisation error of <paramref name="LogEvidence"/>, in nats.</param>
public readonly record struct EvidenceEstimate(double LogEvidence, double QuadratureError);
