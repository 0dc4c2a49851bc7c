namespace GlobalFit.Physics.ExtremeMassRatioInspirals;

/// <summary>Accuracy settings of the fast inspiral template.</summary>
/// <param name="CoarseStepSeconds">Largest spacing of the coarse time grid on which phases, frequencies and amplitudes
/// are computed (and of the stored trajectory points).</param>
/// <param name="LostPowerFraction">Harmonics are kept until they carry 1 − this fraction of the radiated power at the
/// largest eccentricity of the record (<see cref="PetersMathewsHarmonics.HarmonicCount"/>).</param>
/// <param name="DroppedEnergyFraction">Sidebands are kept in decreasing order of their signal energy in A and E until
/// the dropped ones hold at most this fraction of the total.</param>
/// <param name="MaxHarmonics">Upper bound on the number of harmonics (buffers are sized by it).</param>
/// <param name="RelativeTolerance">rtol of the orbital integration.</param>
public sealed record ExtremeMassRatioInspiralTemplateSettings(
    double CoarseStepSeconds = 5e4,
    double LostPowerFraction = 1e-3,
    double DroppedEnergyFraction = 1e-3,
    int MaxHarmonics = 40,
    double RelativeTolerance = 1e-10)
{
    /// <summary>The defaults: 5e4 s grid, 99.9 % of the power, 0.1 % of the sideband energy dropped, at most 40
    /// harmonics, rtol 1e-10. With them the template matches the direct path to better than 0.99 for e0 ≤ 0.4 over a
    /// year (tests).</summary>
    public static ExtremeMassRatioInspiralTemplateSettings Default { get; } = new();

    /// <summary>Throws unless every setting is in range.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A setting is out of range.</exception>
    public void Validate()
    {
        if (!(CoarseStepSeconds >= 100) || !double.IsFinite(CoarseStepSeconds))
            throw new ArgumentOutOfRangeException(nameof(CoarseStepSeconds), CoarseStepSeconds, "coarse step must be at least 100 s and finite");
        if (!(LostPowerFraction > 0 && LostPowerFraction < 1))
            throw new ArgumentOutOfRangeException(nameof(LostPowerFraction), LostPowerFraction, "lost power fraction must lie in (0, 1)");
        if (!(DroppedEnergyFraction >= 0 && DroppedEnergyFraction < 1))
            throw new ArgumentOutOfRangeException(nameof(DroppedEnergyFraction), DroppedEnergyFraction, "dropped energy fraction must lie in [0, 1)");
        if (MaxHarmonics < 2 || MaxHarmonics > 1000)
            throw new ArgumentOutOfRangeException(nameof(MaxHarmonics), MaxHarmonics, "harmonic bound must lie in [2, 1000]");
        if (!(RelativeTolerance > 0 && RelativeTolerance < 1e-3))
            throw new ArgumentOutOfRangeException(nameof(RelativeTolerance), RelativeTolerance, "relative tolerance must lie in (0, 1e-3)");
    }
}
