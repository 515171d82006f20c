using NetAdjust.Simulation;
using FsCheck;
using FsCheck.Fluent;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class ObservationTestsTests
{
    private static AdjustmentOptions Opt(ExternalReliabilityMode mode = ExternalReliabilityMode.Always) =>
        AdjustmentOptions.Default with { Analysis = AnalysisOptions.Default with { ExternalReliability = mode } };

    [Fact]
    public void RedundancyNumbersSumToTheDegreesOfFreedomOnRandomNetworks()
    {
        // Σ rᵢ = tr(Qvv P) = n − u (Baarda 1968; Teunissen 2000, Adjustment theory, from memory) and 0 ≤ rᵢ ≤ 1:
        // property over random horizontal and level networks.
        var gen = from seed in Gen.Choose(1, 1_000_000)
                  from free in Gen.Choose(1, 4)
                  from p in Gen.Choose(0, 100)
                  from lev in Gen.Elements(false, true)
                  select (seed, free, p / 100.0, lev);
        Prop.ForAll(Arb.From(gen), t =>
        {
            var net = t.lev ? BracedNetworks.Levelling(t.seed, t.free + 2, t.free + 1).Network
                            : BracedNetworks.Horizontal(t.seed, t.free, allPairs: false,
                                pairProbability: t.Item3).Network;
            var res = Adjuster.Adjust(net, Opt(ExternalReliabilityMode.Never));
            var a = res.Analysis;
            bool sum = Math.Abs(a.RedundancySum - res.Statistics.DegreesOfFreedom) < 1e-8;
            bool range = a.Observations.All(o => o.Redundancy >= 0 && o.Redundancy <= 1);
            return sum && range;
        }).QuickCheckThrowOnFailure();
    }

    [Fact]
    public void RedundancyAndWAgreeWithAnIndependentDenseComputation()
    {
        // Independent route: dense A and P, Qxx by MathNet's inverse of AᵀPA, Qvv = P⁻¹ − A Qxx Aᵀ (Gauss-Markov model,
        // Koch 1999 §3.2, section from memory), rᵢ = (Qvv P)ᵢᵢ, wᵢ = vᵢ / (σ0 √Qvv,ii) (Baarda 1968).
        var (net, _) = BracedNetworks.Horizontal(17, 3);
        var res = Adjuster.Adjust(net, Opt());
        int m = res.DesignRows.Count, u = res.Unknowns.Count;
        var A = Matrix<double>.Build.Dense(m, u);
        for (int i = 0; i < m; i++)
            for (int k = 0; k < res.DesignRows[i].Columns.Length; k++)
                A[i, res.DesignRows[i].Columns[k]] = res.DesignRows[i].Values[k];
        var P = Matrix<double>.Build.Diagonal(m, m, i => res.Weights.DiagonalEntry(i));
        var Qxx = (A.Transpose() * P * A).Inverse();
        var Qvv = P.Inverse() - (A * Qxx * A.Transpose());
        var R = Qvv * P;
        for (int i = 0; i < res.Observations.Count; i++)
        {
            var t = res.Analysis.Observations[i];
            Assert.Equal(R[i, i], t.Redundancy, 9);
            double w = res.Observations[i].Residual / Math.Sqrt(Qvv[i, i]);
            Assert.Equal(w, t.W!.Value, 7);
            Assert.Equal(t.W!.Value / res.Statistics.Sigma0!.Value, t.Tau!.Value, 9);
            double sd = net.Observations[i].StandardDeviation;
            Assert.Equal(sd * CriticalValues.NonCentrality(0.001, 0.2) / Math.Sqrt(R[i, i]), t.Mdb!.Value, 12);
        }
    }

    [Fact]
    public void ExternalReliabilityEqualsTheShiftOfARepeatedAdjustment()
    {
        // ∇x = Qxx Aᵀ P eᵢ ∇ᵢ (Baarda 1968): compare with adjusting again after adding the MDB to the observation.
        var (net, _) = BracedNetworks.Horizontal(5, 3);
        var res = Adjuster.Adjust(net, Opt());
        foreach (int i in new[] { 0, 4, 9, res.Observations.Count - 1 })
        {
            var t = res.Analysis.Observations[i];
            var biased = Adjuster.Adjust(BracedNetworks.WithBias(net, i, t.Mdb!.Value),
                Opt(ExternalReliabilityMode.Never));
            double best = 0;
            for (int p = 0; p < res.Points.Count; p++)
            {
                double de = biased.Points[p].E!.Value - res.Points[p].E!.Value, dn =
                    biased.Points[p].N!.Value - res.Points[p].N!.Value;
                best = Math.Max(best, Math.Sqrt((de * de) + (dn * dn)));
            }
            Assert.Equal(best, t.ExternalReliability!.Value, 6); // metres; linearisation error ≪ 1 µm
        }
    }

    [Fact]
    public void ASetAsideObservationGetsTheWItWouldHaveIfPutBack()
    {
        // For a diagonal weight, the standardised misclosure l / √(σ² + σ0² a Qxx aᵀ) of an observation left out
        // equals its w-test value in the adjustment that includes it (common practice; follows from the update
        // formulas).
        var (net, _) = BracedNetworks.Horizontal(11, 3, noise: 1.0);
        var biasedNet = BracedNetworks.WithBias(net, 6, 0.03);
        var full = Adjuster.Adjust(biasedNet, Opt(ExternalReliabilityMode.Never));
        var obs = biasedNet.Observations.ToArray();
        obs[6] = obs[6] with { Excluded = true };
        var without = Adjuster.Adjust(new SurveyNetwork("x", biasedNet.Points, obs),
            Opt(ExternalReliabilityMode.Never));
        var t = without.Analysis.Observations[6];
        Assert.Equal(ObservationFlag.Excluded, t.Flag);
        // Exact in the linear model; here the two adjustments are linearised at points a few centimetres apart and
        // converge to 1e−6 m, which moves w by ~1e−7 m / 3 mm ≈ 3e−5: tolerance 1e−4.
        Assert.InRange(t.W!.Value - full.Analysis.Observations[6].W!.Value, -1e-4, 1e-4);
        Assert.True(Math.Abs(t.W!.Value) > 5); // the 3 cm bias (10 σ) stands out
        Assert.Equal(full.Statistics.DegreesOfFreedom - 1, without.Statistics.DegreesOfFreedom);
        // the reported residual is the misclosure against the adjusted coordinates: computed − observed
        var o = (DistanceObservation)obs[6];
        var pf = without.Points.Single(p => p.Id == o.From); var pt = without.Points.Single(p => p.Id == o.To);
        double d = Math.Sqrt(Math.Pow(pt.E!.Value - pf.E!.Value, 2) + Math.Pow(pt.N!.Value - pf.N!.Value, 2));
        Assert.Equal(d - o.Distance.Metres, without.Observations[6].Residual, 9);
        Assert.Equal(0.0, t.Redundancy);
    }

    [Fact]
    public void RelativeEllipsesAgreeWithTheFullCovarianceForObservedAndListedPairs()
    {
        // Relative covariance D = Q_bb + Q_aa − Q_ab − Q_ba (Mikhail & Ackermann 1976); the full Qxx from MathNet's
        // dense inverse is the independent reference, for a pair read from the factor's pattern and one found by
        // solves.
        var (net, _) = BracedNetworks.Horizontal(23, 4, allPairs: false, pairProbability: 0.0);
        var options = Opt() with { Analysis = AnalysisOptions.Default with { RelativePairs = [("P1", "P2"), ("P3",
            "P4")] } };
        var res = Adjuster.Adjust(net, options);
        int m = res.DesignRows.Count, u = res.Unknowns.Count;
        var A = Matrix<double>.Build.Dense(m, u);
        for (int i = 0; i < m; i++)
            for (int k = 0; k < res.DesignRows[i].Columns.Length; k++)
                A[i, res.DesignRows[i].Columns[k]] = res.DesignRows[i].Values[k];
        var P = Matrix<double>.Build.Diagonal(m, m, i => res.Weights.DiagonalEntry(i));
        var Qxx = (A.Transpose() * P * A).Inverse();
        var listed = res.Analysis.Relative.Where(r => !r.Observed).ToList();
        Assert.Equal(2, listed.Count);
        foreach (var rel in res.Analysis.Relative)
        {
            int Col(string id, Parameter p) => res.Unknowns.IndexOf(id, p);
            double C(int i, int j) => i < 0 || j < 0 ? 0 : Qxx[i, j];
            int ae = Col(rel.From, Parameter.E), an = Col(rel.From, Parameter.N), be = Col(rel.To, Parameter.E), bn =
                Col(rel.To, Parameter.N);
            double dee = C(be, be) + C(ae, ae) - (2 * C(ae, be));
            double dnn = C(bn, bn) + C(an, an) - (2 * C(an, bn));
            double den = C(be, bn) + C(ae, an) - C(ae, bn) - C(an, be);
            var expected = ErrorEllipse.FromCovariance(dee, dnn, den);
            Assert.Equal(expected.A, rel.Ellipse.A, 10);
            Assert.Equal(expected.B, rel.Ellipse.B, 10);
            Assert.Equal(2.4477, rel.Confidence.A / rel.Ellipse.A, 4);
        }
    }

    [Fact]
    public void PointEllipsesUseTheCoordinateCovariance()
    {
        var (net, _) = BracedNetworks.Horizontal(3, 2);
        var res = Adjuster.Adjust(net, Opt());
        foreach (var (p, pp) in res.Points.Zip(res.Analysis.Points))
        {
            var e = pp.Ellipse!.Value;
            // a² + b² = σE² + σN² (trace invariant; Mikhail & Ackermann 1976)
            Assert.Equal((p.SdE!.Value * p.SdE.Value) + (p.SdN!.Value * p.SdN.Value), (e.A * e.A) + (e.B * e.B), 12);
        }
    }

    [Fact]
    public void EstimatedBasisScalesByTheAPosterioriVarianceFactor()
    {
        var (net, _) = BracedNetworks.Horizontal(8, 3, noise: 2.0);
        var known = Adjuster.Adjust(net, Opt(ExternalReliabilityMode.Never));
        var est = Adjuster.Adjust(net, Opt(ExternalReliabilityMode.Never) with { Analysis =
            AnalysisOptions.Default with { VarianceFactor = VarianceFactorBasis.Estimated } });
        double s0 = known.Statistics.Sigma0!.Value;
        int r = known.Statistics.DegreesOfFreedom;
        var k = known.Analysis.Points[2].Ellipse!.Value; var e = est.Analysis.Points[2].Ellipse!.Value;
        Assert.Equal(k.A * s0, e.A, 12);
        Assert.Equal(Math.Sqrt(2 * MathNet.Numerics.Distributions.FisherSnedecor.InvCDF(2, r, 0.95)),
            est.Analysis.EllipseScale, 12);
        Assert.Equal(VarianceFactorBasis.Estimated, est.Analysis.Basis);
    }

    [Fact]
    public void AnObservationThatAloneFixesAnUnknownIsUncontrolled()
    {
        // A single distance to a point with no other observation: r = 0, no test possible (Baarda 1968).
        var pts = new[] { new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 100, N = 0, Fixed =
            Fixity.EN }, new Point("C") { E = 50, N = 80 } };
        var obs = new Observation[]
        {
            new DistanceObservation("A", "C", NetAdjust.Units.Length.FromMetres(94.34)) { StandardDeviation = 0.003 },
            new DistanceObservation("B", "C", NetAdjust.Units.Length.FromMetres(94.34)) { StandardDeviation = 0.003 },
            new DistanceObservation("A", "B", NetAdjust.Units.Length.FromMetres(100.002)) { StandardDeviation = 0.003 },
        };
        var res = Adjuster.Adjust(new SurveyNetwork("t", pts, obs));
        var t = res.Analysis.Observations;
        Assert.Equal(ObservationFlag.Uncontrolled, t[0].Flag);
        Assert.Null(t[0].W);
        Assert.Null(t[0].Mdb);
        Assert.Equal(1.0, t[2].Redundancy, 12); // between held points: fully controlled
    }

    [Fact]
    public void ExcludingRowsOfACorrelatedBlockGivesTheInverseOfTheRemainingCovariance()
    {
        // (Σ_kept)⁻¹ = P_kk − P_ke P_ee⁻¹ P_ek (Schur complement), against MathNet's inverse of the covariance
        // sub-block.
        var cov = Matrix<double>.Build.DenseOfArray(new[,] { { 4.0, 1.0, 0.5 }, { 1.0, 3.0, 0.2 }, { 0.5, 0.2, 2.0 } });
        var p = cov.Inverse();
        var wm = WeightMatrix.FromBlocks(3, [new WeightBlock([0, 1, 2], p.ToRowMajorArray())]).Excluding([1]);
        var kept = Matrix<double>.Build.DenseOfArray(new[,] { { 4.0, 0.5 }, { 0.5, 2.0 } }).Inverse();
        var (b, _) = wm.BlockOf(0);
        Assert.Equal(kept[0, 0], b[0, 0], 12);
        Assert.Equal(kept[0, 1], b[0, 2], 12);
        Assert.Equal(kept[1, 1], b[2, 2], 12);
        Assert.Equal(0.0, b[1, 1]);
        Assert.Equal(0.0, b[0, 1]);
    }
}
