namespace GlobalFit.Physics.DataFiles;

/// <summary>The injected sources of one source class: one row per source, one named column per parameter.</summary>
/// <remarks>
/// <para>The table is generic so that every source class stores its injections the same way: the class id
/// names the table, <see cref="Columns"/> name the parameters in order
/// (e.g. <c>f0_hz</c>, <c>fdot_hz_s</c>, <c>amplitude</c>, …, <c>snr</c>; the project's parameter names), and each row has a
/// string id. Values may be NaN where a quantity is unknown (e.g. an SNR that was not computed).</para>
/// <para>Immutable: the value array is owned by the table once handed over. Safe to share between threads.</para>
/// </remarks>
public sealed class TruthTable
{
    private readonly double[] _values;
    private readonly string[] _columns;
    private readonly string[] _ids;

    /// <summary>Creates a table from row-major values.</summary>
    /// <param name="classId">Source-class id, snake_case (see <see cref="SnakeCaseName"/>).</param>
    /// <param name="columns">Parameter names in column order; snake_case, unique, at least one.</param>
    /// <param name="ids">One id per row; non-empty and unique.</param>
    /// <param name="values">Row-major values, <c>ids.Count × columns.Count</c> of them; not copied.</param>
    /// <exception cref="ArgumentException">A name is not snake_case or repeats, an id is empty or repeats, or the value count does not match.</exception>
    public TruthTable(string classId, IEnumerable<string> columns, IEnumerable<string> ids, double[] values)
    {
        ArgumentNullException.ThrowIfNull(columns);
        ArgumentNullException.ThrowIfNull(ids);
        ArgumentNullException.ThrowIfNull(values);
        if (!SnakeCaseName.IsValid(classId))
            throw new ArgumentException($"class id '{classId}' is not a snake_case name such as class_id");
        _columns = columns.ToArray();
        _ids = ids.ToArray();
        if (_columns.Length == 0)
            throw new ArgumentException($"truth table {classId} has no columns");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int c = 0; c < _columns.Length; c++)
        {
            if (!SnakeCaseName.IsValid(_columns[c]))
                throw new ArgumentException($"truth table {classId}: column {c} name '{_columns[c]}' is not a snake_case name such as f0_hz");
            if (!seen.Add(_columns[c]))
                throw new ArgumentException($"truth table {classId}: column name '{_columns[c]}' appears twice");
        }
        seen.Clear();
        for (int r = 0; r < _ids.Length; r++)
        {
            if (string.IsNullOrEmpty(_ids[r]))
                throw new ArgumentException($"truth table {classId}: row {r} has an empty id");
            if (!seen.Add(_ids[r]))
                throw new ArgumentException($"truth table {classId}: row {r} repeats id '{_ids[r]}'");
        }
        if (values.Length != _ids.Length * _columns.Length)
            throw new ArgumentException($"truth table {classId}: {_ids.Length} rows × {_columns.Length} columns need {_ids.Length * _columns.Length} values, got {values.Length}");
        ClassId = classId;
        _values = values;
    }

    /// <summary>The source-class id.</summary>
    public string ClassId { get; }

    /// <summary>Parameter names in column order.</summary>
    public IReadOnlyList<string> Columns => _columns;

    /// <summary>Source ids in row order.</summary>
    public IReadOnlyList<string> Ids => _ids;

    /// <summary>Number of sources.</summary>
    public int RowCount => _ids.Length;

    /// <summary>Number of parameters per source.</summary>
    public int ColumnCount => _columns.Length;

    /// <summary>All values, row-major.</summary>
    public ReadOnlySpan<double> Values => _values;

    /// <summary>The value array itself, for writers that must hand an array to a library without copying it.</summary>
    internal double[] ValueArray => _values;

    /// <summary>The value in row <paramref name="row"/>, column <paramref name="column"/>.</summary>
    public double this[int row, int column]
    {
        get
        {
            ArgumentOutOfRangeException.ThrowIfNegative(row);
            ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(row, RowCount);
            ArgumentOutOfRangeException.ThrowIfNegative(column);
            ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(column, ColumnCount);
            return _values[row * ColumnCount + column];
        }
    }

    /// <summary>The value in row <paramref name="row"/> of the column called <paramref name="column"/>.</summary>
    public double this[int row, string column] => this[row, ColumnIndex(column)];

    /// <summary>The parameters of one source, in column order.</summary>
    public ReadOnlySpan<double> Row(int row)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(row);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(row, RowCount);
        return _values.AsSpan(row * ColumnCount, ColumnCount);
    }

    /// <summary>Position of the column called <paramref name="column"/>.</summary>
    /// <exception cref="KeyNotFoundException">The table has no such column.</exception>
    public int ColumnIndex(string column)
    {
        int index = Array.IndexOf(_columns, column);
        return index >= 0 ? index : throw new KeyNotFoundException($"truth table {ClassId} has no column '{column}' (columns: {string.Join(", ", _columns)})");
    }
}
