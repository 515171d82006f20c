using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests;

public class ProjectReaderTests
{
    private static SurveyProject Parse(string yaml, Dictionary<string, string>? files = null) =>
        ProjectReader.Parse(yaml, "site.yaml", "/proj", p => files is not null &&
            files.TryGetValue(Path.GetFileName(p), out var t)
            ? t : throw new FileNotFoundException("no such file", p));

    private const string Valid = """
        project: Test site
        units: {length: ft, angle: dms, angle_sd: arcsec}
        default_sd: {direction: 2, distance: 0.01, height_difference: 0.003}
        points:
          - {id: A, e: 1000, n: 2000, h: 50, fix: enh}
          - {id: B, e: 1300, n: 2000}
          - {id: C, e: 1000, n: 2300}
        setups:
          - at: A
            directions:
              - {to: B, value: 90-00-00}
            distances:
              - {to: B, value: 300.02, sd: 3 mm}
        levelling:
          - {from: A, to: B, dh: 1.5, length: 0.3 km}
        """;

    [Fact]
    public void ReadsUnitsOnceAndConvertsToSi()
    {
        var p = Parse(Valid);
        Assert.Equal(LengthUnit.InternationalFoot, p.Units.Length);
        var a = p.Network["A"];
        Assert.Equal(1000 * 0.3048, a.E!.Value, 12);
        Assert.Equal(Fixity.ENH, a.Fixed);
        var dist = p.Network.Observations.OfType<DistanceObservation>().Single();
        Assert.Equal(300.02 * 0.3048, dist.Value, 12);
        Assert.Equal(0.003, dist.StandardDeviation, 15); // "3 mm" overrides the default in feet
        var dir = p.Network.Observations.OfType<DirectionObservation>().Single();
        Assert.Equal(Math.PI / 2, dir.Value, 15);
        Assert.Equal(2 / Angle.ArcsecondsPerRadian, dir.StandardDeviation, 15);
        Assert.Equal("A/1", dir.SetId);
        var dh = p.Network.Observations.OfType<HeightDifferenceObservation>().Single();
        Assert.Equal(1.5 * 0.3048, dh.Value, 12);
        Assert.Equal(300, dh.LineLength!.Value.Metres, 9);
        Assert.Equal(0.003 * 0.3048, dh.StandardDeviation, 15);
        Assert.Equal("site.yaml:15", dh.Source);
    }

    [Theory]
    [InlineData("12-75-00", "site.yaml:9: direction B→X: minutes must be below 60 in '12-75-00'")]
    [InlineData("abc", "site.yaml:9: direction B→X:")]
    public void BadAngleNamesFileLineAndObservation(string value, string expected)
    {
        string yaml = $"""
            default_sd: {"{direction: 2}"}
            points:
              - {"{id: B, e: 0, n: 0, fix: en}"}
              - {"{id: X, e: 10, n: 0}"}
            setups:
              - at: B
                directions:
                  - {"{to: X, value: 0-00-00}"}
                  - {"{to: X, value: " + value + "}"}
            """;
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.StartsWith(expected, e.Message);
        Assert.Equal(9, e.Line);
    }

    [Theory]
    [InlineData("pionts: []", 1, "unknown key 'pionts'")]
    [InlineData("points:\n  - {id: A, e: 1, n: 2, fix: xy}", 2, "point A: fix: 'xy' is not a set of held components")]
    [InlineData("points:\n  - {id: A, east: 1}", 2, "point A: unknown key 'east'")]
    [InlineData("points:\n  - {e: 1}", 2, "'id' is missing")]
    [InlineData("units: {length: yd}", 1, "'yd' is not a length unit here")]
    [InlineData("units: {angle: rad}", 1, "'rad' is not an angle format")]
    [InlineData("adjustment: {alpha: 1.5}", 1, "between 0 and 1")]
    [InlineData("adjustment: {max_iterations: 2.5}", 1, "whole number")]
    [InlineData("default_sd: {distance: -3 mm}", 1, "must be positive")]
    [InlineData("default_sd: {distance: 3 mm + 2 ppm}", 1, "is not a length")]
    [InlineData("points: [\n  {id: A, e: 1", 0, "not valid YAML")]
    [InlineData("points:\n  - {id: A, e: \"1,5\"}", 2, "is not a length")]
    [InlineData("points:\n  - {id: A, e: 1,5}", 2, "unknown key '5'")]
    public void InvalidKeysAndValuesNameTheLine(string yaml, int line, string expected)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.Contains(expected, e.Message);
        if (line > 0) Assert.Equal(line, e.Line);
        Assert.StartsWith("site.yaml:", e.Message);
    }

    [Fact]
    public void MissingStandardDeviationIsExplained()
    {
        string yaml =
            "points:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 5, n: 0}\nsetups:\n  - at: A\n    " +
            "distances:\n      - {to: B, value: 5}\n";
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.Equal(
            "site.yaml:7: distance to B in the setup at A: no standard deviation: give 'sd' or a default under " +
            "default_sd.distance", e.Message);
    }

    [Fact]
    public void CsvObservationsAreReadWithTheirLines()
    {
        string yaml = Valid + "\nfiles:\n  - obs.csv\n";
        string csv = "# comment\nkind,at,from,to,value,sd,length,set\n\ndistance,,A,B,300.01,,,\n" +
            "angle,A,B,C,10-00-00,3,,\nheight_difference,,A,B,1.49,0.002,1000,\ndirection,A,,B,0-00-00,2,,r2\n";
        var p = Parse(yaml, new() { ["obs.csv"] = csv });
        var fromCsv = p.Network.Observations.Where(o => o.Source!.StartsWith("obs.csv")).ToList();
        Assert.Equal(["obs.csv:4", "obs.csv:5", "obs.csv:6", "obs.csv:7"], fromCsv.Select(o => o.Source));
        Assert.Equal("A/obs.csv#r2", ((DirectionObservation)fromCsv[3]).SetId);
        Assert.Equal(2, p.InputFiles.Count);
    }

    [Theory]
    [InlineData("kind,from,to,value\nsurvey,A,B,1\n", "obs.csv:2: survey: unknown observation kind")]
    [InlineData("kind,from,to\ndistance,A,B\n", "obs.csv:1: header: the header has no 'value' column")]
    [InlineData("kind,from,to,value,colour\n", "obs.csv:1: header: unknown column 'colour'")]
    [InlineData("kind,from,to,value\ndistance,A,B\n", "obs.csv:2: expected 4 fields as in the header, found 3")]
    [InlineData("kind,from,to,value\ndistance,A,,10\n", "obs.csv:2: distance: the 'to' field is empty")]
    [InlineData("kind,from,to,value,sd\ndistance,A,B,1O.5,0.01\n", "obs.csv:2: distance A→B: '1O.5' is not a length")]
    [InlineData("kind,at,from,to,value,sd\nangle,A,B,C,400-00-00,3\n", null)]
    public void CsvErrorsNameFileLineAndItem(string csv, string? expected)
    {
        string yaml = Valid + "\nfiles:\n  - obs.csv\n";
        if (expected is null)
        {
            // 400° is a valid (if unusual) reading: it is accepted and means 40° past a full turn.
            Parse(yaml, new() { ["obs.csv"] = csv });
            return;
        }
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml, new() { ["obs.csv"] = csv }));
        Assert.StartsWith(expected, e.Message);
    }

    [Fact]
    public void MissingCsvFileIsNamedAtTheLineThatListsIt()
    {
        string yaml = Valid + "\nfiles:\n  - missing.csv\n";
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.Contains("missing.csv: the observation file cannot be read", e.Message);
        Assert.Equal(17, e.Line);
    }

    [Fact]
    public void UnknownPointInAnObservationNamesItsLine()
    {
        string yaml =
            "default_sd: {distance: 0.003}\npoints:\n  - {id: A, e: 0, n: 0, fix: en}\nsetups:\n  - at: A\n    " +
            "distances:\n      - {to: Z9, value: 5}\n";
        var e = Assert.ThrowsAny<InvalidInputException>(() => Parse(yaml));
        Assert.Contains("distance A→Z9 (site.yaml:7): point Z9 is not defined", e.Message);
    }
}
