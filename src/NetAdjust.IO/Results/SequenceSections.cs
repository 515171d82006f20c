using System.Globalization;
using System.Text;
using NetAdjust.Statistics;
using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The sections of the report model that compare the two solutions of a datum sequence: the solutions, the test of
/// the added constraints with its decision, the control discrepancies (with their standard deviations and
/// standardised values) and the coordinate shifts. The text and HTML reports show the same cells.
/// </summary>
internal static class SequenceSections
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Builds the sections.</summary>
    public static IReadOnlyList<ReportSection> Build(SequenceResult s, ReportContext c)
    {
        var units = new ReportUnits(c.Units);
        string lu = units.LengthSymbol;
        string L(double? v) => units.Length(v);
        static string W(double? v) => v is double x ? x.ToString("F2", Inv) : "-";
        static string F(double v, int d) => v.ToString("F" + d, Inv);
        static SectionColumn Nr(string header, string? unit, int width, string gap = " ") =>
            new(header, unit, ValueKind.Number, width, false, gap);
        var sections = new List<ReportSection>();

        var solutions = new List<SectionRow>();
        foreach (var (name, r) in new[] { ("1 minimally constrained", s.Minimal), ("2 constrained", s.Constrained) })
        {
            var st = r.Statistics;
            var g = st.GlobalTest;
            string test = g.Passed is bool p
                ? $"{F(g.Statistic, 3)} in [{F(g.Lower!.Value, 3)}, {F(g.Upper!.Value, 3)}] {(p ? "PASSED" : "FAILED")}"
                : "not possible (r = 0)";
            solutions.Add(new SectionRow([
                name, st.DegreesOfFreedom.ToString(Inv), F(st.Vtpv, 4),
                st.VarianceFactor is double vf ? F(vf, 4) : "n/a", test,
            ], g.Passed == false ? RowState.Fail : RowState.Normal));
        }
        sections.Add(new ReportSection("sequence-solutions", "SOLUTIONS", "Datum sequence: the two solutions", [],
            [
                new SectionColumn("Solution", null, ValueKind.Text, 24, true) { TextHeading = "" },
                Nr("r", null, 6), Nr("vTPv", null, 12), Nr("variance factor", null, 16),
                new SectionColumn("global test", null, ValueKind.Text, 0, true, "  "),
            ], solutions, []));

        var t = s.Test;
        var testRows = new List<SectionRow>();
        var testAfter = new List<string>();
        if (t.PassedChiSquare is bool ok)
        {
            testRows.Add(new SectionRow(["Chi-square (sigma0 known)", F(t.ChiSquare, 3),
                F(t.ChiSquareCritical!.Value, 3), ok ? "PASSED" : "FAILED", t.SigmaEstimated ? "" : "decides"],
                ok ? RowState.Normal : RowState.Fail));
            if (t.PassedF is bool okF)
                testRows.Add(new SectionRow(["F (sigma0 from step 1)", F(t.F!.Value, 3), F(t.FCritical!.Value, 3),
                    okF ? "PASSED" : "FAILED", t.SigmaEstimated ? "decides" : ""],
                    okF ? RowState.Normal : RowState.Fail));
        }
        else testAfter.Add("  Not possible: the control adds no constraint beyond the minimum.");
        sections.Add(new ReportSection("sequence-test",
            $"TEST OF THE ADDED CONSTRAINTS (does the control fit the observations? alpha {F(t.Alpha, 3)}, one-tailed)",
            "Test of the added constraints",
            [
                $"  Added constraints                 {t.AddedConstraints,8}",
                $"  Increase of vTPv                  {F(t.VtpvIncrease, 4),12}",
            ],
            [
                new SectionColumn("Test", null, ValueKind.Text, 34, true), Nr("Statistic", null, 0),
                Nr("Critical value", null, 0), new SectionColumn("Decision", null, ValueKind.Text, 0, true),
                new SectionColumn("Deciding test", null, ValueKind.Text, 0, true),
            ], testRows, testAfter)
        {
            TextHeader = false,
            TextLayout = cells => $"  {cells[0],-34}{cells[1]}, critical {cells[2]}: {cells[3]}" +
                                  (cells[4].Length > 0 ? "  (" + cells[4] + ")" : ""),
            HtmlSummary = t.Passed switch
            {
                true => "Decision: the control fits the observations (PASSED).",
                false => "Decision: the control does not fit the observations (FAILED).",
                _ => "Decision: nothing to test (the control adds no constraint beyond the minimum).",
            },
        });

        double critical = s.Minimal.Analysis.WCritical;
        // components the observations cannot test are neither failed nor named the largest (docs/methods.md)
        double worst = s.Discrepancies.Select(d => DiscrepancyVerdict.TestedMaxAbsW(s, d) ?? 0).DefaultIfEmpty(0).Max();
        sections.Add(new ReportSection("sequence-discrepancies",
            $"CONTROL DISCREPANCIES (given - minimally constrained, {lu}; w = discrepancy / its standard deviation)",
            "Control discrepancies (given − minimally constrained)", [],
            [
                new SectionColumn("Point", null, ValueKind.PointId, 12, true, Clip: true), Nr("dE", lu, 9),
                Nr("dN", lu, 9), Nr("dH", lu, 9), Nr("sd dE", lu, 8), Nr("sd dN", lu, 8), Nr("sd dH", lu, 8),
                Nr("wE", null, 7), Nr("wN", null, 7), Nr("wH", null, 7),
                new SectionColumn("", null, ValueKind.Text, 0, true, ""),
            ],
            s.Discrepancies.Select(d => new SectionRow([
                d.Id, L(d.DE), L(d.DN), L(d.DH), L(d.SdE), L(d.SdN), L(d.SdH), W(d.WE), W(d.WN), W(d.WH),
                (DiscrepancyVerdict.TestedMaxAbsW(s, d) is double m && m == worst && worst > 0 ? "  <- largest" : "") +
                (DiscrepancyVerdict.NotTestable(s, d) is { Count: > 0 } nt
                    ? $"  {DiscrepancyVerdict.NotTestableVerdict} ({string.Join(", ", nt)})" : ""),
            ], DiscrepancyVerdict.Of(s, d, critical) switch
            {
                "fails" => RowState.Fail,
                _ when DiscrepancyVerdict.NotTestable(s, d).Count > 0 => RowState.Warn,
                _ => RowState.Normal,
            })).ToList(),
            s.Minimal.Options.Datum.ReferenceObjects is { Count: > 0 } objects
                ? [
                    $"  Step 1 holds the reference object(s) {string.Join(", ", objects)} (one sight line each): an " +
                    "error in their",
                    "  given positions turns the observed network and shows as discrepancies of the other marks",
                    "  (see the control testability below).",
                ]
                : AlongLine(s) is { Count: > 0 } along
                    ? [
                        $"  Step 1 holds the reference object(s) {string.Join(", ", along)} along their sight line " +
                        "only (one",
                        "  coordinate, marked held): an error across the line shows in their own discrepancy, which",
                        "  the observations cannot test (see the control testability below).",
                    ]
                    : [])
        {
            MarkNote = $"Rows marked ✗ have a standardised discrepancy |w| above {F(critical, 2)}, " +
                       "the critical value of the w-test." + (s.Testability.Any(x => x.Testable == false)
                           ? " Rows marked ! have components the observations cannot test (see the control " +
                             "testability), which get no verdict." : ""),
        });

        var testability = s.Testability;
        double limit = s.Constrained.Options.Analysis.UncontrolledRedundancy;
        sections.Add(new ReportSection("sequence-testability",
            "CONTROL TESTABILITY (can the observations check each control component?)",
            "Control testability",
            [
                "  r = redundancy number of the component in the constrained step: the share of an error in its",
                $"  given value that shows in its own discrepancy. Below {F(limit, 2)} an error goes unseen;",
                "  components whose discrepancies move together cannot be told apart (docs/methods.md).",
            ],
            [
                new SectionColumn("Point", null, ValueKind.PointId, 12, true, Clip: true),
                new SectionColumn("Comp.", null, ValueKind.Text, 5, true),
                Nr("r", null, 5),
                new SectionColumn("Testable", null, ValueKind.Text, 8, true, "  "),
                new SectionColumn("Cannot be told apart from", null, ValueKind.Text, 0, true),
            ],
            testability.Select(x => new SectionRow([x.Id, x.Component.ToString(),
                x.Redundancy is double r ? F(r + 0.0, 2) : "-",
                x.Testable switch { true => "yes", false => "NO", null => "unknown" },
                string.Join(", ", x.CannotBeToldApartFrom)],
                x.Testable == false ? RowState.Warn : RowState.Normal)).ToList(),
            testability.Any(x => x.Testable is null)
                ? [$"  unknown: not computed for networks of more than {ControlTestability.MaxUnknowns} unknowns."]
                : [])
        {
            MarkNote = "Rows marked ! are control components the observations cannot check on their own.",
        });

        sections.Add(new ReportSection("sequence-shifts",
            $"COORDINATE SHIFTS (constrained - minimally constrained, {lu})",
            "Coordinate shifts (constrained − minimally constrained)", [],
            [
                new SectionColumn("Point", null, ValueKind.PointId, 12, true, Clip: true), Nr("dE", lu, 9),
                Nr("dN", lu, 9), Nr("horiz.", lu, 9), Nr("dH", lu, 9),
            ],
            s.Shifts.Select(sh => new SectionRow([sh.Id, L(sh.DE), L(sh.DN), L(sh.Horizontal), L(sh.DH)])).ToList(),
            []));
        return sections;
    }

    /// <summary>The control marks the minimal step held in one plane coordinate only: reference objects held along
    /// their sight line.</summary>
    private static List<string> AlongLine(SequenceResult s) => s.Minimal.Points
        .Where(p => p.Input.Fixed is Fixity.E or Fixity.N && s.Discrepancies.Any(d => d.Id == p.Input.Id))
        .Select(p => p.Input.Id).ToList();

    /// <summary>The coordinates and standard deviations of one solution, as a section.</summary>
    public static ReportSection Coordinates(ResultReport other, string solution)
    {
        var units = new ReportUnits(other.Context.Units);
        string lu = units.LengthSymbol;
        static SectionColumn Nr(string header, string unit) => new(header, unit, ValueKind.Number, 0);
        return new ReportSection("sequence-other-solution",
            $"COORDINATES OF THE {solution.ToUpperInvariant()} SOLUTION",
            $"Coordinates of the {solution} solution",
            [$"  Standard deviations at {other.Basis.Words}."],
            [
                new SectionColumn("Point", null, ValueKind.PointId, 0, true), Nr("Easting", lu), Nr("Northing", lu),
                Nr("Height", lu), Nr("sd E", lu), Nr("sd N", lu), Nr("sd H", lu),
            ],
            other.Points.Rows.Select(p => new SectionRow([
                p.Source.Id, units.Length(p.Source.E), units.Length(p.Source.N), units.Length(p.Source.H),
                units.Length(p.SdE), units.Length(p.SdN), units.Length(p.SdH),
            ])).ToList(), []);
    }
}
