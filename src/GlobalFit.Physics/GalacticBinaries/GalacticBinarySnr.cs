using GlobalFit.Physics.Noise;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>Optimal signal-to-noise ratio of a galactic binary in A and E (and optionally T).</summary>
/// <remarks><c>ρ² = Σ_channels 4Δf Σ_k |h̃_k|²/S(f_k)</c> (the inner product of Cutler &amp; Flanagan 1994, discretised) over the template's
/// bins, with the PSDs of an <see cref="AetNoiseModel"/> at the bin frequencies. Uses the generator's scratch buffers,
/// so it shares the generator's thread rules.</remarks>
public static class GalacticBinarySnr
{
    /// <summary>The optimal SNR ρ of <paramref name="source"/>.</summary>
    /// <param name="generator">Template generator for the record.</param>
    /// <param name="source">The source.</param>
    /// <param name="noise">Noise model giving S_A, S_E, S_T.</param>
    /// <param name="includeT">Whether channel T counts.</param>
    /// <exception cref="ArgumentOutOfRangeException">f0 is not in (0, Nyquist).</exception>
    public static double Optimal(GalacticBinaryTemplateGenerator generator, in GalacticBinaryParameters source, AetNoiseModel noise, bool includeT = true)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(noise);
        var view = generator.Render(source, includeT);
        double df = generator.FrequencyResolutionHz, sum = 0;
        for (int j = 0; j < view.Count; j++)
        {
            int bin = view.FirstBin + j;
            if (bin <= 0 || bin >= generator.OneSidedBinCount) continue;
            double f = bin * df;
            sum += (view.A[j].Real * view.A[j].Real + view.A[j].Imaginary * view.A[j].Imaginary) / noise.Psd(AetChannel.A, f);
            sum += (view.E[j].Real * view.E[j].Real + view.E[j].Imaginary * view.E[j].Imaginary) / noise.Psd(AetChannel.E, f);
            if (includeT)
                sum += (view.T[j].Real * view.T[j].Real + view.T[j].Imaginary * view.T[j].Imaginary) / noise.Psd(AetChannel.T, f);
        }
        return Math.Sqrt(4.0 * df * sum);
    }
}
