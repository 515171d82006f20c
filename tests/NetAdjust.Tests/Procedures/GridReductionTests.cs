using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Tests.Geodesy;
using NetAdjust.Units;
using Xunit.Abstractions;

namespace NetAdjust.Tests.Procedures;

/// <summary>A network measured on the ground and adjusted on the grid (docs/methods.md, "Grid and ground").</summary>
public class GridReductionTests(ITestOutputHelper output)
{
    private const double Arcsec = Math.PI / 648000, SdDistance = 0.0015, SdDirection = 1.0 * Arcsec;
    private static readonly KruegerTransverseMercator Utm33 = KruegerTransverseMercator.Utm(Ellipsoid.Wgs84, 33);

    private static readonly (string Id, double E, double N, double H, bool Fixed)[] Truth =
    [
        ("A", 681200, 5101400, 612, true), ("B", 683050, 5102950, 655, true), ("C", 682700, 5099800, 640, true),
        ("P1", 681900, 5100600, 628, false), ("P2", 682600, 5101500, 633, false), ("P3", 683500, 5100700, 648, false),
    ];

    private static readonly (string At, string[] To)[] Sightings =
    [
        ("A", ["P1", "P2", "B"]), ("P1", ["A", "P2", "C", "P3"]), ("P2", ["A", "P1", "P3", "B"]),
        ("P3", ["P1", "P2", "B", "C"]), ("C", ["P1", "P3"]), ("B", ["P2", "P3"]),
    ];

    /// <summary>The measurements of the truth on the ground, computed without the projection's factors: the
    /// geodesic's length and azimuth from Vincenty's inverse (Survey Review 1975) between the truth's geodetic
    /// positions, the length raised to the line's mean ellipsoidal height by (R + h) / R, plus seeded noise.
    /// </summary>
    private static SurveyNetwork Measured(int seed)
    {
        var rnd = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rnd.NextDouble())) * Math.Cos(2 * Math.PI * rnd.NextDouble());
        var at = Truth.ToDictionary(t => t.Id);
        var points = Truth.Select(t => t.Fixed
            ? new Point(t.Id) { E = t.E, N = t.N, H = t.H, Fixed = Fixity.EN }
            : new Point(t.Id) { H = t.H });
        var observations = new List<Observation>();
        foreach (var (station, targets) in Sightings)
        {
            double orientation = rnd.NextDouble() * 2 * Math.PI;
            var a = at[station];
            var (lat1, lon1) = Utm33.Inverse(a.E, a.N);
            foreach (var target in targets)
            {
                var b = at[target];
                var (lat2, lon2) = Utm33.Inverse(b.E, b.N);
                var (s, alpha) = Vincenty.Inverse(Ellipsoid.Wgs84, lat1, lon1, lat2, lon2);
                double r = Ellipsoid.Wgs84.RadiusInAzimuth((lat1 + lat2) / 2, alpha), h = (a.H + b.H) / 2;
                observations.Add(new DirectionObservation(station, target,
                    Angle.FromRadians(alpha - orientation + SdDirection * Gauss()), station)
                    { StandardDeviation = SdDirection });
                observations.Add(new DistanceObservation(station, target,
                    Length.FromMetres(s * (r + h) / r + SdDistance * Gauss())) { StandardDeviation = SdDistance });
            }
        }
        return new SurveyNetwork("ground network", points, observations);
    }

    private static readonly GridSystem Ground = new() { Projection = Utm33, Distances = DistanceBasis.Ground };

    [Fact]
    public void GlobalTestPassesWithTheReductionsAndFailsWithoutThem()
    {
        var network = Measured(11);
        var plain = Adjuster.Adjust(network);
        var reduced = Adjuster.Adjust(GridReduction.Reduce(network, Ground).Network);
        output.WriteLine($"vTPv without reductions {plain.Statistics.Vtpv:F1}, with {reduced.Statistics.Vtpv:F1} " +
            $"(r = {reduced.Statistics.DegreesOfFreedom})");
        // The chi-square global test (docs/references.md §2) measured on both adjustments of the same data.
        Assert.True(reduced.Statistics.GlobalTest.Passed);
        Assert.False(plain.Statistics.GlobalTest.Passed);
        // With the reductions the adjusted points are within a few millimetres of the truth.
        foreach (var p in reduced.Points.Where(p => !p.Input.IsControl))
        {
            var t = Truth.Single(x => x.Id == p.Id);
            Assert.True(Math.Abs(p.E!.Value - t.E) < 0.006 && Math.Abs(p.N!.Value - t.N) < 0.006, p.Id);
        }
    }

    /// <summary>The adjusted positions of a whole adjustment, as the reduction takes them (the given height where
    /// the adjustment has none).</summary>
    private static Dictionary<string, (double E, double N, double? H)> Positions(AdjustmentResult r) =>
        r.Points.Where(p => p.E is not null && p.N is not null)
            .ToDictionary(p => p.Id, p => (p.E!.Value, p.N!.Value, p.H ?? p.Input.H));

    [Fact]
    public void TheFactorsAreThoseAtThePositionsOfTwoWholePreliminaryAdjustments()
    {
        // The definition (docs/methods.md, "Grid and ground"): the factors at the positions adjusted from the
        // observations as measured, then once more at those adjusted from the reduced ones. The reduction takes the
        // positions from the iterations alone; they are the whole adjustments' to the last bit.
        var network = Measured(5);
        var first = GridReduction.ReduceAt(network, Ground, Positions(Adjuster.Adjust(network)));
        var expected = GridReduction.ReduceAt(network, Ground, Positions(Adjuster.Adjust(first.Network)));
        Adjuster.PatternCount = 0;
        var actual = GridReduction.Reduce(network, Ground);
        Assert.Equal(2, Adjuster.PatternCount); // two preliminary adjustments: directions and distances change
        Assert.Equal(expected.Network.Observations.Select(o => o.Value),
            actual.Network.Observations.Select(o => o.Value));
        Assert.Equal(expected.Observations.Select(o => o.CombinedFactor),
            actual.Observations.Select(o => o.CombinedFactor));
        Assert.Equal(expected.Points.Select(p => (p.Point, p.ScaleFactor, p.Convergence)),
            actual.Points.Select(p => (p.Point, p.ScaleFactor, p.Convergence)));
    }

    [Fact]
    public void ANetworkWithNothingToReduceIsAdjustedOnceBeforehandOrTakesTheFactorsOfItsOwnAdjustment()
    {
        // GNSS baselines pass to the grid as they are (docs/methods.md, "GNSS baselines"): the second preliminary
        // adjustment would repeat the first (the same observations), so it is left out; the point factors are still
        // those at the adjusted positions. The command takes them at the ordinary adjustment itself, once it is made
        // (ReduceAt with the adjustment): the same factors to the last bit.
        var network = NetAdjust.Tests.Network.BaselineTestNetworks.Network(seed: 9);
        var grid = NetAdjust.Tests.Network.BaselineTestNetworks.Grid;
        Assert.True(GridReduction.LeavesAsIs(network, grid));
        Adjuster.PatternCount = 0;
        var actual = GridReduction.Reduce(network, grid);
        Assert.Equal(1, Adjuster.PatternCount);
        Assert.Empty(actual.Observations);
        Assert.All(network.Observations.Zip(actual.Network.Observations), t => Assert.Same(t.First, t.Second));
        var adjusted = Adjuster.Adjust(network);
        var expected = GridReduction.ReduceAt(network, grid, Positions(adjusted));
        var afterwards = GridReduction.ReduceAt(network, grid, adjusted);
        Assert.NotEmpty(expected.Points);
        foreach (var r in new[] { actual, afterwards })
            Assert.Equal(expected.Points.Select(p => (p.Point, p.ScaleFactor, p.Convergence)),
                r.Points.Select(p => (p.Point, p.ScaleFactor, p.Convergence)));
        Assert.Empty(afterwards.Observations);
        Assert.Equal(actual.Network.Observations, afterwards.Network.Observations);
    }

    private static readonly GridSystem[] Systems =
    [
        Ground, Ground with { Distances = DistanceBasis.Grid },
        Ground with { Azimuths = AzimuthBasis.Geodetic, Distances = DistanceBasis.Grid },
        new() { ProjectScale = 0.9996, Distances = DistanceBasis.Ground },
        new() { ProjectScale = 0.9996, Distances = DistanceBasis.Grid }, new(),
    ];

    [Theory]
    [InlineData("directions and distances")]
    [InlineData("distances")]
    [InlineData("directions")]
    [InlineData("azimuths")]
    [InlineData("baselines")]
    public void ANetworkIsSaidToBeLeftAsItIsJustWhenTheReductionLeavesEveryObservation(string kinds)
    {
        var measured = Measured(5);
        var truth = Truth.ToDictionary(t => t.Id, t => (t.E, t.N, (double?)t.H));
        SurveyNetwork Only(Func<Observation, bool> keep) =>
            new(kinds, measured.Points, measured.Observations.Where(keep).ToList());
        var network = kinds switch
        {
            "distances" => Only(o => o is DistanceObservation),
            "directions" => Only(o => o is DirectionObservation),
            "azimuths" => new SurveyNetwork(kinds, measured.Points,
                [new AzimuthObservation("A", "B", Angle.FromDegrees(50)) { StandardDeviation = SdDirection }]),
            "baselines" => NetAdjust.Tests.Network.BaselineTestNetworks.Network(seed: 4),
            _ => measured,
        };
        var positions = kinds == "baselines" ? Positions(Adjuster.Adjust(network)) : truth;
        foreach (var system in Systems)
        {
            var reduced = GridReduction.ReduceAt(network, system, positions).Network.Observations;
            bool same = network.Observations.Zip(reduced).All(t => ReferenceEquals(t.First, t.Second));
            Assert.True(same == GridReduction.LeavesAsIs(network, system), $"{kinds}, {system}");
        }
    }

    [Fact]
    public void EveryGroundDistanceIsMultipliedByItsCombinedFactor()
    {
        var network = Measured(3);
        var result = GridReduction.Reduce(network, Ground);
        var distances = result.Observations.Where(o => o.Observed.Kind == ObservationKind.Distance).ToList();
        Assert.Equal(network.Observations.Count(o => o.Kind == ObservationKind.Distance), distances.Count);
        foreach (var d in distances)
        {
            Assert.Equal(d.ElevationFactor!.Value * d.ScaleFactor!.Value, d.CombinedFactor!.Value, 15);
            Assert.Equal(d.Observed.Value * d.CombinedFactor.Value, d.Reduced.Value, 9);
            // 182 km east of the central meridian at about 630 m: k ≈ 0.9996 (1 + x²/2R²) ≈ 1.00000,
            // EF ≈ 1 − 630 / 6.38e6 ≈ 0.99990 (common practice)
            Assert.InRange(d.CombinedFactor.Value, 0.99985, 0.99995);
        }
        Assert.Equal(network.Points.Count, result.Points.Count);
    }

    [Fact]
    public void GridDistancesAreLeftAsTheyAre()
    {
        var network = Measured(3);
        var result = GridReduction.Reduce(network, Ground with { Distances = DistanceBasis.Grid });
        foreach (var (o, r) in network.Observations.Zip(result.Network.Observations))
            if (o.Kind == ObservationKind.Distance) Assert.Equal(o.Value, r.Value);
    }

    [Fact]
    public void AProjectScaleMultipliesGroundDistancesAndTurnsNothing()
    {
        var network = Measured(3);
        var system = new GridSystem { ProjectScale = 0.99985, Distances = DistanceBasis.Ground };
        var result = GridReduction.Reduce(network, system);
        foreach (var (o, r) in network.Observations.Zip(result.Network.Observations))
            Assert.Equal(o.Kind == ObservationKind.Distance ? o.Value * 0.99985 : o.Value, r.Value, 12);
        Assert.Empty(result.Points);
    }

    [Fact]
    public void AGroundDistanceToAPointWithoutHeightIsRefused()
    {
        var network = Measured(3);
        var points = network.Points.Select(p => p.Id == "P2" ? p with { H = null } : p);
        var noHeight = new SurveyNetwork(network.Name, points, network.Observations);
        var e = Assert.Throws<InvalidInputException>(() => GridReduction.Reduce(noHeight, Ground));
        Assert.Contains("P2", e.Message);
        // a mean height fills it in
        Assert.NotNull(GridReduction.Reduce(noHeight, Ground with { MeanHeight = 630 }));
    }

    [Fact]
    public void APointFarOutsideTheZoneIsNamedNotReducedToNonsense()
    {
        var network = Measured(3);
        // 40 000 km east: no transverse Mercator reaches it; the series gives no finite factor there.
        var at = Truth.ToDictionary(t => t.Id, t => (E: t.Id == "A" ? 4e7 : t.E, t.N, (double?)t.H));
        var e = Assert.ThrowsAny<InvalidInputException>(() => GridReduction.ReduceAt(network, Ground, at));
        Assert.Contains("A", e.Message);
    }

    [Theory]
    [InlineData(800.0, 35.0)]
    [InlineData(1500.0, -120.0)]
    public void ReducedSlopeDistanceAndZenithFitTheSpatialModelOnTheGrid(double length, double rise)
    {
        // The spatial model (docs/methods.md) takes the plane distance as the arc at height 0, so a sighting measured
        // on the earth is the model evaluated with the plane distance on the ellipsoid, s = grid distance / k. Reduced
        // by k, the observations must equal the model evaluated on the grid coordinates.
        double e1 = 505000, n1 = 5101400, h1 = 612; // near the central meridian: k ≈ 0.9996, −400 ppm
        double e2 = e1 + length * 0.6, n2 = n1 + length * 0.8, h2 = h1 + rise;
        double k = ProjectionFactors.LineScaleFactor(Utm33, e1, n1, e2, n2);
        var a = new PlanePoint(e1, n1);
        var onEarth = new Sighting("A", a, h1, 1.6, "B",
            new PlanePoint(e1 + (e2 - e1) / k, n1 + (n2 - n1) / k), h2, 1.3);
        var onGrid = onEarth with { Target = new PlanePoint(e2, n2) };
        double s = SpatialGeometry.SlopeDistance(onEarth).Value;
        double z = SpatialGeometry.Zenith(onEarth, 0.13).Value;
        var network = new SurveyNetwork("trig", [new Point("A") { E = e1, N = n1, H = h1 },
            new Point("B") { E = e2, N = n2, H = h2 }],
        [
            new SlopeDistanceObservation("A", "B", Length.FromMetres(s), Length.FromMetres(1.6), Length.FromMetres(1.3))
                { StandardDeviation = 0.002 },
            new ZenithObservation("A", "B", Angle.FromRadians(z), Length.FromMetres(1.6), Length.FromMetres(1.3))
                { StandardDeviation = 2 * Arcsec },
        ]);
        var reduced = GridReduction.ReduceAt(network, Ground, new Dictionary<string, (double E, double N, double? H)>
            { ["A"] = (e1, n1, h1), ["B"] = (e2, n2, h2) }).Network.Observations;
        Assert.Equal(SpatialGeometry.SlopeDistance(onGrid).Value, reduced[0].Value, 5); // 0.01 mm
        Assert.Equal(SpatialGeometry.Zenith(onGrid, 0.13).Value, reduced[1].Value, 8); // 0.002″
        Assert.True(Math.Abs(reduced[0].Value - s) > 1e-4 * length); // the reduction is not nothing (> 100 ppm)
    }
}
