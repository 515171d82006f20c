namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// A numeric supernodal Cholesky factor of N = AᵀPA (N = Pᵀ S⁻¹ L Lᵀ S⁻¹ P with the fill-reducing permutation P
/// and the Jacobi scale S of its <see cref="SymbolicCholesky"/>): solves with N, and gives entries of Qxx = N⁻¹.
/// Immutable after construction; the selected inverse is computed once, on the first request, thread-safely.
/// </summary>
/// <remarks>
/// A large factor made by <see cref="Factorize"/> computes its selected inverse in place (Z overwrites L; see
/// <see cref="InPlaceCovariance"/>): the adjuster and the statistics ask for entries on the pattern, and a solve
/// asked afterwards (an observation set aside, external reliability, an entry off the pattern, the diagnosis)
/// first factorises N again from the same rows and weights, which gives L bit for bit.
/// </remarks>
/// <remarks>
/// <see cref="InverseEntry"/> is exact (to rounding) on the pattern of L: any (i, j) of unknowns that share a
/// design row or weight block, or that share a point's group when points are kept together by the ordering, lies
/// on it. An entry off the pattern is computed by one solve N x = e_j (O(nnz(L))) and the last such column is
/// cached, so a run of requests in one column costs one solve.
/// </remarks>
internal sealed class SparseCholeskyFactor : INormalFactor, IRecyclableFactor
{
    private double[] _l;
    private readonly double[] _scale;
    private readonly IReadOnlyList<SparseRow>? _rows;
    private readonly WeightMatrix? _weights;
    private bool _recycled;
    private bool _overwritten; // L's storage holds Z: a solve factorises again
    private readonly object _gate = new();
    private double[]? _z;
    private int _cachedColumn = -1;
    private double[]? _cachedSolution;

    internal SparseCholeskyFactor(SymbolicCholesky symbolic, double[] l, double[] scale,
        IReadOnlyList<SparseRow>? rows = null, WeightMatrix? weights = null)
    {
        Symbolic = symbolic; _l = l; _scale = scale; _rows = rows; _weights = weights;
    }

    /// <summary>Factors with at least this many stored values compute their selected inverse in place by default
    /// (64 MiB of L).</summary>
    internal const long InPlaceMinimumEntries = 1L << 23;

    /// <summary>Whether the selected inverse overwrites L (null: when the factor knows its rows and weights and
    /// stores at least <see cref="InPlaceMinimumEntries"/> values). Set before the first request.</summary>
    internal bool? InPlaceCovariance { get; set; }

    /// <summary>Threads for the selected inversion (0: the processor count).</summary>
    internal int InversionThreads { get; set; }

    /// <summary>Estimated work below which the selected inversion keeps the tree on one thread.</summary>
    internal double InversionParallelWork { get; set; } = SelectedInversion.TreeParallelWork;

    /// <summary>How many times L was factorised again after the selected inverse overwrote it.</summary>
    internal int Refactorizations { get; private set; }

    private bool InPlace => _rows is not null && _weights is not null &&
        (InPlaceCovariance ?? Symbolic.StoredEntries >= InPlaceMinimumEntries);

    /// <summary>Factorises C = P (AᵀPA) Pᵀ on an analysed pattern.</summary>
    /// <param name="symbolic">The symbolic analysis of the pattern.</param>
    /// <param name="assembly">The assembly plan for that pattern.</param>
    /// <param name="rows">The rows of A (same pattern as analysed).</param>
    /// <param name="weights">The weights.</param>
    /// <exception cref="SingularNormalMatrixException">When a scaled pivot is not above
    /// <see cref="DenseNormalEquationsSolver.PivotTolerance"/>; names the original column.</exception>
    public static SparseCholeskyFactor Factorize(SymbolicCholesky symbolic, NormalMatrixAssembly assembly,
        IReadOnlyList<SparseRow> rows, WeightMatrix weights)
    {
        var values = assembly.Assemble(rows, weights);
        var (l, scale) = MultifrontalCholesky.Factorize(symbolic, values);
        return new SparseCholeskyFactor(symbolic, l, scale, rows, weights);
    }

    /// <summary>Hands this factor's storage to the next factorisation on the same pattern; the factor is unusable
    /// afterwards (any use throws). For the Gauss-Newton iterations, whose factors are dropped after their step.
    /// </summary>
    /// <returns>True: nothing of the factor's inputs is used again.</returns>
    public bool Recycle()
    {
        lock (_gate)
        {
            if (_recycled) return true;
            _recycled = true;
            var storage = _l;
            _l = [];
            _z = null;
            _cachedSolution = null;
            _cachedColumn = -1;
            if (storage.Length > 0 && !_overwritten) Symbolic.OfferSpare(storage);
            return true;
        }
    }

    /// <summary>L: the factor's values, factorised again when the selected inverse has overwritten them.</summary>
    private double[] Live
    {
        get
        {
            var l = _l;
            if (l.Length > 0 || Symbolic.StoredEntries == 0) return l;
            lock (_gate)
            {
                if (_recycled)
                    throw new InvalidOperationException(
                        "this factor was recycled: its storage now belongs to another factor");
                if (_l.Length == 0 && _overwritten)
                {
                    // same assembly and factorisation as the first time: the same L, bit for bit
                    var values = new NormalMatrixAssembly(Symbolic, _rows!).Assemble(_rows!, _weights!);
                    _l = MultifrontalCholesky.Factorize(Symbolic, values).L;
                    Refactorizations++;
                }
                return _l;
            }
        }
    }

    /// <summary>The selected inverse, computed on the first call (under the gate).</summary>
    private double[] SelectedInverse()
    {
        var z = _z;
        if (z is not null) return z;
        lock (_gate)
        {
            if (_z is not null) return _z;
            var l = Live;
            if (InPlace && l.Length > 0)
            {
                _overwritten = true;
                _l = [];
                _z = SelectedInversion.Compute(Symbolic, l, inPlace: true, InversionThreads, InversionParallelWork);
            }
            else _z = SelectedInversion.Compute(Symbolic, l, inPlace: false, InversionThreads, InversionParallelWork);
            return _z;
        }
    }

    /// <summary>The symbolic analysis this factor was computed on.</summary>
    public SymbolicCholesky Symbolic { get; }

    /// <inheritdoc />
    public int Size => Symbolic.Size;

    /// <inheritdoc />
    public double[] Solve(ReadOnlySpan<double> rhs)
    {
        int n = Size;
        if (rhs.Length != n)
            throw new ArgumentException($"the right-hand side has {rhs.Length} entries for {n} unknowns");
        var perm = Symbolic.Perm;
        var y = new double[n];
        for (int k = 0; k < n; k++) y[k] = rhs[perm[k]] * _scale[k];      // y = S P b
        var l = Live;
        SupernodalTriangularSolve.Forward(Symbolic, l, y);               // y = L \ y
        SupernodalTriangularSolve.Backward(Symbolic, l, y);              // y = Lᵀ \ y
        var x = new double[n];
        for (int k = 0; k < n; k++) x[perm[k]] = y[k] * _scale[k];        // x = Pᵀ S y
        return x;
    }

    /// <summary>True when (i, j) of Qxx lies on the pattern of the factor (an O(log m) look-up, no inverse
    /// needed).</summary>
    /// <param name="i">Unknown index.</param>
    /// <param name="j">Unknown index.</param>
    public bool IsOnPattern(int i, int j)
    {
        int pi = Symbolic.InversePerm[i], pj = Symbolic.InversePerm[j];
        return Symbolic.TryLocate(Math.Max(pi, pj), Math.Min(pi, pj), out _);
    }

    /// <inheritdoc />
    public double InverseEntry(int i, int j)
    {
        int pi = Symbolic.InversePerm[i], pj = Symbolic.InversePerm[j];
        if (Symbolic.TryLocate(Math.Max(pi, pj), Math.Min(pi, pj), out long at))
        {
            var z = SelectedInverse();
            return z[at] * _scale[pi] * _scale[pj];
        }
        lock (_gate)
        {
            if (_cachedColumn != j)
            {
                var e = new double[Size];
                e[j] = 1;
                _cachedSolution = Solve(e);
                _cachedColumn = j;
            }
            return _cachedSolution![i];
        }
    }

    /// <summary>
    /// a Qxx aᵀ for one design row: Σ_p Σ_q a_p a_q Qxx(c_p, c_q) summed in that order, each entry the number
    /// <see cref="InverseEntry"/> gives (bit-identical), with the position of each unordered pair located once.
    /// </summary>
    /// <param name="columns">The row's unknowns.</param>
    /// <param name="values">Its coefficients.</param>
    internal double QuadraticForm(ReadOnlySpan<int> columns, ReadOnlySpan<double> values)
    {
        int n = columns.Length;
        if (n > 16) return QuadraticFormByEntries(columns, values);
        var z = SelectedInverse();
        Span<int> perm = stackalloc int[n];
        Span<long> at = stackalloc long[n * n];
        for (int p = 0; p < n; p++) perm[p] = Symbolic.InversePerm[columns[p]];
        for (int p = 0; p < n; p++)
            for (int q = 0; q <= p; q++)
            {
                if (!Symbolic.TryLocate(Math.Max(perm[p], perm[q]), Math.Min(perm[p], perm[q]), out long o))
                    return QuadraticFormByEntries(columns, values); // off the pattern: entries by solves
                at[(p * n) + q] = o;
                at[(q * n) + p] = o;
            }
        double s = 0;
        for (int p = 0; p < n; p++)
            for (int q = 0; q < n; q++)
                s += values[p] * values[q] * (z[at[(p * n) + q]] * _scale[perm[p]] * _scale[perm[q]]);
        return s;
    }

    private double QuadraticFormByEntries(ReadOnlySpan<int> columns, ReadOnlySpan<double> values)
    {
        double s = 0;
        for (int p = 0; p < columns.Length; p++)
            for (int q = 0; q < columns.Length; q++)
                s += values[p] * values[q] * InverseEntry(columns[p], columns[q]);
        return s;
    }

    /// <summary>Computes the selected inverse now (otherwise done on the first <see cref="InverseEntry"/> on the
    /// pattern).</summary>
    public void ComputeSelectedInverse() => SelectedInverse();
}
