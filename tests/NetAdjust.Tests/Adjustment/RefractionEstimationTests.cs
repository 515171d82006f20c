using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// The refraction coefficient k of a group of zenith angles as an unknown (docs/methods.md, "Refraction coefficient
/// as an unknown"), on a simulated 3D network of reciprocal zenith angles and slope distances over 0.9–2.6 km,
/// observed with k = 0.16 and started at 0.13.
/// </summary>
public class RefractionEstimationTests
{
    private const double Arcsec = Math.PI / 648000;
    private const double R = 6_371_008.8; // the mean earth radius of docs/methods.md
    private const double TrueK = 0.16;
    private const double SdSlope = 0.003, SdZenith = 2 * Arcsec;

    private static readonly (string Id, double E, double N, double H)[] Truth =
    [
        ("P1", 5000.0, 5000.0, 312.40), ("P2", 6850.0, 5420.0, 355.10), ("P3", 6120.0, 7030.0, 298.75),
        ("P4", 4380.0, 6650.0, 401.20), ("P5", 5600.0, 6010.0, 340.00),
    ];

    private static (double E, double N, double H) True(string id)
    {
        var p = Truth.First(t => t.Id == id);
        return (p.E, p.N, p.H);
    }

    private static double InstrumentHeight(string id) => 1.45 + (0.03 * (id[1] - '0'));

    private static double TargetHeight(string id) => 1.60 + (0.05 * (id[1] - '0'));

    /// <summary>The slope distance and the zenith angle in a form of their own (law of cosines, arc cosine).</summary>
    private static (double D, double Z) Model(double[] a, double[] b, double i, double t, double k)
    {
        double s = Math.Sqrt(Math.Pow(b[0] - a[0], 2) + Math.Pow(b[1] - a[1], 2));
        double g = s / R, ra = R + a[2] + i, rb = R + b[2] + t, sh = Math.Sin(g / 2);
        double d = Math.Sqrt(Math.Pow(rb - ra, 2) + (4 * ra * rb * sh * sh)); // r_A² + r_B² − 2 r_A r_B cos γ
        double up = rb - ra - (2 * rb * sh * sh);                             // r_B cos γ − r_A
        return (d, Math.Acos(up / d) - (k * g / 2));
    }

    /// <summary>Every pair observed both ways (slope distance and zenith angle), all zeniths in group DAY1.</summary>
    private static SurveyNetwork Network(Random? rng, bool estimate = true, bool reciprocal = true)
    {
        double Noise() => rng is null ? 0
            : Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var points = Truth.Select((p, j) => p.Id switch
        {
            "P1" => new Point("P1") { E = p.E, N = p.N, H = p.H, Fixed = Fixity.ENH },
            "P2" => new Point("P2") { E = p.E, N = p.N, H = p.H + 0.4, Fixed = Fixity.EN },
            _ => new Point(p.Id) { E = p.E + (0.3 * (j - 2)), N = p.N - 0.2, H = p.H - 0.5 },
        }).ToList();
        var obs = new List<Observation>();
        foreach (var (from, _, _, _) in Truth)
            foreach (var (to, _, _, _) in Truth)
            {
                if (from == to || (!reciprocal && string.CompareOrdinal(from, to) > 0)) continue;
                var (ea, na, ha) = True(from);
                var (eb, nb, hb) = True(to);
                double i = InstrumentHeight(from), t = TargetHeight(to);
                var (d, z) = Model([ea, na, ha], [eb, nb, hb], i, t, TrueK);
                obs.Add(new SlopeDistanceObservation(from, to, Length.FromMetres(d + (SdSlope * Noise())),
                    Length.FromMetres(i), Length.FromMetres(t)) { StandardDeviation = SdSlope });
                obs.Add(new ZenithObservation(from, to, Angle.FromRadians(z + (SdZenith * Noise())),
                    Length.FromMetres(i), Length.FromMetres(t))
                {
                    StandardDeviation = SdZenith, Refraction = 0.13, RefractionGroup = "DAY1",
                    RefractionEstimated = estimate,
                });
            }
        return new SurveyNetwork("refraction", points, obs);
    }

    /// <summary>Gauss-Newton with numerical derivatives, each step solved by MathNet's Householder QR of the
    /// weighted design matrix; unknowns H of P2, E N H of P3–P5 and k.</summary>
    private static (Dictionary<string, double[]> At, double K) IndependentSolve(SurveyNetwork net)
    {
        var at = net.Points.ToDictionary(p => p.Id, p => new[] { p.E!.Value, p.N!.Value, p.H!.Value });
        var kk = new[] { 0.13 };
        var unknowns = new List<(string Id, int Axis)> { ("P2", 2) };
        foreach (var id in new[] { "P3", "P4", "P5" }) unknowns.AddRange([(id, 0), (id, 1), (id, 2)]);
        unknowns.Add(("k", 0));
        var o = net.Observations;
        double F(int row)
        {
            var x = o[row];
            var (i, t) = x switch
            {
                SlopeDistanceObservation sd => (sd.InstrumentHeight.Metres, sd.TargetHeight.Metres),
                ZenithObservation zn => (zn.InstrumentHeight.Metres, zn.TargetHeight.Metres),
                _ => throw new InvalidOperationException(),
            };
            var (d, z) = Model(at[x.From], at[x.To], i, t, kk[0]);
            return x is SlopeDistanceObservation ? d : z;
        }
        ref double Value((string Id, int Axis) u) => ref u.Id == "k" ? ref kk[0] : ref at[u.Id][u.Axis];
        for (int iter = 0; iter < 30; iter++)
        {
            var a = Matrix<double>.Build.Dense(o.Count, unknowns.Count);
            var l = Vector<double>.Build.Dense(o.Count);
            for (int r = 0; r < o.Count; r++)
            {
                double w = 1 / o[r].StandardDeviation;
                l[r] = w * (o[r].Value - F(r));
                for (int c = 0; c < unknowns.Count; c++)
                {
                    double h = unknowns[c].Id == "k" ? 1e-3 : 1e-4;
                    Value(unknowns[c]) += h;
                    double up = F(r);
                    Value(unknowns[c]) -= 2 * h;
                    double down = F(r);
                    Value(unknowns[c]) += h;
                    a[r, c] = w * (up - down) / (2 * h);
                }
            }
            var dx = a.QR().Solve(l);
            for (int c = 0; c < unknowns.Count; c++) Value(unknowns[c]) += dx[c];
            if (dx.AbsoluteMaximum() < 1e-13) break;
        }
        return (at, kk[0]);
    }

    [Fact]
    public void WithoutNoiseTheEstimatedCoefficientIsTheSimulatedOne()
    {
        var result = Adjuster.Adjust(Network(null));
        var k = Assert.Single(result.Refractions);
        Assert.Equal("DAY1", k.Group);
        Assert.Equal(TrueK, k.Coefficient, 1e-7); // observations computed at k = 0.16 (exact model, no noise)
        Assert.True(k.Sd is > 0 and < 0.02, $"sd(k) = {k.Sd}");
        foreach (var (id, _, _, h) in Truth) Assert.Equal(h, result.Points.First(p => p.Id == id).H!.Value, 1e-6);
        Assert.Contains(result.Unknowns.Unknowns, u => u.Parameter == Parameter.Refraction && u.Owner == "DAY1");
    }

    [Theory]
    [InlineData(11)]
    [InlineData(12)]
    public void CoordinatesHeightsAndKAgreeWithAnIndependentQrSolve(int seed)
    {
        var net = Network(new Random(seed));
        var result = Adjuster.Adjust(net);
        var (at, k) = IndependentSolve(net);
        foreach (var p in result.Points)
        {
            var x = at[p.Id];
            Assert.Equal(x[0], p.E!.Value, 1e-9 * Math.Abs(x[0]));
            Assert.Equal(x[1], p.N!.Value, 1e-9 * Math.Abs(x[1]));
            Assert.Equal(x[2], p.H!.Value, 1e-9 * Math.Abs(x[2]));
        }
        Assert.Equal(k, result.Refractions[0].Coefficient, 1e-9 * Math.Abs(k));
    }

    [Fact]
    public void AWrongAssumedKLeavesResidualsThatEstimatingKRemoves()
    {
        // With k assumed at 0.13 instead of 0.16, each zenith carries the error of the correction
        // Δk·s²/(2R) (Ghilani & Wolf, Elementary Surveying, ch. 4, docs/references.md §10): 0.03·1.9²/(2·6371) m
        // = 17 mm over the 1.9 km sight P1→P2. Reciprocal zeniths cancel most of it; estimating k removes it.
        var assumed = Adjuster.Adjust(Network(null, estimate: false));
        var estimated = Adjuster.Adjust(Network(null));
        Assert.Empty(assumed.Refractions);
        Assert.True(assumed.Statistics.Vtpv > 1, $"vᵀPv with the wrong k = {assumed.Statistics.Vtpv}");
        Assert.True(estimated.Statistics.Vtpv < 1e-6, $"vᵀPv with k estimated = {estimated.Statistics.Vtpv}");
    }

    [Fact]
    public void OneWayZenithsAloneDoNotDetermineKAndAreRefusedNamingTheGroup()
    {
        // Plane coordinates held, zenith angles only, from P1 one way: each height absorbs k (rank defect).
        var pts = Truth.Select(p => new Point(p.Id)
        {
            E = p.E, N = p.N, H = p.H, Fixed = p.Id == "P1" ? Fixity.ENH : Fixity.EN,
        }).ToList();
        Observation Z(string from, string to) =>
            new ZenithObservation(from, to, Angle.FromDegrees(90), Length.FromMetres(1.5), Length.FromMetres(1.6))
            { StandardDeviation = SdZenith, RefractionGroup = "DAY1", RefractionEstimated = true };
        var oneWay = new SurveyNetwork("one way", pts, [Z("P1", "P2"), Z("P1", "P3"), Z("P1", "P4"), Z("P1", "P5")]);
        var e = Assert.Throws<DatumDefectException>(() => Adjuster.Adjust(oneWay));
        Assert.Contains("refraction coefficient of group DAY1", e.Message);
        Assert.Contains("reciprocal", e.Message);
        // One reciprocal zenith (P2→P1) determines it.
        var withBack = new SurveyNetwork("reciprocal", pts,
            [.. oneWay.Observations, Z("P2", "P1")]);
        Assert.Single(Adjuster.Adjust(withBack).Refractions);
    }

    [Fact]
    public void ZenithsOfOneGroupMustAgreeOnTheirCoefficient()
    {
        var net = Network(null);
        var obs = net.Observations.ToList();
        int last = obs.FindLastIndex(o => o is ZenithObservation);
        obs[last] = ((ZenithObservation)obs[last]) with { RefractionEstimated = false };
        var e = Assert.Throws<InvalidInputException>(() =>
            Adjuster.Adjust(new SurveyNetwork("mixed", net.Points, obs)));
        Assert.Contains("refraction group DAY1", e.Message);
    }

    [Fact]
    public void MonteCarloGivesVarianceFactorNearOneAndIntervalsCoveringNinetyFivePercent()
    {
        // 300 seeded runs of the network above, k estimated each time. Checks against MathNet's distributions:
        // - the mean of σ̂0² over the runs is 1 within 4 of its sd √(2/(r·runs)) (χ²_r/r has variance 2/r);
        // - 95% intervals Ĥ ± z₀.₉₇₅·σ_H of each free height, and k̂ ± z₀.₉₇₅·σ_k, cover the truth in 95% of the
        //   runs within 4 binomial sd √(0.95·0.05/runs) = 0.050 (common practice for a seeded calibration test).
        const int runs = 300;
        double z975 = Normal.InvCDF(0, 1, 0.975);
        var free = new[] { "P2", "P3", "P4", "P5" };
        var covered = free.ToDictionary(id => id, _ => 0);
        int kCovered = 0;
        double sumFactor = 0;
        int dof = 0;
        for (int run = 0; run < runs; run++)
        {
            var result = Adjuster.Adjust(Network(new Random(1000 + run)));
            dof = result.Statistics.DegreesOfFreedom;
            sumFactor += result.Statistics.VarianceFactor!.Value;
            foreach (var id in free)
            {
                var p = result.Points.First(q => q.Id == id);
                if (Math.Abs(p.H!.Value - True(id).H) <= z975 * p.SdH!.Value) covered[id]++;
            }
            var k = result.Refractions[0];
            if (Math.Abs(k.Coefficient - TrueK) <= z975 * k.Sd) kCovered++;
        }
        double meanFactor = sumFactor / runs;
        Assert.True(Math.Abs(meanFactor - 1) <= 4 * Math.Sqrt(2.0 / (dof * runs)), $"mean σ̂0² = {meanFactor}");
        double tolerance = 4 * Math.Sqrt(0.95 * 0.05 / runs);
        foreach (var id in free)
            Assert.True(Math.Abs(((double)covered[id] / runs) - 0.95) <= tolerance, $"{id}: {covered[id]}/{runs}");
        Assert.True(Math.Abs(((double)kCovered / runs) - 0.95) <= tolerance, $"k: {kCovered}/{runs}");
    }
}
