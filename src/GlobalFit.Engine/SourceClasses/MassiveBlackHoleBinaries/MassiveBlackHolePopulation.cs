using GlobalFit.Inference.Random;
using GlobalFit.Physics.Cosmology;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>Draws binaries from <see cref="MassiveBlackHoleBinaryPopulationSettings"/>.</summary>
public static class MassiveBlackHolePopulation
{
    /// <summary>Draws <see cref="MassiveBlackHoleBinaryPopulationSettings.Count"/> binaries from <paramref name="random"/>,
    /// eleven draws per binary in a fixed order, so a seed gives the same population on every machine.</summary>
    public static MassiveBlackHoleBinaryParameters[] Draw(MassiveBlackHoleBinaryPopulationSettings settings, ref RandomStream random)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var cosmology = FlatLambdaCdm.Planck2018;
        var drawn = new MassiveBlackHoleBinaryParameters[settings.Count];
        double logMin = Math.Log(settings.ChirpMassMinMsun), logMax = Math.Log(settings.ChirpMassMaxMsun);
        for (int i = 0; i < drawn.Length; i++)
        {
            double chirpMass = Math.Exp(random.NextUniform(logMin, logMax));
            double q = random.NextUniform(settings.MassRatioMin, settings.MassRatioMax);
            double spin1 = random.NextUniform(settings.SpinMin, settings.SpinMax);
            double spin2 = random.NextUniform(settings.SpinMin, settings.SpinMax);
            double tc = random.NextUniform(settings.MergerStartS, settings.MergerEndS);
            double z = random.NextUniform(settings.RedshiftMin, settings.RedshiftMax);
            double beta = Math.Asin(random.NextUniform(-1, 1));
            double lambda = random.NextUniform(0, 2 * Math.PI);
            double iota = Math.Acos(random.NextUniform(-1, 1));
            double psi = random.NextUniform(0, Math.PI);
            double phi = random.NextUniform(0, 2 * Math.PI);
            drawn[i] = new MassiveBlackHoleBinaryParameters(chirpMass, q, spin1, spin2, tc, cosmology.LuminosityDistanceMpc(z), beta, lambda, iota, psi, phi);
        }
        return drawn;
    }
}
