using System.Globalization;
using System.Text.Json;
using System.Xml.Linq;
using NetAdjust.Adjustment;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;
using nietras.SeparatedValues;

namespace NetAdjust.IO.Tests.Results;

public class CoordinateCsvTests
{
    public static TheoryData<string> Projects => new() { "demo", "ashgrove" };

    private static (AdjustmentResult R, ReportContext C) Load(string name) => name == "demo" ? TestProjects.Demo() : TestProjects.AshgroveFeet();

    // The CSV is read back with Sep (an independent RFC 4180 reader, unescaping quoted fields) and every number must come back to
    // within half a unit of the last written decimal of the value in the result (converted to the file's unit).
    [Theory]
    [MemberData(nameof(Projects))]
    public void RoundTripsThroughSep(string name)
    {
        var (r, c) = Load(name);
        string text = CoordinateCsvWriter.Write(r, c);
        double k = 1.0 / c.Units.Length.MetresPerUnit;
        string u = c.Units.Length.Symbol;
        using var reader = Sep.New(',').Reader(o => o with { Unescape = true, CultureInfo = CultureInfo.InvariantCulture }).FromText(text);
        Assert.Equal(["id", $"easting_{u}", $"northing_{u}", $"height_{u}", $"sd_e_{u}", $"sd_n_{u}", $"sd_h_{u}", $"ellipse_a_{u}", $"ellipse_b_{u}", "ellipse_azimuth_deg", "held", "weighted",
                      "variance_factor_basis"],
            reader.Header.ColNames);
        double tolL = 0.5 * Math.Pow(10, -CoordinateCsvWriter.LengthDecimals) + 1e-9;
        double tolA = 0.5 * Math.Pow(10, -CoordinateCsvWriter.AzimuthDecimals) + 1e-9;
        int row = 0;
        foreach (var rec in reader)
        {
            var p = r.Points[row++];
            var fields = new Dictionary<string, string>();
            foreach (string n in reader.Header.ColNames) fields[n] = rec[n].ToString();
            Assert.Equal(p.Id, fields["id"]);
            Assert.Equal("known", fields["variance_factor_basis"]); // both projects keep the default basis
            void Check(string col, double? metres)
            {
                string f = fields[col];
                if (metres is null) { Assert.Equal("", f); return; }
                Assert.Equal(metres.Value * k, double.Parse(f, CultureInfo.InvariantCulture), tolL);
            }
            Check($"easting_{u}", p.E); Check($"northing_{u}", p.N); Check($"height_{u}", p.H);
            Check($"sd_e_{u}", p.SdE); Check($"sd_n_{u}", p.SdN); Check($"sd_h_{u}", p.SdH);
            // The ellipse columns carry the statistics' ellipse (the shared NetAdjust.Statistics.ErrorEllipse).
            var el = ReportFigures.HasPlan(p) && !ReportFigures.IsPlanFixed(p) ? r.Analysis.Points[row - 1].Ellipse : null;
            Check($"ellipse_a_{u}", el?.A); Check($"ellipse_b_{u}", el?.B);
            string az = fields["ellipse_azimuth_deg"];
            if (el is null) Assert.Equal("", az);
            else Assert.Equal(el.Value.Azimuth * 180 / Math.PI, double.Parse(az, CultureInfo.InvariantCulture), tolA);
        }
        Assert.Equal(r.Points.Count, row);
    }

    [Fact]
    public void QuotesAnIdHoldingACommaAndUsesTheProjectUnit()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        string text = CoordinateCsvWriter.Write(r, c);
        Assert.StartsWith("id,easting_ft,", text);
        Assert.Contains("\n\"A,1\",1000.000000,1000.000000,", text); // 1000 ft held, written in feet
    }
}

public class LandXmlTests
{
    private static readonly XNamespace Ns = "http://www.landxml.org/schema/LandXML-1.2";

    // Element-by-element check against the structure of the LandXML 1.2 schema for the elements used
    // (LandXML-1.2.xsd, the open standard; element and attribute names from memory of the schema and checked
    // against public LandXML 1.2 files): root LandXML with required version/date/time; Units with Metric or
    // Imperial carrying the required areaUnit/linearUnit/volumeUnit/temperatureUnit/pressureUnit;
    // CgPoints holding CgPoint elements whose text is "northing easting [elevation]".
    [Fact]
    public void DemoMatchesTheSchemaStructureElementByElement()
    {
        var (r, c) = TestProjects.Demo();
        var doc = XDocument.Parse(LandXmlWriter.Write(r, c));
        var root = doc.Root!;
        Assert.Equal(Ns + "LandXML", root.Name);
        Assert.Equal("1.2", (string?)root.Attribute("version"));
        Assert.Equal("2026-12-01", (string?)root.Attribute("date"));
        Assert.Matches(@"^\d\d:\d\d:\d\d$", (string?)root.Attribute("time"));

        Assert.Equal([Ns + "Units", Ns + "Project", Ns + "Application", Ns + "CgPoints"], root.Elements().Select(e => e.Name));
        var metric = Assert.Single(root.Element(Ns + "Units")!.Elements());
        Assert.Equal(Ns + "Metric", metric.Name);
        Assert.Equal("meter", (string?)metric.Attribute("linearUnit"));
        Assert.Equal("squareMeter", (string?)metric.Attribute("areaUnit"));
        Assert.Equal("cubicMeter", (string?)metric.Attribute("volumeUnit"));
        Assert.NotNull(metric.Attribute("temperatureUnit"));
        Assert.NotNull(metric.Attribute("pressureUnit"));
        Assert.Equal("decimal degrees", (string?)metric.Attribute("angularUnit"));
        Assert.Equal(r.Network.Name, (string?)root.Element(Ns + "Project")!.Attribute("name"));
        Assert.Equal("NetAdjust", (string?)root.Element(Ns + "Application")!.Attribute("name"));

        var cg = root.Element(Ns + "CgPoints")!.Elements().ToList();
        Assert.All(cg, e => Assert.Equal(Ns + "CgPoint", e.Name));
        var plan = r.Points.Where(ReportFigures.HasPlan).ToList();
        Assert.Equal(plan.Select(p => p.Id), cg.Select(e => (string?)e.Attribute("name")));
        Assert.Equal(8, cg.Count); // the demo's 5 height-only benchmarks are left out
        var allowedRoles = new[] { "control point", "calculated" }; // surveyRoleType values used
        for (int i = 0; i < plan.Count; i++)
        {
            var p = plan[i];
            var parts = cg[i].Value.Split(' ').Select(s => double.Parse(s, CultureInfo.InvariantCulture)).ToArray();
            Assert.Equal(p.H is null ? 2 : 3, parts.Length);
            Assert.Equal(p.N!.Value, parts[0], 1e-6); // northing first
            Assert.Equal(p.E!.Value, parts[1], 1e-6);
            Assert.Equal(p.SdN!.Value, double.Parse((string)cg[i].Attribute("northingStdError")!, CultureInfo.InvariantCulture), 1e-6);
            Assert.Equal(p.SdE!.Value, double.Parse((string)cg[i].Attribute("eastingStdError")!, CultureInfo.InvariantCulture), 1e-6);
            Assert.Contains((string)cg[i].Attribute("role")!, allowedRoles);
        }
        Assert.Equal("control point", (string?)cg[0].Attribute("role")); // BK01 is held
        Assert.Equal("calculated", (string?)cg[2].Attribute("role"));    // S1 is new
    }

    [Fact]
    public void FeetProjectDeclaresImperialUnitsAndItsCoordinateSystem()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        var root = XDocument.Parse(LandXmlWriter.Write(r, c)).Root!;
        var imp = Assert.Single(root.Element(Ns + "Units")!.Elements());
        Assert.Equal(Ns + "Imperial", imp.Name);
        // LandXML-1.2.xsd imperial linear units include "foot" and "USSurveyFoot" (from memory of the schema's enumeration).
        Assert.Equal("foot", (string?)imp.Attribute("linearUnit"));
        var cs = root.Element(Ns + "CoordinateSystem")!;
        Assert.Equal("27700", (string?)cs.Attribute("epsgCode"));
        var a1 = root.Element(Ns + "CgPoints")!.Elements().First();
        Assert.Equal("A,1", (string?)a1.Attribute("name"));
        Assert.Equal("1000.000000 1000.000000", a1.Value); // held 1000 ft, written in feet
        var b = root.Element(Ns + "CgPoints")!.Elements().ElementAt(1);
        Assert.Equal("control point", (string?)b.Attribute("role")); // weighted control
    }
}

public class GeoJsonTests
{
    [Fact]
    public void LocalCoordinatesAreMarkedAndNoCrsIsClaimed()
    {
        var (r, c) = TestProjects.Demo();
        using var doc = JsonDocument.Parse(GeoJsonWriter.Write(r, c));
        var root = doc.RootElement;
        Assert.Equal("FeatureCollection", root.GetProperty("type").GetString());
        Assert.False(root.TryGetProperty("crs", out _));
        Assert.Equal("local", root.GetProperty("netadjust").GetProperty("coordinates").GetString());
        var features = root.GetProperty("features").EnumerateArray().ToList();
        int Count(string f) => features.Count(x => x.GetProperty("properties").GetProperty("feature").GetString() == f);
        Assert.Equal(8, Count("point"));
        Assert.Equal(6, Count("ellipse"));     // S1..S6: plan points not held
        Assert.Equal(21, Count("observation")); // all but the 5 height differences between height-only benchmarks
    }

    [Fact]
    public void DeclaredCrsIsWrittenForGisReaders()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        using var doc = JsonDocument.Parse(GeoJsonWriter.Write(r, c));
        var root = doc.RootElement;
        Assert.Equal("urn:ogc:def:crs:EPSG::27700", root.GetProperty("crs").GetProperty("properties").GetProperty("name").GetString());
        Assert.Equal("EPSG:27700", root.GetProperty("netadjust").GetProperty("coordinates").GetString());
        Assert.Equal("ft", root.GetProperty("netadjust").GetProperty("length_unit").GetString());
    }

    // A closed counter-clockwise ring (RFC 7946 §3.1.6: exterior rings counter-clockwise) whose area equals that of
    // the inscribed n-gon of the ellipse, π a b · sin(2π/n)/(2π/n) (area of an affine image of a regular n-gon).
    [Fact]
    public void EllipsePolygonsAreClosedCounterClockwiseAndTrueSize()
    {
        var (r, c) = TestProjects.Demo();
        using var doc = JsonDocument.Parse(GeoJsonWriter.Write(r, c));
        foreach (var f in doc.RootElement.GetProperty("features").EnumerateArray()
                     .Where(x => x.GetProperty("properties").GetProperty("feature").GetString() == "ellipse"))
        {
            var ring = f.GetProperty("geometry").GetProperty("coordinates")[0].EnumerateArray()
                .Select(p => (E: p[0].GetDouble(), N: p[1].GetDouble())).ToList();
            Assert.Equal(GeoJsonWriter.EllipseVertices + 1, ring.Count);
            Assert.Equal(ring[0], ring[^1]);
            double area = 0;
            for (int i = 0; i + 1 < ring.Count; i++) area += (ring[i].E * ring[i + 1].N) - (ring[i + 1].E * ring[i].N);
            area *= 0.5;
            var p = r.Points.Single(x => x.Id == f.GetProperty("properties").GetProperty("id").GetString());
            var el = ReportFigures.Ellipse(r, p)!.Value;
            double n = GeoJsonWriter.EllipseVertices, t = 2 * Math.PI / n;
            double expected = Math.PI * el.A * el.B * Math.Sin(t) / t;
            Assert.True(area > 0, "ring must be counter-clockwise");
            Assert.Equal(expected, area, expected * 2e-3); // coordinates are rounded to 1 µm
        }
    }
}

public class EdgeCaseWriterTests
{
    private const string LevelsOnly = """
        project: Millrace levels (invented)
        default_sd: {height_difference: 1 mm}
        points:
          - {id: BM1, h: 20.000, fix: h}
          - {id: BM2}
          - {id: BM3}
        levelling:
          - {from: BM1, to: BM2, dh: 1.2500}
          - {from: BM2, to: BM3, dh: -0.4012}
          - {from: BM3, to: BM1, dh: -0.8479}
        """;

    private static (AdjustmentResult, ReportContext) Load(string yaml)
    {
        var project = NetAdjust.IO.Project.ProjectReader.Parse(yaml, "t.yaml", "/nonexistent", _ => throw new IOException());
        return (Adjuster.Adjust(project.Network, project.Options), new ReportContext("t.yaml", TestProjects.RunDate, project.Units) { Crs = project.Crs });
    }

    [Fact]
    public void LevellingOnlyNetworkGivesEmptyPlanOutputsAndSaysSo()
    {
        var (r, c) = Load(LevelsOnly);
        Assert.Contains("nothing to plot", NetworkPlotWriter.WriteDocument(r, c));
        var root = XDocument.Parse(LandXmlWriter.Write(r, c)).Root!;
        Assert.Empty(root.Element(XName.Get("CgPoints", LandXmlWriter.Namespace))!.Elements());
        using var geo = JsonDocument.Parse(GeoJsonWriter.Write(r, c));
        Assert.Equal(0, geo.RootElement.GetProperty("features").GetArrayLength());
        string csv = CoordinateCsvWriter.Write(r, c);
        Assert.Equal(4, csv.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length); // header + 3 benchmarks
        string html = HtmlReportWriter.Write(r, c);
        Assert.DoesNotContain("class=\"ellipse\"", html);
        Assert.Contains("<td class=\"id\">BM3</td>", html);
    }

    [Fact]
    public void UsSurveyFeetAreDeclaredAsSuch()
    {
        var (r, c) = Load(TestProjects.Ashgrove.Replace("length: ft", "length: usft"));
        var imp = XDocument.Parse(LandXmlWriter.Write(r, c)).Root!.Element(XName.Get("Units", LandXmlWriter.Namespace))!.Elements().Single();
        Assert.Equal("USSurveyFoot", (string?)imp.Attribute("linearUnit"));
        Assert.StartsWith("id,easting_usft,", CoordinateCsvWriter.Write(r, c));
        // 1000 usft held: 1000 × 1200/3937 m (24 FR 5348, 1959) written back as 1000 usft.
        Assert.Contains("\n\"A,1\",1000.000000,1000.000000,", CoordinateCsvWriter.Write(r, c));
        Assert.Equal(1000 * 1200.0 / 3937.0, r.Points[0].E!.Value, 1e-9);
    }
}
