using System.Globalization;
using System.Net;
using System.Text;
using NetAdjust.Adjustment;

namespace NetAdjust.IO.Results;

/// <summary>
/// The estimated refraction coefficients (one per group of zenith angles whose k is an unknown) in the text and HTML
/// reports and the JSON result; nothing is written when no k is estimated (docs/output-format.md).
/// </summary>
internal static class RefractionOutput
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static string K(double k) => k.ToString("F4", Inv);

    /// <summary>The text report's table.</summary>
    public static void AppendText(StringBuilder sb, AdjustmentResult r)
    {
        if (r.Refractions.Count == 0) return;
        sb.Append("REFRACTION COEFFICIENTS (estimated, one per group of zenith angles; k and sd dimensionless)\n");
        sb.Append($"  {"Group",-20} {"k",10} {"sd",8}\n");
        foreach (var k in r.Refractions)
            sb.Append($"  {TextReportWriter.Clip(k.Group, 20),-20} {K(k.Coefficient),10} {K(k.Sd),8}\n");
        sb.Append('\n');
    }

    /// <summary>The HTML report's section.</summary>
    public static void AppendHtml(StringBuilder sb, AdjustmentResult r)
    {
        if (r.Refractions.Count == 0) return;
        sb.Append("<section id=\"refraction\">\n<h2>Refraction coefficients</h2>\n<p>Estimated, one per group of ")
          .Append("zenith angles; k and its sd are dimensionless.</p>\n<table>\n<thead><tr><th>Group</th>")
          .Append("<th class=\"num\">k</th><th class=\"num\">sd</th></tr></thead>\n<tbody>\n");
        foreach (var k in r.Refractions)
            sb.Append("<tr><td>").Append(WebUtility.HtmlEncode(k.Group)).Append("</td><td class=\"num\">")
              .Append(K(k.Coefficient)).Append("</td><td class=\"num\">").Append(K(k.Sd)).Append("</td></tr>\n");
        sb.Append("</tbody>\n</table>\n</section>\n");
    }

    /// <summary>The JSON result's <c>refraction</c> list, or null (key left out) when no k is estimated.</summary>
    public static IReadOnlyList<ResultJson.Refraction>? Json(AdjustmentResult r) => r.Refractions.Count == 0 ? null
        : r.Refractions.Select(k => new ResultJson.Refraction(k.Group, k.Coefficient, k.Sd)).ToArray();
}
