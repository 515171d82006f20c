using NetAdjust.Simulation;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Adjustment.Datum;

/// <summary>
/// The sequence "minimally constrained, then constrained" on simulated networks with five held control points.
/// The test of the added constraints is checked against its closed form in the linear model: the increase of
/// vᵀPv equals dᵀ Q_dd⁺ d for the control discrepancies d and their cofactor Q_dd in the minimally-constrained
/// datum (Koch 1999, §4.3, test of linear hypotheses; Caspary 1987, ch. 4; sections from memory), computed with
/// MathNet's singular value decomposition.
/// </summary>
public class SequenceTests
{
    private static readonly Dictionary<int, Fixity> Five = new() { [0] = Fixity.EN, [3] = Fixity.EN, [5] = Fixity.EN, [12] = Fixity.EN, [15] = Fixity.EN };

    // The dense solver gives every entry of Qxx, which the oracles below compare in full.
    private static readonly AdjustmentOptions Tight = AdjustmentOptions.Default with
    {
        LengthTolerance = 1e-10, AngleTolerance = 1e-12, MaxIterations = 50, Solver = new NetAdjust.LinearAlgebra.DenseNormalEquationsSolver(),
    };

    private static double QuadraticForm(SequenceResult s)
    {
        var m = s.Minimal;
        var cols = new List<int>();
        var d = new List<double>();
        foreach (var c in s.Discrepancies)
        {
            cols.Add(m.Unknowns.IndexOf(c.Id, Parameter.E)); d.Add(c.DE!.Value);
            cols.Add(m.Unknowns.IndexOf(c.Id, Parameter.N)); d.Add(c.DN!.Value);
        }
        var q = Matrix<double>.Build.Dense(cols.Count, cols.Count, (i, j) => m.Cofactor(cols[i], cols[j]));
        var dv = Vector<double>.Build.DenseOfEnumerable(d);
        // dᵀ Q_dd⁺ d by MathNet's SVD truncated to the known rank c − 3 (the datum defect 3 leaves 3 zero singular
        // values; a tolerance-based pseudo-inverse is unstable on singular values of 1e−15 relative).
        var svd = q.Svd();
        int rank = cols.Count - 3;
        double form = 0;
        for (int k = 0; k < rank; k++) form += Math.Pow(svd.U.Column(k) * dv, 2) / svd.S[k];
        return form;
    }

    [Theory]
    [InlineData(41)]
    [InlineData(42)]
    [InlineData(43)]
    public void TheIncreaseOfVtpvIsTheQuadraticFormOfTheDiscrepancies(int seed)
    {
        var net = GridNetworks.Grid(seed, 4, Five).Network;
        var s = AdjustmentSequence.Run(net, Tight);
        Assert.Equal(DatumMode.InnerConstraints, s.Minimal.Options.Datum.Mode);
        Assert.Equal(10 - 3, s.Test.AddedConstraints); // 5 points × 2 components − datum defect 3
        // (Whether single simulations pass is a matter of chance at α; the calibration test below checks the rate.)
        Assert.Equal(QuadraticForm(s), s.Test.VtpvIncrease, 1e-4 * Math.Max(1, s.Test.VtpvIncrease));
        // χ²(0.95; 7) = 14.0671: computed with scipy, not read in a printed table (docs/references.md §2).
        Assert.Equal(14.0671, s.Test.ChiSquareCritical!.Value, 4);
    }

    [Theory]
    [InlineData(41, 12, 0.03, 0.04)]
    [InlineData(42, 5, -0.05, 0.0)]
    [InlineData(43, 3, 0.0, -0.05)]
    public void AControlMarkDisturbedByFiveCentimetresFailsTheTestAndStandsOut(int seed, int disturbed, double de, double dn)
    {
        var sim = GridNetworks.Grid(seed, 4, Five, disturb: (disturbed, de, dn));
        var s = AdjustmentSequence.Run(sim.Network, Tight);
        string id = sim.Network.Points[disturbed].Id;
        Assert.False(s.Test.Passed, $"T = {s.Test.ChiSquare}");
        Assert.False(s.Test.PassedF);
        var worst = s.Discrepancies.OrderByDescending(d => d.MaxAbsW).First();
        Assert.Equal(id, worst.Id);
        Assert.Equal(QuadraticForm(s), s.Test.VtpvIncrease, 1e-3 * s.Test.VtpvIncrease);
        // The minimally-constrained solution tests the observations alone: its global test is not affected.
        Assert.Equal(s.Minimal.Statistics.Vtpv, AdjustmentSequence.Run(GridNetworks.Grid(seed, 4, Five).Network, Tight).Minimal.Statistics.Vtpv, 6);
        // Shifts: the constrained solution moves the points near the disturbed mark most.
        Assert.Contains(s.Shifts, x => x.Id == id && x.Horizontal > 0.01);
    }

    [Fact]
    public void TheConstraintTestStatisticFollowsChiSquareWhenTheControlIsRight()
    {
        // Monte Carlo calibration: 300 simulations with error-free control; T ~ χ²(7) has mean 7 and variance 14,
        // and the test at α = 0.05 rejects 5% (common practice: calibration of a test by simulation).
        const int runs = 300;
        var t = new List<double>();
        int rejected = 0;
        for (int k = 0; k < runs; k++)
        {
            var s = AdjustmentSequence.Run(GridNetworks.Grid(1000 + k, 4, Five).Network);
            t.Add(s.Test.ChiSquare);
            if (s.Test.Passed == false) rejected++;
        }
        double mean = t.Average();
        Assert.InRange(mean, 7 - (4 * Math.Sqrt(14.0 / runs)), 7 + (4 * Math.Sqrt(14.0 / runs)));   // ±4 standard errors
        Assert.InRange(rejected, 3, 30);                                                            // 15 expected; binomial(300, 0.05) ±4σ
    }

    [Fact]
    public void ExplicitMinimalConstraintsCanBeChosenForTheFirstSolution()
    {
        var net = GridNetworks.Grid(44, 4, Five).Network;
        var s = AdjustmentSequence.Run(net, Tight with { Datum = DatumDefinition.Minimal("Q00", "Q33") });
        Assert.Equal("minimal constraints: position of Q00, azimuth to Q33", s.MinimalDatum);
        var q00 = s.Discrepancies.Single(d => d.Id == "Q00");
        Assert.Equal(0, q00.DE!.Value, 9);
        Assert.Null(q00.WE); // no variance at the held point: no standardised value
        // The test itself does not depend on the minimal datum chosen.
        var inner = AdjustmentSequence.Run(net, Tight);
        Assert.Equal(inner.Test.VtpvIncrease, s.Test.VtpvIncrease, 6);
    }

    [Fact]
    public void WithAnEstimatedVarianceFactorTheFTestDecides()
    {
        var sim = GridNetworks.Grid(46, 4, Five, disturb: (12, 0.03, 0.04));
        var options = Tight with { Analysis = Tight.Analysis with { VarianceFactor = VarianceFactorBasis.Estimated } };
        var s = AdjustmentSequence.Run(sim.Network, options);
        Assert.True(s.Test.SigmaEstimated);
        Assert.Equal(s.Test.PassedF, s.Test.Passed);
        Assert.False(s.Test.Passed);
    }

    [Fact]
    public void WithAnEstimatedVarianceFactorTheDiscrepanciesUseIt()
    {
        // Regression (defect): the control discrepancies' standard deviations used the a-priori variance factor even
        // when it was taken as estimated. Var(given − adjusted) = σ̂0² q for held control (law of propagation of
        // variances, common practice), σ̂0² = vᵀPv / r of the minimally-constrained run. The observations' standard
        // deviations are halved so that σ̂0² is near 4, far from the a-priori 1.
        var sim = GridNetworks.Grid(46, 4, Five);
        var net = new SurveyNetwork(sim.Network.Name, sim.Network.Points,
            sim.Network.Observations.Select(o => o with { StandardDeviation = o.StandardDeviation / 2 }));
        var options = Tight with { Analysis = Tight.Analysis with { VarianceFactor = VarianceFactorBasis.Estimated } };
        var s = AdjustmentSequence.Run(net, options);
        double vf = s.Minimal.Statistics.VarianceFactor!.Value;
        Assert.True(vf > 2);
        int checkedCount = 0;
        foreach (var c in s.Discrepancies)
        {
            if (c.SdE is not double sdE || sdE == 0) continue;
            int j = s.Minimal.Unknowns.IndexOf(c.Id, Parameter.E);
            Assert.Equal(Math.Sqrt(vf * s.Minimal.Cofactor(j, j)), sdE, 1e-12);
            checkedCount++;
        }
        Assert.True(checkedCount >= 3);
    }
}
