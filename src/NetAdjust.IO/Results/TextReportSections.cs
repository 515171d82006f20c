using System.Text;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.IO.Results;

/// <summary>
/// Sections of the text report kept apart from <see cref="TextReportWriter"/>: the datum line and the largest
/// standardised residuals in the summary. Every line stays within 100 columns.
/// </summary>
internal static class TextReportSections
{
    /// <summary>The report's maximum line width in characters.</summary>
    public const int MaxWidth = 100;

    /// <summary>The datum: which points are held or weighted, and in which components; wrapped to the width.</summary>
    public static void Datum(StringBuilder sb, AdjustmentResult r, ReportContext c)
    {
        Wrapped(sb, "Datum     : ", DatumText(r));
        Wrapped(sb, "Grid      : ",
            (GridReport.HeaderLine(c) ??
            (c.Crs is null ? "local plane coordinates (no coordinate reference system declared)" : c.Crs))
            + PlaneHeightReport.Suffix(c));
    }

    /// <summary>"held A (en), B (h); weighted C (en)" for the points that define the datum.</summary>
    public static string DatumText(AdjustmentResult r)
    {
        var held = r.Points.Where(p => p.Input.Fixed != Fixity.None)
            .Select(p => $"{p.Id} ({PointRow.Components(p.Input.Fixed)})").ToList();
        var weighted = r.Points.Where(p => PointRow.Weights(p.Input).Length > 0)
            .Select(p => $"{p.Id} ({PointRow.Weights(p.Input)})").ToList();
        // Minimal or inner constraints set the control aside: say which datum was used instead.
        if (r.Options.Datum.Mode != Adjustment.Datum.DatumMode.Control) return r.Options.Datum.Describe();
        return "held " + (held.Count == 0 ? "none" : string.Join(", ", held)) + "; weighted " +
            (weighted.Count == 0 ? "none" : string.Join(", ", weighted));
    }

    /// <summary>The survey's particulars, one "Label     : text" line each (wrapped), when the project gives them.
    /// </summary>
    public static void Particulars(StringBuilder sb, ReportContext c)
    {
        if (c.Particulars is null) return;
        foreach (var (label, text) in c.Particulars.Lines()) Wrapped(sb, $"{label,-10}: ", text);
    }

    /// <summary>The observations with the largest |w| (when the result has standardised residuals).</summary>
    public static void WorstResiduals(StringBuilder sb, ResultReport report, int count)
    {
        var r = report.Result;
        var worst = ReportFigures.Worst(r, report.W, count);
        if (worst.Count == 0)
        {
            sb.Append("  Largest standardised residuals: none (no observation can be tested)\n");
            return;
        }
        sb.Append("  Largest standardised residuals |w| (w-test critical value ")
            .Append(ReportUnits.F(report.WCritical, 2)).Append("):\n");
        foreach (var (o, wi) in worst)
        {
            string line =
                $"    #{o.Index + 1,-4} w = {ReportUnits.F(wi, 2),7}  " +
                $"{(Math.Abs(wi) > report.WCritical ? "FAILS" : "passes")}  {o.Input.Describe()}";
            sb.Append(TextReportWriter.Clip(line, MaxWidth)).Append('\n');
        }
    }

    /// <summary>Writes label + text, wrapping at spaces so no line passes <see cref="MaxWidth"/>; continuation lines
    /// are indented.</summary>
    internal static void Wrapped(StringBuilder sb, string label, string text)
    {
        string indent = new(' ', label.Length);
        var line = new StringBuilder(label);
        bool empty = true;
        foreach (string word in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (!empty && line.Length + 1 + word.Length > MaxWidth)
            {
                sb.Append(line).Append('\n');
                line.Clear().Append(indent);
                empty = true;
            }
            if (!empty) line.Append(' ');
            line.Append(word);
            empty = false;
        }
        sb.Append(TextReportWriter.Clip(line.ToString(), MaxWidth)).Append('\n');
    }
}
