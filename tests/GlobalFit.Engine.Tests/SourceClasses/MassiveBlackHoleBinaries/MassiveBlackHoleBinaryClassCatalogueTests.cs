using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.SourceClasses.MassiveBlackHoleBinaries;

public class MassiveBlackHoleBinaryClassCatalogueTests
{
    private static readonly string[] Columns = [.. MassiveBlackHoleBinaryParameters.ColumnNames];

    private sealed class InstrumentPsd : IPsdSource
    {
        private readonly AetNoiseModel _model = new(new InstrumentNoiseSettings());

        public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
        {
            for (int i = 0; i < psd.Length; i++) psd[i] = _model.Psd(channel, (bins.First + i) * MassiveBlackHoleBinaryTestData.Shape.DfHz);
        }
    }

    private static MassiveBlackHoleBinaryClassCatalogue NewCatalogue(long burnIn)
    {
        var settings = MassiveBlackHoleBinaryTestData.Settings();
        return new MassiveBlackHoleBinaryClassCatalogue(new RigidOrbits(), MassiveBlackHoleBinaryTestData.Shape,
            settings.Window(MassiveBlackHoleBinaryTestData.Shape), new InstrumentPsd(), burnIn);
    }

    // Samples of one binary: chirp mass uniform on truth × [0.99, 1.01] (others fixed at the truth), so the quantiles are known.
    private static SampleBlock Block(string worker, long iteration, MassiveBlackHoleBinaryParameters truth, int count, ulong seed)
    {
        var random = RandomStream.ForPath(seed, 1, 2);
        var values = new List<double>();
        for (int i = 0; i < count; i++)
            values.AddRange((truth with { ChirpMassMsun = truth.ChirpMassMsun * random.NextUniform(0.99, 1.01) }).ToArray());
        return new SampleBlock(worker, MassiveBlackHoleBinaryClass.Id, iteration, Columns, [.. Enumerable.Repeat(1, count)], [.. values], new double[count]);
    }

    [Fact]
    public void A_row_per_binary_holds_medians_ninety_percent_intervals_snr_and_samples_after_burn_in()
    {
        var early = MassiveBlackHoleBinaryTestData.Binary(1e5) with { CoalescenceTimeS = 5 * 86_400.0 };
        var late = MassiveBlackHoleBinaryTestData.Binary(1e5);
        var catalogue = NewCatalogue(burnIn: 1);
        catalogue.Add(Block("massive_black_hole_binaries/01", 1, late with { ChirpMassMsun = 1e6 }, 50, 1)); // burn-in: ignored
        catalogue.Add(Block("massive_black_hole_binaries/01", 2, late, 2000, 2));
        catalogue.Add(Block("massive_black_hole_binaries/02", 2, early, 2000, 3));
        var rows = catalogue.Build();

        Assert.Equal(["mbhb-0001", "mbhb-0002"], rows.Select(r => r.Id));   // by median t_c: the early binary first
        var row = rows[1];
        Assert.Equal(MassiveBlackHoleBinaryClass.Id, row.ClassId);
        Assert.Equal(1.0, row.Confidence);
        Assert.Equal(2000, row.SampleCount);
        Assert.Equal(MassiveBlackHoleBinaryParameters.ColumnNames, row.ParameterNames);
        // Uniform on ±1 %: median at the truth, 5 % and 95 % quantiles at ∓0.9 %; 2000 draws put each within ~0.1 % of
        // the range (binomial standard error √(q(1−q)/n) of the quantile's level, times the range; 4 σ).
        Assert.Equal(late.ChirpMassMsun, row.Median[0], late.ChirpMassMsun * 1e-3);
        Assert.Equal(late.ChirpMassMsun * 0.991, row.Lower[0], late.ChirpMassMsun * 1e-3);
        Assert.Equal(late.ChirpMassMsun * 1.009, row.Upper[0], late.ChirpMassMsun * 1e-3);
        Assert.Equal(late.CoalescenceTimeS, row.Median[4]);
        // SNR: the median over 64 samples of the optimal SNR in A, E and T; chirp masses within 1 % change it by ~1 %.
        var residual = MassiveBlackHoleBinaryTestData.Residual(MassiveBlackHoleBinaryTestData.Settings(), null, null);
        double expected = MassiveBlackHoleBinaryTestData.Snr(residual, late);
        Assert.InRange(row.Snr, 0.98 * expected, 1.05 * expected);   // T adds a little above A and E
    }

    [Fact]
    public void A_block_of_another_class_or_with_other_columns_is_refused()
    {
        var catalogue = NewCatalogue(0);
        var block = Block("massive_black_hole_binaries/01", 1, MassiveBlackHoleBinaryTestData.Binary(1e5), 3, 1);
        Assert.Throws<ArgumentException>(() => catalogue.Add(block with { ClassId = "galactic_binaries" }));
        Assert.Throws<ArgumentException>(() => catalogue.Add(block with { ParameterNames = ["f0_hz", .. Columns[1..]] }));
        Assert.Empty(catalogue.Build());
    }
}
