using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Reduction;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The reduction of rounds in the report model (docs/output-format.md, "Rounds"): per setup and set the collimation
/// and index errors, per target the reduced direction, zenith angle and slope distance with their spread over the
/// sets and the verdict of the ISO 17123-3 test; and the same figures for the JSON result. Empty when the project
/// books no rounds, so that the outputs of other projects do not change.
/// </summary>
internal static class RoundsReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The two sections (sets, targets), or none without rounds.</summary>
    public static IReadOnlyList<ReportSection> Sections(ReportContext c)
    {
        if (c.Rounds.Count == 0) return [];
        var units = new ReportUnits(c.Units);
        string au = units.SmallAngleSymbol, lu = units.LengthSymbol;
        string Small(double rad) => double.IsFinite(rad) ? units.SmallAngle(rad) : "-";
        string Ang(double rad) => double.IsFinite(rad) ? units.AngleValue(rad) : "-";
        string Len(double m) => double.IsFinite(m) ? units.Length(m) : "-";
        static SectionColumn Id(string header, int width) =>
            new(header, null, ValueKind.PointId, width, true, Clip: true);
        static SectionColumn Txt(string header, int width) => new(header, null, ValueKind.Text, width, true);
        static SectionColumn Nr(string header, string? unit, int width) => new(header, unit, ValueKind.Number, width);

        var setRows = new List<SectionRow>();
        var targetRows = new List<SectionRow>();
        var after = new List<string>();
        foreach (var r in c.Rounds)
        {
            var red = r.Reduction;
            for (int s = 0; s < red.Sets.Count; s++)
                setRows.Add(new SectionRow([r.Station, (s + 1).ToString(Inv), Faces(red),
                    Small(red.Sets[s].Collimation), Small(red.Sets[s].IndexError), r.SetSources[s]]));
            foreach (var t in red.Targets)
            {
                bool fails = t.DirectionTest is { Passes: false } || t.ZenithTest is { Passes: false };
                bool tested = t.DirectionTest is not null || t.ZenithTest is not null;
                targetRows.Add(new SectionRow([r.Station, t.Target, Ang(t.Direction), Ang(t.Zenith),
                    Len(t.SlopeDistance), Small(t.DirectionTest?.Empirical ?? double.NaN),
                    Small(t.DirectionTest?.Bound ?? double.NaN), Small(t.ZenithTest?.Empirical ?? double.NaN),
                    Small(t.ZenithTest?.Bound ?? double.NaN), !tested ? "-" : fails ? "fails" : "passes",
                ], fails ? RowState.Warn : RowState.Normal));
            }
            after.Add($"  {r.Station} ({r.Source}): {red.Sets.Count} set{(red.Sets.Count == 1 ? "" : "s")}, " +
                $"directions reduced to {red.ReferenceTarget ?? "-"}");
            after.Add($"    directions {Verdict(red.Directions, Small)}; zenith angles {Verdict(red.Zeniths, Small)}");
        }
        var sets = new ReportSection("rounds-sets",
            $"ROUNDS: INSTRUMENT ERRORS PER SET ({au}; collimation c, vertical index error i)",
            "Rounds: instrument errors per set",
            ["  c: face left reads c/sin z more than the mean of both faces; i: zL + zR = 360 deg + 2i"],
            [Id("Station", 10), Nr("Set", null, 4), Txt("Faces", 5), Nr("c", au, 8), Nr("i", au, 8),
                Txt("Line", 0)],
            setRows, []);
        var targets = new ReportSection("rounds-targets",
            $"ROUNDS: REDUCED OBSERVATIONS AND SPREAD OVER THE SETS ({units.AngleName}; {lu}; " +
            $"spread in {au})",
            "Rounds: reduced observations and spread",
            [
                "  Mean over the sets; spread s of one set against its bound s <= sd*sqrt(chi2(1-alpha; nu)/nu)",
                "  (ISO 17123-3); ! marks a target whose spread exceeds its bound (a warning)",
            ],
            [
                Id("Station", 10), Id("Target", 10), Nr("Direction", null, 13), Nr("Zenith", null, 13),
                Nr("Slope dist.", lu, 11), Nr("s hz", au, 6), Nr("bound", au, 6), Nr("s V", au, 6),
                Nr("bound", au, 6), Txt("Test", 0),
            ],
            targetRows, after)
        {
            MarkNote = "! the spread of the target over the sets exceeds its bound (a warning: the data are adjusted)",
        };
        return [sets, targets];
    }

    private static string Faces(ReducedRounds r) => r.Faces == Network.Faces.Both ? "both" : "one";

    private static string Verdict(SpreadTest? t, Func<double, string> small) => t is null ? "not tested"
        : $"s {small(t.Empirical)} {(t.Passes ? "<=" : ">")} {small(t.Bound)} (nu {t.DegreesOfFreedom}): " +
            (t.Passes ? "passes" : "fails");

    /// <summary>The JSON member <c>rounds</c>, or null without rounds (the key is then left out).</summary>
    public static IReadOnlyList<ResultJson.Rounds>? Json(ReportContext c)
    {
        if (c.Rounds.Count == 0) return null;
        static double? Sec(double rad) => double.IsFinite(rad) ? rad * Angle.ArcsecondsPerRadian : null;
        static double? Deg(double rad) => double.IsFinite(rad) ? rad * 180 / Math.PI : null;
        static double? M(double m) => double.IsFinite(m) ? m : null;
        static ResultJson.SpreadTest? Test(SpreadTest? t) => t is null ? null
            : new(t.DegreesOfFreedom, Sec(t.Empirical)!.Value, Sec(t.Expected)!.Value, Sec(t.Bound)!.Value, t.Passes);
        return [.. c.Rounds.Select(r => new ResultJson.Rounds(r.Station, r.SetId, r.Source, Faces(r.Reduction),
            r.Reduction.ReferenceTarget,
            r.Reduction.Sets.Select((s, i) => new ResultJson.RoundsSet(r.SetSources[i], Sec(s.Collimation),
                Sec(s.IndexError))).ToList(),
            r.Reduction.Targets.Select(t => new ResultJson.RoundsTarget(t.Target, Deg(t.Direction), Deg(t.Zenith),
                M(t.SlopeDistance), Test(t.DirectionTest), Test(t.ZenithTest))).ToList(),
            Test(r.Reduction.Directions), Test(r.Reduction.Zeniths)))];
    }
}
