using System.Text.Json;
using NetAdjust.Procedures;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// A control mark that only one sight line reaches cannot be checked by the observations (one direction fixes one
/// coordinate of a point, not two: common practice), so the sequence reports it as not testable, with the marks it
/// is joined to, instead of leaving its error to be blamed on another mark.
/// </summary>
public sealed class ControlTestabilityTests
{
    private static SequenceResult Run(string extraPoint, string extraSetup)
    {
        // data/harrowgate-control.yaml (invented demo, four published marks, HV03 disturbed) with a reference mark
        // RM5 added, 350 m from T1 at azimuth 300 degrees and given 5.7 cm off its true place across the line,
        // sighted only by one direction from T1 in a set of its own (with T2 to orient the set).
        string text = File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data", "harrowgate-control.yaml"))
            .Replace("  - {id: T1}", extraPoint + "\n  - {id: T1}", StringComparison.Ordinal)
            .Replace("setups:\n", "setups:\n" + extraSetup, StringComparison.Ordinal);
        var project = ProjectReader.Parse(text, "harrowgate-rm.yaml", TestProjects.RepoRoot,
            _ => throw new IOException("no files"));
        return AdjustmentSequence.Run(project.Network, project.Options);
    }

    private const string ReferenceMark = "  - {id: RM5, e: 4907.2525, n: 8315.3057, fix: en}";

    private const string OneLine = """
          - at: T1
            directions:
              - {to: T2, value: 95-05-19.9}
              - {to: RM5, value: 300-00-00.0}

        """;

    [Fact]
    public void AMarkOnlyOneLineReachesIsNotTestable()
    {
        var s = Run(ReferenceMark, OneLine);
        var items = s.Testability;
        // One direction fixes RM5 across the line only (common practice): an error along the line shows nowhere,
        // and the two components it checks together cannot be told apart.
        var e = Assert.Single(items, x => x.Id == "RM5" && x.Component == Parameter.E);
        var n = Assert.Single(items, x => x.Id == "RM5" && x.Component == Parameter.N);
        Assert.False(e.Testable!.Value);
        Assert.False(n.Testable!.Value);
        Assert.Equal(["RM5 N"], e.CannotBeToldApartFrom);
        Assert.Equal(["RM5 E"], n.CannotBeToldApartFrom);
        // The four published marks stay testable and separable from RM5.
        Assert.All(items.Where(x => x.Id.StartsWith("HV", StringComparison.Ordinal)), x =>
        {
            Assert.True(x.Testable!.Value);
            Assert.DoesNotContain(x.CannotBeToldApartFrom, y => y.StartsWith("RM5", StringComparison.Ordinal));
        });
        // The redundancy numbers of the control add up to the constraints the control adds (Δr of the test of the
        // added constraints, counted from the two adjustments' degrees of freedom): Σ r_i = Δr (common practice).
        Assert.Equal(s.Test.AddedConstraints, items.Sum(x => x.Redundancy!.Value), 6);

        var c = new ReportContext("harrowgate-rm.yaml", TestProjects.RunDate, ProjectUnits.Default);
        string text = SequenceReportWriter.Write(s, c);
        Assert.Matches(@"\n  RM5          E      0\.\d\d  NO       RM5 N\n", text);
        Assert.Matches(@"\n  HV01         E      0\.\d\d  yes\s*\n", text);
        // the minimal step does not rest on RM5 (a reference object): it is held along its sight line only
        Assert.Contains("Step 1 holds the reference object(s) RM5 along their sight line only", text);
        using var json = JsonDocument.Parse(SequenceJsonWriter.Write(s, c));
        var entry = json.RootElement.GetProperty("control_testability").EnumerateArray()
            .Single(x => x.GetProperty("id").GetString() == "RM5" && x.GetProperty("component").GetString() == "N");
        Assert.False(entry.GetProperty("testable").GetBoolean());
        Assert.Equal(n.Redundancy!.Value, entry.GetProperty("redundancy").GetDouble(), 12);
        Assert.Equal(["RM5 E"],
            entry.GetProperty("cannot_be_told_apart_from").EnumerateArray().Select(x => x.GetString()));
        string html = HtmlReportWriter.Write(ResultReport.Build(s, c, minimal: false));
        Assert.Contains(
            "<tr class=\"warn\"><td class=\"mark\"><span title=\"weak\">!</span></td><td class=\"id\">RM5</td>", html);
    }

    [Fact]
    public void AMarkOnlyOneLineReachesAlongTheNorthingAxisHasNoCheckOfItsNorthing()
    {
        // RM5 350 m due north of T1 (5210.36, 8140.31): the direction checks its easting (across the line) only;
        // its northing has redundancy zero (an error in it shows in no discrepancy) while its easting is testable
        // (common practice).
        const string north = "  - {id: RM5, e: 5210.3620, n: 8490.3057, fix: en}";
        var s = Run(north, OneLine.Replace("300-00-00.0", "0-00-00.0", StringComparison.Ordinal));
        var e = Assert.Single(s.Testability, x => x.Id == "RM5" && x.Component == Parameter.E);
        var n = Assert.Single(s.Testability, x => x.Id == "RM5" && x.Component == Parameter.N);
        Assert.Equal(0, n.Redundancy!.Value, 4);
        Assert.False(n.Testable!.Value);
        Assert.Empty(n.CannotBeToldApartFrom);
        Assert.True(e.Redundancy > 0.01);
        Assert.True(e.Testable!.Value);
    }

    [Fact]
    public void TheSameMarkWithADistanceAsWellIsTestable()
    {
        // Control for the test above: a direction and a distance from T1 fix RM5, so it can be checked.
        string both = OneLine + "    distances:\n      - {to: RM5, value: 350.0000, sd: 0.0015}\n";
        var s = Run(ReferenceMark, both);
        Assert.All(s.Testability.Where(x => x.Id == "RM5"), x =>
        {
            Assert.True(x.Testable!.Value);
            Assert.Empty(x.CannotBeToldApartFrom);
        });
    }

    [Fact]
    public void ThreeHeldBenchmarksOfALevelLoopShareTwoChecks()
    {
        // Three held benchmarks joined by levelled lines: the observations fix their height differences, the
        // height datum is the one direction they leave free, G_c = (1, 1, 1)ᵀ and H = 11ᵀ/3, so each benchmark's
        // redundancy is 1 − 1/3 = 2/3 and Σ r = 2 added constraints (closed form; docs/methods.md, "Datum").
        const string project = """
            project: three benchmarks
            units: {length: m, angle: dms, angle_sd: arcsec}
            points:
              - {id: A, h: 10.000, fix: h}
              - {id: B, h: 11.000, fix: h}
              - {id: C, h: 12.000, fix: h}
              - {id: P, h: 10.500}
            levelling:
              - {from: A, to: P, dh: 0.5000, sd: 0.001}
              - {from: P, to: B, dh: 0.5003, sd: 0.001}
              - {from: B, to: C, dh: 0.9998, sd: 0.001}
              - {from: C, to: A, dh: -2.0001, sd: 0.001}
            """;
        var p = ProjectReader.Parse(project, "three.yaml", TestProjects.RepoRoot, _ => throw new IOException("none"));
        var s = AdjustmentSequence.Run(p.Network, p.Options);
        Assert.Equal(3, s.Testability.Count);
        Assert.All(s.Testability, x =>
        {
            Assert.Equal(Parameter.H, x.Component);
            Assert.Equal(2.0 / 3.0, x.Redundancy!.Value, 9);
            Assert.True(x.Testable!.Value);
        });
        Assert.Equal(2, s.Test.AddedConstraints);
    }

    [Fact]
    public void TwoPlanMarksShareTheirOneCheckAlongTheLineBetweenThem()
    {
        // Two held marks of a network with distances: translation and rotation come from the control, so the one
        // check is the distance between the marks. Its direction u = (sin t, cos t) gives H = I − ccᵀ with
        // c = (−u, u)/√2 over (E1, N1, E2, N2): r(E) = sin²t / 2, r(N) = cos²t / 2 at both marks, and all four
        // discrepancies move together, so no mark can be told apart from the other (closed form).
        const string project = """
            project: two marks
            units: {length: m, angle: dms, angle_sd: arcsec}
            points:
              - {id: A, e: 1000.000, n: 1000.000, fix: en}
              - {id: B, e: 1300.000, n: 1400.000, fix: en}
              - {id: P, e: 1350.000, n: 1050.000}
            setups:
              - at: P
                directions:
                  - {to: A, value: 0-00-00.0, sd: 1.0}
                  - {to: B, value: 90-00-00.0, sd: 1.0}
                distances:
                  - {to: A, value: 353.5534, sd: 0.002}
                  - {to: B, value: 353.5534, sd: 0.002}
              - at: A
                distances:
                  - {to: B, value: 500.0000, sd: 0.002}
            """;
        var p = ProjectReader.Parse(project, "two.yaml", TestProjects.RepoRoot, _ => throw new IOException("none"));
        var s = AdjustmentSequence.Run(p.Network, p.Options);
        double sin = 300.0 / 500.0, cos = 400.0 / 500.0;
        foreach (var x in s.Testability)
        {
            double expected = (x.Component == Parameter.E ? sin * sin : cos * cos) / 2;
            Assert.Equal(expected, x.Redundancy!.Value, 4);
            Assert.Equal(3, x.CannotBeToldApartFrom.Count);
        }
        Assert.Equal(1.0, s.Testability.Sum(x => x.Redundancy!.Value), 9);
    }

    [Fact]
    public void AMovedReferenceMarkIsReportedNotTestableNotBlamedOnAnotherMark()
    {
        // The case of the issue: a reference mark given 5.7 cm off its true place across its only sight line. HV03
        // (disturbed in the demo) is set free here, so RM5 is the only wrong control mark.
        string text = File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data", "harrowgate-control.yaml"))
            .Replace("  - {id: HV03, e: 5655.330, n: 8590.760, fix: en}", "  - {id: HV03, e: 5655.330, n: 8590.760}",
                StringComparison.Ordinal)
            .Replace("  - {id: T1}", ReferenceMark + "\n  - {id: T1}", StringComparison.Ordinal)
            .Replace("setups:\n", "setups:\n" + OneLine, StringComparison.Ordinal);
        Assert.DoesNotContain("HV03, e: 5655.330, n: 8590.760, fix", text, StringComparison.Ordinal);
        var project = ProjectReader.Parse(text, "harrowgate-rm.yaml", TestProjects.RepoRoot,
            _ => throw new IOException("no files"));
        var s = AdjustmentSequence.Run(project.Network, project.Options);
        Assert.False(s.Test.Passed); // the control as a whole does not fit (Koch 1999, §4.3)
        double critical = s.Minimal.Analysis.WCritical;
        // No other mark's discrepancy fails the w-test (Baarda 1968): the error is not passed on to them.
        Assert.All(s.Discrepancies.Where(d => d.Id != "RM5"), d => Assert.False(d.MaxAbsW > critical,
            $"{d.Id}: |w| = {d.MaxAbsW}"));
        // RM5's own discrepancy carries the error across its line, 5.7 cm within 3 sd (common practice: one
        // direction fixes the coordinate of a point across the line).
        var rm = Assert.Single(s.Discrepancies, d => d.Id == "RM5");
        double az = 300 * Math.PI / 180;
        double across = (rm.DE!.Value * Math.Cos(az)) - (rm.DN!.Value * Math.Sin(az));
        double sd = Math.Max(rm.SdE!.Value, rm.SdN!.Value);
        Assert.InRange(Math.Abs(across), 0.057 - (3 * sd), 0.057 + (3 * sd));
        // ... and RM5 is reported not testable, with the components it cannot be told apart from.
        var e = Assert.Single(s.Testability, x => x.Id == "RM5" && x.Component == Parameter.E);
        var n = Assert.Single(s.Testability, x => x.Id == "RM5" && x.Component == Parameter.N);
        Assert.False(e.Testable!.Value);
        Assert.False(n.Testable!.Value);
        Assert.Equal(["RM5 N"], e.CannotBeToldApartFrom);
        Assert.Equal(["RM5 E"], n.CannotBeToldApartFrom);

        var c = new ReportContext("harrowgate-rm.yaml", TestProjects.RunDate, ProjectUnits.Default);
        string report = SequenceReportWriter.Write(s, c);
        Assert.Matches(@"\n  RM5 .* not testable \(E, N\)\n", report);
        Assert.DoesNotMatch(@"\n  RM5 .*<- largest", report);
        using var json = JsonDocument.Parse(SequenceJsonWriter.Write(s, c));
        var verdicts = json.RootElement.GetProperty("control_discrepancies").EnumerateArray()
            .ToDictionary(x => x.GetProperty("id").GetString()!, x => x.GetProperty("verdict").GetString());
        Assert.Equal("not testable", verdicts["RM5"]);
        Assert.All(verdicts.Where(v => v.Key != "RM5"), v => Assert.Equal("passes", v.Value));
        string html = HtmlReportWriter.Write(ResultReport.Build(s, c, minimal: false));
        int at = html.IndexOf("<section id=\"sequence-discrepancies\"", StringComparison.Ordinal);
        Assert.True(at >= 0);
        string table = html[at..html.IndexOf("</section>", at, StringComparison.Ordinal)];
        Assert.DoesNotContain("<tr class=\"fail\">", table);
        Assert.Matches(
            "<tr class=\"warn\">(?:(?!</tr>).)*<td class=\"id\">RM5</td>(?:(?!</tr>).)*not testable \\(E, N\\)",
            table);
    }

    [Fact]
    public void HoldingAReferenceMarkAlongItsLineLeavesTheRestOfStep1AsWithoutIt()
    {
        // In step 1 the one direction to RM5 has redundancy zero (it fixes RM5 across the line and nothing else), so
        // the other points' coordinates, their standard deviations and vᵀPv are those of the network without RM5
        // (common practice: an observation with redundancy zero changes no other estimate). This checks the datum
        // with RM5 held along its line (its null-space columns) against a plain run of the demo.
        var with = Run(ReferenceMark, OneLine);
        string text = File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data", "harrowgate-control.yaml"));
        var plain = ProjectReader.Parse(text, "harrowgate.yaml", TestProjects.RepoRoot,
            _ => throw new IOException("no files"));
        var without = AdjustmentSequence.Run(plain.Network, plain.Options);
        Assert.Equal(without.MinimalDatum, with.MinimalDatum);
        Assert.Equal(without.Minimal.Statistics.Vtpv, with.Minimal.Statistics.Vtpv, 6);
        Assert.Equal(without.Minimal.Statistics.DegreesOfFreedom, with.Minimal.Statistics.DegreesOfFreedom);
        foreach (var p in without.Minimal.Points)
        {
            var q = Assert.Single(with.Minimal.Points, x => x.Id == p.Id);
            Assert.Equal(p.E!.Value, q.E!.Value, 6);
            Assert.Equal(p.N!.Value, q.N!.Value, 6);
            Assert.Equal(p.SdE!.Value, q.SdE!.Value, 7);
            Assert.Equal(p.SdN!.Value, q.SdN!.Value, 7);
        }
        // RM5 itself: its easting (closer to the line's direction, azimuth 300°) is held, its northing estimated.
        var rm = Assert.Single(with.Minimal.Points, x => x.Id == "RM5");
        Assert.Equal(NetAdjust.Network.Fixity.E, rm.Input.Fixed);
        Assert.True(rm.SdN > 0);
    }

    [Fact]
    public void TheFreeCoordinateOfAReferenceMarkHasTheVarianceOfItsSightLine()
    {
        // RM5's easting held, its northing N = N_T1 + (E_RM5 − E_T1) / tan(az), az = o + reading, o the orientation of
        // its set: by propagation of variance (common practice) σ²(N) = σ0² J Q Jᵀ over (E_T1, N_T1, o), Q their
        // cofactor in step 1, plus the reading's own variance. Checks the datum's null-space columns at the mark
        // (without their completion along the line the result is 3.36 mm instead of 3.31 mm).
        var s = Run(ReferenceMark, OneLine);
        var m = s.Minimal;
        var t1 = Assert.Single(m.Points, x => x.Id == "T1");
        var rm = Assert.Single(m.Points, x => x.Id == "RM5");
        double dE = rm.E!.Value - t1.E!.Value;
        double az = Math.Atan2(dE, rm.N!.Value - t1.N!.Value);
        // the set of the sight line: its orientation plus the reading (300°) is the line's azimuth
        var set = Assert.Single(m.Orientations, o => o.Station == "T1" &&
            Math.Abs(Math.IEEERemainder(o.Orientation + (300 * Math.PI / 180) - az, 2 * Math.PI)) < 1e-4);
        double[] j = [-1 / Math.Tan(az), 1, -dE / (Math.Sin(az) * Math.Sin(az))];
        int[] k = [m.Unknowns.IndexOf("T1", Parameter.E), m.Unknowns.IndexOf("T1", Parameter.N),
            m.Unknowns.IndexOf(set.SetId, Parameter.Orientation)];
        Assert.DoesNotContain(-1, k);
        double q = 0;
        for (int a = 0; a < 3; a++)
            for (int b = 0; b < 3; b++) q += j[a] * m.Cofactor(k[a], k[b]) * j[b];
        // ... plus the reading itself (redundancy zero), which enters as the orientation does
        var line = Assert.Single(m.Observations, o => o.Input.Points.Contains("RM5"));
        q += j[2] * j[2] * line.Input.StandardDeviation * line.Input.StandardDeviation;
        Assert.Equal(Math.Sqrt(m.Options.AprioriVarianceFactor * q), rm.SdN!.Value, 6);
    }
}
