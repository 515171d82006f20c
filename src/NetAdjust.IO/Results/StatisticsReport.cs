using System.Globalization;
using System.Text;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The statistics sections of the text report: observation tests and reliability, control tests, absolute and
/// relative error ellipses, and (when run) the blunder-hunt log, the robust estimation and the variance components.
/// Lines at most 100 columns; culture-invariant.
/// </summary>
internal static class StatisticsReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Appends the sections of the model to the text report, passing long tables on to <paramref
    /// name="output"/> (when given) as they grow.</summary>
    public static void Append(StringBuilder sb, IEnumerable<ReportSection> sections, TextWriter? output = null)
    {
        foreach (var section in sections) section.AppendText(sb, output);
    }

    /// <summary>Builds the statistics sections of the report model (only those with something to show).</summary>
    public static IReadOnlyList<ReportSection> Build(AdjustmentResult r, ReportContext c)
    {
        var sections = new List<ReportSection>();
        var u = c.Units;
        var a = r.Analysis;
        string lu = u.Length.Symbol, au = u.AngleSd.Symbol();
        double radPerSd = u.AngleSd.RadiansPerUnit();
        var units = new ReportUnits(u).Booked(r.Network);
        string Len(double? m) => units.Length(m);
        string Small(Observation o, double? si) =>
            si is double x && double.IsFinite(x) ? units.ObservationSmall(o.Kind, x) : "-";
        string Num(double? v, int d) => v is double x && double.IsFinite(x) ? NumberText.Fixed(x, d) : "-";
        // azimuths in the project's angle format, as in the coordinate table and the plot
        string azUnit = u.Angle switch { AngleFormat.Dms => "d-mm-ss", AngleFormat.Gons => "gon", _ => "deg" };
        string Az(double rad) => units.Azimuth(rad);
        string Basis() => a.Basis == VarianceFactorBasis.Known
            ? $"variance factor known (a priori {F(a.VarianceFactor, 4)})"
            : $"variance factor estimated ({F(a.VarianceFactor, 4)})";
        static SectionColumn Id(string header, int width) =>
            new(header, null, ValueKind.PointId, width, true, Clip: true);
        static SectionColumn Txt(string header, int width, bool clip = false, string gap = " ") =>
            new(header, null, ValueKind.Text, width, true, gap, clip);
        static SectionColumn Nr(string header, string? unit, int width, string gap = " ") =>
            new(header, unit, ValueKind.Number, width, false, gap);
        string mixed = $"{lu} or {au}";

        // Tests of the observations: the counts now, the rows when a writer reads them (a long table is never held
        // whole as text).
        int rejected = 0, uncontrolled = 0, weak = 0, excluded = 0;
        foreach (var o in r.Observations)
        {
            switch (a.Observations[o.Index].Flag)
            {
                case ObservationFlag.Rejected: rejected++; break;
                case ObservationFlag.Uncontrolled: uncontrolled++; break;
                case ObservationFlag.Weak: weak++; break;
                case ObservationFlag.Excluded: excluded++; break;
            }
        }
        var observations = r.Observations;
        var tests = a.Observations;
        SectionRow TestRow(int index)
        {
            var o = observations[index];
            var i = o.Input;
            var t = tests[o.Index];
            string flag = t.Flag switch
            {
                ObservationFlag.Rejected => "REJECTED",
                ObservationFlag.Uncontrolled => "uncontrolled",
                ObservationFlag.Weak => "weak",
                ObservationFlag.Excluded => "set aside",
                _ => "",
            };
            if (i.SdFactor != 1.0) flag += (flag.Length > 0 ? " " : "") + $"sd x{i.SdFactor.ToString("0.###", Inv)}";
            var state = t.Flag switch
            {
                ObservationFlag.Rejected => RowState.Fail,
                ObservationFlag.Uncontrolled or ObservationFlag.Weak => RowState.Warn,
                _ => RowState.Normal,
            };
            return new SectionRow([
                (o.Index + 1).ToString(Inv), ObservationLabels.Short(i.Kind), ObservationLabels.Station(i) ?? "",
                ObservationLabels.FromShown(i), i.To, Small(i, o.Residual),
                Num(t.Flag == ObservationFlag.Excluded ? null : t.Redundancy, 2), Num(t.W, 2), Num(t.Tau, 2),
                Small(i, t.Mdb), Len(t.ExternalReliability), flag], state);
        }
        var rows = new RowsOnDemand<SectionRow>(observations.Count, TestRow);
        var after = new List<string>
        {
            $"  Rejected: {rejected}; uncontrolled (r < {F(a.Options.UncontrolledRedundancy, 2)}): {uncontrolled}; " +
            $"weakly controlled (r < {F(a.Options.WeakRedundancy, 2)}): {weak}; set aside: {excluded}",
        };
        if (excluded > 0)
        {
            after.Add(
                "  Set-aside observations carry no weight: their residual is the misclosure against the adjusted");
            after.Add("  coordinates, and w its standardised value.");
        }
        sections.Add(new ReportSection("observation-tests",
            "TESTS OF THE OBSERVATIONS (redundancy numbers, w-test, tau test, internal and external reliability)",
            "Tests of the observations",
            [
                $"  Deciding test: {(a.Basis == VarianceFactorBasis.Known ? "w-test (Baarda)" : "tau test (Pope)")}; " +
                Basis(),
                $"  w-test: alpha0 {F(a.Options.WTestAlpha, 4)} two-sided, critical value {F(a.WCritical, 3)}; " +
                $"MDB for power {F(1 - a.Options.TypeIIError, 2)}: delta0 {F(a.Delta0, 3)}",
                $"  Tau test: overall alpha {F(a.Options.TauAlpha, 3)}, " +
                $"{(a.Options.TauAdjustment == MultipleTestAdjustment.Sidak ? "Sidak" : "Bonferroni")} " +
                $"split over {r.Statistics.Observations} observations, critical value " +
                (a.TauCritical is double tc ? F(tc, 3) : "n/a (r < 2)"),
                $"  Sum of redundancy numbers {F(Math.Round(a.RedundancySum, 3) + 0.0, 3)} " +
                $"(degrees of freedom {r.Statistics.DegreesOfFreedom})",
                $"  Residuals and MDB in {lu} or {au}; ext. rel. = largest point shift ({lu}) from an undetected MDB" +
                (a.ExternalReliabilityComputed ? "" : " (not computed)"),
            ],
            [
                Nr("#", null, 4), Txt("Kind", 9), Id("At", 6), Id("From", 6), Id("To", 6), Nr("Residual", mixed, 9),
                Nr("r", null, 5), Nr("w", null, 6), Nr("tau", null, 6), Nr("MDB", mixed, 8), Nr("Ext.rel.", lu, 8),
                Txt("Flag", 0),
            ],
            rows, after));

        if (a.Control.Count > 0)
        {
            sections.Add(new ReportSection("control-tests", $"TESTS OF THE WEIGHTED CONTROL ({lu})",
                "Tests of the weighted control", [],
                [
                    Id("Point", 12), Txt("Comp.", 5) with { Left = false }, Nr("Residual", lu, 9), Nr("r", null, 5),
                    Nr("w", null, 7), Nr("tau", null, 7), Nr("MDB", lu, 9), Txt("Flag", 0),
                ],
                a.Control.Select(ct => new SectionRow([
                    ct.PointId, ObservationLabels.ComponentKey(ct.Component), Len(ct.Residual),
                    Num(ct.Test.Redundancy, 2),
                    Num(ct.Test.W, 2), Num(ct.Test.Tau, 2), Len(ct.Test.Mdb), ct.Test.Flag.Name() ?? "",
                ], StateOf(ct.Test.Flag))).ToList(), []));
        }

        string level = (a.Options.ConfidenceLevel * 100).ToString("0.#", Inv) + "%";
        if (a.Points.Any(p => p.Ellipse is not null || p.SdHeight is not null))
        {
            var precisions = a.Points;
            var shown = new List<int>();
            for (int pi = 0; pi < precisions.Count; pi++)
                if (precisions[pi].Ellipse is not null || precisions[pi].SdHeight is not null) shown.Add(pi);
            SectionRow EllipseRow(int index)
            {
                var p = precisions[shown[index]];
                var e = p.Ellipse; var k = p.Confidence;
                var input = r.Network[p.Id];
                if ((e is null || input.IsFixed(Fixity.EN)) && (p.SdHeight is null || input.IsFixed(Fixity.H)))
                    return new SectionRow([p.Id, "held", "", "", "", "", "", ""]);
                return new SectionRow([
                    p.Id, Len(e?.A), Len(e?.B), e is ErrorEllipse ee ? Az(ee.Azimuth) : "-", Len(k?.A), Len(k?.B),
                    Len(p.SdHeight), Len(p.HeightConfidence),
                ]);
            }
            var ellipses = new RowsOnDemand<SectionRow>(shown.Count, EllipseRow);
            sections.Add(new ReportSection("ellipses",
                $"ERROR ELLIPSES ({lu}; azimuth of the semi-major axis in {azUnit} from north)", "Error ellipses",
                [
                    $"  {char.ToUpperInvariant(Basis()[0])}{Basis()[1..]}",
                    $"  Confidence scale for {level}: {F(a.EllipseScale, 4)} " +
                    (a.Basis == VarianceFactorBasis.Known ? "(sqrt of chi-square, 2 dof)"
                        : $"(sqrt(2 F(2, {r.Statistics.DegreesOfFreedom})))") +
                    $"; heights {F(a.IntervalScale, 4)}",
                ],
                [
                    Id("Point", 12), Nr("a", lu, 9), Nr("b", lu, 9), Nr("Azimuth", azUnit, 9), Nr("a " + level, lu, 9),
                    Nr("b " + level, lu, 9), Nr("sd H", lu, 9), Nr("H " + level, lu, 9),
                ],
                ellipses, []));
        }

        var relative = a.Relative;
        if (relative.Count > 0)
        {
            sections.Add(new ReportSection("relative",
                $"RELATIVE ERROR ELLIPSES ({lu}; azimuth in {azUnit}; distance precision 1:k; " +
                $"azimuth sd in {au})", "Relative precision", [],
                [
                    Id("From", 8), Id("To", 8), Nr("a", lu, 8), Nr("b", lu, 8), Nr("Azimuth", azUnit, 9),
                    Nr("a " + level, lu, 8), Nr("Distance", lu, 11), Nr("sd dist", lu, 8), Nr("1:k", null, 9),
                    Nr("sd az", au, 7), Txt("", 0, gap: ""),
                ],
                new RowsOnDemand<SectionRow>(relative.Count, x =>
                {
                    var rel = relative[x];
                    return new SectionRow([
                        rel.From, rel.To, Len(rel.Ellipse.A), Len(rel.Ellipse.B), Az(rel.Ellipse.Azimuth),
                        Len(rel.Confidence.A), Len(rel.Distance), Len(rel.SdDistance),
                        double.IsFinite(rel.Ratio) ? rel.Ratio.ToString("F0", Inv) : "exact",
                        units.SmallAngle(rel.SdAzimuth),
                        rel.Observed ? "" : " *",
                    ]);
                }),
                a.Relative.Any(x => !x.Observed)
                    ? ["  * pair listed in the project file (not joined by an observation)"] : []));
        }

        var relativeHeights = a.RelativeHeights;
        if (relativeHeights.Count > 0)
        {
            string Dh(double? m) => units.KindLength(ObservationKind.HeightDifference, m);
            sections.Add(new ReportSection("relative-heights",
                $"RELATIVE HEIGHT PRECISION ({lu}; standard deviation of the height difference and its {level} " +
                "half-width)", "Relative height precision", [],
                [
                    Id("From", 10), Id("To", 10), Nr("dH", lu, 11), Nr("sd dH", lu, 9), Nr("dH " + level, lu, 9),
                    Txt("", 0, gap: ""),
                ],
                new RowsOnDemand<SectionRow>(relativeHeights.Count, x =>
                {
                    var rh = relativeHeights[x];
                    return new SectionRow([
                        rh.From, rh.To, Dh(rh.Difference), Dh(rh.SdDifference), Dh(rh.Confidence),
                        rh.Observed ? "" : " *",
                    ]);
                }),
                a.RelativeHeights.Any(x => !x.Observed)
                    ? ["  * pair listed in the project file (not joined by an observation)"] : []));
        }

        if (c.Hunt is BlunderHunt h)
        {
            var hunt = new List<SectionRow>();
            foreach (var round in h.Rounds)
            {
                // without its source, so that the kind and points fit the column; the sources are listed below
                string worst = round.WorstIndex is int wi
                    ? $"#{wi + 1} {(r.Network.Observations[wi] with { Source = null }).Describe()}" : "-";
                hunt.Add(new SectionRow([
                    round.Round.ToString(Inv), round.DegreesOfFreedom.ToString(Inv), Num(round.VarianceFactor, 4),
                    round.GlobalTestPassed is bool g ? (g ? "passed" : "FAILED") : "n/a", worst,
                    Num(round.WorstStatistic, 2), Num(round.Critical, 2), round.SetAside ? "set aside" : "-",
                ], round.SetAside ? RowState.Fail : RowState.Normal));
            }
            var huntAfter = new List<string> { $"  Stopped: {h.StopReason}." };
            if (h.SetAside.Count > 0)
            {
                huntAfter.Add("  Set aside, in the order found:");
                foreach (int i in h.SetAside)
                    foreach (var part in Wrap($"#{i + 1} {r.Network.Observations[i].Describe()}", 94))
                        huntAfter.Add("    " + part);
                huntAfter.Add(
                    "  To keep these decisions, mark the observations 'exclude: true' (or re-weight them with");
                huntAfter.Add("  'sd_factor') in the project file, or re-measure.");
            }
            sections.Add(new ReportSection("blunder-hunt",
                "BLUNDER HUNT (iterative data snooping: one observation set aside per round)", "Blunder hunt", [],
                [
                    Nr("Round", null, 5), Nr("r", null, 5), Nr("Var.factor", null, 10), Txt("Global", 7) with
                    { Left = false }, Txt("Worst observation", 34, clip: true), Nr("Statistic", null, 9),
                    Nr("Critical", null, 8), Txt("Action", 0, gap: "  "),
                ],
                hunt, huntAfter));
        }

        if (c.Robust is RobustEstimate rb)
        {
            var robust = new List<SectionRow>();
            for (int i = 0; i < rb.WeightFactors.Count; i++)
            {
                if (rb.WeightFactors[i] >= 1) continue;
                bool sus = rb.Suspected.Contains(i);
                robust.Add(new SectionRow([
                    (i + 1).ToString(Inv), (r.Network.Observations[i] with { Source = null }).Describe(),
                    rb.WeightFactors[i].ToString("0.0000", Inv), Num(rb.Standardised[i], 2), sus ? "SUSPECTED" : "",
                ], sus ? RowState.Fail : RowState.Normal));
            }
            var robustAfter = new List<string>();
            if (robust.Count == 0) robustAfter.Add("  none");
            robustAfter.Add($"  Suspected blunders (|u| above {F(a.WCritical, 2)}): " +
                (rb.Suspected.Count == 0 ? "none" : string.Join(", ", rb.Suspected.Select(i => "#" + (i + 1)))));
            foreach (int i in rb.Suspected)
                foreach (var part in Wrap($"#{i + 1} {r.Network.Observations[i].Describe()}", 94))
                    robustAfter.Add("    " + part);
            robustAfter.Add(
                "  The robust solution only locates suspects: exclude or re-measure them, then adjust as usual.");
            sections.Add(new ReportSection("robust",
                $"ROBUST ESTIMATION ({(rb.Method == RobustMethod.Huber ? "Huber" : "Danish method")}, " +
                $"c = {F(rb.Tuning, 2)}; {rb.Iterations} re-weightings, " +
                $"{(rb.Converged ? "converged" : "NOT converged")})",
                "Robust estimation",
                [
                    "  Observations down-weighted (weight factor below 1), with |u| = the |w| each would get at full",
                    "  weight against the others as re-weighted (docs/methods.md):",
                ],
                [
                    Nr("#", null, 4), Txt("Observation", 34, clip: true), Nr("Weight factor", null, 0),
                    Nr("|u|", null, 6), Txt("Suspect", 0),
                ],
                robust, robustAfter)
            {
                TextHeader = false,
                TextLayout = cells =>
                    $"  #{cells[0],-4} {TextReportWriter.Clip(cells[1], 34),-34} factor {cells[2]}  " +
                                      $"|u| {cells[3],6}{(cells[4].Length > 0 ? "  " + cells[4] : "")}",
            });
        }

        if (c.Components is VarianceComponentEstimate vc)
        {
            var groups = new List<SectionRow>();
            foreach (var g in vc.Groups)
            {
                string spec = g.ConstantPart is double ca && g.PpmPart is double pb
                    ? (u.Length == LengthUnit.Metre ? (ca * 1000).ToString("0.0", Inv) + " mm"
                        : Length.FromMetres(ca).In(u.Length).ToString("0.0000", Inv) + " " + lu) +
                      " + " + pb.ToString("0.0", Inv) + " ppm"
                    : g.ScaledSd is double sd && double.IsFinite(sd)
                        ? (g.Kind.IsAngular() ? $"sd {(sd / radPerSd).ToString("0.00", Inv)} {au}"
                            : $"sd {Length.FromMetres(sd).In(u.Length).ToString("0.0000", Inv)} {lu}")
                    : double.IsFinite(g.SdScale) ? $"given sd x {g.SdScale.ToString("0.000", Inv)}" : "not estimable";
                List<string> notes = g.Note is null ? [] : Wrap("note: " + g.Note, 94).Select(p => "    " + p).ToList();
                groups.Add(new SectionRow([
                    ObservationLabels.Short(g.Kind) + (g.Group is { Length: > 0 } bg ? " " + bg : ""),
                    g.Count.ToString(Inv), Num(g.Redundancy, 2),
                    Num(g.VarianceFactor, 3), Num(g.SdScale, 3), spec,
                ], After: notes));
            }
            sections.Add(new ReportSection("variance-components",
                $"VARIANCE COMPONENTS PER OBSERVATION GROUP (Foerstner; {vc.Iterations} iterations, " +
                $"{(vc.Converged ? "converged" : "NOT converged")})", "Variance components per observation group", [],
                [
                    Txt("Group", 18), Nr("n", null, 5), Nr("Redund.", null, 8), Nr("Var.factor", null, 10),
                    Nr("sd scale", null, 9), Txt("Implied specification", 0, gap: "  "),
                ],
                groups, ["  A variance factor of 1 means the group's given standard deviations fit its residuals."]));
        }
        return sections;
    }

    /// <summary>The state of a row by the flag of its test.</summary>
    internal static RowState StateOf(ObservationFlag flag) => flag switch
    {
        ObservationFlag.Rejected => RowState.Fail,
        ObservationFlag.Uncontrolled or ObservationFlag.Weak => RowState.Warn,
        _ => RowState.Normal,
    };

    private static string F(double v, int d) => NumberText.Fixed(v, d);

    private static IEnumerable<string> Wrap(string text, int width)
    {
        var line = new StringBuilder();
        foreach (var word in text.Split(' '))
        {
            if (line.Length > 0 && line.Length + 1 + word.Length > width)
            {
                yield return line.ToString(); line.Clear().Append("  ");
            }
            if (line.Length > 0 && line.ToString() != "  ") line.Append(' ');
            line.Append(word);
        }
        if (line.Length > 0) yield return line.ToString();
    }
}
