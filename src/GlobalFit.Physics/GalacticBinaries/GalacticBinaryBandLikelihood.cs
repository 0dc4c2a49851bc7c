namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The band-limited log-likelihood ratio of one galactic binary against the data of a band.</summary>
/// <remarks>
/// <c>ln Λ = (d|h) − ½ (h|h)</c> (Gaussian-noise likelihood with the inner product of Cutler &amp; Flanagan 1994), summed over A, E (and T when the band has
/// it) on the template's bins inside the band: h vanishes elsewhere, so this is the full band's value up to the
/// constant −½(d|d). Sources within N/2 bins of DC are not folded here. Not thread-safe (it renders with the
/// generator's scratch buffers); allocation-free per call.
/// </remarks>
public sealed class GalacticBinaryBandLikelihood
{
    /// <summary>Creates the likelihood of <paramref name="band"/> with templates from <paramref name="generator"/>.</summary>
    public GalacticBinaryBandLikelihood(GalacticBinaryTemplateGenerator generator, GalacticBinaryBand band)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(band);
        Generator = generator;
        Band = band;
    }

    /// <summary>The template generator.</summary>
    public GalacticBinaryTemplateGenerator Generator { get; }

    /// <summary>The data.</summary>
    public GalacticBinaryBand Band { get; }

    /// <summary><c>(d|h) − ½(h|h)</c> for the template of <paramref name="source"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">f0 is not in (0, Nyquist).</exception>
    public double LogLikelihoodRatio(in GalacticBinaryParameters source)
    {
        var view = Generator.Render(source, Band.IncludesT);
        var overlap = Band.Window.Intersect(new Series.BinWindow(view.FirstBin, view.Count));
        if (overlap.Count == 0) return 0.0;
        int dataOffset = overlap.First - Band.Window.First, templateOffset = overlap.First - view.FirstBin;
        double sum = Channel(view.A.Slice(templateOffset, overlap.Count), Band.DataA.AsSpan(dataOffset, overlap.Count), Band.InverseA.AsSpan(dataOffset, overlap.Count))
            + Channel(view.E.Slice(templateOffset, overlap.Count), Band.DataE.AsSpan(dataOffset, overlap.Count), Band.InverseE.AsSpan(dataOffset, overlap.Count));
        if (Band.IncludesT)
            sum += Channel(view.T.Slice(templateOffset, overlap.Count), Band.DataT.AsSpan(dataOffset, overlap.Count), Band.InverseT.AsSpan(dataOffset, overlap.Count));
        return 4.0 * Band.DfHz * sum;
    }

    // Σ w (Re(d h*) − ½|h|²).
    private static double Channel(ReadOnlySpan<System.Numerics.Complex> template, ReadOnlySpan<System.Numerics.Complex> data, ReadOnlySpan<double> inverse)
    {
        double sum = 0;
        for (int k = 0; k < template.Length; k++)
        {
            var h = template[k];
            var d = data[k];
            sum += inverse[k] * (d.Real * h.Real + d.Imaginary * h.Imaginary - 0.5 * (h.Real * h.Real + h.Imaginary * h.Imaginary));
        }
        return sum;
    }
}
