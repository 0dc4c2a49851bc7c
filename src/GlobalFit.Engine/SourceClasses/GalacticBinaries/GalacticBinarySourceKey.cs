namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>A source's eight sampled coordinates as a dictionary key: the caches of templates and Fisher matrices hold a
/// value per exact coordinate vector, so a hit returns bit for bit what a fresh computation would.</summary>
internal readonly record struct GalacticBinarySourceKey(double F0, double FDot, double Snr, double SinBeta, double Lambda, double CosIota, double Psi, double Phi0)
{
    public GalacticBinarySourceKey(ReadOnlySpan<double> v) : this(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7])
    {
    }
}
