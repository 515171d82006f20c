using NetAdjust.Simulation;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// Guards the contract the sparse engine relies on (docs/methods.md, "Covariance access"): the statistics ask Qxx only
/// for unknowns that share a weighted design row or weight block, or that belong to one point; anything else by solves.
/// A recording solver wraps the dense one and logs every entry asked for.
/// </summary>
public class CovarianceAccessTests
{
    private sealed class RecordingSolver : INormalEquationsSolver
    {
        public readonly HashSet<(int, int)> Asked = [];
        public string Name => "recording";
        public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights) =>
            new Factor(new DenseNormalEquationsSolver().Factorize(unknownCount, rows, weights), Asked);

        private sealed class Factor(INormalFactor inner, HashSet<(int, int)> asked) : INormalFactor
        {
            public int Size => inner.Size;
            public double[] Solve(ReadOnlySpan<double> rhs) => inner.Solve(rhs);
            public double InverseEntry(int i, int j) { asked.Add((i, j)); return inner.InverseEntry(i, j); }
        }
    }

    [Fact]
    public void StatisticsAskOnlyForEntriesOnThePatternOfN()
    {
        // A sparse network (few free-point pairs observed), one set-aside observation and a listed pair that no
        // observation joins: the cases that would tempt an off-pattern request.
        var (net0, _) = BracedNetworks.Horizontal(23, 5, allPairs: false, pairProbability: 0.0);
        // A set-aside distance between two free points that nothing else joins.
        var p1 = net0["P1"]; var p5 = net0["P5"];
        var extra = new DistanceObservation("P1", "P5",
            NetAdjust.Units.Length.FromMetres(Math.Sqrt(Math.Pow(p5.E!.Value - p1.E!.Value, 2) +
            Math.Pow(p5.N!.Value - p1.N!.Value, 2))))
        { StandardDeviation = 0.003, Excluded = true };
        var obs = net0.Observations.Append(extra).ToArray();
        int ex = obs.Length - 1;
        var net = new SurveyNetwork("t", net0.Points, obs);
        var solver = new RecordingSolver();
        var options = AdjustmentOptions.Default with
        {
            Solver = solver,
            Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Always,
                RelativePairs = [("P2", "P4"), ("P3", "P5"), ("A", "P3")] },
        };
        // records the adjuster's final-step requests as well as the analysis'
        var again = Adjuster.Adjust(net, options);
        _ = again.Analysis;

        var allowed = new HashSet<(int, int)>();
        foreach (var blk in again.Weights.Blocks)
        {
            var cols = new HashSet<int>();
            for (int a = 0; a < blk.Size; a++)
                if (Enumerable.Range(0, blk.Size).Any(b => blk[a, b] != 0))
                    cols.UnionWith(again.DesignRows[blk.Rows[a]].Columns.ToArray());
            foreach (int i in cols) foreach (int j in cols) allowed.Add((i, j));
        }
        var u = again.Unknowns.Unknowns;
        for (int i = 0; i < u.Count; i++)
            for (int j = 0; j < u.Count; j++)
                if (u[i].Owner == u[j].Owner && u[i].Parameter != Parameter.Orientation &&
                    u[j].Parameter != Parameter.Orientation)
                    allowed.Add((i, j));
        var off = solver.Asked.Where(p => !allowed.Contains(p)).ToList();
        Assert.True(off.Count == 0,
            "off-pattern Qxx requests: " +
            string.Join(", ", off.Select(p => $"{u[p.Item1].Describe()} × {u[p.Item2].Describe()}")));
        Assert.NotEmpty(solver.Asked);
        Assert.Equal(2, again.Analysis.Relative.Count(r => !r.Observed)); // P1–P5 and P2–P4: computed by solves
        Assert.Equal(ObservationFlag.Excluded, again.Analysis.Observations[ex].Flag);
    }
}

public class RelativeHeightTests
{
    [Fact]
    public void RelativeHeightPrecisionMatchesTheFullCovariance()
    {
        // σ²(H_b − H_a) = C_aa + C_bb − 2 C_ab (propagation of variances; Mikhail & Ackermann 1976), against the full
        // Qxx from MathNet's dense inverse, for observed pairs and for a listed pair computed by solves.
        var (net, _) = BracedNetworks.Levelling(5, 7, 2);
        var options = AdjustmentOptions.Default with { Analysis = AnalysisOptions.Default with { RelativePairs =
            [("BM1", "BM6")] } };
        var res = Adjuster.Adjust(net, options);
        int m = res.DesignRows.Count, u = res.Unknowns.Count;
        var A = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(m, u);
        for (int i = 0; i < m; i++)
            for (int k = 0; k < res.DesignRows[i].Columns.Length; k++)
                A[i, res.DesignRows[i].Columns[k]] = res.DesignRows[i].Values[k];
        var P = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Diagonal(m, m, i => res.Weights.DiagonalEntry(i));
        var Qxx = (A.Transpose() * P * A).Inverse();
        Assert.Contains(res.Analysis.RelativeHeights, r => !r.Observed && r.From == "BM1" && r.To == "BM6");
        Assert.Equal(net.Observations.Select(o => (o.From, o.To)).Distinct().Count() + 1,
            res.Analysis.RelativeHeights.Count);
        foreach (var rh in res.Analysis.RelativeHeights)
        {
            int a = res.Unknowns.IndexOf(rh.From, Parameter.H), b = res.Unknowns.IndexOf(rh.To, Parameter.H);
            double C(int i, int j) => i < 0 || j < 0 ? 0 : Qxx[i, j];
            Assert.Equal(Math.Sqrt(C(a, a) + C(b, b) - (2 * C(a, b))), rh.SdDifference, 12);
            // z(0.975) = 1.959964, computed (docs/references.md §5).
            Assert.Equal(1.959964 * rh.SdDifference, rh.Confidence, 6);
        }
    }
}
