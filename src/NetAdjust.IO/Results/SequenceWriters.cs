using System.Globalization;
using System.Text;
using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the minimally-constrained-then-constrained sequence as JSON (format <c>netadjust-sequence/1</c>):
/// <c>solutions</c> holds the two results in the single-result format (minimally-constrained first), then
/// <c>constraint_test</c>, <c>control_discrepancies</c> and <c>coordinate_shifts</c>. Lengths in metres.
/// </summary>
public static class SequenceJsonWriter
{
    /// <summary>The format identifier written under <c>format</c>.</summary>
    public const string Format = "netadjust-sequence/1";

    /// <summary>Renders the sequence as UTF-8 JSON text.</summary>
    /// <param name="s">The sequence result.</param>
    /// <param name="context">Run details.</param>
    public static string Write(SequenceResult s, ReportContext context) =>
        JsonResultWriter.ToText(stream => Write(stream, s, context));

    /// <summary>Writes the sequence as UTF-8 JSON to a stream (ending with a line feed).</summary>
    /// <param name="stream">The stream; left open.</param>
    /// <param name="s">The sequence result.</param>
    /// <param name="context">Run details.</param>
    public static void Write(Stream stream, SequenceResult s, ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(s);
        var t = s.Test;
        var document = new ResultJson.Sequence(Format, Generator.Name, s.MinimalDatum,
            new[] { s.Minimal, s.Constrained }.Select(r => JsonResultWriter.Document(ResultReport.Build(r, context))),
            new ResultJson.ConstraintTest(t.Alpha, t.AddedConstraints, t.VtpvIncrease,
                new(t.ChiSquare, JsonResultWriter.Finite(t.ChiSquareCritical), t.PassedChiSquare),
                new(JsonResultWriter.Finite(t.F), JsonResultWriter.Finite(t.FCritical), t.PassedF),
                t.SigmaEstimated ? "f" : "chi_square", t.Passed),
            s.Discrepancies.Select(d => new ResultJson.Discrepancy(d.Id, F(d.DE), F(d.DN), F(d.DH), F(d.SdE), F(d.SdN),
                F(d.SdH), F(d.WE), F(d.WN), F(d.WH), F(d.MaxAbsW))),
            s.Shifts.Select(c => new ResultJson.Shift(c.Id, F(c.DE), F(c.DN), F(c.DH), F(c.Horizontal))));
        JsonResultWriter.Serialise(stream, document);
    }

    private static double? F(double? v) => JsonResultWriter.Finite(v);
}

/// <summary>
/// Writes the text report of the sequence: the comparison first (variance factors and global tests of both
/// solutions, the test of the added constraints, control discrepancies, coordinate shifts), then the two full
/// reports. Deterministic and culture-invariant.
/// </summary>
public static class SequenceReportWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Renders the report.</summary>
    /// <param name="s">The sequence result.</param>
    /// <param name="c">Run details and units.</param>
    public static string Write(SequenceResult s, ReportContext c)
    {
        var sb = new StringBuilder();
        void Line(string text = "") => sb.Append(text).Append('\n');
        var units = new ReportUnits(c.Units);
        string lu = units.LengthSymbol;
        string L(double? v, int w) => units.Length(v).PadLeft(w);
        string W(double? v, int w) => v is double x ? x.ToString("F2", Inv).PadLeft(w) : new string(' ', w - 1) + "-";
        string F(double v, int d) => v.ToString("F" + d, Inv);

        Line("NetAdjust datum sequence: minimally constrained, then constrained");
        Line(new string('=', 66));
        Line($"Project   : {s.Constrained.Network.Name}");
        Line($"Input     : {c.InputName}");
        Line($"Run date  : {c.RunDate.ToString("yyyy-MM-dd", Inv)}");
        Line($"Generator : {Generator.Name}");
        Line($"Step 1    : {s.MinimalDatum}");
        Line($"Step 2    : {s.Constrained.Options.Datum.Describe()}");
        ReportWarnings.AppendText(sb, c);
        Line();
        Line("SOLUTIONS");
        Line($"  {"",-24} {"r",6} {"vTPv",12} {"variance factor",16}  global test");
        foreach (var (name, r) in new[] { ("1 minimally constrained", s.Minimal), ("2 constrained", s.Constrained) })
        {
            var st = r.Statistics;
            var g = st.GlobalTest;
            string test = g.Passed is bool p ? $"{F(g.Statistic, 3)} in [{F(g.Lower!.Value, 3)}, {F(g.Upper!.Value, 3)}] {(p ? "PASSED" : "FAILED")}" : "not possible (r = 0)";
            Line($"  {name,-24} {st.DegreesOfFreedom,6} {F(st.Vtpv, 4),12} {(st.VarianceFactor is double vf ? F(vf, 4) : "n/a"),16}  {test}");
        }
        Line();

        var t = s.Test;
        Line($"TEST OF THE ADDED CONSTRAINTS (does the control fit the observations? alpha {F(t.Alpha, 3)}, one-tailed)");
        Line($"  Added constraints                 {t.AddedConstraints,8}");
        Line($"  Increase of vTPv                  {F(t.VtpvIncrease, 4),12}");
        if (t.PassedChiSquare is bool ok)
        {
            string chi = t.SigmaEstimated ? "" : "  (decides)", fd = t.SigmaEstimated ? "  (decides)" : "";
            Line($"  Chi-square (sigma0 known)         {F(t.ChiSquare, 3)}, critical {F(t.ChiSquareCritical!.Value, 3)}: {(ok ? "PASSED" : "FAILED")}{chi}");
            if (t.PassedF is bool okF)
                Line($"  F (sigma0 from step 1)            {F(t.F!.Value, 3)}, critical {F(t.FCritical!.Value, 3)}: {(okF ? "PASSED" : "FAILED")}{fd}");
        }
        else Line("  Not possible: the control adds no constraint beyond the minimum.");
        Line();

        Line($"CONTROL DISCREPANCIES (given - minimally constrained, {lu}; w = discrepancy / its standard deviation)");
        Line($"  {"Point",-12} {"dE",9} {"dN",9} {"dH",9} {"sd dE",8} {"sd dN",8} {"sd dH",8} {"wE",7} {"wN",7} {"wH",7}");
        double worst = s.Discrepancies.Select(d => d.MaxAbsW ?? 0).DefaultIfEmpty(0).Max();
        foreach (var d in s.Discrepancies)
            Line(($"  {TextReportWriter.Clip(d.Id, 12),-12} {L(d.DE, 9)} {L(d.DN, 9)} {L(d.DH, 9)} {L(d.SdE, 8)} {L(d.SdN, 8)} {L(d.SdH, 8)} {W(d.WE, 7)} {W(d.WN, 7)} {W(d.WH, 7)}" +
                  (d.MaxAbsW is double m && m == worst && worst > 0 ? "  <- largest" : "")).TrimEnd());
        Line();

        Line($"COORDINATE SHIFTS (constrained - minimally constrained, {lu})");
        Line($"  {"Point",-12} {"dE",9} {"dN",9} {"horiz.",9} {"dH",9}");
        foreach (var sh in s.Shifts)
            Line($"  {TextReportWriter.Clip(sh.Id, 12),-12} {L(sh.DE, 9)} {L(sh.DN, 9)} {L(sh.Horizontal, 9)} {L(sh.DH, 9)}".TrimEnd());
        Line();

        Line("STEP 1: MINIMALLY CONSTRAINED SOLUTION");
        Line(new string('-', 38));
        sb.Append(TextReportWriter.Write(s.Minimal, c));
        Line();
        Line("STEP 2: CONSTRAINED SOLUTION");
        Line(new string('-', 28));
        sb.Append(TextReportWriter.Write(s.Constrained, c));
        return sb.ToString();
    }
}
