using System.Globalization;
using System.Net;
using System.Runtime.CompilerServices;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>
/// The GNSS baselines in the text and HTML reports and the JSON result (docs/output-format.md, "GNSS baselines"): per
/// baseline the vector, its residuals in ΔX, ΔY, ΔZ and in local north, east, up (mm), the vector test and its
/// verdict, the w-test and MDB per component and along north, east, up; the frame parameters. Nothing is written when
/// the network has no baselines.
/// </summary>
internal static class BaselineSection
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static string Mm(double? m, int width) =>
        (m is double v && double.IsFinite(v) ? (v * 1000).ToString("F1", Inv) : "-").PadLeft(width);

    private static string Num(double? x, string format, int width) =>
        (x is double v && double.IsFinite(v) ? v.ToString(format, Inv) : "-").PadLeft(width);

    private static string Verdict(BaselineTest t) => t.Passed switch
    {
        true => "ok",
        false => "FAIL",
        null => "-",
    };

    /// <summary>The short key of a frame parameter: rx, ry, rz or scale.</summary>
    internal static string FrameKey(Parameter p) => p switch
    {
        Parameter.FrameRotationX => "rx",
        Parameter.FrameRotationY => "ry",
        Parameter.FrameRotationZ => "rz",
        _ => "scale",
    };

    /// <summary>A frame parameter in report units: arcseconds for rotations, ppm for the scale.</summary>
    internal static double FrameValue(Parameter p, double v) =>
        p == Parameter.FrameScale ? v * 1e6 : v * Units.Angle.ArcsecondsPerRadian;

    // The tests of a result, made once for all its writers (the JSON and the reports are written side by side and
    // each needs them; the second waits for the first's instead of testing every baseline again).
    private static readonly ConditionalWeakTable<AdjustmentResult, Lazy<IReadOnlyList<BaselineTest>>> TestsOf = new();

    internal static IReadOnlyList<BaselineTest> Tests(AdjustmentResult r) =>
        TestsOf.GetValue(r, key => new Lazy<IReadOnlyList<BaselineTest>>(() =>
            key.Network.Observations.Any(o => o.Kind == ObservationKind.Baseline)
                ? BaselineAnalysis.Analyse(key, key.Analysis) : [])).Value;

    private static BaselineObservation First(AdjustmentResult r, BaselineTest t) =>
        (BaselineObservation)r.Network.Observations[t.Rows[0]];

    /// <summary>The text report's tables.</summary>
    public static void AppendText(StringBuilder sb, AdjustmentResult r, ReportContext c)
    {
        var tests = Tests(r);
        if (tests.Count == 0) return;
        void Line(string s = "") => sb.Append(s).Append('\n');
        Line("GNSS BASELINES (" + (c.GnssFrame is { } f ? $"frame {f}; " : "") +
            "v = adjusted - observed in mm; n e u at the mid point)");
        Line($"  {"From",-8} {"To",-8} {"Group",-6} {"Length m",10} {"vX",6} {"vY",6} {"vZ",6} {"vN",6} {"vE",6} " +
            $"{"vU",6} {"T",7} {"crit",6} {"Test",4}");
        foreach (var t in tests)
        {
            var b = First(r, t);
            var (x, y, z) = b.Vector;
            double length = Math.Sqrt((x * x) + (y * y) + (z * z));
            Line($"  {TextReportWriter.Clip(t.From, 8),-8} {TextReportWriter.Clip(t.To, 8),-8} " +
                $"{TextReportWriter.Clip(b.Group ?? "", 6),-6} {length.ToString("F3", Inv),10} " +
                $"{Mm(t.Residual.X, 6)} {Mm(t.Residual.Y, 6)} {Mm(t.Residual.Z, 6)} {Mm(t.LocalResidual.North, 6)} " +
                $"{Mm(t.LocalResidual.East, 6)} {Mm(t.LocalResidual.Up, 6)} {Num(t.Statistic, "F2", 7)} " +
                $"{Num(t.CriticalValue, "F2", 6)} {Verdict(t),4}");
        }
        Line("  T: the baseline's three components tested together against chi-square(3) at the w-test's level.");
        Line();
        Line("GNSS BASELINE COMPONENTS (w-test per component and along north, east, up; MDB in mm)");
        Line($"  {"From",-8} {"To",-8} {"wX",6} {"wY",6} {"wZ",6} {"wN",6} {"wE",6} {"wU",6} {"MDB N",7} " +
            $"{"MDB E",7} {"MDB U",7}");
        foreach (var t in tests)
        {
            double? W(BaselineComponent k) => t.Rows.Select(i => (Row: i, Obs: (BaselineObservation)r.Network
                .Observations[i])).Where(x => x.Obs.Component == k).Select(x => r.Analysis.Observations[x.Row].W)
                .FirstOrDefault();
            Line($"  {TextReportWriter.Clip(t.From, 8),-8} {TextReportWriter.Clip(t.To, 8),-8} " +
                $"{Num(W(BaselineComponent.X), "F2", 6)} {Num(W(BaselineComponent.Y), "F2", 6)} " +
                $"{Num(W(BaselineComponent.Z), "F2", 6)} {Num(t.LocalW?.North, "F2", 6)} " +
                $"{Num(t.LocalW?.East, "F2", 6)} {Num(t.LocalW?.Up, "F2", 6)} {Mm(t.LocalMdb?.North, 7)} " +
                $"{Mm(t.LocalMdb?.East, 7)} {Mm(t.LocalMdb?.Up, 7)}");
        }
        Line();
        if (r.FrameParameters.Count > 0)
        {
            Line("FRAME PARAMETERS (GNSS frame to local control; rotations in arcsec, scale difference in ppm)");
            Line($"  {"Frame",-12} {"Parameter",-9} {"Value",10} {"sd",8}");
            foreach (var p in r.FrameParameters)
                Line($"  {TextReportWriter.Clip(p.Frame, 12),-12} {FrameKey(p.Parameter),-9} " +
                    $"{Num(FrameValue(p.Parameter, p.Value), "F4", 10)} {Num(FrameValue(p.Parameter, p.Sd), "F4", 8)}");
            Line();
        }
    }

    /// <summary>The HTML report's section.</summary>
    public static void AppendHtml(StringBuilder sb, AdjustmentResult r, ReportContext c)
    {
        var tests = Tests(r);
        if (tests.Count == 0) return;
        static string E(string s) => WebUtility.HtmlEncode(s);
        static string Td(string s) => "<td class=\"num\">" + s.Trim() + "</td>";
        sb.Append("<section id=\"gnss\">\n<h2>GNSS baselines</h2>\n<p>")
          .Append(c.GnssFrame is { } f ? "Frame " + E(f) + ". " : "")
          .Append("Residuals v = adjusted − observed in mm, in ΔX, ΔY, ΔZ and in local north, east, up at the ")
          .Append("baseline's mid point; T tests the three components together against χ²(3) at the w-test's ")
          .Append("level.</p>\n<table>\n<thead><tr><th>From</th><th>To</th><th>Group</th>")
          .Append("<th class=\"num\">Length (m)</th><th class=\"num\">vX</th><th class=\"num\">vY</th>")
          .Append("<th class=\"num\">vZ</th><th class=\"num\">vN</th><th class=\"num\">vE</th>")
          .Append("<th class=\"num\">vU</th><th class=\"num\">T</th><th class=\"num\">Critical</th><th>Test</th>")
          .Append("<th class=\"num\">wN</th><th class=\"num\">wE</th><th class=\"num\">wU</th>")
          .Append("<th class=\"num\">MDB N</th><th class=\"num\">MDB E</th><th class=\"num\">MDB U</th>")
          .Append("</tr></thead>\n<tbody>\n");
        foreach (var t in tests)
        {
            var b = First(r, t);
            var (x, y, z) = b.Vector;
            sb.Append(t.Passed == false ? "<tr class=\"rejected\">" : "<tr>")
              .Append("<td class=\"id\">").Append(E(t.From)).Append("</td><td class=\"id\">").Append(E(t.To))
              .Append("</td><td>").Append(E(b.Group ?? "")).Append("</td>")
              .Append(Td(Math.Sqrt((x * x) + (y * y) + (z * z)).ToString("F3", Inv)))
              .Append(Td(Mm(t.Residual.X, 0))).Append(Td(Mm(t.Residual.Y, 0))).Append(Td(Mm(t.Residual.Z, 0)))
              .Append(Td(Mm(t.LocalResidual.North, 0))).Append(Td(Mm(t.LocalResidual.East, 0)))
              .Append(Td(Mm(t.LocalResidual.Up, 0))).Append(Td(Num(t.Statistic, "F2", 0)))
              .Append(Td(Num(t.CriticalValue, "F2", 0))).Append("<td>").Append(t.Passed == false ? "✗ rejected"
                  : t.Passed == true ? "passed" : "not tested").Append("</td>")
              .Append(Td(Num(t.LocalW?.North, "F2", 0))).Append(Td(Num(t.LocalW?.East, "F2", 0)))
              .Append(Td(Num(t.LocalW?.Up, "F2", 0))).Append(Td(Mm(t.LocalMdb?.North, 0)))
              .Append(Td(Mm(t.LocalMdb?.East, 0))).Append(Td(Mm(t.LocalMdb?.Up, 0))).Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
        if (r.FrameParameters.Count > 0)
        {
            sb.Append("<h3>Frame parameters</h3>\n<p>From the GNSS frame to the local control; rotations in ")
              .Append("arcseconds, scale difference in ppm.</p>\n<table>\n<thead><tr><th>Frame</th><th>Parameter</th>")
              .Append("<th class=\"num\">Value</th><th class=\"num\">sd</th></tr></thead>\n<tbody>\n");
            foreach (var p in r.FrameParameters)
                sb.Append("<tr><td>").Append(E(p.Frame)).Append("</td><td>").Append(FrameKey(p.Parameter))
                  .Append("</td>").Append(Td(Num(FrameValue(p.Parameter, p.Value), "F4", 0)))
                  .Append(Td(Num(FrameValue(p.Parameter, p.Sd), "F4", 0))).Append("</tr>\n");
            sb.Append("</tbody>\n</table>\n");
        }
        sb.Append("</section>\n");
    }
}
