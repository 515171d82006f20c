using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.Diagnosis;

/// <summary>
/// The adjustment with a group G of observations set aside (weight zero), and what the group's booked values say
/// against it: their misclosures e = observed − computed at its coordinates and the cofactor of those,
/// Qe = Σ_GG/σ0² + A_G Qxx A_Gᵀ. A large blunder in G does not distort this adjustment, so the bias model is judged
/// at a sound linearisation point. Putting G back with a correction C∇ gives, in the linear model,
/// vᵀPv′ = vᵀPv_G + (e − C∇)ᵀQe⁻¹(e − C∇) and the best ∇̂ = (CᵀQe⁻¹C)⁻¹CᵀQe⁻¹e with covariance σ0²(CᵀQe⁻¹C)⁻¹:
/// for one observation these are its predicted residual and Baarda's w (Baarda 1968; Teunissen 2000, ch. 4).
/// </summary>
internal sealed class LeaveOut
{
    private readonly int[] _group;
    private readonly Vector<double> _e;
    private readonly Matrix<double> _qe;
    private readonly Matrix<double> _qeInv;
    private readonly double _sigma0;

    private LeaveOut(AdjustmentResult result, int[] group, Vector<double> e, Matrix<double> qe, double vtpv,
        double maxW, double sigma0)
    {
        Result = result; _group = group; _e = e; _qe = qe; _qeInv = qe.Inverse();
        Vtpv = vtpv; MaxW = maxW; _sigma0 = sigma0;
    }

    /// <summary>The adjustment without the group.</summary>
    public AdjustmentResult Result { get; }

    /// <summary>vᵀPv of the adjustment without the group.</summary>
    public double Vtpv { get; }

    /// <summary>The largest |w| of the adjustment without the group.</summary>
    public double MaxW { get; }

    /// <summary>Sets the group aside and adjusts; null when that adjustment fails (e.g. a datum defect) or Qe is
    /// singular.</summary>
    public static LeaveOut? Of(BiasTesting t, IReadOnlyList<int> group, AdjustmentOptions options)
    {
        var r = t.Result;
        var net = r.Network;
        var obs = net.Observations.ToArray();
        foreach (int j in group) obs[j] = obs[j] with { Excluded = true };
        AdjustmentResult res;
        try { res = Adjuster.Adjust(new SurveyNetwork(net.Name, net.Points, obs), options); }
        catch (NetAdjustException) { return null; }
        int g = group.Count;
        var e = Vector<double>.Build.Dense(g, k => -res.Observations[group[k]].Residual);
        var qe = Matrix<double>.Build.Dense(g, g);
        // Σ_GG / σ0² = (P⁻¹)_GG from the null model's weight blocks
        for (int a = 0; a < g; a++)
        {
            var (blk, pa) = r.Weights.BlockOf(group[a]);
            var p = Matrix<double>.Build.Dense(blk.Size, blk.Size, (i, j) => blk[i, j]);
            if (!(p[pa, pa] > 0)) return null;
            var pinv = p.Inverse();
            for (int b = 0; b < g; b++)
            {
                int pb = r.Weights.BlockOf(group[b]).Position;
                if (r.Weights.BlockIndexOf(group[a]) == r.Weights.BlockIndexOf(group[b])) qe[a, b] = pinv[pa, pb];
            }
        }
        if (res.HasFactor)
        {
            int u = res.Unknowns.Count;
            var sol = new double[g][];
            for (int b = 0; b < g; b++)
            {
                var row = res.DesignRows[group[b]];
                var x = new double[u];
                for (int c = 0; c < row.Columns.Length; c++) x[row.Columns[c]] += row.Values[c];
                sol[b] = res.Solve(x); // Qxx aᵀ
            }
            for (int a = 0; a < g; a++)
                for (int b = 0; b < g; b++) qe[a, b] += res.DesignRows[group[a]].Dot(sol[b]); // + A Qxx Aᵀ
        }
        if (!(qe.Determinant() > 0)) return null;
        var bt = new BiasTesting(res);
        return new LeaveOut(res, [.. group], e, qe, res.Statistics.Vtpv, bt.MaxAbsW(), t.Sigma0);
    }

    private Vector<double> Column(IReadOnlyDictionary<int, double> c) =>
        Vector<double>.Build.Dense(_group.Length, k => c.GetValueOrDefault(_group[k]));

    /// <summary>∇̂ = (cᵀQe⁻¹c)⁻¹cᵀQe⁻¹e and its standard deviation σ0 (cᵀQe⁻¹c)^(−1/2); null when c vanishes.</summary>
    public (double Size, double Sd)? Estimate(IReadOnlyDictionary<int, double> c)
    {
        var cv = Column(c);
        double q = cv * (_qeInv * cv);
        if (!(q > 0)) return null;
        return ((cv * (_qeInv * _e)) / q, _sigma0 / Math.Sqrt(q));
    }

    /// <summary>vᵀPv after putting the group back corrected by c∇, and the largest |w| then: that of the adjustment
    /// without the group, or of a restored observation's standardised remaining misclosure, whichever is larger
    /// (exact for the suspect itself when the group is one observation; the confirmation re-adjusts).</summary>
    public (double Vtpv, double MaxW) After(IReadOnlyDictionary<int, double> c, double nabla)
    {
        var rest = _e - (Column(c) * nabla);
        double omega = Vtpv + (rest * (_qeInv * rest));
        double max = MaxW;
        for (int k = 0; k < rest.Count; k++) max = Math.Max(max, Math.Abs(rest[k]) / (_sigma0 * Math.Sqrt(_qe[k, k])));
        return (omega, max);
    }
}
