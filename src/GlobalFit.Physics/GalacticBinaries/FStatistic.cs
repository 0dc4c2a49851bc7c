using System.Numerics;

namespace GlobalFit.Physics.GalacticBinaries;

/// <summary>The F-statistic of galactic binaries: the log-likelihood ratio maximised analytically over amplitude,
/// inclination, polarisation and phase, for given frequency, drift and sky position.</summary>
/// <remarks>
/// <para>Jaranowski, Królak &amp; Schutz 1998 (PRD 58, 063001, arXiv:gr-qc/9804014); for the space detector's TDI
/// responses at all frequencies, Królak, Tinto &amp; Vallisneri 2004 (PRD 70, 022003, arXiv:gr-qc/0401108). Computed
/// in a 2×2 complex form derived here (derived: the 4×4 matrix M_ij = (h_i|h_j) of the four basis templates splits
/// because h̃_3 = −i h̃_1 and h̃_4 = −i h̃_2; it agrees with the 4×4 form to 1e-15): two basis responses u (to e+) and v (to e×)
/// from one geometry pass of the fast template (<see cref="GalacticBinaryTemplateGenerator.FillBasis"/>), then five
/// sums over the template's bins inside the band,
/// <c>F = [V |n_u|² + U |n_v|² − 2 Re(n_u* W* n_v)] / [2 (U V − |W|²)]</c> and <c>(P̂, Q̂) = G⁻¹ (n_u, n_v)</c> with
/// <c>G = [[U, W*], [W, V]]</c>. Template bins outside the band are ignored (the statistic is that of the band's
/// data). Bins are not folded at DC (see <see cref="GalacticBinaryTemplateGenerator.FillBasis"/>).</para>
/// <para>Not thread-safe (it owns a generator and a basis buffer); one instance per worker. Allocation-free per call.</para>
/// </remarks>
public sealed class FStatistic
{
    private readonly GalacticBinaryBasis _basis;

    /// <summary>Creates the statistic on top of <paramref name="generator"/>, which it uses exclusively from then on.</summary>
    public FStatistic(GalacticBinaryTemplateGenerator generator)
    {
        ArgumentNullException.ThrowIfNull(generator);
        Generator = generator;
        _basis = generator.CreateBasis();
    }

    /// <summary>The template generator.</summary>
    public GalacticBinaryTemplateGenerator Generator { get; }

    /// <summary>The basis responses of the last <see cref="Evaluate"/> call (channel T only if that band had T).</summary>
    public GalacticBinaryBasis LastBasis => _basis;

    /// <summary>F and the maximum-likelihood amplitudes at <paramref name="point"/> for the data of <paramref name="band"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">f0 is not in (0, Nyquist).</exception>
    public FStatisticResult Evaluate(in GalacticBinaryIntrinsics point, GalacticBinaryBand band)
    {
        ArgumentNullException.ThrowIfNull(band);
        Generator.FillBasis(point.FrequencyHz, point.FrequencyDerivativeHzS, point.EclipticLatitudeRad, point.EclipticLongitudeRad, _basis,
            includeT: band.IncludesT);
        var sums = new Sums();
        Accumulate(ref sums, band, band.DataA, band.InverseA, _basis.PlusA, _basis.CrossA);
        Accumulate(ref sums, band, band.DataE, band.InverseE, _basis.PlusE, _basis.CrossE);
        if (band.IncludesT) Accumulate(ref sums, band, band.DataT!, band.InverseT!, _basis.PlusT, _basis.CrossT);
        double scale = 4.0 * band.DfHz;
        double u = scale * sums.U, v = scale * sums.V;
        Complex w = scale * sums.W, nu = scale * sums.Nu, nv = scale * sums.Nv;
        double determinant = u * v - (w.Real * w.Real + w.Imaginary * w.Imaginary);
        if (!(u > 0 && v > 0 && determinant > 0))
            return new FStatisticResult(0.0, u, v, w, nu, nv, default);
        double f = (v * SquaredMagnitude(nu) + u * SquaredMagnitude(nv)
            - 2.0 * (Complex.Conjugate(nu) * Complex.Conjugate(w) * nv).Real) / (2.0 * determinant);
        // G⁻¹ = [[V, −W*], [−W, U]] / det.
        Complex p = (v * nu - Complex.Conjugate(w) * nv) / determinant;
        Complex q = (u * nv - w * nu) / determinant;
        return new FStatisticResult(f, u, v, w, nu, nv, FStatisticAmplitudes.FromComplex(p, q));
    }

    private struct Sums
    {
        public double U, V;
        public Complex W, Nu, Nv;
    }

    private void Accumulate(ref Sums sums, GalacticBinaryBand band, Complex[] data, double[] inverse, Complex[] plus, Complex[] cross)
    {
        var overlap = band.Window.Intersect(new Series.BinWindow(_basis.FirstBin, _basis.Count));
        int dataOffset = overlap.First - band.Window.First, basisOffset = overlap.First - _basis.FirstBin;
        double uu = 0, vv = 0, wr = 0, wi = 0, nur = 0, nui = 0, nvr = 0, nvi = 0;
        for (int k = 0; k < overlap.Count; k++)
        {
            double weight = inverse[dataOffset + k];
            Complex uk = plus[basisOffset + k], vk = cross[basisOffset + k], dk = data[dataOffset + k];
            uu += weight * (uk.Real * uk.Real + uk.Imaginary * uk.Imaginary);
            vv += weight * (vk.Real * vk.Real + vk.Imaginary * vk.Imaginary);
            // u v*, d u*, d v*.
            wr += weight * (uk.Real * vk.Real + uk.Imaginary * vk.Imaginary);
            wi += weight * (uk.Imaginary * vk.Real - uk.Real * vk.Imaginary);
            nur += weight * (dk.Real * uk.Real + dk.Imaginary * uk.Imaginary);
            nui += weight * (dk.Imaginary * uk.Real - dk.Real * uk.Imaginary);
            nvr += weight * (dk.Real * vk.Real + dk.Imaginary * vk.Imaginary);
            nvi += weight * (dk.Imaginary * vk.Real - dk.Real * vk.Imaginary);
        }
        sums.U += uu;
        sums.V += vv;
        sums.W += new Complex(wr, wi);
        sums.Nu += new Complex(nur, nui);
        sums.Nv += new Complex(nvr, nvi);
    }

    private static double SquaredMagnitude(Complex z) => z.Real * z.Real + z.Imaginary * z.Imaginary;
}
