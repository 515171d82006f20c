using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// The Skelmoor demo (invented site and names): four GNSS control marks SK01 … SK04 about 2 to 3 km apart on
/// ETRS89 / UTM zone 32N (about 12–15 km east of the central meridian), 210–270 m above the geoid (separation
/// 47.42 m), observed in two sessions of three receivers; a total-station traverse SK01 – T1 – T2 – T3 – SK03
/// oriented on SK02 at both ends; and a level line along it from SK01, whose height is held. The truth is on the
/// grid with orthometric heights; the baselines are the earth-centred differences of the truth (grid → geodetic by
/// the projection's inverse, h = H + N, → X, Y, Z by <see cref="Geocentric"/>) plus correlated noise drawn from the
/// covariance the processing reports (3 mm + 0.5 ppm horizontal, twice that vertical, with correlations in the local
/// frame, turned into the earth-centred frame at the start point). The traverse is what the field would measure:
/// directions along the geodesic (grid bearing minus the arc-to-chord correction) with 1″, horizontal ground
/// distances (grid distance / combined factor) with 2 mm; levelling 1 mm/√km.
/// </summary>
internal static class SkelmoorGnss
{
    private const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;

    /// <summary>The EPSG code of the grid (ETRS89 / UTM zone 32N).</summary>
    public const int EpsgCode = 25832;

    /// <summary>The geoid separation of the site, metres (ellipsoidal height = height + separation).</summary>
    public const double GeoidSeparation = 47.42;

    /// <summary>σ of a direction (radians), of a distance (metres) and of 1 km of levelling (metres).</summary>
    public const double DirectionSd = 1.0 * Arcsecond, DistanceSd = 0.002, LevelSdPerKm = 0.001;

    /// <summary>The baselines' horizontal σ = 3 mm + 0.5 ppm, vertical twice that; correlations east–north,
    /// east–up, north–up in the local frame.</summary>
    public const double BaselineSdConstant = 0.003, BaselineSdPpm = 0.5e-6, VerticalRatio = 2.0,
        CorrelationEn = 0.10, CorrelationEu = 0.05, CorrelationNu = -0.15;

    /// <summary>The true positions: grid easting, northing and height above the geoid, metres.</summary>
    public static readonly (string Id, double E, double N, double H)[] TruePoints =
    [
        ("SK01", 512340.215, 5627810.442, 212.384), ("SK02", 514875.630, 5628955.118, 248.917),
        ("SK03", 514420.781, 5626240.305, 231.562), ("SK04", 511905.344, 5629870.927, 265.208),
        ("T1", 512820.460, 5627512.830, 218.712), ("T2", 513355.120, 5627190.570, 224.049),
        ("T3", 513902.660, 5626745.210, 227.934),
    ];

    /// <summary>The sessions: each observed baseline (from, to) in the order the processing listed them.</summary>
    public static readonly (string Session, (string From, string To)[] Baselines)[] Sessions =
    [
        ("S1", [("SK01", "SK02"), ("SK01", "SK03"), ("SK02", "SK03")]),
        ("S2", [("SK02", "SK04"), ("SK01", "SK04"), ("SK02", "SK01")]),
    ];

    private static readonly string[] Traverse = ["SK01", "T1", "T2", "T3", "SK03"];

    /// <summary>The orientation mark sighted at both ends of the traverse.</summary>
    private const string Reference = "SK02";

    public static DemoSurvey Draw(int seed, IMapProjection projection, SeededNoise noise)
    {
        var truth = TruePoints.ToDictionary(p => p.Id, p => (p.E, p.N, p.H), StringComparer.Ordinal);
        // SK01 is published control held in all three components; the other marks and the traverse stations get
        // approximate coordinates (a navigation fix and a sketch, within about 0.5 m).
        var points = new List<Point>();
        foreach (var (id, e, n, h) in TruePoints)
        {
            if (id == "SK01")
            {
                points.Add(new Point(id) { E = e, N = n, H = h, Fixed = Fixity.EN | Fixity.H });
                continue;
            }
            points.Add(new Point(id)
            {
                E = Math.Round(e + noise.Uniform(-0.5, 0.5), 1),
                N = Math.Round(n + noise.Uniform(-0.5, 0.5), 1),
                H = Math.Round(h + noise.Uniform(-0.5, 0.5), 1),
            });
        }

        var baselines = new List<DemoBaseline>();
        foreach (var (session, pairs) in Sessions)
            foreach (var (from, to) in pairs)
                baselines.Add(Baseline(projection, truth[from], truth[to], from, to, session, noise));

        var setups = new List<(string, IReadOnlyList<Observation>)>();
        for (int i = 0; i < Traverse.Length; i++)
        {
            string st = Traverse[i];
            var targets = new List<string>();
            if (i == 0) targets.Add(Reference);
            if (i > 0) targets.Add(Traverse[i - 1]);
            if (i < Traverse.Length - 1) targets.Add(Traverse[i + 1]);
            if (i == Traverse.Length - 1) targets.Add(Reference);
            var obs = new List<Observation>();
            double zero = noise.Uniform(0, 2 * Math.PI);
            foreach (var t in targets)
            {
                double value = GridTruth.Geodesic(projection, truth[st], truth[t]) - zero + noise.Gauss(DirectionSd);
                obs.Add(new DirectionObservation(st, t, GridTruth.Circle(value), st + "/1")
                    { StandardDeviation = DirectionSd });
            }
            if (i < Traverse.Length - 1)
            {
                string t = Traverse[i + 1];
                double d = GridTruth.Ground(projection, truth[st], truth[t], GeoidSeparation) + noise.Gauss(DistanceSd);
                obs.Add(new DistanceObservation(st, t, Length.FromMetres(d)) { StandardDeviation = DistanceSd });
            }
            setups.Add((st, obs));
        }

        var levelling = new List<HeightDifferenceObservation>();
        for (int i = 0; i + 1 < Traverse.Length; i++)
        {
            var (a, b) = (truth[Traverse[i]], truth[Traverse[i + 1]]);
            // the levelled route follows the road, about 15% longer than the straight line, rounded to 10 m
            double length = Math.Round(1.15 * Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)))
                / 10) * 10;
            double sd = LevelSdPerKm * Math.Sqrt(length / 1000);
            var dh = Length.FromMetres(b.H - a.H + noise.Gauss(sd));
            levelling.Add(new HeightDifferenceObservation(Traverse[i], Traverse[i + 1], dh, Length.FromMetres(length))
                { StandardDeviation = sd });
        }
        return new DemoSurvey(DemoScenario.Skelmoor, seed, points, setups, levelling, truth, [])
            { Baselines = baselines };
    }

    /// <summary>The earth-centred position of a grid point with its height above the geoid.</summary>
    public static (double X, double Y, double Z) Geocentric3(IMapProjection p, (double E, double N, double H) a)
    {
        var (lat, lon) = p.Inverse(a.E, a.N);
        return Geocentric.ToGeocentric(p.Ellipsoid, lat, lon, a.H + GeoidSeparation);
    }

    /// <summary>The covariance the processing reports for a baseline from a point (local σ and correlations as
    /// above, turned by the rotation at the start point: C = Rᵀ C_enu R), m², row-major.</summary>
    public static double[] BaselineCovariance(IMapProjection p, (double E, double N, double H) from, double length)
    {
        double sh = BaselineSdConstant + BaselineSdPpm * length, sv = VerticalRatio * sh;
        double[] local =
        [
            sh * sh, CorrelationEn * sh * sh, CorrelationEu * sh * sv,
            CorrelationEn * sh * sh, sh * sh, CorrelationNu * sh * sv,
            CorrelationEu * sh * sv, CorrelationNu * sh * sv, sv * sv,
        ];
        var (lat, lon) = p.Inverse(from.E, from.N);
        double[] r = Geocentric.LocalRotation(lat, lon);
        var c = new double[9];
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < 3; j++)
            {
                double s = 0;
                for (int a = 0; a < 3; a++)
                    for (int b = 0; b < 3; b++) s += r[3 * a + i] * local[3 * a + b] * r[3 * b + j];
                c[3 * i + j] = s;
            }
        // exactly symmetric
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < i; j++) c[3 * j + i] = c[3 * i + j];
        return c;
    }

    private static DemoBaseline Baseline(IMapProjection p, (double E, double N, double H) a,
        (double E, double N, double H) b, string from, string to, string session, SeededNoise noise)
    {
        var (x1, y1, z1) = Geocentric3(p, a);
        var (x2, y2, z2) = Geocentric3(p, b);
        double dx = x2 - x1, dy = y2 - y1, dz = z2 - z1;
        double[] c = BaselineCovariance(p, a, Math.Sqrt((dx * dx) + (dy * dy) + (dz * dz)));
        // correlated noise L g with C = L Lᵀ (Cholesky)
        double l00 = Math.Sqrt(c[0]), l10 = c[3] / l00, l20 = c[6] / l00;
        double l11 = Math.Sqrt(c[4] - (l10 * l10)), l21 = (c[7] - (l20 * l10)) / l11;
        double l22 = Math.Sqrt(c[8] - (l20 * l20) - (l21 * l21));
        double g0 = noise.Gauss(1), g1 = noise.Gauss(1), g2 = noise.Gauss(1);
        return new DemoBaseline(from, to, dx + (l00 * g0), dy + (l10 * g0) + (l11 * g1),
            dz + (l20 * g0) + (l21 * g1) + (l22 * g2), c, session);
    }
}
