using System.Globalization;
using System.Text;
using NetAdjust.Adjustment;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the adjusted coordinates as CSV (RFC 4180: comma-separated, a header row, fields quoted only when needed,
/// lines ending in LF) for spreadsheets, CAD and GIS. Lengths in the project's length unit, named in each header
/// (e.g. <c>easting_m</c>); the ellipse azimuth in decimal degrees. Empty fields where a value does not exist
/// (e.g. no easting for a levelling benchmark). Standard deviations and ellipses are at one variance factor, named
/// on every row in the last column (<see cref="BasisColumn"/>). Columns and rules: docs/output-format.md.
/// </summary>
public static class CoordinateCsvWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Decimals written for coordinates, standard deviations and ellipse axes (in the length unit).</summary>
    public const int LengthDecimals = 6;

    /// <summary>Decimals written for the ellipse azimuth (degrees).</summary>
    public const int AzimuthDecimals = PointRow.AzimuthDecimals;

    /// <summary>The header of the last column: the variance factor of every standard deviation and ellipse.</summary>
    public const string BasisColumn = "variance_factor_basis";

    /// <summary>The header of the column, written in a datum sequence only, that names the solution.</summary>
    public const string SolutionColumn = "solution";

    /// <summary>Renders the CSV text.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details; its length unit is used for every length.</param>
    public static string Write(AdjustmentResult result, ReportContext context) =>
        Write(ResultReport.Build(result, context));

    /// <summary>Renders the CSV text of the report model's point table.</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return TextChunks.ToText(w => Write(w, report));
    }

    /// <summary>Writes the CSV text of the report model's point table to a text writer, row by row.</summary>
    /// <param name="output">The writer; left open, and not flushed.</param>
    /// <param name="report">The report model.</param>
    public static void Write(TextWriter output, ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(report);
        var unit = report.Context.Units.Length;
        var table = report.Points;
        string Header(ReportColumn<PointRow> c) => c.Key + c.Unit switch
        {
            ColumnUnit.Length => "_" + unit.Symbol,
            ColumnUnit.Degrees => "_deg",
            _ => "",
        };
        string Cell(ReportColumn<PointRow> c, PointRow row)
        {
            var cell = c.Cell(row);
            if (cell.Number is not double x) return cell.Text is string t ? Field(t) : "";
            return c.Unit == ColumnUnit.Length ? (x / unit.MetresPerUnit).ToString("F" + LengthDecimals, Inv)
                : x.ToString("F" + (c.Unit == ColumnUnit.Degrees ? AzimuthDecimals : LengthDecimals), Inv);
        }
        var sb = new StringBuilder();
        // in a datum sequence, a last column names the solution the file holds
        string? solution = report.Context.Solution;
        sb.AppendJoin(',', table.Columns.Select(Header)).Append(',').Append(BasisColumn)
          .Append(solution is null ? "" : "," + SolutionColumn).Append('\n');
        foreach (var row in table.Rows)
        {
            sb.AppendJoin(',', table.Columns.Select(c => Cell(c, row)))
              .Append(',').Append(report.Basis.Keyword).Append(solution is null ? "" : "," + solution).Append('\n');
            TextChunks.Spill(sb, output);
        }
        TextChunks.Drain(sb, output);
    }

    /// <summary>Quotes a field when it holds a comma, a quote or a line break (RFC 4180 §2).</summary>
    internal static string Field(string s) =>
        s.IndexOfAny([',', '"', '\n', '\r']) < 0 ? s : "\"" + s.Replace("\"", "\"\"") + "\"";
}
