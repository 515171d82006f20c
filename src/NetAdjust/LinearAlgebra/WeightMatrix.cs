namespace NetAdjust.LinearAlgebra;

/// <summary>
/// One block of a block-diagonal weight matrix: the rows it covers and its dense symmetric positive-definite
/// matrix (row-major, k×k for k rows). A diagonal weight is a block of one row.
/// </summary>
/// <param name="Rows">The observation rows the block covers, distinct.</param>
/// <param name="Matrix">The block of P, row-major, Rows.Length² entries, symmetric.</param>
public sealed record WeightBlock(int[] Rows, double[] Matrix)
{
    /// <summary>The number of rows in the block.</summary>
    public int Size => Rows.Length;

    /// <summary>P_block(a, b).</summary>
    /// <param name="a">Position in <see cref="Rows"/>.</param>
    /// <param name="b">Position in <see cref="Rows"/>.</param>
    public double this[int a, int b] => Matrix[(a * Rows.Length) + b];
}

/// <summary>
/// The weight matrix P of the observations: block diagonal, each row in exactly one block. Diagonal weights
/// (uncorrelated observations) are the common case; correlated groups (e.g. the directions of one setup that
/// share its centering error) are full blocks. Immutable.
/// </summary>
public sealed class WeightMatrix
{
    // null when diagonal and kept as one array (DiagonalWeights; block b is row b, made on request)
    private readonly WeightBlock[]? _blocks;
    private readonly int[]? _blockOfRow;
    private readonly int[]? _positionInBlock;

    /// <summary>A diagonal matrix kept as one array of weights (no block objects per row).</summary>
    private WeightMatrix(double[] diagonal)
    {
        RowCount = diagonal.Length;
        IsDiagonal = true;
        DiagonalWeights = diagonal;
        Blocks = new DiagonalBlocks(diagonal);
    }

    private WeightMatrix(int rowCount, WeightBlock[] blocks)
    {
        RowCount = rowCount;
        _blocks = blocks;
        _blockOfRow = Enumerable.Repeat(-1, rowCount).ToArray();
        _positionInBlock = new int[rowCount];
        for (int b = 0; b < blocks.Length; b++)
        {
            var blk = blocks[b];
            if (blk.Matrix.Length != blk.Size * blk.Size)
                throw new ArgumentException($"weight block {b} has {blk.Matrix.Length} entries for {blk.Size} rows");
            for (int k = 0; k < blk.Size; k++)
            {
                int row = blk.Rows[k];
                if (row < 0 || row >= rowCount)
                    throw new ArgumentException($"weight block {b} names row {row}, outside 0..{rowCount - 1}");
                if (_blockOfRow[row] >= 0) throw new ArgumentException($"row {row} is in two weight blocks");
                _blockOfRow[row] = b;
                _positionInBlock[row] = k;
            }
        }
        for (int i = 0; i < rowCount; i++)
            if (_blockOfRow[i] < 0) throw new ArgumentException($"row {i} has no weight");
        IsDiagonal = blocks.All(b => b.Size == 1);
        if (IsDiagonal)
        {
            DiagonalWeights = new double[rowCount];
            foreach (var b in blocks) DiagonalWeights[b.Rows[0]] = b.Matrix[0];
        }
        Blocks = blocks;
    }

    /// <summary>True when block b is row b (a diagonal matrix kept as one array).</summary>
    internal bool BlockIsRow => _blocks is null;

    /// <summary>P_ii by row when every block has one row (<see cref="IsDiagonal"/>), else null.</summary>
    internal double[]? DiagonalWeights { get; }

    /// <summary>A diagonal weight matrix.</summary>
    /// <param name="weights">The positive weights, one per row.</param>
    public static WeightMatrix Diagonal(ReadOnlySpan<double> weights)
    {
        for (int i = 0; i < weights.Length; i++)
            if (!(weights[i] > 0) || !double.IsFinite(weights[i]))
                throw new ArgumentOutOfRangeException(nameof(weights), $"weight {i} must be positive and finite");
        return new WeightMatrix(weights.ToArray());
    }

    /// <summary>This diagonal matrix kept as one array, with rows of the given weights added after its rows (zero
    /// weights allowed, as for set-aside rows); null when it is not kept as one array.</summary>
    /// <param name="more">The weights of the added rows.</param>
    internal WeightMatrix? WithDiagonalRows(ReadOnlySpan<double> more)
    {
        if (_blocks is null)
        {
            var w = new double[RowCount + more.Length];
            DiagonalWeights!.CopyTo(w, 0);
            more.CopyTo(w.AsSpan(RowCount));
            return new WeightMatrix(w);
        }
        return null;
    }

    /// <summary>A block-diagonal weight matrix.</summary>
    /// <param name="rowCount">The number of rows.</param>
    /// <param name="blocks">The blocks; every row in exactly one.</param>
    /// <exception cref="ArgumentException">When the blocks do not cover each row exactly once.</exception>
    public static WeightMatrix FromBlocks(int rowCount, IEnumerable<WeightBlock> blocks) =>
        new(rowCount, blocks.ToArray());

    /// <summary>
    /// The weight matrix with some rows set aside: those rows get weight zero (they stay in the matrix so row numbers
    /// keep their meaning) and the other rows of their blocks get the weight of the remaining observations alone,
    /// (Σ_kept)⁻¹ = P_kk − P_ke P_ee⁻¹ P_ek (the Schur complement). Diagonal blocks simply lose the excluded rows'
    /// weight.
    /// </summary>
    /// <param name="rows">Rows to set aside (duplicates allowed).</param>
    /// <returns>A new matrix; this one when <paramref name="rows"/> is empty.</returns>
    public WeightMatrix Excluding(IReadOnlyCollection<int> rows)
    {
        if (rows.Count == 0) return this;
        if (_blocks is null)
        {
            // one-row blocks simply lose the set-aside rows' weight
            var w = (double[])DiagonalWeights!.Clone();
            foreach (int r in rows)
                if ((uint)r < (uint)w.Length) w[r] = 0;
            return new WeightMatrix(w);
        }
        var drop = new HashSet<int>(rows);
        var blocks = new WeightBlock[_blocks.Length];
        for (int b = 0; b < _blocks.Length; b++)
        {
            var blk = _blocks[b];
            var e = Enumerable.Range(0, blk.Size).Where(k => drop.Contains(blk.Rows[k])).ToArray();
            if (e.Length == 0) { blocks[b] = blk; continue; }
            var keep = Enumerable.Range(0, blk.Size).Where(k => !drop.Contains(blk.Rows[k])).ToArray();
            var m = new double[blk.Size * blk.Size];
            if (keep.Length > 0)
            {
                // P_ee⁻¹ by Gauss-Jordan on the small excluded sub-block (symmetric positive definite).
                int ne = e.Length;
                var pee = new double[ne * ne];
                for (int i = 0; i < ne; i++) for (int j = 0; j < ne; j++) pee[(i * ne) + j] = blk[e[i], e[j]];
                var inv = SmallInverse(pee, ne);
                foreach (int i in keep)
                    foreach (int j in keep)
                    {
                        double s = blk[i, j];
                        for (int x = 0; x < ne; x++)
                            for (int y = 0; y < ne; y++) s -= blk[i, e[x]] * inv[(x * ne) + y] * blk[e[y], j];
                        m[(i * blk.Size) + j] = s;
                    }
            }
            blocks[b] = new WeightBlock(blk.Rows, m);
        }
        return new WeightMatrix(RowCount, blocks);
    }

    private static double[] SmallInverse(double[] a, int n)
    {
        var m = (double[])a.Clone();
        var inv = new double[n * n];
        for (int i = 0; i < n; i++) inv[(i * n) + i] = 1;
        for (int c = 0; c < n; c++)
        {
            double piv = m[(c * n) + c];
            if (!(Math.Abs(piv) > 0)) throw new ArgumentException("a weight block is singular");
            for (int j = 0; j < n; j++) { m[(c * n) + j] /= piv; inv[(c * n) + j] /= piv; }
            for (int r = 0; r < n; r++)
            {
                if (r == c) continue;
                double f = m[(r * n) + c];
                if (f == 0) continue;
                for (int j = 0; j < n; j++)
                {
                    m[(r * n) + j] -= f * m[(c * n) + j]; inv[(r * n) + j] -= f * inv[(c * n) + j];
                }
            }
        }
        return inv;
    }

    /// <summary>The number of rows.</summary>
    public int RowCount { get; }

    /// <summary>True when every block has one row.</summary>
    public bool IsDiagonal { get; }

    /// <summary>The blocks.</summary>
    public IReadOnlyList<WeightBlock> Blocks { get; }

    /// <summary>The block that holds a row and the row's position in it.</summary>
    /// <param name="row">The row.</param>
    public (WeightBlock Block, int Position) BlockOf(int row) => _blocks is null
        ? (Blocks[row], 0)
        : (_blocks[_blockOfRow![row]], _positionInBlock![row]);

    /// <summary>The index in <see cref="Blocks"/> of the block that holds a row (a diagonal matrix kept as one array
    /// makes a new block object at each request: compare blocks by this index, not by reference).</summary>
    /// <param name="row">The row.</param>
    internal int BlockIndexOf(int row) => _blocks is null ? row : _blockOfRow![row];

    /// <summary>P_ii.</summary>
    /// <param name="row">The row.</param>
    public double DiagonalEntry(int row)
    {
        if (_blocks is null) return DiagonalWeights![row];
        var (b, k) = BlockOf(row);
        return b[k, k];
    }

    /// <summary>The one-row blocks of a diagonal matrix kept as one array, each made when asked for.</summary>
    private sealed class DiagonalBlocks(double[] weights) : IReadOnlyList<WeightBlock>
    {
        public WeightBlock this[int index] => new([index], [weights[index]]);

        public int Count => weights.Length;

        public IEnumerator<WeightBlock> GetEnumerator()
        {
            for (int i = 0; i < weights.Length; i++) yield return this[i];
        }

        System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();
    }

    /// <summary>y = P v.</summary>
    /// <param name="v">A vector of <see cref="RowCount"/> entries.</param>
    public double[] Multiply(ReadOnlySpan<double> v)
    {
        var y = new double[RowCount];
        if (DiagonalWeights is { } w)
        {
            for (int i = 0; i < RowCount; i++)
            {
                double s = 0; // the sum of the one-row block below, in its order
                s += w[i] * v[i];
                y[i] = s;
            }
            return y;
        }
        foreach (var b in _blocks!)
            for (int a = 0; a < b.Size; a++)
            {
                double s = 0;
                for (int c = 0; c < b.Size; c++) s += b[a, c] * v[b.Rows[c]];
                y[b.Rows[a]] = s;
            }
        return y;
    }

    /// <summary>vᵀ P v.</summary>
    /// <param name="v">A vector of <see cref="RowCount"/> entries.</param>
    public double Quadratic(ReadOnlySpan<double> v)
    {
        double s = 0;
        if (DiagonalWeights is { } w)
        {
            for (int i = 0; i < RowCount; i++)
            {
                double pvi = 0; // (P v)_i as Multiply sums it
                pvi += w[i] * v[i];
                s += v[i] * pvi;
            }
            return s;
        }
        var pv = Multiply(v);
        for (int i = 0; i < RowCount; i++) s += v[i] * pv[i];
        return s;
    }
}
