using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;

namespace NetAdjust.Diagnosis;

/// <summary>
/// The algebra of testing a bias model against an adjustment (docs/diagnosis.md): for alternative vectors C
/// (observation space, sparse), ŵ = CᵀPv, M = CᵀP Qvv P C = CᵀPC − (AᵀPC)ᵀ N⁻¹ (AᵀPC) by one solve per column on the
/// result's factor, the estimated bias ∇̂ = −M⁻¹ŵ (v = adjusted − observed), and the residuals after a correction C∇:
/// v′ = v + Qvv P C ∇, so P v′ = P v + P C ∇ − P A N⁻¹ AᵀP C ∇ and v′ᵀPv′ = vᵀPv + 2∇ᵀŵ + ∇ᵀM∇ (exact in the
/// linear model; Teunissen 2000, ch. 3).
/// </summary>
internal sealed class BiasTesting
{
    private readonly AdjustmentResult _result;
    private readonly IReadOnlyList<SparseRow> _rows;
    private readonly WeightMatrix _weights;
    private readonly double[] _v;
    private readonly double[] _pv;
    private readonly double[] _pqp;
    private readonly bool[] _testable;

    public BiasTesting(AdjustmentResult result)
    {
        _result = result;
        _rows = result.DesignRows;
        _weights = result.Weights;
        int m = _rows.Count;
        ObservationCount = result.Observations.Count;
        Sigma0Squared = result.Statistics.AprioriVarianceFactor;
        Sigma0 = Math.Sqrt(Sigma0Squared);
        DegreesOfFreedom = result.Statistics.DegreesOfFreedom;
        GlobalAlpha = result.Statistics.GlobalTest.Alpha;
        _v = Residuals(result, m);
        _pv = _weights.Multiply(_v);
        Vtpv = 0;
        for (int i = 0; i < m; i++) Vtpv += _v[i] * _pv[i];
        _pqp = new double[m];
        _testable = new bool[m];
        double minRedundancy = result.Options.Analysis.UncontrolledRedundancy;
        foreach (var blk in _weights.Blocks) Block(blk, minRedundancy);
    }

    public int ObservationCount { get; }

    public double Sigma0Squared { get; }

    public double Sigma0 { get; }

    public int DegreesOfFreedom { get; }

    public double GlobalAlpha { get; }

    /// <summary>vᵀPv of the null model.</summary>
    public double Vtpv { get; }

    public AdjustmentResult Result => _result;

    /// <summary>True when the row carries weight and has a redundancy number at least the analysis' limit.</summary>
    public bool Testable(int row) => _testable[row];

    /// <summary>Baarda's w of a row, (Pv)ᵢ / (σ0 √(P Qvv P)ᵢᵢ), signed as in the analysis.</summary>
    public double W(int row) => _pv[row] / (Sigma0 * Math.Sqrt(_pqp[row]));

    /// <summary>The largest |w| over the testable rows.</summary>
    public double MaxAbsW()
    {
        double max = 0;
        for (int i = 0; i < _pv.Length; i++) if (_testable[i]) max = Math.Max(max, Math.Abs(W(i)));
        return max;
    }

    private void Block(WeightBlock blk, double minRedundancy)
    {
        var kept = Enumerable.Range(0, blk.Size).Where(a => Enumerable.Range(0, blk.Size).Any(b => blk[a, b] != 0))
            .ToArray();
        int k = kept.Length;
        if (k == 0) return;
        var pk = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(k, k, (a, b) => blk[kept[a], kept[b]]);
        var pinv = pk.Inverse();
        var qvv = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(k, k);
        for (int a = 0; a < k; a++)
            for (int b = 0; b <= a; b++)
            {
                // Qvv = P⁻¹ − A Qxx Aᵀ on this block
                double q = pinv[a, b] - AQA(_rows[blk.Rows[kept[a]]], _rows[blk.Rows[kept[b]]]);
                qvv[a, b] = q; qvv[b, a] = q;
            }
        var pqp = pk * qvv * pk;
        var qp = qvv * pk;
        for (int a = 0; a < k; a++)
        {
            int row = blk.Rows[kept[a]];
            _pqp[row] = pqp[a, a];
            _testable[row] = pqp[a, a] > 0 && qp[a, a] >= minRedundancy;
        }
    }

    private double AQA(SparseRow a, SparseRow b)
    {
        if (!_result.HasFactor) return 0;
        double s = 0;
        for (int p = 0; p < a.Columns.Length; p++)
            for (int q = 0; q < b.Columns.Length; q++)
                s += a.Values[p] * b.Values[q] * _result.Cofactor(a.Columns[p], b.Columns[q]);
        return s;
    }

    /// <summary>v of every design row: the observations' residuals, then the weighted-control components' (the
    /// adjuster's order: points in input order, E, N, H when weighted and free).</summary>
    private static double[] Residuals(AdjustmentResult result, int m)
    {
        var v = new double[m];
        int n = result.Observations.Count;
        for (int i = 0; i < n; i++) v[i] = result.Observations[i].Residual;
        int k = n;
        foreach (var ap in result.Points)
        {
            var p = ap.Input;
            if (p.SdE is not null && result.Unknowns.IndexOf(p.Id, Parameter.E) >= 0 && k < m)
                v[k++] = ap.E!.Value - p.E!.Value;
            if (p.SdN is not null && result.Unknowns.IndexOf(p.Id, Parameter.N) >= 0 && k < m)
                v[k++] = ap.N!.Value - p.N!.Value;
            if (p.SdH is not null && result.Unknowns.IndexOf(p.Id, Parameter.H) >= 0 && k < m)
                v[k++] = ap.H!.Value - p.H!.Value;
        }
        return v;
    }

    /// <summary>Prepares an alternative: the columns of C as sparse vectors (row → entry).</summary>
    public Alternative Prepare(IReadOnlyList<IReadOnlyDictionary<int, double>> columns)
    {
        int q = columns.Count, u = _result.Unknowns.Count;
        var pc = new Dictionary<int, double>[q];
        var atpc = new double[q][];
        var h = new double[q][];
        var what = new double[q];
        for (int k = 0; k < q; k++)
        {
            pc[k] = new Dictionary<int, double>();
            foreach (var (row, c) in columns[k])
            {
                if (c == 0) continue;
                var (blk, pos) = _weights.BlockOf(row);
                for (int b = 0; b < blk.Size; b++)
                {
                    double pbc = blk[b, pos] * c; // (P c)_b = Σ P_b,row c_row
                    if (pbc == 0) continue;
                    int r = blk.Rows[b];
                    pc[k][r] = pc[k].GetValueOrDefault(r) + pbc;
                }
            }
            atpc[k] = new double[u];
            foreach (var (r, y) in pc[k])
            {
                var a = _rows[r];
                for (int p = 0; p < a.Columns.Length; p++) atpc[k][a.Columns[p]] += a.Values[p] * y; // AᵀPc
            }
            h[k] = _result.HasFactor && u > 0 ? _result.Solve(atpc[k]) : new double[u]; // N⁻¹AᵀPc
            foreach (var (r, y) in pc[k]) what[k] += y * _v[r];                          // ŵ = cᵀPv
        }
        var mm = new double[q, q];
        for (int k = 0; k < q; k++)
            for (int l = 0; l < q; l++)
            {
                double s = 0;
                foreach (var (r, y) in pc[k]) s += y * columns[l].GetValueOrDefault(r);  // cₖᵀPcₗ
                for (int j = 0; j < u; j++) s -= atpc[k][j] * h[l][j];                   // − (AᵀPcₖ)ᵀN⁻¹AᵀPcₗ
                mm[k, l] = s;
            }
        double cpc = 0;
        for (int k = 0; k < q; k++) foreach (var (r, y) in pc[k]) cpc += y * columns[k].GetValueOrDefault(r);
        return new Alternative(columns, pc, atpc, h, what, mm, cpc);
    }

    /// <summary>The residual fit after the correction C∇: vᵀPv′ and the largest |w′| over the testable rows.</summary>
    public (double Vtpv, double MaxAbsW) After(Alternative a, ReadOnlySpan<double> nabla)
    {
        int m = _rows.Count, u = _result.Unknowns.Count;
        var pvAfter = (double[])_pv.Clone();
        var y = new double[u];
        for (int k = 0; k < a.Q; k++)
        {
            foreach (var (r, g) in a.PC[k]) pvAfter[r] += g * nabla[k];        // + P C ∇
            for (int j = 0; j < u; j++) y[j] += a.H[k][j] * nabla[k];          // y = N⁻¹AᵀPC∇
        }
        var ay = new double[m];
        for (int i = 0; i < m; i++) ay[i] = _rows[i].Dot(y);
        var pay = _weights.Multiply(ay);
        for (int i = 0; i < m; i++) pvAfter[i] -= pay[i];                     // − P A N⁻¹AᵀPC∇
        double max = 0;
        for (int i = 0; i < m; i++)
            if (_testable[i]) max = Math.Max(max, Math.Abs(pvAfter[i]) / (Sigma0 * Math.Sqrt(_pqp[i])));
        double omega = Vtpv;
        for (int k = 0; k < a.Q; k++)
        {
            omega += 2 * nabla[k] * a.What[k];
            for (int l = 0; l < a.Q; l++) omega += nabla[k] * a.M[k, l] * nabla[l];
        }
        return (Math.Max(0, omega), max);
    }

    /// <summary>P(χ²(r′) ≥ vᵀPv′/σ0²): the p-value of the global statistic after a correction.</summary>
    public double PValue(double vtpvAfter, int dof) =>
        dof <= 0 ? (vtpvAfter <= 1e-12 * Math.Max(1, Vtpv) ? 1 : 0)
            : 1 - ChiSquared.CDF(dof, vtpvAfter / Sigma0Squared);

    /// <summary>True when vᵀPv′/σ0² stays below the upper bound of the global test (the adjustment's α, r′ degrees
    /// of freedom): a correction is not blamed for a small vᵀPv.</summary>
    public bool GlobalPasses(double vtpvAfter, int dof) =>
        GlobalTest.Compute(vtpvAfter, Sigma0Squared, dof, GlobalAlpha) is var g && (g.Upper is null
            || g.Statistic <= g.Upper);

    /// <summary>cᵀP Qvv P d of two prepared one-column alternatives.</summary>
    public static double Inner(Alternative a, Alternative b)
    {
        double s = 0;
        foreach (var (r, y) in a.PC[0]) s += y * b.Columns[0].GetValueOrDefault(r);
        for (int j = 0; j < a.H[0].Length; j++) s -= a.AtPC[0][j] * b.H[0][j];
        return s;
    }
}

/// <summary>A prepared alternative model: C and the products the tests need.</summary>
/// <param name="Columns">The columns of C (row → entry).</param>
/// <param name="PC">P C, sparse.</param>
/// <param name="AtPC">AᵀP C, dense per column.</param>
/// <param name="H">N⁻¹AᵀP C per column.</param>
/// <param name="What">ŵ = CᵀPv.</param>
/// <param name="M">CᵀP Qvv P C.</param>
/// <param name="CPC">trace of CᵀPC, the scale against which M is judged zero.</param>
internal sealed record Alternative(IReadOnlyList<IReadOnlyDictionary<int, double>> Columns,
    Dictionary<int, double>[] PC, double[][] AtPC, double[][] H, double[] What, double[,] M, double CPC)
{
    public int Q => Columns.Count;

    /// <summary>True when P Qvv P C vanishes (relative 1e-10): the data cannot see this bias.</summary>
    public bool Untestable
    {
        get
        {
            double tr = 0;
            for (int k = 0; k < Q; k++) tr += M[k, k];
            return !(tr > 1e-10 * CPC);
        }
    }
}
