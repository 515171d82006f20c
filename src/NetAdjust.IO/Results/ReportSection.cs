using System.Text;

namespace NetAdjust.IO.Results;

/// <summary>How a row of a <see cref="ReportSection"/> stands in its tests.</summary>
internal enum RowState
{
    /// <summary>Nothing to mark.</summary>
    Normal,

    /// <summary>Weak or doubtful (e.g. an observation with little control): marked, not failed.</summary>
    Warn,

    /// <summary>Fails its test, or was set aside for failing it.</summary>
    Fail,
}

/// <summary>One column of a <see cref="ReportSection"/>.</summary>
/// <param name="Header">The heading, without its unit (e.g. <c>Residual</c>).</param>
/// <param name="Unit">The unit of the cells in words or symbols (e.g. <c>mm</c>), or null for none.</param>
/// <param name="Kind">What the cells hold (numbers are right-aligned).</param>
/// <param name="Width">The text report's column width (0: as wide as the text, for a last column).</param>
/// <param name="Left">True when the text report left-aligns the column (text), false to right-align it.</param>
/// <param name="Gap">What the text report puts before the column (one space, or more).</param>
/// <param name="Clip">True when the text report cuts longer text to <paramref name="Width"/>.</param>
internal sealed record SectionColumn(string Header, string? Unit, ValueKind Kind, int Width, bool Left = false,
    string Gap = " ", bool Clip = false)
{
    /// <summary>The heading of the text report when it differs from <see cref="Header"/> (e.g. blank).</summary>
    public string? TextHeading { get; init; }

    /// <summary>The heading with its unit in brackets, as tables for people show it.</summary>
    public string HeaderWithUnit => Unit is null ? Header : $"{Header} ({Unit})";
}

/// <summary>One row of a <see cref="ReportSection"/>: its cells already in the project's units.</summary>
/// <param name="Cells">One text per column ("-" for a value that does not exist).</param>
/// <param name="State">Whether the row fails its test (marked by a symbol and a class, not by colour alone).</param>
/// <param name="After">Lines that follow the row in the text report (e.g. a wrapped note); empty for none.</param>
internal sealed record SectionRow(IReadOnlyList<string> Cells, RowState State = RowState.Normal,
    IReadOnlyList<string>? After = null);

/// <summary>
/// A table section of the report model (tests of the observations and of the control, ellipses, relative
/// precision, blunder hunt, robust estimation, variance components, the sequence): the title and explanation
/// lines, the columns with their units, the rows and the closing lines. The text report lays it out in fixed-width
/// columns, the HTML report as a table; both show the same cells.
/// </summary>
/// <param name="Id">The section's machine name (the HTML id).</param>
/// <param name="Title">The title line of the text report (upper case, with its units).</param>
/// <param name="Heading">The heading for people (HTML).</param>
/// <param name="Before">Explanation lines between the title and the table, as the text report indents them.</param>
/// <param name="Columns">The columns.</param>
/// <param name="Rows">The rows.</param>
/// <param name="After">Lines after the table (totals, notes, decisions), as the text report indents them.</param>
internal sealed record ReportSection(string Id, string Title, string Heading, IReadOnlyList<string> Before,
    IReadOnlyList<SectionColumn> Columns, IReadOnlyList<SectionRow> Rows, IReadOnlyList<string> After)
{
    /// <summary>False when the text report prints no header line (the rows label their own values).</summary>
    public bool TextHeader { get; init; } = true;

    /// <summary>A layout of one row for the text report other than the column layout, or null.</summary>
    public Func<IReadOnlyList<string>, string>? TextLayout { get; init; }

    /// <summary>A sentence the HTML report shows above the table (e.g. the decision of a test), or null.</summary>
    public string? HtmlSummary { get; init; }

    /// <summary>What the marks of failing rows mean, when not the general note of the HTML report.</summary>
    public string? MarkNote { get; init; }

    /// <summary>The symbol that marks a row in the given state where colour cannot be seen.</summary>
    public static string Symbol(RowState state) => state switch
    {
        RowState.Fail => "✗",
        RowState.Warn => "!",
        _ => "",
    };

    /// <summary>Appends the section to the text report: title, lines, header, rows, lines, one blank line; the rows
    /// are passed on to <paramref name="output"/> (when given) as they grow.</summary>
    public void AppendText(StringBuilder sb, TextWriter? output = null)
    {
        void Line(string s) => sb.Append(s.TrimEnd()).Append('\n');
        Line(Title);
        foreach (var line in Before) Line(line);
        if (TextHeader) Layout(sb, Columns.Select(c => c.TextHeading ?? c.Header).ToList(), clip: false);
        foreach (var row in Rows)
        {
            if (TextLayout is null) Layout(sb, row.Cells, clip: true);
            else Line(TextLayout(row.Cells));
            foreach (var line in row.After ?? []) Line(line);
            TextChunks.Spill(sb, output);
        }
        foreach (var line in After) Line(line);
        Line("");
    }

    /// <summary>Appends one line of cells in the columns' widths and alignments, without trailing white space.
    /// </summary>
    private void Layout(StringBuilder sb, IReadOnlyList<string> cells, bool clip)
    {
        int start = sb.Length;
        sb.Append("  ");
        for (int i = 0; i < Columns.Count; i++)
        {
            var c = Columns[i];
            string text = clip && c.Clip && c.Width > 0 ? TextReportWriter.Clip(cells[i], c.Width) : cells[i];
            if (i > 0) sb.Append(c.Gap);
            int pad = c.Width - text.Length;
            if (!c.Left && pad > 0) sb.Append(' ', pad);
            sb.Append(text);
            if (c.Left && pad > 0) sb.Append(' ', pad);
        }
        TrimEnd(sb, start);
        sb.Append('\n');
    }

    /// <summary>Removes the white space at the end of the builder, back to <paramref name="start"/> at most (as
    /// <see cref="string.TrimEnd()"/> on the line that starts there).</summary>
    internal static void TrimEnd(StringBuilder sb, int start)
    {
        int end = sb.Length;
        while (end > start && char.IsWhiteSpace(sb[end - 1])) end--;
        sb.Length = end;
    }
}

/// <summary>
/// The rows of a long table or section, made from their index each time they are read (by a writer), so that the
/// report model never holds a long table whole: neither as text nor as one row record per observation.
/// </summary>
/// <typeparam name="TRow">The row type.</typeparam>
/// <param name="count">The number of rows.</param>
/// <param name="row">Makes the row of an index.</param>
internal sealed class RowsOnDemand<TRow>(int count, Func<int, TRow> row) : IReadOnlyList<TRow>
{
    /// <inheritdoc />
    public int Count => count;

    /// <inheritdoc />
    public TRow this[int index] =>
        (uint)index < (uint)count ? row(index) : throw new ArgumentOutOfRangeException(nameof(index));

    /// <inheritdoc />
    public IEnumerator<TRow> GetEnumerator()
    {
        for (int i = 0; i < count; i++) yield return row(i);
    }

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();
}
