namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>Which fill-reducing ordering the sparse solver uses.</summary>
public enum SparseOrdering
{
    /// <summary>Try the available orderings and keep the one with the least fill nnz(L) (see the solver's
    /// remarks).</summary>
    Automatic,

    /// <summary>
    /// Geometric nested dissection (needs positions of the unknowns); approximate minimum degree when they are missing.
    /// </summary>
    NestedDissection,

    /// <summary>Approximate minimum degree (AMD; Amestoy, Davis &amp; Duff 1996), which needs no positions.</summary>
    MinimumDegree,
}

/// <summary>
/// The sparse normal-equations solver: forms N = AᵀPA in compressed columns (no dense n×n array), orders it
/// (geometric nested dissection and/or approximate minimum degree, chosen by measured fill), analyses it
/// symbolically once per pattern, and factorises it by the supernodal multifrontal method each time it is called;
/// Qxx entries on the factor's pattern come from selected inversion.
/// </summary>
/// <remarks>
/// The symbolic analysis is cached: a later call whose design rows and weight blocks have the same pattern
/// (Gauss-Newton iterations, blunder-hunt rounds, re-weighting) reuses it and only repeats the numeric phase.
/// <see cref="SparseOrdering.Automatic"/> computes nnz(L) for nested dissection (when positions are known) and
/// for approximate minimum degree (when there are at most <see cref="MinimumDegreeLimit"/> unknowns, or no positions)
/// and keeps the smaller. An instance holds that cache: use one instance per adjustment, from one thread at a time.
/// References: Davis 2006, <i>Direct Methods for Sparse Linear Systems</i> (SIAM); George 1973; Amestoy, Davis
/// &amp; Duff 1996; Liu 1990; Takahashi, Fagan &amp; Chin 1973; Erisman &amp; Tinney 1975 (see docs/sparse-engine.md).
/// </remarks>
public sealed class SparseNormalEquationsSolver : IGeometryAwareSolver
{
    /// <summary>Above this many unknowns the automatic choice does not try minimum degree when nested dissection is
    /// available.</summary>
    public const int MinimumDegreeLimit = 10_000;

    private const string AmdName = "approximate minimum degree";

    private DesignPattern? _pattern;
    private SymbolicCholesky? _symbolic;
    private NormalMatrixAssembly? _assembly;

    /// <summary>Creates the solver.</summary>
    /// <param name="ordering">The ordering policy.</param>
    public SparseNormalEquationsSolver(SparseOrdering ordering = SparseOrdering.Automatic) => Ordering = ordering;

    /// <summary>The ordering policy.</summary>
    public SparseOrdering Ordering { get; }

    /// <summary>The analysis of the last pattern factorised; null before the first call.</summary>
    internal SymbolicCholesky? Symbolic => _symbolic;

    /// <summary>How many symbolic analyses this instance has made (one per distinct pattern).</summary>
    public int AnalysisCount { get; private set; }

    /// <inheritdoc />
    public string Name => _symbolic is null
        ? "sparse supernodal Cholesky (managed)"
        : $"sparse supernodal Cholesky (managed; {_symbolic.OrderingName} ordering)";

    /// <inheritdoc />
    public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights) =>
        Factorize(unknownCount, rows, weights, null);

    /// <inheritdoc />
    public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights,
        UnknownGeometry? geometry)
    {
        if (weights.RowCount != rows.Count)
            throw new ArgumentException($"{rows.Count} design rows but {weights.RowCount} weighted rows");
        if (_pattern is null || !_pattern.Matches(unknownCount, rows, weights))
        {
            var graph = AdjacencyGraph.FromNormalEquations(unknownCount, rows, weights);
            var (perm, name) = ChooseOrdering(graph, geometry);
            _symbolic = SymbolicCholesky.Analyze(graph, perm, name);
            _assembly = new NormalMatrixAssembly(_symbolic, rows);
            _pattern = new DesignPattern(unknownCount, rows, weights);
            AnalysisCount++;
        }
        return SparseCholeskyFactor.Factorize(_symbolic!, _assembly!, rows, weights);
    }

    private (int[] Perm, string Name) ChooseOrdering(AdjacencyGraph graph, UnknownGeometry? geometry)
    {
        bool geometric = geometry is not null && geometry.UnknownCount == graph.VertexCount && geometry.HasAllPositions;
        if (Ordering == SparseOrdering.MinimumDegree || !geometric)
            return (ApproximateMinimumDegree.Order(graph), AmdName);
        var nd = GeometricNestedDissection.Order(graph, geometry!);
        if (Ordering == SparseOrdering.NestedDissection || graph.VertexCount > MinimumDegreeLimit)
            return (nd, "nested dissection");
        var md = ApproximateMinimumDegree.Order(graph);
        return SymbolicCholesky.CountFill(graph, md) < SymbolicCholesky.CountFill(graph, nd)
            ? (md, AmdName)
            : (nd, "nested dissection");
    }

    /// <summary>A copy of the sparsity pattern of A and of the block structure of P, to detect reuse.</summary>
    private sealed class DesignPattern
    {
        private readonly int _unknowns;
        private readonly int[] _rowStart, _columns, _blockOfRowStart, _blockRows;
        private readonly bool _blockIsRow; // one-row blocks in row order, kept as one array of weights

        public DesignPattern(int unknowns, IReadOnlyList<SparseRow> rows, WeightMatrix weights)
        {
            _unknowns = unknowns;
            _rowStart = new int[rows.Count + 1];
            for (int s = 0; s < rows.Count; s++) _rowStart[s + 1] = _rowStart[s] + rows[s].Columns.Length;
            _columns = new int[_rowStart[rows.Count]];
            for (int s = 0; s < rows.Count; s++) rows[s].Columns.CopyTo(_columns.AsSpan(_rowStart[s]));
            _blockIsRow = weights.BlockIsRow;
            if (_blockIsRow) { _blockOfRowStart = []; _blockRows = []; return; }
            _blockOfRowStart = new int[weights.Blocks.Count + 1];
            for (int b = 0; b < weights.Blocks.Count; b++)
                _blockOfRowStart[b + 1] = _blockOfRowStart[b] + weights.Blocks[b].Size;
            _blockRows = new int[_blockOfRowStart[weights.Blocks.Count]];
            for (int b = 0; b < weights.Blocks.Count; b++)
                weights.Blocks[b].Rows.CopyTo(_blockRows, _blockOfRowStart[b]);
        }

        public bool Matches(int unknowns, IReadOnlyList<SparseRow> rows, WeightMatrix weights)
        {
            if (unknowns != _unknowns || rows.Count + 1 != _rowStart.Length ||
                (_blockIsRow ? weights.Blocks.Count != rows.Count :
                    weights.Blocks.Count + 1 != _blockOfRowStart.Length))
                return false;
            for (int s = 0; s < rows.Count; s++)
                if (!rows[s].Columns.SequenceEqual(_columns.AsSpan(_rowStart[s],
                    _rowStart[s + 1] - _rowStart[s])))
                    return false;
            if (_blockIsRow) return BlocksAreRows(weights);
            for (int b = 0; b < weights.Blocks.Count; b++)
                if (!weights.Blocks[b].Rows.AsSpan().SequenceEqual(_blockRows.AsSpan(_blockOfRowStart[b],
                    _blockOfRowStart[b + 1] - _blockOfRowStart[b])))
                    return false;
            return true;
        }

        /// <summary>True when block b is the one row b, for every b.</summary>
        private static bool BlocksAreRows(WeightMatrix weights)
        {
            if (weights.BlockIsRow) return true;
            for (int b = 0; b < weights.Blocks.Count; b++)
                if (weights.Blocks[b].Rows is not [var r] || r != b) return false;
            return true;
        }
    }
}
