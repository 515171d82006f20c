namespace NetAdjust.LinearAlgebra;

/// <summary>
/// One row of the design matrix A in sparse form: the columns (unknown indices) it touches and the coefficients.
/// Columns are distinct; their order carries no meaning. A row is a view: the rows of one linearisation share one
/// array of columns and one array of coefficients (compressed rows), so a network of millions of observations holds
/// no object per row.
/// </summary>
public readonly struct SparseRow
{
    private readonly int[] _columns;
    private readonly double[] _values;
    private readonly int _start, _count;

    /// <summary>A row of its own arrays.</summary>
    /// <param name="columns">The unknown indices, each in [0, unknown count).</param>
    /// <param name="values">The coefficients ∂f/∂x for each column.</param>
    /// <exception cref="ArgumentException">When the two arrays differ in length.</exception>
    public SparseRow(int[] columns, double[] values)
    {
        ArgumentNullException.ThrowIfNull(columns);
        ArgumentNullException.ThrowIfNull(values);
        if (columns.Length != values.Length)
            throw new ArgumentException($"A row has {columns.Length} columns but {values.Length} coefficients.",
                nameof(values));
        (_columns, _values, _start, _count) = (columns, values, 0, columns.Length);
    }

    /// <summary>A row stored at [<paramref name="start"/>, start + <paramref name="count"/>) of arrays shared with
    /// other rows (checked by the caller).</summary>
    internal SparseRow(int[] columns, double[] values, int start, int count) =>
        (_columns, _values, _start, _count) = (columns, values, start, count);

    /// <summary>The unknown indices, each in [0, unknown count).</summary>
    public ReadOnlySpan<int> Columns => new(_columns, _start, _count);

    /// <summary>The coefficients ∂f/∂x for each column.</summary>
    public ReadOnlySpan<double> Values => new(_values, _start, _count);

    /// <summary>The arrays the row is stored in (for the tests of the compact layout).</summary>
    internal (int[] Columns, double[] Values) Storage => (_columns, _values);

    /// <summary>The number of columns.</summary>
    public int Count => _count;

    /// <summary>The dot product of this row with a dense vector: a·x.</summary>
    /// <param name="x">A vector of length ≥ the largest column + 1.</param>
    public double Dot(ReadOnlySpan<double> x)
    {
        var columns = Columns;
        var values = Values;
        double s = 0;
        for (int k = 0; k < columns.Length; k++) s += values[k] * x[columns[k]];
        return s;
    }
}
