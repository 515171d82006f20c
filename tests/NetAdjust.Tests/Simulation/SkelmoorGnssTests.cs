using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Geodesy;
using NetAdjust.Misclosures;
using NetAdjust.Simulation;
using NetAdjust.Tests.Geodesy;

namespace NetAdjust.Tests.Simulation;

/// <summary>The Skelmoor GNSS demo draws baselines around its truth with the covariance it states.</summary>
public class SkelmoorGnssTests
{
    // ETRS89 / UTM zone 32N through Krüger's series (an independent projection; docs/references.md §14)
    private static readonly KruegerTransverseMercator Utm32 = KruegerTransverseMercator.Utm(Ellipsoid.Grs80, 32);

    [Fact]
    public void BaselineCovarianceIsThreeMillimetresAndHalfAPpmHorizontalAndTwiceThatVertical()
    {
        var s = DemoScenarios.Draw(DemoScenario.Skelmoor, 5, Utm32);
        Assert.Equal(6, s.Baselines.Count);
        foreach (var b in s.Baselines)
        {
            var t = s.Truth[b.From];
            var (lat, lon) = Utm32.Inverse(t.E, t.N);
            double[] r = Geocentric.LocalRotation(lat, lon);
            var rm = Matrix<double>.Build.Dense(3, 3, (i, j) => r[3 * i + j]);
            var c = Matrix<double>.Build.Dense(3, 3, (i, j) => b.Covariance[3 * i + j]);
            var local = rm * c * rm.Transpose();
            var (x1, y1, z1) = Xyz(s.Truth[b.From]);
            var (x2, y2, z2) = Xyz(s.Truth[b.To]);
            double length = Math.Sqrt((x2 - x1) * (x2 - x1) + (y2 - y1) * (y2 - y1) + (z2 - z1) * (z2 - z1));
            double sh = 0.003 + 0.5e-6 * length; // the stated model: 3 mm + 0.5 ppm of the true length
            Assert.Equal(sh, Math.Sqrt(local[0, 0]), 1e-10);
            Assert.Equal(sh, Math.Sqrt(local[1, 1]), 1e-10);
            Assert.Equal(2 * sh, Math.Sqrt(local[2, 2]), 1e-10);
            Assert.Equal(-0.15, local[1, 2] / Math.Sqrt(local[1, 1] * local[2, 2]), 9);
            Assert.True(c.Evd().EigenValues.All(v => v.Real > 0)); // positive definite (MathNet eigenvalues)
        }
    }

    /// <summary>
    /// Over 200 seeds the baselines' errors against the truth, each normalised as eᵀC⁻¹e, sum to a χ² with
    /// 3 × 6 × 200 = 3600 degrees of freedom: its mean is 1 per degree of freedom with sd √(2/3600) = 0.024 (common
    /// practice); allowed 5 sd. The truth is computed here with the test's own projection and Geocentric.
    /// </summary>
    [Fact]
    public void BaselineNoiseHasTheStatedCovariance()
    {
        double sum = 0;
        int dof = 0;
        for (int seed = 1; seed <= 200; seed++)
        {
            var s = DemoScenarios.Draw(DemoScenario.Skelmoor, seed, Utm32);
            foreach (var b in s.Baselines)
            {
                var (x1, y1, z1) = Xyz(s.Truth[b.From]);
                var (x2, y2, z2) = Xyz(s.Truth[b.To]);
                var e = Vector<double>.Build.Dense([b.Dx - (x2 - x1), b.Dy - (y2 - y1), b.Dz - (z2 - z1)]);
                var c = Matrix<double>.Build.Dense(3, 3, (i, j) => b.Covariance[3 * i + j]);
                sum += e * c.Solve(e);
                dof += 3;
            }
        }
        Assert.InRange(sum / dof, 1 - 5 * Math.Sqrt(2.0 / dof), 1 + 5 * Math.Sqrt(2.0 / dof));
    }

    /// <summary>The drawn loops: three, none of one session, and their χ² statistics over 200 seeds are rejected at
    /// 95% about 5% of the time (binomial: 600 loops, sd √(600 × 0.05 × 0.95) = 5.3 rejections; allowed 4 sd).
    /// </summary>
    [Fact]
    public void LoopsOfTheDrawnBaselinesAreRejectedAtTheirRate()
    {
        int rejected = 0, count = 0;
        for (int seed = 1; seed <= 200; seed++)
        {
            var s = DemoScenarios.Draw(DemoScenario.Skelmoor, seed, Utm32);
            var vectors = s.Baselines.Select(b => new BaselineVector(b.From, b.To, b.Dx, b.Dy, b.Dz,
                [.. b.Covariance], b.Session, null)).ToList();
            var loops = BaselineLoops.Find(vectors, Ellipsoid.Grs80, id => Utm32.Inverse(s.Truth[id].E,
                s.Truth[id].N), 0.95);
            Assert.Equal(6 - 4 + 1, loops.Count);
            Assert.All(loops, l => Assert.False(l.Trivial));
            rejected += loops.Count(l => !l.Passed);
            count += loops.Count;
        }
        // the loops of one draw share baselines, so they are not independent; the rate over draws still is α
        double expected = 0.05 * count, sd = Math.Sqrt(count * 0.05 * 0.95);
        Assert.InRange(rejected, expected - 4 * sd, expected + 4 * sd);
        Assert.Equal(7.8147, ChiSquared.InvCDF(3, 0.95), 4); // computed
    }

    [Fact]
    public void TheSameSeedGivesTheSameBaselines()
    {
        var a = DemoScenarios.Draw(DemoScenario.Skelmoor, 11, Utm32);
        var b = DemoScenarios.Draw(DemoScenario.Skelmoor, 11, Utm32);
        Assert.Equal(a.Baselines.Select(x => (x.From, x.To, x.Dx, x.Dy, x.Dz)),
            b.Baselines.Select(x => (x.From, x.To, x.Dx, x.Dy, x.Dz)));
    }

    private static (double X, double Y, double Z) Xyz((double E, double N, double H) p)
    {
        var (lat, lon) = Utm32.Inverse(p.E, p.N);
        return Geocentric.ToGeocentric(Ellipsoid.Grs80, lat, lon, p.H + 47.42); // h = H + N, N = 47.42 m
    }
}
