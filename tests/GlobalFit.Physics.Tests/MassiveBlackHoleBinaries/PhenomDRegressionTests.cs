using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Physics.Tests.MassiveBlackHoleBinaries;

/// <summary>Inspiral values of an independent implementation of the same IMRPhenomD formulas (Khan et al. 2016,
/// arXiv:1508.07253; not published numbers): they catch transcription errors in the amplitude and spin-dependent phase
/// coefficients. The inspiral does not depend on the ringdown frequencies, where the two implementations differ.</summary>
public sealed class PhenomDRegressionTests
{
    // Source: independent implementation (derived: same formulas, coded separately), printed to 8–9 significant figures,
    // so 1e-7 relative. Columns: q, χ1, χ2, Mf, A/A0 (NaN where Mf lies beyond the inspiral amplitude region, whose value then
    // depends on the ringdown frequencies), raw dφ/d(Mf) of the inspiral region (no time shift).
    [Theory]
    [InlineData(1.0, 0.0, 0.0, 0.004, 0.94423534, -54356.50201344)]
    [InlineData(1.0, 0.0, 0.0, 0.016, double.NaN, -836.67652176)]
    [InlineData(3.0, 0.5, -0.3, 0.004, 0.94942507, -76444.42083286)]
    [InlineData(3.0, 0.5, -0.3, 0.016, double.NaN, -1399.68262065)]
    [InlineData(8.0, 0.9, 0.0, 0.004, 0.95879936, -158129.13415118)]
    [InlineData(8.0, 0.9, 0.0, 0.016, double.NaN, -3852.00256641)]
    public void Inspiral_amplitude_and_phase_slope_match_an_independent_implementation(
        double q, double spin1, double spin2, double mf, double reducedAmplitude, double phaseSlope)
    {
        var model = new PhenomDModel(q, spin1, spin2);
        if (!double.IsNaN(reducedAmplitude))
            Assert.Equal(reducedAmplitude, model.InspiralReducedAmplitude(mf), 1e-7 * reducedAmplitude);
        Assert.Equal(phaseSlope, model.InspiralPhaseDerivative(mf), 1e-7 * Math.Abs(phaseSlope));
    }

    // Source: same independent implementation of the Husa et al. 2016 fits (arXiv:1508.07250), 6 figures: 1e-6.
    [Theory]
    [InlineData(3.0, 0.5, -0.3, 0.738779, 0.0386424)]
    [InlineData(8.0, 0.9, 0.0, 0.915926, 0.0277471)]
    public void Remnant_fits_match_an_independent_implementation(double q, double spin1, double spin2, double finalSpin, double radiated)
    {
        double eta = q / ((1 + q) * (1 + q));
        Assert.Equal(finalSpin, RemnantFits.FinalSpin(eta, spin1, spin2), 1e-6);
        Assert.Equal(radiated, RemnantFits.RadiatedEnergy(eta, spin1, spin2), 1e-6);
    }
}
