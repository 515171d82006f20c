namespace NetAdjust.LinearAlgebra;

/// <summary>
/// Forms and factorises the normal matrix N = AᵀPA of a least-squares problem (P block diagonal). Implementations:
/// <see cref="DenseNormalEquationsSolver"/> now; a sparse engine plugs in behind the same interface.
/// </summary>
public interface INormalEquationsSolver
{
    /// <summary>A short name for reports (e.g. "dense Cholesky (managed)").</summary>
    string Name { get; }

    /// <summary>Forms N = AᵀPA and factorises it.</summary>
    /// <param name="unknownCount">The number of unknowns (columns of A).</param>
    /// <param name="rows">The rows of A.</param>
    /// <param name="weights">The weight matrix P (block diagonal), one row per row of A.</param>
    /// <returns>The factor, able to solve with N and to give entries of N⁻¹.</returns>
    /// <exception cref="SingularNormalMatrixException">When N is numerically singular; names the first failing
    /// column.</exception>
    INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights);
}

/// <summary>A factorised normal matrix N.</summary>
public interface INormalFactor
{
    /// <summary>The order of N.</summary>
    int Size { get; }

    /// <summary>Solves N x = b.</summary>
    /// <param name="rhs">b, of length <see cref="Size"/>.</param>
    /// <returns>x.</returns>
    double[] Solve(ReadOnlySpan<double> rhs);

    /// <summary>The entry (i, j) of Qxx = N⁻¹.</summary>
    /// <param name="i">Row index in [0, Size).</param>
    /// <param name="j">Column index in [0, Size).</param>
    double InverseEntry(int i, int j);
}

/// <summary>A factor whose storage can be handed to the next factorisation once its owner is done with it (the
/// Gauss-Newton iterations' factors); it is unusable afterwards.</summary>
internal interface IRecyclableFactor
{
    /// <summary>Hands the storage on; any later use of the factor throws.</summary>
    /// <returns>True when the factor was made by the sparse engine and keeps nothing its owner may reuse (the rows
    /// it was made from included); false when it wraps a factor of another kind, which may still hold them.</returns>
    bool Recycle();
}

/// <summary>The normal matrix is numerically singular: some unknown is not determined by the observations and
/// constraints.</summary>
public sealed class SingularNormalMatrixException : Exception
{
    /// <summary>Creates the exception.</summary>
    /// <param name="column">The column at which the factorisation found no usable pivot.</param>
    public SingularNormalMatrixException(int column) : base($"The normal matrix is singular at column {column}.") =>
        Column = column;

    /// <summary>The column at which the factorisation found no usable pivot.</summary>
    public int Column { get; }
}
