using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra;

namespace NetAdjust.Adjustment.Datum;

/// <summary>
/// The normal-equation factor of a network with datum defect d, in the datum chosen by d conditions Bᵀx = 0.
/// <para>
/// Method: the singular N (null space spanned by the columns of G, A G = 0) is never factorised. Instead d
/// unknowns K, chosen so that G is regular on them, are held by direct observations with weights W:
/// M = N + E_K W E_Kᵀ is positive definite, has the sparsity pattern and the unknowns of N, so any
/// <see cref="INormalEquationsSolver"/> (dense or sparse Cholesky) factorises it. For a consistent right-hand side
/// M⁻¹b is the minimal-constraint solution (x_K = 0), and M⁻¹ = Q_m + H_K W⁻¹ H_Kᵀ with H_K = G (E_KᵀG)⁻¹, which
/// gives the minimal-constraint cofactor Q_m (zero rows and columns at K) entry by entry. The S-transformation S = I −
/// G (BᵀG)⁻¹ Bᵀ then moves both to the wanted datum:
/// x_B = S x_m, Q_B = S Q_m Sᵀ (Baarda 1973, <i>S-transformations and criterion matrices</i>, Netherlands Geodetic
/// Commission, Publ. on Geodesy, New Series 5(1); Koch 1999, §3.4; Caspary 1987, §2.5). With B = G over all
/// coordinates this is the inner-constraint (minimum-trace, pseudo-inverse) solution; with B = E G for a
/// selection E, the minimum trace over a subset; with B the gradients of held quantities, explicit minimal constraints.
/// </para>
/// <para>
/// An entry of Q_B costs one entry of Q_m plus O(d²): Q_B(i,j) = Q_m(i,j) − H_i·W_j − W_i·H_j + H_i K H_jᵀ with
/// H = G (BᵀG)⁻¹, W = Q_m B (d solves, done once) and K = Bᵀ W. Entries of M⁻¹ are asked only where the caller
/// asked for Q_B, so a selected inverse on the pattern of N suffices. Adding G Gᵀ to N instead would fill N densely.
/// </para>
/// </summary>
internal sealed class DatumFactor : INormalFactor, IRecyclableFactor
{
    private readonly INormalFactor _inner;  // factor of M = N + E_K W E_Kᵀ
    private readonly double[][] _g, _b;    // d columns of length u
    private readonly double[,] _h;         // H = G (BᵀG)⁻¹, u×d
    private readonly double[,] _hk;        // H_K = G (E_KᵀG)⁻¹, u×d
    private readonly double[] _w;          // W, the weights of the hold rows
    private double[,]? _wq;                // Q_m B, u×d
    private double[,]? _k;                 // Bᵀ Q_m B, d×d
    private readonly object _gate = new();  // guards the first computation of _wq and _k

    public DatumFactor(INormalFactor inner, double[][] g, double[][] b, double[,] btgInverse, double[,] ekgInverse,
        double[] w)
    {
        _inner = inner; _g = g; _b = b; _w = w;
        int u = inner.Size, d = g.Length;
        _h = Times(g, btgInverse, u, d);
        _hk = Times(g, ekgInverse, u, d);
    }

    private static double[,] Times(double[][] g, double[,] m, int u, int d)
    {
        var r = new double[u, d];
        for (int j = 0; j < u; j++)
            for (int k = 0; k < d; k++)
            {
                double s = 0;
                for (int l = 0; l < d; l++) s += g[l][j] * m[l, k];
                r[j, k] = s;
            }
        return r;
    }

    public int Size => _inner.Size;

    /// <summary>Hands the inner factor's storage to the next factorisation (see
    /// <see cref="IRecyclableFactor"/>).</summary>
    public bool Recycle() => _inner is IRecyclableFactor inner && inner.Recycle();

    private int D => _g.Length;

    /// <summary>y = Q_m b = M⁻¹ b − H_K W⁻¹ H_Kᵀ b: the minimal-constraint solve (zero at the held unknowns).</summary>
    private double[] SolveMinimal(ReadOnlySpan<double> b)
    {
        var y = _inner.Solve(b);
        for (int k = 0; k < D; k++)
        {
            double t = 0;
            for (int j = 0; j < y.Length; j++) t += _hk[j, k] * b[j];
            t /= _w[k];
            for (int j = 0; j < y.Length; j++) y[j] -= _hk[j, k] * t;
        }
        return y;
    }

    /// <summary>Q_m(i, j) = M⁻¹(i, j) − Σ_k H_K(i,k) H_K(j,k) / w_k.</summary>
    private double MinimalEntry(int i, int j)
    {
        double q = _inner.InverseEntry(i, j);
        for (int k = 0; k < D; k++) q -= _hk[i, k] * _hk[j, k] / _w[k];
        return q;
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
        double q = MinimalEntry(i, j);
        for (int k = 0; k < D; k++) q -= (_h[i, k] * _wq![j, k]) + (_wq[i, k] * _h[j, k]);
        for (int k = 0; k < D; k++)
            for (int l = 0; l < D; l++) q += _h[i, k] * _k![k, l] * _h[j, l];
        return q;
    }

    private void EnsureW()
    {
        // computed once, under a lock: the statistics may ask entries from two threads at once
        if (Volatile.Read(ref _wq) is not null) return;
        lock (_gate) MakeW();
    }

    private void MakeW()
    {
        if (_wq is not null) return;
        int u = Size;
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
        Volatile.Write(ref _wq, w);
    }
}
