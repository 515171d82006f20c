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
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(c);
        return TextChunks.ToText(w => Write(w, s, c));
    }

    /// <summary>Writes the report to a text writer as it is rendered (the same text as <see
    /// cref="Write(SequenceResult, ReportContext)"/>).</summary>
    /// <param name="output">The writer; left open, and not flushed.</param>
    /// <param name="s">The sequence result.</param>
    /// <param name="c">Run details and units.</param>
    public static void Write(TextWriter output, SequenceResult s, ReportContext c)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(s);
        ArgumentNullException.ThrowIfNull(c);
        var sb = new StringBuilder();
        void Line(string text = "") => sb.Append(text).Append('\n');
        Line("NetAdjust datum sequence: minimally constrained, then constrained");
        Line(new string('=', 66));
        Line($"Project   : {s.Constrained.Network.Name}");
        Line($"Input     : {c.InputName}");
        Line($"Run date  : {c.RunDate.ToString("yyyy-MM-dd", Inv)}");
        Line($"Generator : {Generator.Name}");
        TextReportSections.Particulars(sb, c);
        Line($"Step 1    : {s.MinimalDatum}");
        Line($"Step 2    : {s.Constrained.Options.Datum.Describe()}");
        ReportWarnings.AppendText(sb, c);
        Line();
        foreach (var section in SequenceSections.Build(s, c)) section.AppendText(sb, output);

        Line("STEP 1: MINIMALLY CONSTRAINED SOLUTION");
        Line(new string('-', 38));
        TextChunks.Drain(sb, output);
        TextReportWriter.Write(output, ResultReport.Build(s.Minimal, c));
        Line();
        Line("STEP 2: CONSTRAINED SOLUTION");
        Line(new string('-', 28));
        TextChunks.Drain(sb, output);
        TextReportWriter.Write(output, ResultReport.Build(s.Constrained, c));
    }
}
