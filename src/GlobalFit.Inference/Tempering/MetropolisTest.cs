using GlobalFit.Inference.Random;

namespace GlobalFit.Inference.Tempering;

/// <summary>The Metropolis accept/reject decision in log space.</summary>
internal static class MetropolisTest
{
    /// <summary>Accepts with probability min(1, exp(<paramref name="logAcceptance"/>)); NaN is rejected.</summary>
    /// <remarks>A uniform is drawn only when the acceptance is below one, so certain acceptances cost no
    /// random numbers; the rule is part of the documented stream layout and must not change between
    /// versions that share checkpoints.</remarks>
    public static bool Accepts(double logAcceptance, ref RandomStream random)
    {
        if (logAcceptance >= 0.0)
        {
            return true;
        }

        return logAcceptance > double.NegativeInfinity && random.NextLogUniform() < logAcceptance;
    }
}
