using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The Fisher information matrix of one massive black-hole binary, <c>Γ_ij = Σ_c (∂_i h_c | ∂_j h_c)</c>, by central
/// differences of the full template.</summary>
/// <remarks>
/// Standard definition (Vallisneri 2008, PRD 77, 042001, arXiv:gr-qc/0703086; Cutler &amp; Flanagan 1994). Parameters in the
/// order of <see cref="MassiveBlackHoleBinaryParameters.ColumnNames"/>, in their physical units. Default steps
/// (<see cref="DefaultSteps"/>) balance truncation (step²) against rounding of phases of up to ~1e6 rad; derivatives are taken
/// without regard to the prior's bounds, so a spin within a step of ±1 is refused by the waveform. Not a hot kernel: it
/// allocates its 22 templates.
/// </remarks>
public static class MassiveBlackHoleBinaryFisherMatrix
{
    /// <summary>Default steps for a source: relative 1e-6 for chirp mass, 1e-5 for mass ratio and 1e-4 for distance; absolute 1e-5
    /// for spins and angles (rad) and 1e-2 s for t_c.</summary>
    public static double[] DefaultSteps(in MassiveBlackHoleBinaryParameters source) =>
    [
        1e-6 * source.ChirpMassMsun, 1e-5 * source.MassRatio, 1e-5, 1e-5, 1e-2, 1e-4 * source.DistanceMpc,
        1e-5, 1e-5, 1e-5, 1e-5, 1e-5,
    ];

    /// <summary>Γ at <paramref name="source"/> over the window and weights of <paramref name="data"/> (its data values are not used).</summary>
    /// <param name="generator">Generator able to render the window.</param>
    /// <param name="data">Window, spacing and inverse PSDs.</param>
    /// <param name="source">Where to evaluate.</param>
    /// <param name="steps">Finite-difference steps (eleven), or null for <see cref="DefaultSteps"/>.</param>
    /// <exception cref="ArgumentException">The steps are not eleven positive numbers.</exception>
    public static double[,] Compute(MassiveBlackHoleBinaryTemplateGenerator generator, MassiveBlackHoleBinaryData data,
        in MassiveBlackHoleBinaryParameters source, double[]? steps = null)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(data);
        steps ??= DefaultSteps(source);
        if (steps.Length != 11 || steps.Any(s => !(s > 0) || !double.IsFinite(s)))
            throw new ArgumentException("give eleven positive finite steps", nameof(steps));
        int n = data.Window.Count;
        var derivatives = new Complex[11][][];
        var plus = new[] { new Complex[n], new Complex[n], new Complex[n] };
        var minus = new[] { new Complex[n], new Complex[n], new Complex[n] };
        var values = source.ToArray();
        for (int i = 0; i < 11; i++)
        {
            var shifted = (double[])values.Clone();
            shifted[i] = values[i] + steps[i];
            generator.RenderBins(MassiveBlackHoleBinaryParameters.FromSpan(shifted), data.Window, data.DfHz, plus[0], plus[1], plus[2]);
            shifted[i] = values[i] - steps[i];
            generator.RenderBins(MassiveBlackHoleBinaryParameters.FromSpan(shifted), data.Window, data.DfHz, minus[0], minus[1], minus[2]);
            derivatives[i] = new Complex[3][];
            for (int c = 0; c < 3; c++)
            {
                derivatives[i][c] = new Complex[n];
                for (int k = 0; k < n; k++) derivatives[i][c][k] = (plus[c][k] - minus[c][k]) / (2.0 * steps[i]);
            }
        }
        var fisher = new double[11, 11];
        for (int i = 0; i < 11; i++)
            for (int j = i; j < 11; j++)
            {
                double sum = 0;
                for (int c = 0; c < 3; c++)
                    sum += InnerProduct.Real(derivatives[i][c], derivatives[j][c], data.InversePsd[c], data.DfHz);
                fisher[i, j] = fisher[j, i] = sum;
            }
        return fisher;
    }
}
