using NetAdjust.Simulation;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class BlockWeightTests
{
    [Fact]
    public void RedundancyAndWUseTheWholeWeightBlock()
    {
        // The directions of each set are given a correlated covariance block (as a common centering error makes them).
        // A linear least-squares step at the solution's linearisation point with that P gives v; the analysis must
        // then match the dense formulas rᵢ = (Qvv P)ᵢᵢ and wᵢ = (P v)ᵢ / √(P Qvv P)ᵢᵢ computed with MathNet
        // (Baarda 1968; Koch 1999 §3.2, section from memory), and Σ rᵢ = r.
        var (net, _) = BracedNetworks.Horizontal(61, 3);
        var baseResult = Adjuster.Adjust(net);
        var rows = baseResult.DesignRows;
        int m = rows.Count, u = baseResult.Unknowns.Count;
        var blocks = new List<WeightBlock>();
        var cov = Matrix<double>.Build.Dense(m, m);
        foreach (var set in Enumerable.Range(0, m).GroupBy(i =>
            net.Observations[i] is NetAdjust.Network.DirectionObservation d ? d.SetId : "#" + i))
        {
            var idx = set.ToArray();
            var c = Matrix<double>.Build.Dense(idx.Length, idx.Length, (a, b) =>
            {
                double s = net.Observations[idx[a]].StandardDeviation;
                return a == b ? s * s : 0.4 * s * s; // correlation 0.4 within a set
            });
            var p = c.Inverse();
            blocks.Add(new WeightBlock(idx, p.ToRowMajorArray()));
            for (int a = 0; a < idx.Length; a++) for (int b = 0; b < idx.Length; b++) cov[idx[a], idx[b]] = c[a, b];
        }
        var weights = WeightMatrix.FromBlocks(m, blocks);
        var factor = new DenseNormalEquationsSolver().Factorize(u, rows, weights);

        // l = observed − computed at the old solution (= −v_old); x = N⁻¹ AᵀP l; v = A x − l
        var l = baseResult.Observations.Select(o => -o.Residual).ToArray();
        var pl = weights.Multiply(l);
        var rhs = new double[u];
        for (int i = 0; i < m; i++)
            for (int k = 0; k < rows[i].Columns.Length; k++) rhs[rows[i].Columns[k]] += rows[i].Values[k] * pl[i];
        var x = factor.Solve(rhs);
        var v = Enumerable.Range(0, m).Select(i => rows[i].Dot(x) - l[i]).ToArray();
        var obs = baseResult.Observations.Select((o, i) => o with { Residual = v[i] }).ToArray();
        int dof = m - u;
        double vtpv = weights.Quadratic(v);
        var stats = new AdjustmentStatistics(m, u, dof, vtpv, 1.0, 1, GlobalTest.Compute(vtpv, 1.0, dof, 0.05));
        var result = new AdjustmentResult(net, AdjustmentOptions.Default, baseResult.Unknowns, factor,
            baseResult.Points, obs,
            baseResult.Orientations, stats, "dense", rows, weights);

        var A = Matrix<double>.Build.Dense(m, u);
        for (int i = 0; i < m; i++)
            for (int k = 0; k < rows[i].Columns.Length; k++) A[i, rows[i].Columns[k]] = rows[i].Values[k];
        var P = cov.Inverse();
        var Qvv = cov - (A * (A.Transpose() * P * A).Inverse() * A.Transpose());
        var R = Qvv * P; var PQP = P * Qvv * P; var Pv = P * Vector<double>.Build.DenseOfArray(v);
        var an = result.Analysis;
        Assert.Equal(dof, an.RedundancySum, 9);
        for (int i = 0; i < m; i++)
        {
            Assert.Equal(R[i, i], an.Observations[i].Redundancy, 9);
            Assert.Equal(Pv[i] / Math.Sqrt(PQP[i, i]), an.Observations[i].W!.Value, 6);
            Assert.Equal(CriticalValues.NonCentrality(0.001, 0.2) / Math.Sqrt(PQP[i, i]), an.Observations[i].Mdb!.Value,
                9);
        }
    }
}
