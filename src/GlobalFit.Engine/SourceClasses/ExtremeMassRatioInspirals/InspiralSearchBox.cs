using GlobalFit.Physics.Constants;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The part of the prior a blind inspiral search looks in: ranges of the five parameters that shape the
/// track (central and compact mass, spin, orbital frequency, eccentricity); the angles always range over their whole
/// period or sphere and the distance is not searched (the semi-coherent statistic maximises the amplitude).</summary>
/// <remarks>Keys <c>search_central_mass_min_msun</c> … <c>search_eccentricity_max</c> of the
/// <c>[extreme_mass_ratio_inspirals]</c> table; each defaults to the prior's bound and must lie inside the prior.
/// Masses and frequency are searched uniformly in their logarithm, spin and eccentricity uniformly, as the prior draws
/// them. Immutable.</remarks>
/// <param name="MinCentralMassMsun">Lower bound of M [<c>search_central_mass_min_msun</c>].</param>
/// <param name="MaxCentralMassMsun">Upper bound of M [<c>search_central_mass_max_msun</c>].</param>
/// <param name="MinCompactMassMsun">Lower bound of μ [<c>search_compact_mass_min_msun</c>].</param>
/// <param name="MaxCompactMassMsun">Upper bound of μ [<c>search_compact_mass_max_msun</c>].</param>
/// <param name="MinSpin">Lower bound of χ [<c>search_spin_min</c>].</param>
/// <param name="MaxSpin">Upper bound of χ [<c>search_spin_max</c>].</param>
/// <param name="MinFrequencyHz">Lower bound of ν0 [<c>search_orbital_frequency_min_hz</c>].</param>
/// <param name="MaxFrequencyHz">Upper bound of ν0 [<c>search_orbital_frequency_max_hz</c>]; further limited by each
/// source's plunge, as in the prior.</param>
/// <param name="MinEccentricity">Lower bound of e0 [<c>search_eccentricity_min</c>].</param>
/// <param name="MaxEccentricity">Upper bound of e0 [<c>search_eccentricity_max</c>].</param>
public sealed record InspiralSearchBox(
    double MinCentralMassMsun, double MaxCentralMassMsun,
    double MinCompactMassMsun, double MaxCompactMassMsun,
    double MinSpin, double MaxSpin,
    double MinFrequencyHz, double MaxFrequencyHz,
    double MinEccentricity, double MaxEccentricity)
{
    /// <summary>Configuration keys, in the order of the constructor.</summary>
    public static readonly string[] Keys =
    [
        "search_central_mass_min_msun", "search_central_mass_max_msun", "search_compact_mass_min_msun", "search_compact_mass_max_msun",
        "search_spin_min", "search_spin_max", "search_orbital_frequency_min_hz", "search_orbital_frequency_max_hz",
        "search_eccentricity_min", "search_eccentricity_max",
    ];

    /// <summary>Distance every searched template is built at; the statistic does not depend on it.</summary>
    public const double ReferenceDistanceMpc = 1000;

    /// <summary>The whole prior.</summary>
    public static InspiralSearchBox Of(ExtremeMassRatioInspiralPrior prior) => new(
        prior.MinCentralMassMsun, prior.MaxCentralMassMsun, prior.MinCompactMassMsun, prior.MaxCompactMassMsun,
        0, prior.MaxSpin, prior.MinFrequencyHz, prior.MaxFrequencyHz, 0, prior.MaxEccentricity);

    /// <summary>The values as an array in the order of <see cref="Keys"/>.</summary>
    public double[] ToArray() =>
    [
        MinCentralMassMsun, MaxCentralMassMsun, MinCompactMassMsun, MaxCompactMassMsun, MinSpin, MaxSpin,
        MinFrequencyHz, MaxFrequencyHz, MinEccentricity, MaxEccentricity,
    ];

    /// <summary>The parameters at unit-cube point <paramref name="u"/> (14 values in [0, 1), in column order; entry 10,
    /// the distance, is ignored); null when the orbital frequency lies above the source's plunge.</summary>
    public ExtremeMassRatioInspiralParameters? At(ReadOnlySpan<double> u)
    {
        double m = MinCentralMassMsun * Math.Pow(MaxCentralMassMsun / MinCentralMassMsun, u[0]);
        double mu = MinCompactMassMsun * Math.Pow(MaxCompactMassMsun / MinCompactMassMsun, u[1]);
        double chi = MinSpin + (MaxSpin - MinSpin) * u[2];
        double nu = MinFrequencyHz * Math.Pow(MaxFrequencyHz / MinFrequencyHz, u[3]);
        double e0 = MinEccentricity + (MaxEccentricity - MinEccentricity) * u[4];
        // The prior's bound: (1 − 1e-3) of the plunge frequency of the kludge's separatrix p = 6 + 2e.
        double ratio = (1 - e0 * e0) / (6 + 2 * e0);
        double plunge = ratio * Math.Sqrt(ratio) / (2 * Math.PI * m * PhysicalConstants.SolarMassSeconds);
        if (!(nu <= (1 - 1e-3) * plunge)) return null;
        double twoPi = 2 * Math.PI;
        return new ExtremeMassRatioInspiralParameters(m, mu, chi, nu, e0,
            Math.Acos(1 - 2 * u[5]), Math.Asin(2 * u[6] - 1), twoPi * u[7], Math.Acos(1 - 2 * u[8]), twoPi * u[9],
            ReferenceDistanceMpc, twoPi * u[11], twoPi * u[12], twoPi * u[13]);
    }

    /// <summary>The bins the templates of the box reach: the union of the templates' bins at every corner of the five
    /// searched ranges (the highest frequency capped below the plunge), under two sky and orientation choices, clipped to
    /// the record; empty when none reaches it.</summary>
    /// <remarks>A sideband's frequency nν + 2sγ̇/2π + kα̇/2π moves monotonically with each searched parameter over most
    /// of the box, so its extremes sit at corners; the sky enters only through the Doppler shift (10⁻⁴ of the
    /// frequency) and the sidebands kept.</remarks>
    public BinWindow Reach(ExtremeMassRatioInspiralTemplateGenerator generator)
    {
        ArgumentNullException.ThrowIfNull(generator);
        int first = int.MaxValue, end = 0;
        Span<double> u = stackalloc double[14];
        for (int corner = 0; corner < 64; corner++)
        {
            for (int i = 0; i < 5; i++) u[i] = (corner >> i & 1) == 0 ? 0 : 1 - 1e-12;
            bool other = (corner >> 5 & 1) == 1;
            for (int i = 5; i < 14; i++) u[i] = other ? 0.7 : 0.3;
            if (At(u) is not { } p)
            {
                // Above the plunge: the highest frequency this corner allows.
                u[3] = 0;
                if (At(u) is not { } low) continue;
                double ratio = (1 - low.Eccentricity0 * low.Eccentricity0) / (6 + 2 * low.Eccentricity0);
                double plunge = ratio * Math.Sqrt(ratio) / (2 * Math.PI * low.CentralMassMsun * PhysicalConstants.SolarMassSeconds);
                p = low with { OrbitalFrequency0Hz = Math.Max(low.OrbitalFrequency0Hz, (1 - 2e-3) * plunge) };
            }
            BinWindow bins;
            try
            {
                bins = generator.TemplateBins(p);
            }
            catch (ArgumentOutOfRangeException)
            {
                continue;
            }
            catch (InvalidOperationException)
            {
                continue;
            }
            if (bins.Count == 0) continue;
            first = Math.Min(first, bins.First);
            end = Math.Max(end, bins.End);
        }
        return end > first ? new BinWindow(Math.Max(first, 1), end - Math.Max(first, 1)) : new BinWindow(0, 0);
    }

    /// <summary>Whether coordinate <paramref name="index"/> of the unit cube is periodic (the longitude, φ_K and the three
    /// phases).</summary>
    public static bool IsPeriodic(int index) => InspiralSamplingCoordinates.IsPeriodic(index);
}
