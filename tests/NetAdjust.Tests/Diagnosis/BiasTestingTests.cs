using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Diagnosis;

public class BiasTestingTests
{
    private static AdjustmentResult Blundered(int seed, int index, double sigmas)
    {
        var net = DiagnosisNetworks.Draw(seed);
        var o = net.Observations[index];
        var biased = DiagnosisNetworks.Replace(net, index, DiagnosisNetworks.WithValue(o, o.Value +
            (sigmas * o.StandardDeviation)) with { StandardDeviation = o.StandardDeviation, Source = o.Source });
        return Adjuster.Adjust(biased, DiagnosisMonteCarlo.Quick);
    }

    private static Dictionary<int, double> Unit(int i) => new() { [i] = 1.0 };

    [Fact]
    public void GroupStatisticOfOneObservationIsItsWSquared()
    {
        // Teunissen (2000), Testing Theory, §4.2: for q = 1 and C = cᵢ the GLR statistic T₁ equals wᵢ²; w here
        // is the analysis' own w-test (Baarda 1968), computed by other code.
        var result = Blundered(11, 30, 6);
        var t = new BiasTesting(result);
        var analysis = result.Analysis;
        int checkedCount = 0;
        foreach (var test in analysis.Observations.Where(x => x.W is not null && x.Redundancy > 0.05))
        {
            var (tq, size, cov) = BlunderDiagnosis.GroupTest(t, [Unit(test.Index)]);
            double w = test.W!.Value;
            Assert.Equal(w * w, tq, Math.Max(1e-9, 1e-9 * w * w));
            Assert.Equal(w, t.W(test.Index), 1e-9);
            // ∇̂ / σ∇̂ = −w (v = adjusted − observed: an observation too large gives a negative w)
            Assert.Equal(-w, size[0] / Math.Sqrt(cov[0, 0]), 1e-8);
            checkedCount++;
        }
        Assert.True(checkedCount > 40);
    }

    [Fact]
    public void GroupStatisticIsTheDropInVtpvOfAnIndependentAdjustmentWithTheBiasesAsUnknowns()
    {
        // Teunissen (2000), §3.3: T_q = (vᵀPv of the null model − vᵀPv with C∇ added as unknowns) / σ0². The
        // alternative is solved here independently: a QR solve (MathNet) of the linearised model at the solution,
        // √P [A C] [dx; ∇] ≈ √P (−v), with the design rows and weights of the result.
        var result = Blundered(12, 33, 5);
        var t = new BiasTesting(result);
        int m = result.DesignRows.Count, u = result.Unknowns.Count;
        var a = Matrix<double>.Build.Dense(m, u);
        for (int i = 0; i < m; i++)
        {
            var row = result.DesignRows[i];
            for (int k = 0; k < row.Columns.Length; k++) a[i, row.Columns[k]] += row.Values[k];
        }
        var p = Matrix<double>.Build.Dense(m, m);
        foreach (var blk in result.Weights.Blocks)
            for (int x = 0; x < blk.Size; x++)
                for (int y = 0; y < blk.Size; y++) p[blk.Rows[x], blk.Rows[y]] = blk[x, y];
        var minusV = Vector<double>.Build.Dense(m, i => i < result.Observations.Count
            ? -result.Observations[i].Residual : 0);
        var sqrtP = p.Cholesky().Factor.Transpose(); // P = Lᵀ... (L Lᵀ = P, so ‖Lᵀ r‖² = rᵀPr)

        // three alternatives: three directions of one set, a slope distance and zenith of one sighting with the
        // target-height pattern, and four observations of two setups with arbitrary weights
        var groups = new List<IReadOnlyList<IReadOnlyDictionary<int, double>>>
        {
            new[] { Unit(28), Unit(29), Unit(30) },
            new[] { Unit(33), Unit(34) },
            new[] { new Dictionary<int, double> { [33] = 1, [35] = -0.5 }, Unit(40), Unit(8),
                new Dictionary<int, double> { [12] = 0.3, [14] = 2.0 } },
        };
        foreach (var cols in groups)
        {
            int q = cols.Count;
            var ac = Matrix<double>.Build.Dense(m, u + q);
            ac.SetSubMatrix(0, 0, a);
            for (int k = 0; k < q; k++) foreach (var (row, c) in cols[k]) ac[row, u + k] = c;
            double Omega(Matrix<double> design)
            {
                var x = (sqrtP * design).QR().Solve(sqrtP * minusV);
                var r = minusV - (design * x);
                return r * (p * r);
            }
            double nullOmega = Omega(a), altOmega = Omega(ac);
            double expected = (nullOmega - altOmega) / result.Statistics.AprioriVarianceFactor;
            var (tq, size, _) = BlunderDiagnosis.GroupTest(t, cols);
            Assert.Equal(expected, tq, 1e-9 * Math.Max(1, expected));
            var xAlt = (sqrtP * ac).QR().Solve(sqrtP * minusV);
            for (int k = 0; k < q; k++) Assert.Equal(xAlt[u + k], size[k], 1e-9 * Math.Max(1e-6, Math.Abs(size[k])));
            Assert.True(tq > 0);
        }
    }

    [Fact]
    public void UpdateAfterACorrectionAgreesWithReadjustingTheCorrectedNetwork()
    {
        // The rank-one update v′ = v + Qvv P c ∇ (docs/diagnosis.md) against an independent re-adjustment of the
        // network with the observation corrected: vᵀPv′ and the largest |w′| agree up to the non-linearity of a
        // 6σ correction.
        var clean = Adjuster.Adjust(DiagnosisNetworks.Draw(13), DiagnosisMonteCarlo.Quick);
        int index = clean.Analysis.Observations.First(x => x.Redundancy > 0.5 && x.Index > 20).Index;
        var result = Blundered(13, index, 6);
        var t = new BiasTesting(result);
        var alt = t.Prepare([Unit(index)]);
        double nabla = 6 * result.Network.Observations[index].StandardDeviation;
        var (omega, maxW) = t.After(alt, [nabla]);
        var corrected = clean;
        double expectedMax = corrected.Analysis.Observations.Where(x => x.W is not null).Max(x => Math.Abs(x.W!.Value));
        Assert.Equal(corrected.Statistics.Vtpv, omega, 1e-6 * corrected.Statistics.Vtpv);
        Assert.Equal(expectedMax, maxW, 1e-5);
        // the check is not empty: the blunder mattered (w² ≈ 36 r with r > 0.5)
        Assert.True(result.Statistics.Vtpv - omega > 9, $"{result.Statistics.Vtpv} {omega}");
    }

    [Fact]
    public void LevellingGroupStatisticMatchesTheDropInVtpvOfTheReadjustment()
    {
        // A linear model (levelling): adding C∇ as unknowns is the same as correcting the observations by C∇̂ and
        // re-adjusting; the drop in vᵀPv / σ0² is T_q (Teunissen 2000, §3.3), here through the adjuster itself.
        var (net, _) = BracedNetworks.Levelling(5, 8, 10);
        var result = Adjuster.Adjust(BracedNetworks.WithBias(net, 3, 0.01), DiagnosisMonteCarlo.Quick);
        var t = new BiasTesting(result);
        IReadOnlyList<IReadOnlyDictionary<int, double>> cols = [Unit(3), Unit(7)];
        var (tq, size, _) = BlunderDiagnosis.GroupTest(t, cols);
        var obs = result.Network.Observations.ToArray();
        obs[3] = ObservationEdits.WithValue(obs[3], obs[3].Value - size[0]);
        obs[7] = ObservationEdits.WithValue(obs[7], obs[7].Value - size[1]);
        var after = Adjuster.Adjust(new SurveyNetwork(net.Name, net.Points, obs), DiagnosisMonteCarlo.Quick);
        double expected = (result.Statistics.Vtpv - after.Statistics.Vtpv) / result.Statistics.AprioriVarianceFactor;
        Assert.Equal(expected, tq, 1e-9 * expected);
        Assert.True(tq > BlunderDiagnosis.GroupCritical(2, 0.001)); // a 10 mm blunder is found
    }
}
