using System.Globalization;
using System.Text;
using NetAdjust.IO.Project;
using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Standards;

namespace NetAdjust.IO.Results;

/// <summary>
/// The report sections of the checks before the adjustment (level closures, traverses, GNSS baseline loops) and of
/// the accuracy standards (docs/output-format.md, "Misclosures" and "Accuracy standards"), for the text and HTML
/// reports and for <c>netadjust check</c>. Lengths in the project's units, angles in its angular sd unit.
/// </summary>
internal static partial class CheckSections
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The sections of the misclosures and of the standards that have something to show.</summary>
    public static IEnumerable<ReportSection> Build(ReportContext c, SurveyNetwork network)
    {
        if (c.Misclosures is MisclosureReport m)
            foreach (var s in Misclosures(m, network, c.Units)) yield return s;
        if (c.Standards is StandardsReport s2 && s2.Standards.Count > 0) yield return Standards(s2, c.Units);
    }

    /// <summary>The misclosure sections as text, for <c>netadjust check</c>; empty when nothing was found.</summary>
    /// <param name="report">The checks.</param>
    /// <param name="network">The network they were run on (for the observations' sources).</param>
    /// <param name="units">The project's units.</param>
    public static string Text(MisclosureReport report, SurveyNetwork network, ProjectUnits units)
    {
        var sb = new StringBuilder();
        foreach (var s in Misclosures(report, network, units)) s.AppendText(sb);
        return sb.ToString();
    }

    /// <summary>The lines under a closure's row: its points and the observations it contains (where each was
    /// read), wrapped to at most 100 columns.</summary>
    private static List<string> Named(SurveyNetwork network, IReadOnlyList<string> points, IEnumerable<int> obs)
    {
        var lines = Wrap("points: ", points.Select((p, i) => i < points.Count - 1 ? p + "-" : p), "");
        lines.AddRange(Wrap("observations: ", obs.Select(i => network.Observations[i].Source ?? $"#{i + 1}"), ", "));
        return lines;
    }

    private static List<string> Wrap(string head, IEnumerable<string> items, string separator)
    {
        const string indent = "      ";
        var lines = new List<string>();
        var line = new StringBuilder(indent + head);
        bool first = true;
        foreach (var item in items)
        {
            string piece = (first ? "" : separator) + item;
            if (!first && line.Length + piece.TrimEnd().Length > 100)
            {
                lines.Add((line + separator).TrimEnd());
                line = new StringBuilder(indent + "  ").Append(item);
            }
            else line.Append(piece);
            first = false;
        }
        lines.Add(line.ToString().TrimEnd());
        return lines;
    }

    private static List<ReportSection> Misclosures(MisclosureReport m, SurveyNetwork network, ProjectUnits u)
    {
        var units = new ReportUnits(u);
        string lu = u.Length.Symbol, au = u.AngleSd.Symbol();
        string conf = (m.Options.Confidence * 100).ToString("0.##", Inv) + "%";
        var list = new List<ReportSection>();
        static SectionColumn Txt(string h, int w) => new(h, null, ValueKind.Text, w, true, Clip: true);
        static SectionColumn Nr(string h, string? unit, int w) => new(h, unit, ValueKind.Number, w);
        string Pass(bool passed) => passed ? "pass" : "FAIL";
        if (m.Levels.Count > 0)
        {
            var shown = Listed(m.Levels, l => l.Passed);
            var rows = shown.Select(l => new SectionRow([
                l.Kind switch { LevelClosureKind.Loop => "loop", LevelClosureKind.Line => "line", _ => "section" },
                string.Join("-", l.Points), units.SmallLength(l.Misclosure),
                double.IsFinite(l.Length) ? (l.Length / 1000).ToString("F3", Inv) : "-",
                units.SmallLength(l.SdAllowance), units.SmallLength(l.Allowance), F(l.Ratio, 2), Pass(l.Passed),
            ], l.Passed ? RowState.Normal : RowState.Fail, Named(network, l.Points, l.Observations))).ToList();
            string allowance = m.Options.LevelLoopConstant is double c
                ? $"c*sqrt(K), c = {F(c * 1000, 2)} mm (loops, lines), " +
                  $"{F((m.Options.LevelSectionConstant ?? c) * 1000, 2)} mm (sections)"
                : "none set (checks.level_loop_mm)";
            list.Add(new ReportSection("level-misclosures", $"LEVEL LOOPS AND LINES BEFORE THE ADJUSTMENT ({lu})",
                "Level loops and lines before the adjustment",
                [
                    "  Misclosure = sum of the height differences round the loop (line: minus the given height",
                    "  difference of its end benchmarks); a section levelled twice closes on itself.",
                    $"  Tested against z*sd at {conf} (expected sd from the observations' sd) and the allowance " +
                    "of the",
                    $"  project: {allowance}. K in km.",
                ],
                [
                    Txt("Closes", 7), Txt("Points", 28), Nr("Misclosure", lu, 10), Nr("K", "km", 7),
                    Nr("z*sd", lu, 8), Nr("c*sqrtK", lu, 8), Nr("Ratio", null, 6), Txt("", 0),
                ],
                rows, Omitted(shown.Count, m.Levels.Count, "closures"))
                { HtmlSummary = Summary(m.Levels.Count(l => !l.Passed), m.Levels.Count, "closure") });
        }
        if (m.Traverses.Count > 0)
        {
            var shown = Listed(m.Traverses, t => t.Passed);
            var rows = shown.Select(t => new SectionRow([
                t.Kind == TraverseKind.Link ? "link" : "closed", string.Join("-", t.Points),
                double.IsFinite(t.AngularMisclosure) ? units.SmallAngle(t.AngularMisclosure) : "-",
                double.IsFinite(t.AngularAllowance) ? units.SmallAngle(t.AngularAllowance) : "-",
                units.SmallLength(t.LinearMisclosure), units.Length(t.Length),
                double.IsFinite(t.PrecisionRatio) ? "1:" + Math.Floor(t.PrecisionRatio).ToString("F0", Inv) : "exact",
                F(t.Ratio, 2), Pass(t.Passed),
            ], t.Passed ? RowState.Normal : RowState.Fail, Named(network, t.Points, t.Observations))).ToList();
            list.Add(new ReportSection("traverse-misclosures",
                $"TRAVERSES BEFORE THE ADJUSTMENT (angles {au}, lengths {lu})", "Traverses before the adjustment",
                [
                    $"  Angular misclosure = carried minus known azimuth, against z*sd at {conf}; linear misclosure " +
                    "after",
                    $"  balancing the angles equally, tested against its expected covariance at {conf} " +
                    "(chi-square, 2 dof)" + (m.Options.MinimumTraverseRatio is double k
                        ? $" and a least ratio 1:{k.ToString("0", Inv)}." : "."),
                ],
                [
                    Txt("Kind", 6), Txt("Stations", 26), Nr("Ang.mis.", au, 8), Nr("z*sd", au, 7),
                    Nr("Lin.mis.", lu, 9), Nr("Length", lu, 10), Txt("Precision", 10) with { Left = false },
                    Nr("Ratio", null, 6), Txt("", 0),
                ],
                rows, Omitted(shown.Count, m.Traverses.Count, "traverses"))
                { HtmlSummary = Summary(m.Traverses.Count(t => !t.Passed), m.Traverses.Count, "traverse") });
        }
        if (m.BaselineLoops.Count > 0) list.Add(BaselineLoopSection(m, network, u));
        return list;
    }

    /// <summary>The most closures a report lists one by one; beyond it only the failing ones are listed (the JSON
    /// result holds them all).</summary>
    internal const int ListLimit = 100;

    private static List<T> Listed<T>(IReadOnlyList<T> all, Func<T, bool> passed) =>
        all.Count <= ListLimit ? [.. all] : [.. all.Where(x => !passed(x))];

    private static List<string> Omitted(int shown, int all, string what) => shown == all ? []
        : [$"  {all} {what} checked; only the {shown} failing ones are listed (the JSON result holds all)."];

    private static string Summary(int failed, int all, string what) => failed == 0
        ? $"Every {what} is within its allowance ({all} checked)."
        : $"{failed} of {all} {what}s fail: look for a blunder among the observations each names.";

    private static ReportSection Standards(StandardsReport s, ProjectUnits u)
    {
        var units = new ReportUnits(u);
        string lu = u.Length.Symbol;
        var rows = s.Items.Select(i => new SectionRow([
            i.Standard, i.Item, i.Quantity, units.SmallLength(i.Value), units.SmallLength(i.Allowance),
            i.Ratio is double r ? F(r, 2) : "-", i.ClassReached is double c ? ClassText(c) : "-",
            i.Passed switch { true => "pass", false => "FAIL", _ => "" },
        ], i.Passed == false ? RowState.Fail : RowState.Normal)).ToList();
        var before = new List<string>
        {
            "  Relative precision: 95% relative ellipse semi-major axis (standard ellipse x 2.4477) against a + b ppm;",
            "  geodetic accuracy (FGDC-STD-007.2-1998): horizontal 95% circle radius from the standard ellipse,",
            "  vertical 1.96 sd; network from the point's own covariance, local as the mean over directly connected",
            "  points; levelling: |misclosure| against c*sqrt(K). Worst first within each standard.",
        };
        foreach (var st in s.Standards) before.Add($"  {st.Name}: {Describe(st)}; source: {st.Source}");
        int failed = s.Items.Count(i => i.Passed == false);
        return new ReportSection("accuracy-standards", $"ACCURACY STANDARDS ({lu})", "Accuracy standards", before,
            [
                new SectionColumn("Standard", null, ValueKind.Text, 16, true, Clip: true),
                new SectionColumn("Item", null, ValueKind.Text, 15, true, Clip: true),
                new SectionColumn("Quantity", null, ValueKind.Text, 18, true),
                new SectionColumn("Value", lu, ValueKind.Number, 8),
                new SectionColumn("Allowance", lu, ValueKind.Number, 9),
                new SectionColumn("Ratio", null, ValueKind.Number, 6),
                new SectionColumn("Class", null, ValueKind.Text, 6, false),
                new SectionColumn("", null, ValueKind.Text, 0, true),
            ],
            rows, [$"  {StandardsReport.Caution}"])
        {
            HtmlSummary = (failed == 0 ? "No checked item exceeds its allowance. " :
                $"{failed} of {s.Items.Count} items exceed their allowance. ") + StandardsReport.Caution,
        };
    }

    private static string Describe(AccuracyStandard s) => s.Kind switch
    {
        StandardKind.RelativePrecision => $"{F(s.Constant * 1000, 1)} mm + {F(s.Ppm, 1)} ppm, " + (s.Pairs switch
        {
            PairSelection.Observed => "observed pairs",
            PairSelection.Listed => "listed pairs",
            _ => "all pairs of " + string.Join(", ", s.Points),
        }),
        StandardKind.GeodeticAccuracy => s.RequiredClass is double c ? $"required class {ClassText(c)}"
            : "class reached, no required class",
        _ => $"section {F(s.SectionConstant * 1000, 1)} mm sqrt(E), loop {F(s.LoopConstant * 1000, 1)} mm sqrt(F)",
    };

    private static string ClassText(double metres) => metres < 0.01 ? $"{F(metres * 1000, 0)} mm"
        : metres < 0.1 ? $"{F(metres * 100, 0)} cm" : metres < 1 ? $"{F(metres * 10, 0)} dm" : $"{F(metres, 0)} m";

    private static string F(double v, int d) => double.IsFinite(v) ? v.ToString("F" + d, Inv) : "-";
}

/// <summary>The checks before the adjustment as plain text (what <c>netadjust check</c> prints).</summary>
public static class MisclosureText
{
    /// <summary>Renders the level closures and traverses as text tables; empty when nothing was found.</summary>
    /// <param name="report">The checks.</param>
    /// <param name="network">The network they were run on (for the observations' sources).</param>
    /// <param name="units">The project's units.</param>
    public static string Write(MisclosureReport report, SurveyNetwork network, ProjectUnits units)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(units);
        return CheckSections.Text(report, network, units);
    }
}
