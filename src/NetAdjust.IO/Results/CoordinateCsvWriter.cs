using System.Globalization;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the adjusted coordinates as CSV (RFC 4180: comma-separated, a header row, fields quoted only when needed,
/// lines ending in LF) for spreadsheets, CAD and GIS. Lengths in the project's length unit, named in each header
/// (e.g. <c>easting_m</c>); the ellipse azimuth in decimal degrees. Empty fields where a value does not exist
/// (e.g. no easting for a levelling benchmark). Columns and rules: docs/output-format.md.
/// </summary>
public static class CoordinateCsvWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Decimals written for coordinates, standard deviations and ellipse axes (in the length unit).</summary>
    public const int LengthDecimals = 6;

    /// <summary>Decimals written for the ellipse azimuth (degrees).</summary>
    public const int AzimuthDecimals = 4;

    /// <summary>Renders the CSV text.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details; its length unit is used for every length.</param>
    public static string Write(AdjustmentResult result, ReportContext context)
    {
        var unit = context.Units.Length;
        string u = unit.Symbol;
        var sb = new StringBuilder();
        sb.Append("id,easting_").Append(u).Append(",northing_").Append(u).Append(",height_").Append(u)
          .Append(",sd_e_").Append(u).Append(",sd_n_").Append(u).Append(",sd_h_").Append(u)
          .Append(",ellipse_a_").Append(u).Append(",ellipse_b_").Append(u).Append(",ellipse_azimuth_deg,held,weighted\n");
        foreach (var p in result.Points)
        {
            string L(double? metres) => metres is double m && double.IsFinite(m) ? (m / unit.MetresPerUnit).ToString("F" + LengthDecimals, Inv) : "";
            var el = ReportFigures.IsPlanFixed(p) ? null : ReportFigures.Ellipse(result, p);
            sb.Append(Field(p.Id)).Append(',')
              .Append(L(p.E)).Append(',').Append(L(p.N)).Append(',').Append(L(p.H)).Append(',')
              .Append(L(p.SdE)).Append(',').Append(L(p.SdN)).Append(',').Append(L(p.SdH)).Append(',')
              .Append(L(el?.A)).Append(',').Append(L(el?.B)).Append(',')
              .Append(el is ErrorEllipse e ? e.AzimuthDegreesRounded(AzimuthDecimals).ToString("F" + AzimuthDecimals, Inv) : "").Append(',')
              .Append(JsonResultWriter.FixityText(p.Input.Fixed)).Append(',')
              .Append((p.Input.SdE.HasValue ? "e" : "") + (p.Input.SdN.HasValue ? "n" : "") + (p.Input.SdH.HasValue ? "h" : ""))
              .Append('\n');
        }
        return sb.ToString();
    }

    /// <summary>Quotes a field when it holds a comma, a quote or a line break (RFC 4180 §2).</summary>
    internal static string Field(string s) =>
        s.IndexOfAny([',', '"', '\n', '\r']) < 0 ? s : "\"" + s.Replace("\"", "\"\"") + "\"";
}
