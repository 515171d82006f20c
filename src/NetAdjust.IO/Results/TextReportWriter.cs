using System.Globalization;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the plain-text adjustment report in the project's units, at most 100 columns wide.
/// Deterministic and culture-invariant: the same result and context give the same text.
/// </summary>
public static class TextReportWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The caution printed at the end of every report.</summary>
    public const string Caution =
        "CAUTION: these results depend on the stochastic model (the standard deviations given or derived for\n" +
        "the observations) and on the data. A passed test does not prove the absence of errors. Whether the\n" +
        "work complies with a survey standard or contract is for the licensed surveyor in charge to judge\n" +
        "under local regulations, before any result is used for stake-out, boundaries or construction.";

    /// <summary>Renders the report.</summary>
    /// <param name="r">The result.</param>
    /// <param name="c">Run details and units.</param>
    public static string Write(AdjustmentResult r, ReportContext c) => Write(ResultReport.Build(r, c));

    /// <summary>Renders the report of a report model.</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return TextChunks.ToText(w => Write(w, report));
    }

    /// <summary>Writes the report of a report model to a text writer as it is rendered, table row by table row (the
    /// same text as <see cref="Write(ResultReport)"/>).</summary>
    /// <param name="output">The writer; left open, and not flushed.</param>
    /// <param name="report">The report model.</param>
    public static void Write(TextWriter output, ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(report);
        var r = report.Result;
        var c = report.Context;
        var u = c.Units;
        var units = new ReportUnits(u).Booked(r.Network);
        string lu = u.Length.Symbol, au = u.AngleSd.Symbol();

        var sb = new StringBuilder();
        void Line(string s = "") => sb.Append(s).Append('\n');

        Line("NetAdjust least-squares adjustment report");
        Line(new string('=', 42));
        Line($"Project   : {r.Network.Name}");
        Line($"Input     : {c.InputName}");
        Line($"Run date  : {c.RunDate.ToString("yyyy-MM-dd", Inv)}");
        Line($"Generator : {Generator.Name}");
        TextReportSections.Particulars(sb, c);
        Line($"Units     : lengths {u.Length.Name} ({lu}), angles {units.AngleName}, angular sd and residuals {au}");
        Line($"Solver    : {r.SolverName}");
        TextReportSections.Datum(sb, r, c);
        ReportWarnings.AppendText(sb, c);
        Line();

        var s = r.Statistics;
        var g = s.GlobalTest;
        Line("SUMMARY");
        Line($"  Observations (n)              {s.Observations,8}");
        Line($"  Unknowns (u)                  {s.Unknowns,8}");
        Line($"  Degrees of freedom (r)        {s.DegreesOfFreedom,8}");
        Line($"  vTPv                          {F(s.Vtpv, 4),12}");
        Line($"  A-priori variance factor      {F(s.AprioriVarianceFactor, 4),12}");
        Line($"  A-posteriori variance factor  {(s.VarianceFactor is double vf ? F(vf, 4) : "n/a"),12}");
        Line($"  Std. deviation of unit weight {(s.Sigma0 is double s0 ? F(s0, 4) : "n/a"),12}");
        Line($"  Iterations                    {s.Iterations,8}");
        if (g.Passed is bool passed)
        {
            Line($"  Global test (chi-square, two-tailed, alpha {F(g.Alpha, 3)}): {(passed ? "PASSED" : "FAILED")}");
            Line(
                $"    vTPv / a-priori variance factor = {F(g.Statistic, 3)}; accepted from {F(g.Lower!.Value, 3)} to " +
                $"{F(g.Upper!.Value, 3)}");
        }
        else
            Line("  Global test: not possible (no redundancy)");
        TextReportSections.WorstResiduals(sb, report, 5);
        Line();

        Line($"ADJUSTED COORDINATES ({lu}; standard deviations at {report.Basis.Words})");
        Line($"  {"Point",-12} {"Easting",14} {"Northing",14} {"Height",11} {"sd E",8} {"sd N",8} {"sd H",8}  Held");
        foreach (var row in report.Points.Rows)
        {
            string E(double? v, int w) => units.Length(v).PadLeft(w);
            var p = row.Source;
            string held = row.Held, weighted = row.Weighted;
            string role = held + (weighted.Length > 0 ? (held.Length > 0 ? " " : "") + $"w:{weighted}" : "");
            int start = sb.Length;
            sb.Append($"  {Clip(p.Id, 12),-12} {E(p.E, 14)} {E(p.N, 14)} {E(p.H, 11)} ")
                .Append($"{E(row.SdE, 8)} {E(row.SdN, 8)} {E(row.SdH, 8)}  {role}");
            ReportSection.TrimEnd(sb, start);
            sb.Append('\n');
            TextChunks.Spill(sb, output);
        }
        Line();

        Line(
            $"OBSERVATIONS (residual v = adjusted - observed; lengths {lu}, angles {units.AngleName}, angular sd " +
            $"{au})");
        Line(
            $"  {"#",4} {"Kind",-9} {"At",-8} {"From",-8} {"To",-8} {"Observed",14} {"Adjusted",14} {"Residual",9} " +
            $"{"sd",7}");
        foreach (var row in report.Observations.Rows)
        {
            var i = row.Input;
            var k = i.Kind;
            sb.Append($"  {row.Number,4} {ObservationLabels.Short(k),-9} {Clip(row.AtShown, 8),-8} ")
                .Append($"{Clip(row.FromShown, 8),-8} {Clip(i.To, 8),-8} {units.ObservationValue(k, i.Value),14} ")
                .Append($"{units.ObservationValue(k, row.Source.Adjusted),14} ")
                .Append($"{units.ObservationSmall(k, row.Source.Residual),9} ")
                .Append($"{units.ObservationSmall(k, i.StandardDeviation),7}").Append('\n');
            TextChunks.Spill(sb, output);
        }
        Line();

        BudgetOutput.AppendSummary(sb, r, c, output);

        if (r.Orientations.Count > 0)
        {
            Line($"ORIENTATION UNKNOWNS (one per direction set; azimuth of the circle zero, sd in {au})");
            Line($"  {"Set",-20} {"Station",-10} {"Orientation",14} {"sd",8}");
            foreach (var o in r.Orientations)
            {
                Line($"  {Clip(o.SetId, 20),-20} {Clip(o.Station, 10),-10} {units.AngleValue(o.Orientation),14} " +
                     $"{units.SmallAngle(o.Sd),8}");
                TextChunks.Spill(sb, output);
            }
            Line();
        }

        RefractionOutput.AppendText(sb, r);
        BaselineSection.AppendText(sb, r, c);
        StatisticsReport.Append(sb, report.Sections, output);
        DiagnosisOutput.AppendText(sb, report);
        Line(Caution);
        TextChunks.Drain(sb, output);
    }

    private static string F(double v, int decimals) => NumberText.Fixed(v, decimals);

    /// <summary>Cuts text to a column width, marking the cut with a tilde.</summary>
    internal static string Clip(string s, int w) => s.Length <= w ? s : s[..(w - 1)] + "~";
}
