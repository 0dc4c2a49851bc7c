using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Physics.Tests.GalacticBinaries;

public class BasisWithoutTTests
{
    // Leaving T out skips its two transforms only; A and E come from the same samples and must be the same numbers.
    [Fact]
    public void A_basis_filled_without_T_has_the_same_A_and_E_bit_for_bit()
    {
        var generator = new GalacticBinaryTemplateGenerator(30 * 86400.0, 5.0);
        var full = generator.CreateBasis();
        var withoutT = generator.CreateBasis();
        generator.FillBasis(3e-3, 2e-17, 0.4, 1.9, full);
        generator.FillBasis(3e-3, 2e-17, 0.4, 1.9, withoutT, includeT: false);
        Assert.Equal((full.FirstBin, full.Count), (withoutT.FirstBin, withoutT.Count));
        Assert.Equal(full.PlusA.AsSpan(0, full.Count).ToArray(), withoutT.PlusA.AsSpan(0, full.Count).ToArray());
        Assert.Equal(full.PlusE.AsSpan(0, full.Count).ToArray(), withoutT.PlusE.AsSpan(0, full.Count).ToArray());
        Assert.Equal(full.CrossA.AsSpan(0, full.Count).ToArray(), withoutT.CrossA.AsSpan(0, full.Count).ToArray());
        Assert.Equal(full.CrossE.AsSpan(0, full.Count).ToArray(), withoutT.CrossE.AsSpan(0, full.Count).ToArray());
    }
}
