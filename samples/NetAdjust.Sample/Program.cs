// NetAdjust sample: a traverse and a level loop built in code, weighted from instrument specifications, adjusted,
// searched for blunders and reported, with the public API of the NetAdjust packages only. The data are those of the
// demo project data/brackenmoor.yaml (an invented site), so the printed variance factor equals the one
// `netadjust adjust data/brackenmoor.yaml` gives (CI checks it: .ci/check-sample).
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;
using NetAdjust.Units;

var inv = CultureInfo.InvariantCulture;
var dms = new AnglePattern(AngleFormat.Dms, 1);
Angle Dms(string text) => dms.Parse(text).Value;

// Equipment: a total station (ISO 17123-3 direction sd 3", EDM 2 mm + 2 ppm, centering 1 mm), prisms in tribrachs
// observed in two sets in both faces, and a level of 1.0 mm per km double-run levelling (ISO 17123-2). Standard
// deviations are typed like the values (Angle, Length): a bare number is not taken, so arcseconds cannot be
// mistaken for radians.
var ts3 = new TotalStationSpecification("TS3", Angle.FromArcseconds(3), Angle.FromArcseconds(3),
    new EdmSpecification(Length.FromMillimetres(2), 2), Length.FromMillimetres(1), Length.FromMillimetres(1.5));
var tribrach = new TargetSpecification("TRIBRACH", Length.FromMillimetres(1), Length.FromMillimetres(1.5));
var twoSets = new ObservingProcedure(2, Faces.Both);
var dl10 = LevelSpecification.PerKm("DL10", Length.FromMillimetres(1));

// Points: two held control stations, six traverse stations with rough coordinates, a held benchmark, four new ones.
var points = new List<Point>
{
    new("BK01") { E = 2150.000, N = 5320.000, Fixed = Fixity.EN },
    new("BK02") { E = 2480.512, N = 5790.233, Fixed = Fixity.EN },
    new("S1") { E = 2331.6, N = 5265.5 }, new("S2") { E = 2512.1, N = 5331.3 }, new("S3") { E = 2599.2, N = 5496.7 },
    new("S4") { E = 2470.6, N = 5622.7 }, new("S5") { E = 2287.2, N = 5598.8 }, new("S6") { E = 2158.9, N = 5471.6 },
    new("BMK1") { H = 84.2170, Fixed = Fixity.H }, new("BMK2"), new("BMK3"), new("BMK4"), new("BMK5"),
};
var observations = new List<Observation>();

// The traverse: at each station one set of directions and the distance ahead (an angle at S3). Each sighting is
// weighted from the setup's equipment; the distance observed in the setup is its sight length.
void Station(string at, (string To, string Reading)[] directions, (string To, double Metres) ahead,
    (string Back, string Reading)? angle = null)
{
    var weighting = new ObservationWeighting
    {
        Instrument = ts3, Target = tribrach, Procedure = twoSets,
        ObservedSights = new Dictionary<string, double> { [ahead.To] = ahead.Metres },
    };
    string setup = at + "#1";
    foreach (var (to, reading) in directions)
        observations.Add(new DirectionObservation(at, to, Dms(reading), at + "/1")
            { Weighting = weighting, SetupId = setup });
    if (angle is var (back, measured))
        observations.Add(new AngleObservation(at, back, ahead.To, Dms(measured))
            { Weighting = weighting, SetupId = setup });
    observations.Add(new DistanceObservation(at, ahead.To, Length.FromMetres(ahead.Metres))
        { Weighting = weighting, SetupId = setup });
}
Station("BK01", [("BK02", "170-10-20.8"), ("S6", "138-20-33.9"), ("S1", "241-51-52.3")], ("S1", 189.9390));
Station("S1", [("BK01", "301-59-55.6"), ("S2", "84-59-59.8")], ("S2", 192.4074));
Station("S2", [("S1", "278-08-53.8"), ("S3", "55-54-55.1")], ("S3", 186.6487));
Station("S3", [], ("S4", 179.9118), angle: ("S2", "106-50-07.0"));
Station("S4", [("S3", "124-29-11.9"), ("S5", "252-28-34.9")], ("S5", 184.4638));
Station("S5", [("S4", "69-57-50.5"), ("S6", "212-55-34.2")], ("S6", 180.9601));
Station("S6", [("S5", "229-23-06.1"), ("BK01", "7-18-29.6")], ("BK01", 151.5517));

// The level loop: double-run sections (height difference and section length in metres) weighted from the level.
foreach (var (from, to, dh, metres) in new[]
{
    ("BMK1", "BMK2", 1.82378, 420.0), ("BMK2", "BMK3", 5.29650, 515.0), ("BMK3", "BMK4", -2.43684, 380.0),
    ("BMK4", "BMK5", -3.78618, 610.0), ("BMK5", "BMK1", -0.89900, 455.0),
})
{
    observations.Add(new HeightDifferenceObservation(from, to, Length.FromMetres(dh), Length.FromMetres(metres))
        { Weighting = new ObservationWeighting { Level = dl10, Levelling = new LevellingProcedure(1, 2) } });
}

// Adjust, hunt blunders (data snooping with the w-test), read the statistics.
var network = new SurveyNetwork("Brackenmoor WTW control resurvey (sample)", points, observations);
var result = Adjuster.Adjust(network);
var hunt = DataSnooping.Run(network);
var statistics = result.Statistics;
Console.WriteLine(string.Create(inv,
    $"observations {statistics.Observations}, unknowns {statistics.Unknowns}, " +
    $"redundancy {statistics.DegreesOfFreedom}"));
Console.WriteLine(string.Create(inv, $"variance factor {statistics.VarianceFactor:R}"));
Console.WriteLine(string.Create(inv, $"global test {(statistics.GlobalTest.Passed == true ? "passed" : "failed")}"
    + $" (statistic {statistics.GlobalTest.Statistic:F3})"));
Console.WriteLine($"blunder hunt: {hunt.StopReason}; observations set aside: {hunt.SetAside.Count}");
var s3 = result.Points.Single(p => p.Id == "S3");
var bmk3 = result.Points.Single(p => p.Id == "BMK3");
var mm = LengthUnit.Millimetre;
// Results are typed like the inputs: coordinates and their standard deviations are lengths, an observation's
// residual is a Quantity (a length or an angle by its kind), an error ellipse has lengths and an angle.
Console.WriteLine(string.Create(inv, $"S3: E {s3.Easting?.Metres:F4} N {s3.Northing?.Metres:F4} m " +
    $"(sd {s3.SdEasting?.In(mm):F1} {s3.SdNorthing?.In(mm):F1} mm)"));
Console.WriteLine(string.Create(inv, $"BMK3: H {bmk3.Height?.Metres:F4} m (sd {bmk3.SdHeight?.In(mm):F1} mm)"));
var largest = result.Observations.Where(o => o.ResidualValue.IsAngle)
    .MaxBy(o => Math.Abs(o.ResidualValue.AsAngle!.Value.Arcseconds))!;
Console.WriteLine(string.Create(inv, $"largest angular residual: {largest.Input.Describe()}: " +
    $"{largest.ResidualValue.AsAngle!.Value.Arcseconds:F1}\""));
var ellipse = result.Analysis.Points.Single(p => p.Id == "S3").Ellipse!.Value;
Console.WriteLine(string.Create(inv, $"S3 standard error ellipse: a {ellipse.SemiMajorAxis.In(mm):F1} mm, " +
    $"b {ellipse.SemiMinorAxis.In(mm):F1} mm, azimuth {ellipse.MajorAxisAzimuth.Degrees:F1}°"));

// Each observation's a-priori standard deviation, derived from the equipment at the adjusted coordinates, is typed
// like its value: an angle for a direction, a length for a distance (an observation can also be given one directly,
// e.g. new DistanceObservation(...) { Sd = Length.FromMillimetres(3) }).
foreach (var o in result.Network.Observations.Where(o => o.From == "S1"))
    Console.WriteLine($"{o.Describe()}: a-priori sd {o.Sd}");

// The handover report: one self-contained HTML file with the network plot, the tests and the caution.
string html = args.Length > 0 ? args[0] : "sample-report.html";
var context = new ReportContext("(built in code)", new DateOnly(2026, 12, 1), ProjectUnits.Default) { Hunt = hunt };
File.WriteAllText(html, HtmlReportWriter.Write(ResultReport.Build(result, context)));
Console.WriteLine($"report written to {html}");

