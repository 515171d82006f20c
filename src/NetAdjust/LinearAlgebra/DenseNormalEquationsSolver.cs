namespace NetAdjust.LinearAlgebra;

/// <summary>
/// Dense normal equations: N = AᵀPA in full storage, Jacobi-scaled to unit diagonal, then Cholesky
/// factorised (N_s = L Lᵀ; Golub &amp; Van Loan, <i>Matrix Computations</i>, 4th ed., Alg. 4.2.1).
/// O(u²) memory and O(u³) time: for small networks, and as the test oracle for the sparse engine.
/// </summary>
/// <remarks>
/// Failure contract: a pivot of the scaled matrix below <see cref="PivotTolerance"/> (relative to the unit
/// diagonal) is reported as <see cref="SingularNormalMatrixException"/> naming its column. With scaling, an exact
/// rank defect gives pivots of order 1e−15; a legitimate network with a condition number below 1e10 stays above.
/// </remarks>
public sealed class DenseNormalEquationsSolver : INormalEquationsSolver
{
    /// <summary>The smallest accepted pivot of the unit-diagonal scaled normal matrix.</summary>
    public const double PivotTolerance = 1e-11;

    /// <inheritdoc />
    public string Name => "dense Cholesky (managed)";

    /// <inheritdoc />
    public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights)
    {
        int n = unknownCount;
        var a = new double[n * n];
        // N = Σ_blocks A_Bᵀ P_B A_B, lower triangle only.
        foreach (var block in weights.Blocks)
            for (int s = 0; s < block.Size; s++)
            {
                var rs = rows[block.Rows[s]];
                for (int t = 0; t < block.Size; t++)
                {
                    double w = block[s, t];
                    if (w == 0) continue;
                    var rt = rows[block.Rows[t]];
                    for (int p = 0; p < rs.Columns.Length; p++)
                    {
                        int i = rs.Columns[p];
                        double wv = w * rs.Values[p];
                        for (int q = 0; q < rt.Columns.Length; q++)
                        {
                            int j = rt.Columns[q];
                            if (j <= i) a[(i * n) + j] += wv * rt.Values[q];
                        }
                    }
                }
            }
        return Factor.Create(n, a);
    }

    /// <summary>The dense factor: scale s (N = S⁻¹ N_s S⁻¹ with S = diag(1/√N_ii)) and L with N_s = L Lᵀ.</summary>
    private sealed class Factor : INormalFactor
    {
        private readonly int _n;
        private readonly double[] _l;      // lower triangle of L, row-major n×n
        private readonly double[] _scale;  // s_i = 1/√N_ii
        private double[]? _inverse;        // N_s⁻¹, full, computed on first request

        private Factor(int n, double[] l, double[] scale) { _n = n; _l = l; _scale = scale; }

        public int Size => _n;

        public static Factor Create(int n, double[] a)
        {
            var scale = new double[n];
            for (int i = 0; i < n; i++)
            {
                double d = a[(i * n) + i];
                if (!(d > 0)) throw new SingularNormalMatrixException(i);
                scale[i] = 1.0 / Math.Sqrt(d);
            }
            for (int i = 0; i < n; i++)
                for (int j = 0; j <= i; j++) a[(i * n) + j] *= scale[i] * scale[j];

            for (int j = 0; j < n; j++)
            {
                // d = N_jj − Σ_k<j L_jk²
                double d = a[(j * n) + j];
                for (int k = 0; k < j; k++) d -= a[(j * n) + k] * a[(j * n) + k];
                if (!(d > PivotTolerance)) throw new SingularNormalMatrixException(j);
                double ljj = Math.Sqrt(d);
                a[(j * n) + j] = ljj;
                for (int i = j + 1; i < n; i++)
                {
                    // L_ij = (N_ij − Σ_k<j L_ik L_jk) / L_jj
                    double s = a[(i * n) + j];
                    for (int k = 0; k < j; k++) s -= a[(i * n) + k] * a[(j * n) + k];
                    a[(i * n) + j] = s / ljj;
                }
            }
            return new Factor(n, a, scale);
        }

        public double[] Solve(ReadOnlySpan<double> rhs)
        {
            int n = _n;
            var y = new double[n];
            for (int i = 0; i < n; i++) y[i] = rhs[i] * _scale[i];
            // y = L \ y
            for (int i = 0; i < n; i++)
            {
                double s = y[i];
                for (int k = 0; k < i; k++) s -= _l[(i * n) + k] * y[k];
                y[i] = s / _l[(i * n) + i];
            }
            // y = Lᵀ \ y
            for (int i = n - 1; i >= 0; i--)
            {
                double s = y[i];
                for (int k = i + 1; k < n; k++) s -= _l[(k * n) + i] * y[k];
                y[i] = s / _l[(i * n) + i];
            }
            for (int i = 0; i < n; i++) y[i] *= _scale[i];
            return y;
        }

        public double InverseEntry(int i, int j)
        {
            // made once even when asked from two threads at once (a second computation would give the same numbers)
            var inverse = LazyInitializer.EnsureInitialized(ref _inverse, ComputeInverse);
            return inverse[(i * _n) + j] * _scale[i] * _scale[j];
        }

        private double[] ComputeInverse()
        {
            int n = _n;
            // Linv = L⁻¹ (lower triangular), then N_s⁻¹ = Linvᵀ Linv.
            var li = new double[n * n];
            for (int j = 0; j < n; j++)
            {
                li[(j * n) + j] = 1.0 / _l[(j * n) + j];
                for (int i = j + 1; i < n; i++)
                {
                    double s = 0;
                    for (int k = j; k < i; k++) s -= _l[(i * n) + k] * li[(k * n) + j];
                    li[(i * n) + j] = s / _l[(i * n) + i];
                }
            }
            var inv = new double[n * n];
            for (int i = 0; i < n; i++)
                for (int j = 0; j <= i; j++)
                {
                    double s = 0;
                    for (int k = i; k < n; k++) s += li[(k * n) + i] * li[(k * n) + j];
                    inv[(i * n) + j] = s;
                    inv[(j * n) + i] = s;
                }
            return inv;
        }
    }
}
