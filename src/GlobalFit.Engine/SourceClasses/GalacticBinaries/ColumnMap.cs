using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>Where each galactic-binary parameter sits in a <see cref="SampleBlock"/> row, and the catalogue's own row
/// order (<see cref="GalacticBinaryParameters.ColumnNames"/>).</summary>
/// <remarks>Looked up by name rather than position so a worker may write its columns in any order, and a block missing a
/// column fails here instead of shifting every parameter by one.</remarks>
internal sealed class ColumnMap
{
    public const int Width = 8;

    private readonly int[] _positions;
    private readonly int _secondDerivative;

    private ColumnMap(int[] positions, int secondDerivative)
    {
        _positions = positions;
        _secondDerivative = secondDerivative;
    }

    public static ColumnMap For(SampleBlock block)
    {
        var names = block.ParameterNames;
        var positions = new int[Width];
        for (int c = 0; c < Width; c++)
        {
            positions[c] = Array.IndexOf(names, GalacticBinaryParameters.ColumnNames[c]);
            if (positions[c] < 0)
                throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: column {GalacticBinaryParameters.ColumnNames[c]} is missing (columns: {string.Join(", ", names)})", nameof(block));
        }
        long sources = block.SourcesPerSample.Sum(n => (long)n);
        if (sources * names.Length != block.Values.Length)
            throw new ArgumentException($"worker {block.WorkerId}, iteration {block.Iteration}: {block.Values.Length} values do not fit {sources} sources of {names.Length} columns", nameof(block));
        return new ColumnMap(positions, Array.IndexOf(names, GalacticBinaryParameters.SecondFrequencyDerivativeColumn));
    }

    public GalacticBinaryParameters Read(ReadOnlySpan<double> row) => new(
        row[_positions[0]], row[_positions[1]], row[_positions[2]], row[_positions[3]],
        row[_positions[4]], row[_positions[5]], row[_positions[6]], row[_positions[7]],
        _secondDerivative >= 0 ? row[_secondDerivative] : 0.0);
}
