namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Forms the lower triangle of C = P (AᵀPA) Pᵀ column by column, straight into the compressed-column pattern of
/// a <see cref="SymbolicCholesky"/> analysis, without any dense n×n array: column k of C is
/// Σ_{rows s ∋ p[k]} a_s,p[k] Σ_{t ∈ block(s)} P(s, t) a_t, gathered through a row-to-position map.
/// </summary>
/// <remarks>
/// Column-oriented sparse matrix product with a dense accumulator (Gustavson 1978, "Two fast algorithms for
/// sparse matrices", ACM TOMS 4(3):250–269; Davis 2006, §2.8 cs_multiply). Time O(Σ_s |a_s|·|block row lengths|).
/// The plan (transpose of A's pattern) is built once per pattern;
/// <see cref="Assemble(IReadOnlyList{SparseRow}, WeightMatrix)"/> runs per numeric phase.
/// </remarks>
internal sealed class NormalMatrixAssembly
{
    private readonly SymbolicCholesky _symbolic;
    private readonly int[] _atStart, _atRow, _atPos; // Aᵀ pattern: rows s and positions q with A(s, j) at Columns[q]

    /// <summary>Prepares the assembly for rows of the pattern analysed by <paramref name="symbolic"/>.</summary>
    /// <param name="symbolic">The analysis of G(AᵀPA).</param>
    /// <param name="rows">The rows of A (their pattern must be the analysed one).</param>
    /// <exception cref="ArgumentException">When a column is out of range.</exception>
    public NormalMatrixAssembly(SymbolicCholesky symbolic, IReadOnlyList<SparseRow> rows)
    {
        _symbolic = symbolic;
        int n = symbolic.Size;
        _atStart = new int[n + 1];
        for (int s = 0; s < rows.Count; s++)
            foreach (int c in rows[s].Columns)
            {
                if ((uint)c >= (uint)n) throw new ArgumentException($"row {s} names unknown {c}, outside 0..{n - 1}");
                _atStart[c + 1]++;
            }
        for (int j = 0; j < n; j++) _atStart[j + 1] += _atStart[j];
        _atRow = new int[_atStart[n]];
        _atPos = new int[_atStart[n]];
        var put = (int[])_atStart.Clone();
        for (int s = 0; s < rows.Count; s++)
        {
            var cols = rows[s].Columns;
            for (int q = 0; q < cols.Length; q++) { int at = put[cols[q]]++; _atRow[at] = s; _atPos[at] = q; }
        }
    }

    /// <summary>The values of the lower triangle of C, in the analysis' column pattern.</summary>
    /// <param name="rows">The rows of A, with the analysed pattern.</param>
    /// <param name="weights">The block-diagonal P.</param>
    /// <returns>Values aligned with the lower pattern of C (diagonal first in each column).</returns>
    /// <exception cref="InvalidOperationException">When the rows or blocks reach outside the analysed
    /// pattern.</exception>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public double[] Assemble(IReadOnlyList<SparseRow> rows, WeightMatrix weights) =>
        Assemble(rows, weights, sideBySide: true);

    /// <summary>As <see cref="Assemble(IReadOnlyList{SparseRow}, WeightMatrix)"/>; with
    /// <paramref name="sideBySide"/> false, every column on the calling thread (the tests compare the two).</summary>
    internal double[] Assemble(IReadOnlyList<SparseRow> rows, WeightMatrix weights, bool sideBySide)
    {
        var a = rows as SparseRow[] ?? [.. rows];
        var diagonal = weights.DiagonalWeights; // P_ss by row when every block has one row, else null
        var lower = _symbolic.LowerC;
        int n = _symbolic.Size;
        var values = new double[lower.Index.Length];
        // Each column k of C is summed into its own segment of the values, in the same order whoever sums it: on a
        // large system the columns are split in two parts of about equal length, the second summed on another core
        // (the same numbers whatever the schedule; a failure of the first part is the one reported).
        int split = n;
        if (sideBySide && a.Length >= SideBySideRows && Environment.ProcessorCount > 1)
        {
            split = Array.BinarySearch(lower.Start, 0, n + 1, lower.Start[n] / 2);
            if (split < 0) split = ~split;
            split = Math.Clamp(split, 1, n);
        }
        SideBySide.Run(() => Columns(0, split), split < n ? () => Columns(split, n) : null);
        return values;

        void Columns(int from, int to) => AssembleColumns(a, weights, diagonal, values, from, to);
    }

    /// <summary>Rows of A from which the assembly is split between two cores.</summary>
    internal const int SideBySideRows = 4096;

    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private void AssembleColumns(SparseRow[] a, WeightMatrix weights, double[]? diagonal, double[] values, int from,
        int to)
    {
        var lower = _symbolic.LowerC;
        var perm = _symbolic.Perm;
        var iperm = _symbolic.InversePerm;
        int n = _symbolic.Size;
        var position = new int[n];
        var stamp = new int[n];
        Array.Fill(stamp, -1);
        for (int k = from; k < to; k++)
        {
            for (int p = lower.Start[k]; p < lower.Start[k + 1]; p++)
            {
                position[lower.Index[p]] = p; stamp[lower.Index[p]] = k;
            }
            int j = perm[k];
            for (int e = _atStart[j]; e < _atStart[j + 1]; e++)
            {
                int s = _atRow[e];
                double asj = a[s].Values[_atPos[e]];
                if (diagonal is not null)
                {
                    double c = asj * diagonal[s];
                    if (c != 0) Scatter(a[s], c, k, iperm, stamp, position, values);
                    continue;
                }
                var (block, ps) = weights.BlockOf(s);
                for (int t = 0; t < block.Size; t++)
                {
                    double c = asj * block[ps, t];
                    if (c == 0) continue;
                    Scatter(a[block.Rows[t]], c, k, iperm, stamp, position, values);
                }
            }
        }
    }

    /// <summary>Adds c·a_t to the entries of column k of C on or below the diagonal.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private static void Scatter(SparseRow rt, double c, int k, int[] iperm, int[] stamp, int[] position,
        double[] values)
    {
        var columns = rt.Columns;
        var coefficients = rt.Values;
        for (int q = 0; q < columns.Length; q++)
        {
            int i = iperm[columns[q]];
            if (i < k) continue;
            if (stamp[i] != k)
                throw new InvalidOperationException(
                    "The design rows reach outside the analysed pattern of the normal matrix.");
            values[position[i]] += c * coefficients[q];
        }
    }
}
