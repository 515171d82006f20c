using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using FsCheck.Fluent;
using FsCheck.Xunit;
using FsCheck;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

public class StochasticProjectTests
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    internal static string DataDirectory()
    {
        return Path.Combine(NetAdjust.IO.Tests.Results.TestProjects.RepoRoot, "data");
    }

    private static SurveyProject Parse(string yaml, string? dir = null) =>
        ProjectReader.Parse(yaml, "test.yaml", dir ?? Path.GetTempPath(), p => File.ReadAllText(p));

    private const string Head = """
        project: stochastic test
        units: {length: m, angle: dms, angle_sd: arcsec}
        instruments:
          - {id: TS, direction_sd: 5, edm: 2 mm + 2 ppm, centering: 1 mm}
        targets:
          - {id: POLE, centering: 3 mm}
          - {id: TRI, centering: 0.5 mm}
        levels:
          - {id: DIGI, reading_sd: 0.3 mm, resolution: 0.1 mm, rounding: half}
          - {id: ISO, sd_per_km: 0.7 mm}
        default_sd: {direction: 9, azimuth: 4, height_difference: 5 mm}
        points:
          - {id: A, e: 1000, n: 1000, h: 50, fix: enh}
          - {id: B, e: 1000, n: 1200}
          - {id: C, e: 1150, n: 1000}
          - {id: D, h: 51}

        """;

    [Fact]
    public void SetupObservationsInheritInstrumentTargetAndProcedureAndExplicitSdOverrides()
    {
        var p = Parse(Head + """
            setups:
              - at: A
                instrument: TS
                target: TRI
                sets: 4
                faces: both
                directions:
                  - {to: B, value: 0-00-00}
                  - {to: C, value: 90-00-00, target: POLE}
                  - {to: D2, value: 10-00-00, sd: 1.5}
                distances:
                  - {to: B, value: 200.004}
                azimuths:
                  - {to: C, value: 90-00-00}
            """.Replace("D2", "C"));
        var model = StochasticModel.Build(p.Network, new GivenCoordinates(p.Network), CenteringModel.Independent, 1.0);
        var o = p.Network.Observations.Select((x, i) => x with { StandardDeviation = model.StandardDeviations[i] }).ToList();
        // Direction to B: pointing 5"/√4 = 2.5"; centering at the observed distance 200.004 m.
        var b = model.Budgets[0]!;
        Assert.Equal(2.5, b.ValueOf(ContributionNames.PointingReading) * Angle.ArcsecondsPerRadian, 12);
        Assert.Equal(0.001 / 200.004, b.ValueOf(ContributionNames.InstrumentCentering), 15);
        Assert.Equal(0.0005 / 200.004, b.ValueOf(ContributionNames.TargetCentering), 15);
        Assert.Equal(b.Total, o[0].StandardDeviation);
        // Direction to C: per-sighting target override; no distance observed, so from coordinates (150 m).
        Assert.Equal(0.003 / 150, model.Budgets[1]!.ValueOf(ContributionNames.TargetCentering), 15);
        // Explicit sd overrides the specification.
        Assert.Null(model.Budgets[2]);
        Assert.Equal(1.5 / Angle.ArcsecondsPerRadian, o[2].StandardDeviation, 15);
        // Distance: 2 mm + 2 ppm, 1 mm and 0.5 mm centering.
        Assert.Equal(Math.Sqrt(Math.Pow(0.002, 2) + Math.Pow(2e-6 * 200.004, 2) + Math.Pow(0.001, 2) + Math.Pow(0.0005, 2)), o[3].StandardDeviation, 15);
        // Azimuths are not weighted from the instrument: default_sd.
        Assert.Null(model.Budgets[4]);
        Assert.Equal(4 / Angle.ArcsecondsPerRadian, o[4].StandardDeviation, 15);
        Assert.All(o, x => Assert.Equal("A#1", x.SetupId));
    }

    [Fact]
    public void LevellingSectionsFromLevelSpecifications()
    {
        var p = Parse(Head + """
            levelling:
              - {from: A, to: D, dh: 1.0, length: 640, level: ISO}
              - {from: A, to: D, dh: 1.0, length: 640, level: ISO, runs: 1}
              - {from: A, to: D, dh: 1.0, level: DIGI, setups: 6, runs: 2}
              - {from: A, to: D, dh: 1.0}
            """);
        var model = StochasticModel.Build(p.Network, new GivenCoordinates(p.Network), CenteringModel.Independent, 1.0);
        var o = p.Network.Observations.Select((x, i) => x with { StandardDeviation = model.StandardDeviations[i] }).ToList();
        Assert.Equal(0.0007 * Math.Sqrt(0.64), o[0].StandardDeviation, 15);
        Assert.Equal(0.0007 * Math.Sqrt(0.64) * Math.Sqrt(2), o[1].StandardDeviation, 15);
        // 6 setups → 12 readings; mean of 2 runs. Rounding 'half': 0.05 mm per reading.
        Assert.Equal(0.0003 * Math.Sqrt(12) / Math.Sqrt(2), model.Budgets[2]!.ValueOf(ContributionNames.RodReadings), 15);
        Assert.Equal(0.00005 * Math.Sqrt(12) / Math.Sqrt(2), model.Budgets[2]!.ValueOf(ContributionNames.RodRounding), 15);
        Assert.Equal(0.005, o[3].StandardDeviation, 15);
    }

    [Fact]
    public void CsvHeightDifferencesMayNameALevel()
    {
        string csv = "kind,from,to,value,length,level,setups,runs\nheight_difference,A,D,1.0,250,ISO,,\nheight_difference,A,D,1.0,,DIGI,5,1\n";
        var p = ProjectReader.Parse(Head + "files:\n  - lev.csv\n", "test.yaml", "/x", f => f.EndsWith("lev.csv") ? csv : throw new IOException("no"));
        var model = StochasticModel.Build(p.Network, new GivenCoordinates(p.Network), CenteringModel.Independent, 1.0);
        var o = p.Network.Observations.Select((x, i) => x with { StandardDeviation = model.StandardDeviations[i] }).ToList();
        Assert.Equal(0.0007 * Math.Sqrt(0.25), o[0].StandardDeviation, 15);
        Assert.Equal(Math.Sqrt(10) * Math.Sqrt((0.0003 * 0.0003) + (0.00005 * 0.00005)), o[1].StandardDeviation, 15);
        var bad = csv.Replace(",DIGI,5,1", ",DIGI,,1");
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(Head + "files:\n  - lev.csv\n", "test.yaml", "/x", f => bad));
        Assert.Contains("lev.csv:3", e.Message);
        Assert.Contains("number of setups", e.Message);
        var unknown = csv.Replace(",ISO,", ",NOPE,");
        e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(Head + "files:\n  - lev.csv\n", "test.yaml", "/x", f => unknown));
        Assert.Contains("level 'NOPE' is not defined", e.Message);
    }

    [Theory]
    [InlineData("  - {id: TS2, direction_sd: 5, edm: 3 mm + x ppm}", "test.yaml:", "'x' in '3 mm + x ppm' is not a number of ppm")]
    [InlineData("  - {id: TS2, direction_sd: -5}", "instrument TS2", "direction_sd must be positive")]
    [InlineData("  - {id: TS2, direction_sd: 5, centering: -1 mm}", "instrument TS2", "centering must not be negative")]
    [InlineData("  - {id: TS2, edm: 3 mm + 2 ppm}", "instrument TS2", "'direction_sd' is missing")]
    public void BadInstrumentSpecificationsNameFileLineAndItem(string line, string where, string what)
    {
        string yaml = Head.Replace("instruments:\n", "instruments:\n" + line + "\n");
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.Contains(where, e.Message);
        Assert.Contains(what, e.Message);
        Assert.Contains("test.yaml:", e.Message);
    }

    [Theory]
    [InlineData("    instrument: NOPE\n", "instrument 'NOPE' is not defined")]
    [InlineData("    sets: 2\n", "name the setup's 'instrument'")]
    [InlineData("    instrument: TS\n    faces: two\n", "faces: 'two' is not a choice of faces: use both (face left and face right) or one")]
    [InlineData("    instrument: TS\n    sets: 0\n", "sets must be a whole number")]
    public void BadSetupProceduresAreReported(string keys, string what)
    {
        string yaml = Head + "setups:\n  - at: A\n" + keys + "    directions:\n      - {to: B, value: 0-00-00}\n";
        var e = Assert.Throws<ProjectFileException>(() => Parse(yaml));
        Assert.Contains(what, e.Message);
        Assert.Contains("setup at A", e.Message);
    }

    [Fact]
    public void CenteringOptionSelectsTheCorrelatedWeightModel()
    {
        var p = Parse(Head.Replace("default_sd:", "adjustment: {centering: correlated}\ndefault_sd:"));
        Assert.Equal(CenteringModel.Correlated, p.Options.Centering);
        var e = Assert.Throws<ProjectFileException>(() => Parse(Head.Replace("default_sd:", "adjustment: {centering: maybe}\ndefault_sd:")));
        Assert.Contains("'maybe' is not a centering model: use independent (diagonal weights) or correlated", e.Message);
    }

    [Fact]
    public void DemoIsWeightedFromSpecificationsAndAdjustsCleanlyBothWays()
    {
        string dir = DataDirectory();
        var p = ProjectReader.Read(Path.Combine(dir, "brackenmoor.yaml"));
        Assert.All(p.Network.Observations, o => Assert.NotNull(o.Weighting));
        // The level loop (CSV) uses level DL10, 1.0 mm per km double run: section BMK1-BMK2 of 420 m.
        var first = Adjuster.Adjust(p.Network, p.Options).Network.Observations.OfType<HeightDifferenceObservation>().First();
        Assert.Equal(0.001 * Math.Sqrt(0.42), first.StandardDeviation, 15);
        foreach (var options in new[] { p.Options, p.Options with { Centering = CenteringModel.Correlated } })
        {
            var r = Adjuster.Adjust(p.Network, options);
            Assert.True(r.Statistics.GlobalTest.Passed);
        }
    }

    private sealed record Spec(double DirSd, double EdmA, double EdmB, double Ci, double Ct, int Sets, bool OneFace, bool Correlated);

    private static readonly Gen<Spec> Specs =
        from dir in Gen.Choose(5, 200)          // 0.5" .. 20"
        from a in Gen.Choose(1, 100)            // 0.1 .. 10 mm
        from b in Gen.Choose(0, 100)            // 0 .. 10 ppm
        from ci in Gen.Choose(0, 30)            // 0 .. 3 mm
        from ct in Gen.Choose(0, 30)
        from sets in Gen.Choose(1, 4)
        from one in Gen.Elements(false, true)
        from corr in Gen.Elements(false, true)
        select new Spec(dir / 10.0, a / 10.0, b / 10.0, ci / 10.0, ct / 10.0, sets, one, corr);

    /// <summary>
    /// The demo project with random instrument and target specifications: for every observation in the JSON,
    /// the root-sum-square of sd_components equals sd (issue requirement; invariant of the error budget).
    /// </summary>
    [Property(MaxTest = 30)]
    public Property RootSumSquareOfSdComponentsEqualsSdForEveryDemoObservation()
    {
        string dir = DataDirectory();
        string demo = File.ReadAllText(Path.Combine(dir, "brackenmoor.yaml"));
        return Prop.ForAll(Specs.ToArbitrary(), s =>
        {
            string yaml = Regex.Replace(demo, @"  - \{id: TS3,[^\n]*", string.Create(Inv,
                $"  - {{id: TS3, direction_sd: {s.DirSd}, edm: {s.EdmA} mm + {s.EdmB} ppm, centering: {s.Ci} mm}}"));
            yaml = Regex.Replace(yaml, @"  - \{id: TRIBRACH,[^\n]*", string.Create(Inv, $"  - {{id: TRIBRACH, centering: {s.Ct} mm}}"));
            yaml = yaml.Replace("    sets: 2", $"    sets: {s.Sets}").Replace("    faces: both", s.OneFace ? "    faces: one" : "    faces: both")
                .Replace("centering: independent", s.Correlated ? "centering: correlated" : "centering: independent");
            var p = ProjectReader.Parse(yaml, "brackenmoor.yaml", dir, f => File.ReadAllText(f));
            var r = Adjuster.Adjust(p.Network, p.Options);
            using var json = JsonDocument.Parse(JsonResultWriter.Write(r, new ReportContext("brackenmoor.yaml", new DateOnly(2026, 12, 1), p.Units)));
            foreach (var o in json.RootElement.GetProperty("observations").EnumerateArray())
            {
                double sd = o.GetProperty("sd").GetDouble();
                double rss = Math.Sqrt(o.GetProperty("sd_components").EnumerateObject().Sum(c => c.Value.GetDouble() * c.Value.GetDouble()));
                if (!(Math.Abs(rss - sd) <= 1e-12 * sd)) return false;
            }
            return true;
        });
    }
}
