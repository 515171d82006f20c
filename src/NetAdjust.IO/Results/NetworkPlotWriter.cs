using System.Globalization;
using System.Net;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.IO.Results;

/// <summary>
/// Draws the plan of an adjusted network as SVG: points by role (fixed control: triangle; weighted control:
/// diamond; new point: circle), observation lines, standard error ellipses magnified by a stated factor
/// (each an SVG <c>ellipse</c> element of class <c>ellipse</c>), a scale bar for the map and one for the
/// ellipses, a north arrow and a legend. Observations failing the w-test are drawn dashed and thick when
/// standardised residuals are available. Levelled height differences are not sight lines: between two plotted
/// points they are drawn dotted in their own colour, and where a point has no plan position they are listed in the
/// legend, not drawn, so that no line appears that was never sighted. Colours from the Okabe–Ito palette
/// (Okabe &amp; Ito 2008, "Color Universal Design"), chosen to stay distinct for colour-blind readers; every role
/// also has its own shape.
/// Deterministic: same result, same text.
/// </summary>
public static class NetworkPlotWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    internal const string FixedColour = "#0072B2";    // blue
    internal const string WeightedColour = "#E69F00"; // orange
    internal const string NewColour = "#009E73";      // bluish green
    internal const string EllipseColour = "#CC79A7";  // reddish purple
    internal const string FailColour = "#D55E00";     // vermillion
    internal const string LineColour = "#8C8C8C";     // neutral grey
    internal const string LevelledColour = "#56B4E9"; // sky blue

    /// <summary>The dash pattern of a levelled height difference (dotted, against the solid sight lines).</summary>
    internal const string LevelledDashes = "2 4";

    /// <summary>At most this many levelled lines that cannot be drawn are named in the legend.</summary>
    internal const int LevelledListed = 6;

    private const double Width = 960, Height = 640;
    private const double MapX0 = 16, MapY0 = 16, MapX1 = 700, MapY1 = 624;

    /// <summary>Renders a standalone SVG document (with XML declaration) of the network plot.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details (units of the scale bars).</param>
    public static string WriteDocument(AdjustmentResult result, ReportContext context) =>
        WriteDocument(ResultReport.Build(result, context));

    /// <summary>Renders a standalone SVG document (with XML declaration) of the report model's network plot.</summary>
    /// <param name="report">The report model.</param>
    public static string WriteDocument(ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + Render(report);
    }

    /// <summary>Renders the plot as an <c>svg</c> element for embedding in HTML.</summary>
    internal static string Render(ResultReport report)
    {
        var w = report.W;
        var result = report.Result;
        var context = report.Context;
        var units = new ReportUnits(context.Units);
        var rows = report.Points.Rows.Where(r => r.HasPlan).ToList();
        var pts = rows.Select(r => r.Source).ToList();
        var sb = new StringBuilder();
        sb.Append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"network-plot\" viewBox=\"0 0 ").Append(N(Width))
          .Append(' ').Append(N(Height))
          .Append("\" width=\"").Append(N(Width)).Append("\" height=\"").Append(N(Height))
          .Append("\" role=\"img\" aria-labelledby=\"plot-title\"")
          .Append(" font-family=\"Helvetica, Arial, sans-serif\" font-size=\"12\">\n");
        sb.Append("<title id=\"plot-title\">Network plot: ").Append(E(result.Network.Name))
          .Append(context.Solution is string solution ? E($" ({solution} solution)") : "").Append("</title>\n");
        sb.Append("<rect x=\"0\" y=\"0\" width=\"").Append(N(Width)).Append("\" height=\"").Append(N(Height))
            .Append("\" fill=\"#FFFFFF\"/>\n");
        sb.Append("<rect x=\"").Append(N(MapX0)).Append("\" y=\"").Append(N(MapY0)).Append("\" width=\"")
          .Append(N(MapX1 - MapX0))
          .Append("\" height=\"").Append(N(MapY1 - MapY0))
          .Append("\" fill=\"none\" stroke=\"#BBBBBB\" stroke-width=\"1\"/>\n");
        if (pts.Count == 0)
        {
            sb.Append(
                "<text x=\"40\" y=\"60\">No point has plan coordinates: nothing to plot (a levelling " +
                "network).</text>\n</svg>\n");
            return sb.ToString();
        }

        // Map transform: grid (E, N) in metres → SVG (x right, y down), north up, equal scale on both axes.
        double eMin = pts.Min(p => p.E!.Value), eMax = pts.Max(p => p.E!.Value);
        double nMin = pts.Min(p => p.N!.Value), nMax = pts.Max(p => p.N!.Value);
        double span = Math.Max(Math.Max(eMax - eMin, nMax - nMin), 1.0);
        double pad = 60; // pixels kept free around the points for labels and ellipses
        double scale = Math.Min(
            (MapX1 - MapX0 - (2 * pad)) / Math.Max(eMax - eMin, span * 1e-3),
            (MapY1 - MapY0 - (2 * pad)) / Math.Max(nMax - nMin, span * 1e-3));
        double cx = 0.5 * (MapX0 + MapX1), cy = 0.5 * (MapY0 + MapY1),
            ce = 0.5 * (eMin + eMax), cn = 0.5 * (nMin + nMax);
        double X(double e) => cx + ((e - ce) * scale);
        double Y(double n) => cy - ((n - cn) * scale);

        // Ellipse magnification: a "nice" factor (1, 2, 5 × 10^k) making the largest ellipse about 40 px long.
        var ellipses = rows.Where(r => r.Ellipse is not null)
            .Select(r => (Point: r.Source, El: r.Ellipse!.Value)).ToList();
        double aMax = ellipses.Count > 0 ? ellipses.Max(t => t.El.A) : 0;
        double mag = aMax > 0 ? NiceDown(40.0 / (aMax * scale)) : 1.0;
        if (mag < 1) mag = 1;

        // Observation lines (fails on top).
        var planIds = pts.ToDictionary(p => p.Id, StringComparer.Ordinal);
        var ok = new StringBuilder();
        var fail = new StringBuilder();
        var levelledDrawn = 0;
        var notDrawn = new List<ObservationRow>();
        foreach (var row in report.Observations.Rows)
        {
            var o = row.Source;
            var i = o.Input;
            var segs = i.Kind == ObservationKind.Angle
                ? new[] { (i.At!, i.From), (i.At!, i.To) }
                : new[] { (i.From, i.To) };
            double? wi = row.W;
            bool failed = row.FailsWTest;
            bool levelled = ObservationLabels.IsLevelled(i.Kind);
            foreach (var (a, b) in segs)
            {
                if (!planIds.TryGetValue(a, out var pa) || !planIds.TryGetValue(b, out var pb))
                {
                    if (levelled) notDrawn.Add(row);
                    continue;
                }
                if (levelled) levelledDrawn++;
                var target = failed ? fail : ok;
                target.Append("<line class=\"obs").Append(levelled ? " obs-levelled" : "")
                      .Append(failed ? " obs-fail" : "").Append("\" x1=\"")
                      .Append(N(X(pa.E!.Value))).Append("\" y1=\"").Append(N(Y(pa.N!.Value)))
                      .Append("\" x2=\"").Append(N(X(pb.E!.Value))).Append("\" y2=\"").Append(N(Y(pb.N!.Value)))
                      .Append('"');
                if (failed) target.Append(" stroke=\"").Append(FailColour)
                    .Append("\" stroke-width=\"3\" stroke-dasharray=\"8 4\"");
                else if (levelled) target.Append(" stroke=\"").Append(LevelledColour)
                    .Append("\" stroke-width=\"1.6\" stroke-dasharray=\"").Append(LevelledDashes).Append('"');
                else target.Append(" stroke=\"").Append(LineColour).Append("\" stroke-width=\"1.2\"");
                target.Append("><title>")
                    .Append(E($"#{o.Index + 1} {i.Describe()}" +
                        (wi is double wv ? $", w = {wv.ToString("F2", Inv)}" : "")))
                    .Append("</title></line>\n");
            }
        }
        sb.Append("<g class=\"observations\">\n").Append(ok).Append("</g>\n");
        sb.Append("<g class=\"observations-failing\">\n").Append(fail).Append("</g>\n");

        // Ellipses: SVG rotates clockwise on screen (y down); the semi-major axis lies at azimuth θ from north,
        // which is the +x axis turned clockwise by θ − 90°.
        sb.Append("<g class=\"ellipses\" fill=\"none\" stroke=\"").Append(EllipseColour)
            .Append("\" stroke-width=\"1.8\">\n");
        foreach (var (p, el) in ellipses)
        {
            double x = X(p.E!.Value), y = Y(p.N!.Value);
            double rot = (el.Azimuth * 180 / Math.PI) - 90;
            sb.Append("<ellipse class=\"ellipse\" data-point=\"").Append(E(p.Id)).Append("\" cx=\"").Append(N(x))
              .Append("\" cy=\"").Append(N(y))
              .Append("\" rx=\"").Append(N(el.A * mag * scale)).Append("\" ry=\"").Append(N(el.B * mag * scale))
              .Append("\" transform=\"rotate(").Append(N(rot)).Append(' ').Append(N(x)).Append(' ').Append(N(y))
              .Append(")\"><title>")
              .Append(E(
                  $"{p.Id}: a = {units.SmallLength(el.A)} {units.LengthSymbol}, b = {units.SmallLength(el.B)} " +
                  $"{units.LengthSymbol}, azimuth of a {units.Azimuth(el.Azimuth)}"))
              .Append("</title></ellipse>\n");
        }
        sb.Append("</g>\n");

        // Points and labels.
        sb.Append("<g class=\"points\">\n");
        foreach (var row in rows)
        {
            var p = row.Source;
            double x = X(p.E!.Value), y = Y(p.N!.Value);
            var role = row.Role;
            sb.Append(Symbol(role, x, y, E(p.Id)));
            sb.Append("<text class=\"label\" x=\"").Append(N(x + 9)).Append("\" y=\"").Append(N(y - 9))
              .Append("\" font-size=\"13\" font-weight=\"bold\" fill=\"#111111\"")
              .Append(" paint-order=\"stroke\" stroke=\"#FFFFFF\" stroke-width=\"3\">").Append(E(p.Id))
              .Append("</text>\n");
        }
        sb.Append("</g>\n");

        // North arrow (top left of the map).
        sb.Append("<g class=\"north-arrow\" transform=\"translate(48 40)\">")
          .Append("<path d=\"M0 0 L10 28 L0 22 L-10 28 Z\" fill=\"#111111\"/>")
          .Append("<text x=\"0\" y=\"44\" text-anchor=\"middle\" font-size=\"14\" font-weight=\"bold\">N</text>")
          .Append("<text x=\"0\" y=\"58\" text-anchor=\"middle\" font-size=\"10\">grid</text></g>\n");

        // Legend panel.
        double lx = 716, ly = 30;
        sb.Append("<g class=\"legend\">\n");
        sb.Append("<text x=\"").Append(N(lx)).Append("\" y=\"").Append(N(ly))
            .Append("\" font-size=\"14\" font-weight=\"bold\">Legend</text>\n");
        void Row(string symbol, string text)
        {
            ly += 26;
            sb.Append(symbol).Append("<text x=\"").Append(N(lx + 26)).Append("\" y=\"").Append(N(ly + 4)).Append("\">")
                .Append(E(text)).Append("</text>\n");
        }
        Row(Symbol(PointRole.Fixed, lx + 8, ly + 26, null), "fixed control");
        Row(Symbol(PointRole.Weighted, lx + 8, ly + 26, null), "weighted control");
        Row(Symbol(PointRole.New, lx + 8, ly + 26, null), "new point");
        Row(
            $"<line x1=\"{N(lx)}\" y1=\"{N(ly + 26)}\" x2=\"{N(lx + 18)}\" y2=\"{N(ly + 26)}\" " +
            $"stroke=\"{LineColour}\" stroke-width=\"1.2\"/>", "observation (sight line)");
        if (levelledDrawn > 0)
            Row(
                $"<line x1=\"{N(lx)}\" y1=\"{N(ly + 26)}\" x2=\"{N(lx + 18)}\" y2=\"{N(ly + 26)}\" " +
                $"stroke=\"{LevelledColour}\" stroke-width=\"1.6\" stroke-dasharray=\"{LevelledDashes}\"/>",
                "levelled height difference");
        if (w is not null)
            Row(
                $"<line x1=\"{N(lx)}\" y1=\"{N(ly + 26)}\" x2=\"{N(lx + 18)}\" y2=\"{N(ly + 26)}\" " +
                $"stroke=\"{FailColour}\" stroke-width=\"3\" stroke-dasharray=\"8 4\"/>",
                $"fails the w-test (|w| > {report.WCritical.ToString("F2", Inv)})");
        else
            Row("", "w-test: not available");
        Row(
            $"<ellipse cx=\"{N(lx + 9)}\" cy=\"{N(ly + 26)}\" rx=\"9\" ry=\"5\" fill=\"none\" " +
            $"stroke=\"{EllipseColour}\" stroke-width=\"1.8\"/>", "standard error ellipse (1σ)");
        ly += 30;
        sb.Append("<text class=\"magnification\" x=\"").Append(N(lx)).Append("\" y=\"").Append(N(ly))
          .Append("\">Ellipses magnified ×")
          .Append(mag.ToString("#,0", Inv)).Append("</text>\n");

        // Scale bars: map (about 120 px) and ellipses (about 80 px at the magnification), in the project's unit.
        double unitM = context.Units.Length.MetresPerUnit;
        double mapLen = NiceDown(160.0 / scale / unitM); // in project units
        ly += 34;
        ScaleBar(sb, lx, ly, mapLen * unitM * scale, $"Map: {Pretty(mapLen)} {units.LengthSymbol}", "scale-bar-map");
        if (ellipses.Count > 0)
        {
            double elLen = NiceDown(110.0 / (mag * scale) / unitM);
            ly += 50;
            ScaleBar(sb, lx, ly, elLen * unitM * mag * scale, $"Ellipses: {Pretty(elLen)} {units.LengthSymbol}",
                "scale-bar-ellipses");
        }
        int hidden = result.Points.Count - pts.Count;
        if (hidden > 0)
        {
            ly += 48;
            sb.Append("<text x=\"").Append(N(lx)).Append("\" y=\"").Append(N(ly)).Append("\" font-size=\"11\">")
              .Append(hidden.ToString(Inv)).Append(hidden == 1 ? " point has" : " points have")
              .Append(" a height only</text>\n");
            sb.Append("<text x=\"").Append(N(lx)).Append("\" y=\"").Append(N(ly + 14))
                .Append("\" font-size=\"11\">and is not plotted.</text>\n");
        }
        if (notDrawn.Count > 0)
        {
            // levelled lines to points without a plan position: named, not drawn
            var lines = new List<string>
            {
                $"{notDrawn.Count} levelled height difference{(notDrawn.Count == 1 ? "" : "s")}",
                "not drawn (no plan position):",
            };
            lines.AddRange(notDrawn.Take(LevelledListed).Select(r => $"#{r.Number} {r.Input.From} to {r.Input.To}"));
            if (notDrawn.Count > LevelledListed)
                lines.Add($"and {notDrawn.Count - LevelledListed} more (observations table)");
            ly += 34;
            sb.Append("<g class=\"levelled-not-drawn\">");
            foreach (var line in lines)
            {
                sb.Append("<text x=\"").Append(N(lx)).Append("\" y=\"").Append(N(ly)).Append("\" font-size=\"11\">")
                  .Append(E(line)).Append("</text>");
                ly += 14;
            }
            sb.Append("</g>\n");
        }
        sb.Append("</g>\n");
        sb.Append("</svg>\n");
        return sb.ToString();
    }

    private static void ScaleBar(StringBuilder sb, double x, double y, double px, string label, string cls)
    {
        sb.Append("<g class=\"").Append(cls).Append("\">")
          .Append("<rect x=\"").Append(N(x)).Append("\" y=\"").Append(N(y)).Append("\" width=\"").Append(N(px / 2))
          .Append("\" height=\"6\" fill=\"#111111\"/>")
          .Append("<rect x=\"").Append(N(x + (px / 2))).Append("\" y=\"").Append(N(y)).Append("\" width=\"")
          .Append(N(px / 2)).Append("\" height=\"6\" fill=\"#FFFFFF\" stroke=\"#111111\"/>")
          .Append("<rect x=\"").Append(N(x)).Append("\" y=\"").Append(N(y)).Append("\" width=\"").Append(N(px))
          .Append("\" height=\"6\" fill=\"none\" stroke=\"#111111\"/>")
          .Append("<text x=\"").Append(N(x)).Append("\" y=\"").Append(N(y + 22)).Append("\">").Append(E(label))
          .Append("</text></g>\n");
    }

    /// <summary>The SVG of a point symbol: fixed control a triangle, weighted control a diamond, a new point a
    /// circle.</summary>
    internal static string Symbol(PointRole role, double x, double y, string? id)
    {
        string data = id is null ? "" : $" data-point=\"{id}\"";
        return role switch
        {
            PointRole.Fixed =>
                $"<path class=\"point point-fixed\"{data} d=\"M{N(x)} {N(y - 9)} L{N(x + 8)} {N(y + 6)} L{N(x - 8)} " +
                $"{N(y + 6)} Z\" fill=\"{FixedColour}\" stroke=\"#111111\" stroke-width=\"1\"/>\n",
            PointRole.Weighted =>
                $"<path class=\"point point-weighted\"{data} d=\"M{N(x)} {N(y - 8)} L{N(x + 8)} {N(y)} L{N(x)} " +
                $"{N(y + 8)} L{N(x - 8)} {N(y)} Z\" fill=\"{WeightedColour}\" stroke=\"#111111\" " +
                $"stroke-width=\"1\"/>\n",
            _ =>
                $"<circle class=\"point point-new\"{data} cx=\"{N(x)}\" cy=\"{N(y)}\" r=\"5.5\" fill=\"{NewColour}\" " +
                $"stroke=\"#111111\" stroke-width=\"1\"/>\n",
        };
    }

    /// <summary>The largest 1, 2 or 5 × 10^k not above v (v &gt; 0).</summary>
    internal static double NiceDown(double v)
    {
        if (!(v > 0) || !double.IsFinite(v)) return 1;
        double p = Math.Pow(10, Math.Floor(Math.Log10(v)));
        double m = v / p;
        double nice = m >= 5 ? 5 : m >= 2 ? 2 : 1;
        return nice * p;
    }

    private static string Pretty(double v) => v >= 1 ? v.ToString("0.##", Inv) : v.ToString("0.######", Inv);

    private static string N(double v) => Math.Round(v, 2).ToString("0.##", Inv);

    private static string E(string s) => WebUtility.HtmlEncode(s);
}
