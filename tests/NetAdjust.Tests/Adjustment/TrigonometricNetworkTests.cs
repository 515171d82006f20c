using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// A small 3D network of slope distances and zenith angles (with instrument and target heights, over a curved earth
/// with refraction) adjusted by NetAdjust, against an independent Gauss-Newton solve written here.
/// </summary>
public class TrigonometricNetworkTests
{
    private const double Arcsec = Math.PI / 648000;
    private const double R = 6_371_008.8; // the mean earth radius of docs/methods.md
    private const double K = 0.13;
    private const double SdSlope = 0.002, SdZenith = 3 * Arcsec;

    private static readonly (string Id, double E, double N, double H)[] Truth =
    [
        ("A", 1000.000, 1000.000, 210.000), ("B", 1840.000, 1120.000, 236.500),
        ("C", 1450.000, 1630.000, 251.250), ("D", 1210.000, 1480.000, 198.700),
    ];

    private static readonly (string From, string To, double I, double T)[] Sights =
    [
        ("A", "B", 1.55, 1.70), ("A", "C", 1.55, 1.80), ("A", "D", 1.55, 2.00),
        ("B", "A", 1.62, 1.70), ("B", "C", 1.62, 1.50), ("B", "D", 1.62, 1.75),
        ("C", "A", 1.48, 1.60), ("C", "D", 1.48, 1.65), ("D", "B", 1.51, 1.80), ("D", "C", 1.51, 1.60),
    ];

    private static (double E, double N, double H) True(string id)
    {
        var p = Truth.First(t => t.Id == id);
        return (p.E, p.N, p.H);
    }

    /// <summary>The slope distance and the zenith angle in a form of their own (law of cosines, arc cosine).</summary>
    private static (double D, double Z) Model(double[] a, double[] b, double i, double t)
    {
        double s = Math.Sqrt(Math.Pow(b[0] - a[0], 2) + Math.Pow(b[1] - a[1], 2));
        double g = s / R, ra = R + a[2] + i, rb = R + b[2] + t, sh = Math.Sin(g / 2);
        double d = Math.Sqrt(Math.Pow(rb - ra, 2) + (4 * ra * rb * sh * sh)); // r_A² + r_B² − 2 r_A r_B cos γ
        double up = rb - ra - (2 * rb * sh * sh);                             // r_B cos γ − r_A
        return (d, Math.Acos(up / d) - (K * g / 2));
    }

    private static SurveyNetwork Network(int seed, double wrongTargetHeight = 0)
    {
        var rng = new Random(seed);
        double Noise() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var points = Truth.Select((p, j) => p.Id switch
        {
            "A" => new Point("A") { E = p.E, N = p.N, H = p.H, Fixed = Fixity.ENH },
            "B" => new Point("B") { E = p.E, N = p.N, H = p.H + 0.3, Fixed = Fixity.EN },
            _ => new Point(p.Id) { E = p.E + 0.05 * (j - 2), N = p.N - 0.04, H = p.H + 0.2 },
        });
        var obs = new List<Observation>();
        int line = 0;
        foreach (var (from, to, i, t) in Sights)
        {
            var (ea, na, ha) = True(from);
            var (eb, nb, hb) = True(to);
            var (d, z) = Model([ea, na, ha], [eb, nb, hb], i, t);
            line++;
            obs.Add(new SlopeDistanceObservation(from, to, Length.FromMetres(d + (SdSlope * Noise())),
                Length.FromMetres(i), Length.FromMetres(t)) { StandardDeviation = SdSlope, Source = $"s:{line}" });
            double booked = t + (line == 5 ? wrongTargetHeight : 0);
            obs.Add(new ZenithObservation(from, to, Angle.FromRadians(z + (SdZenith * Noise())),
                Length.FromMetres(i), Length.FromMetres(booked))
            { StandardDeviation = SdZenith, Source = $"z:{line}" });
        }
        return new SurveyNetwork("trig", points, obs);
    }

    /// <summary>Gauss-Newton with numerical derivatives, each step solved by MathNet's Householder QR.</summary>
    private static Dictionary<string, double[]> IndependentSolve(SurveyNetwork net)
    {
        var at = net.Points.ToDictionary(p => p.Id, p => new[] { p.E!.Value, p.N!.Value, p.H!.Value });
        var unknowns = new List<(string Id, int Axis)> { ("B", 2) };
        foreach (var id in new[] { "C", "D" }) unknowns.AddRange([(id, 0), (id, 1), (id, 2)]);
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
            var (d, z) = Model(at[x.From], at[x.To], i, t);
            return x is SlopeDistanceObservation ? d : z;
        }
        for (int iter = 0; iter < 20; iter++)
        {
            var a = Matrix<double>.Build.Dense(o.Count, unknowns.Count);
            var l = Vector<double>.Build.Dense(o.Count);
            for (int r = 0; r < o.Count; r++)
            {
                double w = 1 / o[r].StandardDeviation;
                l[r] = w * (o[r].Value - F(r));
                for (int c = 0; c < unknowns.Count; c++)
                {
                    var (id, axis) = unknowns[c];
                    const double h = 1e-4;
                    at[id][axis] += h;
                    double up = F(r);
                    at[id][axis] -= 2 * h;
                    double down = F(r);
                    at[id][axis] += h;
                    a[r, c] = w * (up - down) / (2 * h);
                }
            }
            var dx = a.QR().Solve(l);
            for (int c = 0; c < unknowns.Count; c++) at[unknowns[c].Id][unknowns[c].Axis] += dx[c];
            if (dx.AbsoluteMaximum() < 1e-12) break;
        }
        return at;
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void AdjustedCoordinatesAndHeightsAgreeWithAnIndependentQrSolve(int seed)
    {
        var net = Network(seed);
        var result = Adjuster.Adjust(net);
        var independent = IndependentSolve(net);
        foreach (var p in result.Points)
        {
            var x = independent[p.Id];
            Assert.Equal(x[0], p.E!.Value, 1e-9 * Math.Abs(x[0]));
            Assert.Equal(x[1], p.N!.Value, 1e-9 * Math.Abs(x[1]));
            Assert.Equal(x[2], p.H!.Value, 1e-9 * Math.Abs(x[2]));
        }
        // Heights of all points are unknowns except the held one, with standard deviations.
        Assert.All(result.Points.Where(p => p.Id != "A"), p => Assert.True(p.SdH > 0));
        Assert.Equal(3 * 2 + 1, result.Unknowns.Count);
        // and the truth is recovered within a few millimetres
        foreach (var (id, e, n, h) in Truth)
        {
            var p = result.Points.First(q => q.Id == id);
            Assert.Equal(h, p.H!.Value, 0.01);
            Assert.Equal(e, p.E!.Value, 0.01);
        }
    }

    [Fact]
    public void AWrongTargetHeightIsFlaggedByTheWTestOnItsZenithAngle()
    {
        // Baarda's w-test (Baarda 1968, A testing procedure for use in geodetic networks), critical value 3.29 for
        // α₀ = 0.001 (normal distribution). A target booked 0.1 m too high on B→C (641 m): 32″ against σ = 3″.
        var clean = Adjuster.Adjust(Network(3)).Analysis;
        var wrong = Adjuster.Adjust(Network(3, wrongTargetHeight: 0.1));
        var tests = wrong.Analysis.Observations;
        int bad = wrong.Observations.First(o => o.Input.Source == "z:5").Index;
        double critical = CriticalValues.WTest(0.001);
        Assert.True(clean.Observations.All(t => t.W is not double w || Math.Abs(w) < critical));
        Assert.True(Math.Abs(tests[bad].W!.Value) > critical, $"w = {tests[bad].W}");
        Assert.Equal(bad, tests.Where(t => t.W is not null).MaxBy(t => Math.Abs(t.W!.Value))!.Index);
    }
}
