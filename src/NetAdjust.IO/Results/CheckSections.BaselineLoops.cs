using NetAdjust.IO.Project;
using NetAdjust.Misclosures;
using NetAdjust.Network;

namespace NetAdjust.IO.Results;

internal static partial class CheckSections
{
    /// <summary>The section of the GNSS baseline loops (docs/output-format.md, "Misclosures").</summary>
    private static ReportSection BaselineLoopSection(MisclosureReport m, SurveyNetwork network, ProjectUnits u)
    {
        var units = new ReportUnits(u);
        string lu = u.Length.Symbol;
        string conf = (m.Options.Confidence * 100).ToString("0.##", Inv) + "%";
        var shown = Listed(m.BaselineLoops, l => l.Passed);
        var rows = shown.Select(l => new SectionRow([
            l.Baselines.Count == 2 ? "repeat" : "loop", string.Join("-", l.Points),
            (l.Length / 1000).ToString("F3", Inv), units.SmallLength(l.Misclosure), F(l.Ppm, 2),
            units.SmallLength(l.East), units.SmallLength(l.North), units.SmallLength(l.Up), F(l.ComponentRatio, 2),
            F(l.Ratio, 2), (l.Passed ? "pass" : "FAIL") + (l.Trivial ? " (one session)" : ""),
        ], l.Passed ? RowState.Normal : RowState.Fail, LoopLines(network, l))).ToList();
        int trivial = m.BaselineLoops.Count(l => l.Trivial);
        var before = new List<string>
        {
            "  Misclosure = sum of the baselines round the loop (each with the sign of the direction of travel), in",
            "  ppm of the loop length and in east, north, up at the loop's mean position. Tested against the summed",
            $"  covariances at {conf} (chi-square, 3 dof): Ratio = sqrt(statistic / critical value). ENU ratio = the",
            "  largest |component| / (z*sd), to see where a failing loop's misclosure lies. Length in km.",
        };
        if (trivial > 0)
            before.Add($"  {trivial} loop(s) have baselines of one session only: the processing closes them, they " +
                "check little.");
        int failed = m.BaselineLoops.Count(l => !l.Passed);
        return new ReportSection("baseline-loops", $"GNSS BASELINE LOOPS BEFORE THE ADJUSTMENT ({lu})",
            "GNSS baseline loops before the adjustment", before,
            [
                new SectionColumn("Closes", null, ValueKind.Text, 7, true, Clip: true),
                new SectionColumn("Points", null, ValueKind.Text, 24, true, Clip: true),
                new SectionColumn("Length", "km", ValueKind.Number, 7),
                new SectionColumn("Mis.", lu, ValueKind.Number, 8),
                new SectionColumn("ppm", null, ValueKind.Number, 6),
                new SectionColumn("East", lu, ValueKind.Number, 8),
                new SectionColumn("North", lu, ValueKind.Number, 8),
                new SectionColumn("Up", lu, ValueKind.Number, 8),
                new SectionColumn("ENU ratio", null, ValueKind.Number, 9),
                new SectionColumn("Ratio", null, ValueKind.Number, 6),
                new SectionColumn("", null, ValueKind.Text, 0, true),
            ],
            rows, Omitted(shown.Count, m.BaselineLoops.Count, "loops"))
        {
            HtmlSummary = failed == 0
                ? $"Every baseline loop closes within its allowance ({m.BaselineLoops.Count} checked)."
                : $"{failed} of {m.BaselineLoops.Count} baseline loops fail: look for a blunder among the " +
                  "baselines each names.",
        };
    }

    /// <summary>The lines under a loop's row: its points, its sessions, and where each baseline was read.</summary>
    private static List<string> LoopLines(SurveyNetwork network, BaselineLoop l)
    {
        // one source per baseline: its first component (the three share the line they were read from)
        var obs = l.Observations.Where((_, k) => k % 3 == 0);
        var lines = Named(network, l.Points, obs);
        if (l.Groups.Count > 0)
            lines.Insert(1, "      sessions: " + string.Join(", ", l.Groups.Select(g => g ?? "(none)")));
        return lines;
    }
}
