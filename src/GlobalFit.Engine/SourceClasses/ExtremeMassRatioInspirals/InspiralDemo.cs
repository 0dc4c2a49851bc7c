namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The inspiral of the built-in demo: one invented source (SNR 32 over the demo's month and noise), fitted from
/// a start row a posterior width or two off its truth (as a catalogue row of an earlier, shorter analysis would be);
/// <c>compare</c> reports it against the truth with <see cref="InspiralMatcher"/>.</summary>
internal sealed class InspiralDemo : IDemoPart
{
    public string ScenarioToml => """
        [[extreme_mass_ratio_inspirals.inspiral]]
        id = "demo-emri"
        central_mass_msun = 5e5
        compact_mass_msun = 10
        central_spin = 0.6
        orbital_frequency0_hz = 1.2e-3
        eccentricity0 = 0.15
        orbit_inclination_rad = 0.8
        beta_rad = 0.4
        lambda_rad = 2.0
        spin_theta_rad = 1.2
        spin_phi_rad = 0.7
        distance_mpc = 200
        phi0_rad = 1.0
        gamma0_rad = 0.5
        alpha0_rad = 2.5
        """;

    // The start row is about one posterior width off in ν0 and ln M and two in Φ0 (widths at SNR 43 over a month of the default noise, measured by the worker tests:
    // 8e-10 Hz, 5e-6, 0.01 rad), as the median of an earlier, shorter analysis would be.
    public string FitToml => """
        [extreme_mass_ratio_inspirals]
        steps_per_update = 120
        temperatures = 3
        search_evaluations = 150

        [[extreme_mass_ratio_inspirals.start]]
        id = "demo-emri"
        central_mass_msun = 500002.5
        compact_mass_msun = 10
        central_spin = 0.6
        orbital_frequency0_hz = 1.200001e-3
        eccentricity0 = 0.15
        orbit_inclination_rad = 0.8
        beta_rad = 0.4
        lambda_rad = 2.0
        spin_theta_rad = 1.2
        spin_phi_rad = 0.7
        distance_mpc = 200
        phi0_rad = 1.02
        gamma0_rad = 0.5
        alpha0_rad = 2.5
        """;
}
