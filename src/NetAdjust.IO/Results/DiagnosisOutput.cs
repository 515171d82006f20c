using System.Globalization;
using System.Net;
using System.Text;
using NetAdjust.Diagnosis;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;
using DiagnosisResult = NetAdjust.Diagnosis.Diagnosis;

namespace NetAdjust.IO.Results;

/// <summary>
/// The blunder diagnosis (docs/diagnosis.md) in the text and HTML reports and the JSON result (docs/report.md,
/// docs/output-format.md): per suspect observation its w and the hypotheses tried, best first, with their test
/// statistic, critical value, dimension, estimated size and its sd, the candidate chosen, the largest |w| after the
/// correction and whether the network then fits; the pairs of hypotheses this data cannot tell apart; and, for an
/// explained suspect, the edit of the project file the surveyor may apply by hand. Nothing is written when no
/// diagnosis was run. Sizes in the report's units: lengths in the project's length unit, angles in its angular sd
/// unit; in JSON lengths in metres and angles in arcseconds.
/// </summary>
internal static class DiagnosisOutput
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The note under every diagnosis: the program suggests, the surveyor decides and edits.</summary>
    public const string NeverChanges =
        "NetAdjust never changes the input: check the field book, apply an edit by hand, then adjust again.";

    /// <summary>The word of a kind, as the command line takes it and the JSON writes it (e.g.
    /// <c>target_height</c>).</summary>
    internal static string Name(BlunderKind kind) => OptionGrammars.BlunderKinds.Format(kind);

    /// <summary>
    /// The edit as a line the surveyor applies by hand: <c>site.yaml:41  value  123.4567 -> 123.4657</c> (where the
    /// observation was read, the key, the booked text and the suggested one).
    /// </summary>
    internal static string EditLine(SuggestedEdit edit, Observation o, int index) =>
        $"{edit.Source ?? o.Source ?? $"observation #{index + 1}"}  {edit.Item}  {edit.Booked ?? "(not set)"} -> " +
        edit.Suggested;

    /// <summary>The edit to print for a suspect: the first hypothesis's, when it explains the suspect.</summary>
    internal static SuggestedEdit? EditOf(SuspectDiagnosis s) =>
        s.Explained && s.Ranked.Count > 0 ? s.Ranked[0].Edit : null;

    /// <summary>The suspect listed before <paramref name="s"/> whose edit is the same (one blunder found through two
    /// of its observations, e.g. a target height through a zenith angle and a slope distance), or null.</summary>
    private static int? SameEdit(DiagnosisResult d, SuspectDiagnosis s)
    {
        var edit = EditOf(s);
        foreach (var before in d.Suspects.TakeWhile(x => !ReferenceEquals(x, s)))
            if (EditOf(before) is SuggestedEdit e && e == edit) return before.Observation;
        return null;
    }

    /// <summary>The explanation above the suspects (text report lines; the HTML report joins them).</summary>
    private static string Basis(DiagnosisResult d, ReportContext c, double critical) =>
        (HuntRounds(c)
            ? "Suspects: each observation the blunder hunt set aside, in the round it was set aside (the " +
              "observations set aside before it left out), where it fails the w-test (alpha " + A(d) +
              $", critical |w| {F(critical)}). Each hypothesis "
            : "Suspects: the observations that fail the w-test (alpha " + A(d) + $", critical |w| {F(critical)}) " +
              $"in the adjustment, or the {d.Options.WorstWhenGlobalFails} largest |w| when only the global test " +
              "fails. Each hypothesis ") +
        "is a model of how a field blunder biases the suspect (or a group of observations with it); its statistic " +
        "is w for one observation (q = 1) or the generalised likelihood ratio statistic T for q observations, " +
        "against its critical value. Size = the estimated blunder and sd its standard deviation; After = the " +
        "largest |w| in the network once it is corrected; Fits = After below the critical |w| and the global " +
        "test passed. Kinds tried: " + string.Join(", ", Enum.GetValues<BlunderKind>()
            .Where(d.Options.Enabled.Contains).Select(Name)) + ".";

    /// <summary>True when the suspects are the observations a blunder hunt set aside, each diagnosed in its round.
    /// </summary>
    private static bool HuntRounds(ReportContext c) => c.Hunt is { SetAside.Count: > 0 };

    private static string A(DiagnosisResult d) => d.Options.Alpha.ToString("0.####", Inv);

    /// <summary>The suspect's headline, e.g. <c>#26 distance H3→H4 (site.yaml:59): w = -7.23</c>.</summary>
    private static string Headline(SuspectDiagnosis s, Observation o) =>
        $"#{s.Observation + 1} {o.Describe()}: w = {F(s.W)}";

    /// <summary>The verdict on a suspect in words.
    /// An explained suspect whose unexplained bias fits as well says so: the data then favour the named cause only
    /// because its amount is a usual one, which the field book must confirm.</summary>
    private static string Verdict(SuspectDiagnosis s) => s.Explained
        ? $"explained as {Words(s.Ranked[0].Kind)}" + (s.Ranked.Any(h => h.Kind == BlunderKind.UnexplainedBias
            && h.FitsAfter) ? " (an unexplained bias fits as well: confirm the cause in the field book before "
            + "applying the edit)" : "")
        : "not explained by a named kind: treat it as an unexplained bias (check the field book, or re-measure)";

    private static string Words(BlunderKind kind) => Name(kind).Replace('_', ' ');

    /// <summary>The indistinguishable pairs in words, or null when there are none.</summary>
    private static string? Pairs(SuspectDiagnosis s) => s.Indistinguishable.Count == 0 ? null
        : "Cannot be told apart with this data (nearly parallel): " + string.Join("; ",
            s.Indistinguishable.Select(p => $"{Name(p.First)} and {Name(p.Second)}")) + ".";

    /// <summary>The size and its sd in the report's units, and the unit's symbol.</summary>
    private static (string Size, string Sd, string Unit) Size(BlunderHypothesis h, ReportUnits units)
    {
        if (!h.SizeIsAngle)
            return (units.SmallLength(h.Size), units.SmallLength(h.SizeSd), h.Size is null ? "" : units.LengthSymbol);
        string A(double? v) => v is double x && double.IsFinite(x) ? units.SmallAngle(x) : "-";
        return (A(h.Size), A(h.SizeSd), h.Size is null ? "" : units.SmallAngleSymbol);
    }

    /// <summary>Appends the diagnosis to the text report (at most 100 columns); nothing when none was run.</summary>
    public static void AppendText(StringBuilder sb, ResultReport report)
    {
        if (report.Context.Diagnosis is not DiagnosisResult d) return;
        var r = report.Result;
        var units = new ReportUnits(report.Context.Units).Booked(r.Network);
        void Line(string s = "") => sb.Append(s.TrimEnd()).Append('\n');
        Line("BLUNDER DIAGNOSIS (what may have gone wrong in the field; hypotheses for each suspect, best first)");
        TextReportSections.Wrapped(sb, "  ", Basis(d, report.Context, report.WCritical));
        if (d.Suspects.Count == 0)
            Line("  No suspects: no observation fails the w-test and the global test passes.");
        foreach (var s in d.Suspects)
        {
            var o = r.Network.Observations[s.Observation];
            Line();
            TextReportSections.Wrapped(sb, "  ", Headline(s, o));
            TextReportSections.Wrapped(sb, "    ", Verdict(s));
            Line($"  {"#",2} {"Hypothesis",-20} {"q",2} {"Statistic",9} {"Critical",8} {"Size",10} {"sd",8} " +
                 $"{"Unit",-6} {"Candidate",-13} {"After",6} Fits");
            int rank = 0;
            foreach (var h in s.Ranked)
            {
                var (size, sd, unit) = Size(h, units);
                Line($"  {++rank,2} {TextReportWriter.Clip(Name(h.Kind), 20),-20} {h.Dimension,2} " +
                     $"{F(h.Statistic),9} {F(h.CriticalValue),8} {size,10} {sd,8} {unit,-6} " +
                     $"{TextReportWriter.Clip(h.Candidate ?? "-", 13),-13} {After(h.MaxAbsWAfter),6} " +
                     (h.FitsAfter ? "yes" : "no"));
                TextReportSections.Wrapped(sb, "     ", h.Description + Group(h));
            }
            if (Pairs(s) is string pairs) TextReportSections.Wrapped(sb, "    ", pairs);
            if (EditOf(s) is SuggestedEdit e)
            {
                if (SameEdit(d, s) is int earlier)
                    Line($"    Suggested edit: the same as for #{earlier + 1}.");
                else
                {
                    Line("    Suggested edit of the project file (after checking the field book):");
                    EditText(sb, e, o, s.Observation);
                }
            }
        }
        Line();
        TextReportSections.Wrapped(sb, "  ", NeverChanges);
        Line();
    }

    /// <summary>The edit line, as it is (its double spaces kept); a line too long for the report is split after
    /// the file and line.</summary>
    private static void EditText(StringBuilder sb, SuggestedEdit e, Observation o, int index)
    {
        string line = "      " + EditLine(e, o, index);
        if (line.Length <= TextReportSections.MaxWidth) { sb.Append(line).Append('\n'); return; }
        string where = e.Source ?? o.Source ?? $"observation #{index + 1}";
        sb.Append("      ").Append(where).Append('\n')
          .Append("        ").Append(line[(6 + where.Length)..].TrimStart()).Append('\n');
    }

    /// <summary>The observations of a group hypothesis, e.g. <c> (observations #3, #4, #9)</c>; empty for one.
    /// </summary>
    private static string Group(BlunderHypothesis h) => h.Observations.Count <= 1 ? ""
        : " (observations " + string.Join(", ", h.Observations.Select(i => "#" + (i + 1))) + ")";

    /// <summary>Appends the diagnosis section to the HTML report; nothing when none was run.</summary>
    public static void AppendHtml(StringBuilder sb, ResultReport report)
    {
        if (report.Context.Diagnosis is not DiagnosisResult d) return;
        var r = report.Result;
        var units = new ReportUnits(report.Context.Units).Booked(r.Network);
        static string E(string s) => WebUtility.HtmlEncode(s);
        sb.Append("<section id=\"diagnosis\" class=\"table-section\">\n<h2>Blunder diagnosis</h2>\n<p>")
          .Append(E(Basis(d, report.Context, report.WCritical))).Append("</p>\n");
        if (d.Suspects.Count == 0)
            sb.Append("<p>No suspects: no observation fails the w-test and the global test passes.</p>\n");
        foreach (var s in d.Suspects)
        {
            var o = r.Network.Observations[s.Observation];
            sb.Append("<h3>").Append(E(Headline(s, o))).Append("</h3>\n<p class=\"verdict ")
              .Append(s.Explained ? "pass" : "fail").Append("\"><strong>").Append(s.Explained ? "✓ " : "✗ ")
              .Append(E(Verdict(s)))
              .Append("</strong></p>\n<table class=\"model\">\n<thead><tr><th class=\"num\">Rank</th>")
              .Append("<th>Hypothesis</th><th>Description</th><th class=\"num\">q</th>")
              .Append("<th class=\"num\">Statistic</th><th class=\"num\">Critical</th><th class=\"num\">Size</th>")
              .Append("<th class=\"num\">sd</th><th>Unit</th><th>Candidate</th>")
              .Append("<th class=\"num\">Largest |w| after</th><th>Fits</th></tr></thead>\n<tbody>\n");
            int rank = 0;
            foreach (var h in s.Ranked)
            {
                var (size, sd, unit) = Size(h, units);
                sb.Append("<tr><td class=\"num\">").Append(++rank).Append("</td><td>").Append(E(Name(h.Kind)))
                  .Append("</td><td>").Append(E(h.Description + Group(h))).Append("</td><td class=\"num\">")
                  .Append(h.Dimension.ToString(Inv)).Append("</td><td class=\"num\">").Append(F(h.Statistic))
                  .Append("</td><td class=\"num\">").Append(F(h.CriticalValue)).Append("</td><td class=\"num\">")
                  .Append(E(size)).Append("</td><td class=\"num\">").Append(E(sd)).Append("</td><td>")
                  .Append(E(unit)).Append("</td><td>").Append(E(h.Candidate ?? "-")).Append("</td><td class=\"num\">")
                  .Append(F(h.MaxAbsWAfter)).Append("</td><td>").Append(h.FitsAfter ? "yes" : "no")
                  .Append("</td></tr>\n");
            }
            sb.Append("</tbody>\n</table>\n");
            if (Pairs(s) is string pairs) sb.Append("<p class=\"note\">").Append(E(pairs)).Append("</p>\n");
            if (EditOf(s) is SuggestedEdit e)
            {
                if (SameEdit(d, s) is int earlier)
                    sb.Append("<p>Suggested edit: the same as for #").Append(earlier + 1).Append(".</p>\n");
                else
                    sb.Append("<p>Suggested edit of the project file (after checking the field book):</p>\n<pre>")
                      .Append(E(EditLine(e, o, s.Observation))).Append("</pre>\n");
            }
        }
        sb.Append("<p class=\"note\">").Append(E(NeverChanges)).Append("</p>\n</section>\n");
    }

    /// <summary>The JSON result's <c>diagnosis</c>, or null (key left out) when none was run.</summary>
    public static ResultJson.DiagnosisSection? Json(ResultReport report)
    {
        if (report.Context.Diagnosis is not DiagnosisResult d) return null;
        var r = report.Result;
        return new ResultJson.DiagnosisSection(d.Options.Alpha, report.WCritical,
            HuntRounds(report.Context) ? "hunt_rounds" : "adjustment",
            Enum.GetValues<BlunderKind>().Where(d.Options.Enabled.Contains).Select(Name),
            d.Suspects.Select(s =>
            {
                var o = r.Network.Observations[s.Observation];
                return new ResultJson.Suspect(
                    new ResultJson.SuspectObservation(s.Observation, ObservationLabels.Key(o.Kind),
                        ObservationLabels.Station(o), o.From, o.To, o.Source, o.BookedText),
                    JsonResultWriter.Finite(s.W), s.Explained,
                    s.Ranked.Select(h => Hypothesis(h, o, s.Observation)),
                    s.Indistinguishable.Select(p => new[] { Name(p.First), Name(p.Second) }),
                    EditOf(s) is SuggestedEdit e ? EditLine(e, o, s.Observation) : null);
            }), NeverChanges);
    }

    private static ResultJson.Hypothesis Hypothesis(BlunderHypothesis h, Observation o, int index)
    {
        double factor = h.SizeIsAngle ? Angle.ArcsecondsPerRadian : 1.0;
        return new ResultJson.Hypothesis(Name(h.Kind), h.Description, h.Observations, h.Dimension,
            JsonResultWriter.Finite(h.Statistic), JsonResultWriter.Finite(h.CriticalValue),
            JsonResultWriter.Finite(h.Size * factor), JsonResultWriter.Finite(h.SizeSd * factor),
            h.SizeIsAngle ? "arcsec" : "m", h.Candidate,
            JsonResultWriter.Finite(h.MaxAbsWAfter), h.FitsAfter,
            h.Edit is SuggestedEdit e ? new ResultJson.Edit(e.Source, e.Item, e.Booked, e.Suggested,
                EditLine(e, o, index)) : null);
    }

    /// <summary>The largest |w| after a correction for the text report's narrow column: above 999.99 as
    /// <c>&gt;999</c> (the JSON has the value).</summary>
    private static string After(double v) => v > 999.99 ? ">999" : F(v);

    private static string F(double v) => double.IsFinite(v) ? v.ToString("F2", Inv) : "-";
}
