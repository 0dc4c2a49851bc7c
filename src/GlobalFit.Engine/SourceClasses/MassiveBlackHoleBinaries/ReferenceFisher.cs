using GlobalFit.Inference.Targets;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The Fisher matrix of one binary at a fixed point (the heterodyne reference), served for every position: the
/// Fisher-matrix jumps of the worker's sampler take their directions and sizes from it.</summary>
/// <remarks>Computed once on construction with <see cref="MassiveBlackHoleBinaryFisherMatrix"/> (22 full templates), in the
/// sampled coordinates (the parameters in column order and their units). Serving one matrix for every position keeps the
/// proposal symmetric and its cost out of the chains' steps; the matrix changes only with the reference, which is part of
/// the worker's saved state, so a restored worker rebuilds the same one. A spin within a finite-difference step of ±1 is
/// moved inside first, since the waveform refuses |χ| &gt; 1.</remarks>
public sealed class ReferenceFisher : IFisherInformation
{
    private readonly double[] _matrix = new double[11 * 11];

    /// <summary>Computes the matrix at <paramref name="reference"/> over the window and weights of <paramref name="data"/>.</summary>
    public ReferenceFisher(MassiveBlackHoleBinaryTemplateGenerator generator, MassiveBlackHoleBinaryData data, MassiveBlackHoleBinaryParameters reference)
    {
        ArgumentNullException.ThrowIfNull(generator);
        ArgumentNullException.ThrowIfNull(data);
        var steps = MassiveBlackHoleBinaryFisherMatrix.DefaultSteps(reference);
        reference = reference with
        {
            Spin1 = Math.Clamp(reference.Spin1, -1 + 2 * steps[2], 1 - 2 * steps[2]),
            Spin2 = Math.Clamp(reference.Spin2, -1 + 2 * steps[3], 1 - 2 * steps[3]),
            MassRatio = Math.Max(reference.MassRatio, 1 + 2 * steps[1]),
        };
        var fisher = MassiveBlackHoleBinaryFisherMatrix.Compute(generator, data, reference, steps);
        for (int i = 0; i < 11; i++)
            for (int j = 0; j < 11; j++)
                _matrix[i * 11 + j] = double.IsFinite(fisher[i, j]) ? fisher[i, j] : 0.0;
    }

    /// <inheritdoc />
    public int Dimension => 11;

    /// <inheritdoc />
    public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix) => _matrix.CopyTo(matrix);
}
