namespace NetAdjust.LinearAlgebra;

/// <summary>
/// One row of the design matrix A in sparse form: the columns (unknown indices) it touches and the coefficients.
/// Columns are distinct; their order carries no meaning.
/// </summary>
/// <param name="Columns">The unknown indices, each in [0, unknown count).</param>
/// <param name="Values">The coefficients ∂f/∂x for each column.</param>
public readonly record struct SparseRow(int[] Columns, double[] Values)
{
    /// <summary>The dot product of this row with a dense vector: a·x.</summary>
    /// <param name="x">A vector of length ≥ the largest column + 1.</param>
    public double Dot(ReadOnlySpan<double> x)
    {
        double s = 0;
        for (int k = 0; k < Columns.Length; k++) s += Values[k] * x[Columns[k]];
        return s;
    }
}
