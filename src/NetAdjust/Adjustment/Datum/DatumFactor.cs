using NetAdjust.LinearAlgebra;

namespace NetAdjust.Adjustment;

/// <summary>
/// The normal-equation factor of a network with datum defect d, in the datum chosen by d conditions Bᵀx = 0.
/// <para>
/// Method: the singular N (null space spanned by the columns of G, A G = 0) is never factorised. Instead d
/// unknowns chosen so that G is regular on them are held (their columns removed): the reduced N_m is positive
/// definite and has the sparsity of N, so any <see cref="INormalEquationsSolver"/> (dense or sparse Cholesky)
/// factorises it. That gives the minimal-constraint solution and its cofactor Q_m (zero rows and columns at the
/// held unknowns). The S-transformation S = I − G (BᵀG)⁻¹ Bᵀ then moves both to the wanted datum:
/// x_B = S x_m, Q_B = S Q_m Sᵀ (Baarda 1973, <i>S-transformations and criterion matrices</i>, Netherlands Geodetic
/// Commission, Publ. on Geodesy, New Series 5(1); Koch 1999, §3.4; Caspary 1987, §2.5). With B = G over all
/// coordinates this is the inner-constraint (minimum-trace, pseudo-inverse) solution; with B = E G for a
/// selection E, the minimum trace over a subset; with B the gradients of held quantities, explicit minimal constraints.
/// </para>
/// <para>
/// An entry of Q_B costs one entry of Q_m plus O(d²): Q_B(i,j) = Q_m(i,j) − H_i·W_j − W_i·H_j + H_i K H_jᵀ with
/// H = G (BᵀG)⁻¹, W = Q_m B (d solves, done once) and K = Bᵀ W. Entries of Q_m are asked only where the caller
/// asked for Q_B, so a selected inverse on the pattern of N suffices. Adding G Gᵀ to N instead would fill N densely.
/// </para>
/// </summary>
internal sealed class DatumFactor : INormalFactor
{
    private readonly INormalFactor _inner;
    private readonly int[] _reduced;      // full index → reduced index, −1 when held
    private readonly double[][] _g, _b;    // d columns of length u
    private readonly double[,] _h;         // H = G (BᵀG)⁻¹, u×d
    private double[,]? _w;                 // W = Q_m B, u×d
    private double[,]? _k;                 // K = Bᵀ W, d×d

    public DatumFactor(INormalFactor inner, int[] reduced, double[][] g, double[][] b, double[,] btgInverse)
    {
        _inner = inner; _reduced = reduced; _g = g; _b = b;
        int u = reduced.Length, d = g.Length;
        _h = new double[u, d];
        for (int j = 0; j < u; j++)
            for (int k = 0; k < d; k++)
            {
                double s = 0;
                for (int l = 0; l < d; l++) s += g[l][j] * btgInverse[l, k];
                _h[j, k] = s;
            }
    }

    public int Size => _reduced.Length;

    private int D => _g.Length;

    /// <summary>y = Q_m b: the minimal-constraint solve (zero at held unknowns).</summary>
    private double[] SolveMinimal(ReadOnlySpan<double> b)
    {
        var rb = new double[_inner.Size];
        for (int j = 0; j < _reduced.Length; j++) if (_reduced[j] >= 0) rb[_reduced[j]] = b[j];
        var ry = _inner.Solve(rb);
        var y = new double[_reduced.Length];
        for (int j = 0; j < _reduced.Length; j++) if (_reduced[j] >= 0) y[j] = ry[_reduced[j]];
        return y;
    }

    private double[] BtX(double[] x)
    {
        var r = new double[D];
        for (int k = 0; k < D; k++)
            for (int j = 0; j < x.Length; j++) r[k] += _b[k][j] * x[j];
        return r;
    }

    /// <summary>x = y + H (c − Bᵀ y) with y = Q_m b: the solution that meets the datum conditions Bᵀx = c.</summary>
    public double[] SolveWithConditions(ReadOnlySpan<double> b, double[] c)
    {
        var y = SolveMinimal(b);
        var bty = BtX(y);
        for (int j = 0; j < y.Length; j++)
            for (int k = 0; k < D; k++) y[j] += _h[j, k] * (c[k] - bty[k]);
        return y;
    }

    /// <summary>x = S Q_m Sᵀ b = Q_B b.</summary>
    public double[] Solve(ReadOnlySpan<double> rhs)
    {
        // Sᵀ b = b − B Hᵀ b
        var b = rhs.ToArray();
        var htb = new double[D];
        for (int k = 0; k < D; k++)
            for (int j = 0; j < b.Length; j++) htb[k] += _h[j, k] * b[j];
        for (int j = 0; j < b.Length; j++)
            for (int k = 0; k < D; k++) b[j] -= _b[k][j] * htb[k];
        return SolveWithConditions(b, new double[D]);
    }

    public double InverseEntry(int i, int j)
    {
        EnsureW();
        double q = _reduced[i] >= 0 && _reduced[j] >= 0 ? _inner.InverseEntry(_reduced[i], _reduced[j]) : 0;
        for (int k = 0; k < D; k++) q -= (_h[i, k] * _w![j, k]) + (_w[i, k] * _h[j, k]);
        for (int k = 0; k < D; k++)
            for (int l = 0; l < D; l++) q += _h[i, k] * _k![k, l] * _h[j, l];
        return q;
    }

    private void EnsureW()
    {
        if (_w is not null) return;
        int u = _reduced.Length;
        var w = new double[u, D];
        for (int k = 0; k < D; k++)
        {
            var col = SolveMinimal(_b[k]);
            for (int j = 0; j < u; j++) w[j, k] = col[j];
        }
        var kk = new double[D, D];
        for (int a = 0; a < D; a++)
            for (int c = 0; c < D; c++)
                for (int j = 0; j < u; j++) kk[a, c] += _b[a][j] * w[j, c];
        _k = kk;
        _w = w;
    }
}
