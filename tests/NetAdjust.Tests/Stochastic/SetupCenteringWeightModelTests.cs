using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

public class SetupCenteringWeightModelTests
{
    // Own scenario (invented): two held points and two new points, three setups with directions and distances,
    // observations computed from the coordinates below and disturbed by fixed small amounts.
    private static readonly Dictionary<string, PlanePoint> Truth = new()
    {
        ["A"] = new(1000, 1000), ["B"] = new(1300, 1010), ["C"] = new(1150, 1210), ["D"] = new(1120, 820),
    };

    private static readonly (string At, string[] To)[] Setups =
    [
        ("A", ["B", "C", "D"]), ("B", ["A", "C", "D"]), ("C", ["A", "B", "D"]), ("D", ["A", "B"]),
    ];

    private static SurveyNetwork Network(double instrumentCentering, double targetCentering, double approximationError = 0.3)
    {
        double x = approximationError;
        var ts = new TotalStationSpecification("T", Angle.FromArcseconds(2).Radians, 0, new EdmSpecification(0.002, 2), instrumentCentering, 0);
        var tg = new TargetSpecification("P", targetCentering, 0);
        var points = new List<Point>
        {
            new("A") { E = 1000, N = 1000, Fixed = Fixity.EN }, new("B") { E = 1300, N = 1010, Fixed = Fixity.EN },
            new("C") { E = 1150 + x, N = 1210 - x }, new("D") { E = 1120 - x, N = 820 + x },
        };
        var obs = new List<Observation>();
        int k = 0;
        foreach (var (at, targets) in Setups)
        {
            string setup = at + "#1";
            foreach (string to in targets)
            {
                k++;
                double dist = PlaneGeometry.Distance(at, Truth[at], to, Truth[to]).Value;
                double az = PlaneGeometry.Azimuth(at, Truth[at], to, Truth[to]).Value;
                double noiseRad = Angle.FromArcseconds(((k * 7) % 5) - 2.0).Radians;   // −2″..+2″
                double noiseM = (((k * 3) % 5) - 2.0) * 0.001;                        // −2..+2 mm
                // Weighted from the specifications; the sight lengths are the true distances.
                var weighting = new ObservationWeighting
                {
                    Instrument = ts, Target = tg, ObservedSights = new Dictionary<string, double> { [to] = dist },
                };
                obs.Add(new DirectionObservation(at, to, Angle.FromRadians(Angle.Reduce0To2Pi(az - 0.7 + noiseRad)), setup)
                { SetupId = setup, Weighting = weighting });
                obs.Add(new DistanceObservation(at, to, Length.FromMetres(dist + noiseM)) { SetupId = setup, Weighting = weighting });
            }
        }
        return new SurveyNetwork("centering test", points, obs);
    }

    private static AdjustmentOptions Correlated => AdjustmentOptions.Default with { Centering = CenteringModel.Correlated };

    [Fact]
    public void CorrelatedAndDiagonalAgreeWhenInstrumentCenteringIsZero()
    {
        var net = Network(0.0, 0.001);
        var diag = Adjuster.Adjust(net);
        var corr = Adjuster.Adjust(net, Correlated);
        Assert.True(corr.Weights.IsDiagonal);
        Assert.Equal(diag.Statistics.Vtpv, corr.Statistics.Vtpv, 1e-10);
        for (int i = 0; i < diag.Points.Count; i++)
        {
            Assert.Equal(diag.Points[i].E!.Value, corr.Points[i].E!.Value, 1e-10);
            Assert.Equal(diag.Points[i].N!.Value, corr.Points[i].N!.Value, 1e-10);
            Assert.Equal(diag.Points[i].SdE!.Value, corr.Points[i].SdE!.Value, 1e-12);
        }
    }

    [Fact]
    public void CorrelatedOptionDiffersWhenTheInstrumentCenteringIsNotZero()
    {
        var net = Network(0.002, 0.001);
        var diag = Adjuster.Adjust(net);
        var corr = Adjuster.Adjust(net, Correlated);
        Assert.False(corr.Weights.IsDiagonal);
        Assert.Equal(Setups.Length, corr.Weights.Blocks.Count(b => b.Size > 1));
        Assert.True(Math.Abs(diag.Statistics.Vtpv - corr.Statistics.Vtpv) > 1e-6 * diag.Statistics.Vtpv);
        Assert.True(Math.Abs(diag.Points[2].SdE!.Value - corr.Points[2].SdE!.Value) > 1e-7);
    }

    [Fact]
    public void WeightBlockInverseIsThePropagatedCovarianceOfTheSetup()
    {
        // Independent check: Σ = D + J (σ_i² I) Jᵀ where J holds each observation's partial derivatives with
        // respect to the station's easting and northing (PlaneGeometry), D the other contributions squared.
        double sigmaI = 0.0015;
        var net = Network(sigmaI, 0.001, approximationError: 0); // the model takes its geometry from the approximate coordinates
        var model = StochasticModel.Build(net, new GivenCoordinates(net), CenteringModel.Correlated, 1.0);
        var block = model.Blocks[0];
        int k = block.Rows.Count;
        Assert.Equal(6, k); // three directions and three distances at A
        var j = Matrix<double>.Build.Dense(k, 2);
        var d = Matrix<double>.Build.Dense(k, k);
        for (int a = 0; a < k; a++)
        {
            var o = net.Observations[block.Rows[a]];
            var eq = o is DirectionObservation dir
                ? PlaneGeometry.Azimuth(dir.Station, Truth[dir.Station], dir.Target, Truth[dir.Target])
                : PlaneGeometry.Distance(o.From, Truth[o.From], o.To, Truth[o.To]);
            j[a, 0] = eq.Partials.Where(p => p.Owner == "A" && p.Parameter == Parameter.E).Sum(p => p.Derivative);
            j[a, 1] = eq.Partials.Where(p => p.Owner == "A" && p.Parameter == Parameter.N).Sum(p => p.Derivative);
            double c = model.Budgets[block.Rows[a]]!.ValueOf(ContributionNames.InstrumentCentering);
            double sd = model.StandardDeviations[block.Rows[a]];
            d[a, a] = (sd * sd) - (c * c);
        }
        var expected = d + ErrorPropagation.Propagate(j, Matrix<double>.Build.DiagonalIdentity(2) * (sigmaI * sigmaI));
        var p = Matrix<double>.Build.Dense(k, k, (r, c) => block.Weights[(r * k) + c]);
        var cov = p.Inverse();
        for (int r = 0; r < k; r++)
            for (int c = 0; c < k; c++)
                Assert.Equal(expected[r, c], cov[r, c], 1e-9 * expected[r, r]);
    }
}
