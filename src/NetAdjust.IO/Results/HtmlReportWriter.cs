using System.Globalization;
using System.Net;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;
using NetAdjust.Network;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the adjustment report as one self-contained HTML file: inline CSS and SVG only (no scripts, no fonts or
/// other resources fetched, enforced by a Content-Security-Policy), readable on screen and printable to PDF
/// (print stylesheet with a page break before each section). Sections: summary, network plot, histogram of
/// standardised residuals with the standard normal curve (when w-values are available), the tables of the text
/// report, and the caution. Deterministic: the run date is the only date.
/// </summary>
public static class HtmlReportWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Renders the report.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details and units.</param>
    public static string Write(AdjustmentResult result, ReportContext context) =>
        Write(ResultReport.Build(result, context));

    /// <summary>Renders the report of a report model.</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        var w = report.W;
        var r = report.Result;
        var c = report.Context;
        var u = new ReportUnits(c.Units).Booked(r.Network);
        var s = r.Statistics;
        var g = s.GlobalTest;
        var sb = new StringBuilder();
        string title = $"Adjustment report: {r.Network.Name}";
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
          .Append(
              "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; " +
              "img-src data:\">\n")
          .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
          .Append("<meta name=\"generator\" content=\"").Append(Generator.Name).Append("\">\n")
          .Append("<title>").Append(E(title)).Append("</title>\n<style>\n").Append(Css)
          .Append("</style>\n</head>\n<body>\n");

        sb.Append("<header>\n<h1>").Append(E(title)).Append("</h1>\n<dl class=\"run\">\n");
        if (c.Particulars is not null)
            foreach (var (label, text) in c.Particulars.Lines()) Dl(sb, label, text);
        Dl(sb, "Input", c.InputName);
        Dl(sb, "Run date", c.RunDate.ToString("yyyy-MM-dd", Inv));
        Dl(sb, "Units",
            $"lengths {c.Units.Length.Name} ({u.LengthSymbol}); angles {u.AngleName}; angular sd and residuals " +
            $"{u.SmallAngleSymbol}");
        Dl(sb, "Datum", TextReportSections.DatumText(r));
        Dl(sb, "Coordinates",
            (GridReport.HeaderLine(c) ??
            (c.Crs is null ? "local plane grid (no coordinate reference system declared)" : $"grid of {c.Crs}"))
            + PlaneHeightReport.Suffix(c));
        Dl(sb, "Solver", r.SolverName);
        if (c.Solution is string solution)
            Dl(sb, "Solution", $"the {solution} solution of the datum sequence (tables below the comparison)");
        foreach (var warning in c.Warnings) Dl(sb, "Warning", warning);
        sb.Append("</dl>\n</header>\n");

        // Summary.
        sb.Append("<section id=\"summary\">\n<h2>Summary</h2>\n");
        string verdict = g.Passed switch { true => "PASSED", false => "FAILED", _ => "not possible (no redundancy)" };
        sb.Append("<p class=\"verdict ").Append(g.Passed switch { true => "pass", false => "fail", _ => "none" })
          .Append("\">Global test (χ², two-tailed, α = ")
          .Append(F(g.Alpha, 3)).Append("): <strong>").Append(verdict).Append("</strong>");
        if (g.Lower is double lo && g.Upper is double hi)
            sb.Append(" — vᵀPv/σ0² = ").Append(F(g.Statistic, 3)).Append(", accepted ").Append(F(lo, 3)).Append(" to ")
                .Append(F(hi, 3));
        sb.Append("</p>\n<table class=\"figures\">\n<tbody>\n");
        var planRows = report.Points.Rows.Where(p => p.HasPlan).ToList();
        int plan = planRows.Count;
        Tr(sb, "Points (with plan position / height only)", $"{r.Points.Count} ({plan} / {r.Points.Count - plan})");
        Tr(sb, "Fixed control / weighted control / new (plan)",
            $"{planRows.Count(p => p.Role == PointRole.Fixed)} / " +
            $"{planRows.Count(p => p.Role == PointRole.Weighted)} / " +
            $"{planRows.Count(p => p.Role == PointRole.New)}");
        Tr(sb, "Observations (n)", s.Observations.ToString(Inv));
        Tr(sb, "Unknowns (u)", s.Unknowns.ToString(Inv));
        Tr(sb, "Degrees of freedom (r)", s.DegreesOfFreedom.ToString(Inv));
        Tr(sb, "vᵀPv", F(s.Vtpv, 4));
        Tr(sb, "A-priori variance factor σ0²", F(s.AprioriVarianceFactor, 4));
        Tr(sb, "A-posteriori variance factor σ̂0²", s.VarianceFactor is double vf ? F(vf, 4) : "n/a");
        Tr(sb, "Standard deviation of unit weight σ̂0", s.Sigma0 is double s0 ? F(s0, 4) : "n/a");
        Tr(sb, "Iterations", s.Iterations.ToString(Inv));
        sb.Append("</tbody>\n</table>\n");
        var worst = ReportFigures.Worst(r, w, 5);
        if (worst.Count > 0)
        {
            sb.Append(
                "<h3>Largest standardised residuals</h3>\n<table>\n<thead><tr><th>#</th><th>Observation</th><th " +
                "class=\"num\">w</th><th>w-test</th></tr></thead>\n<tbody>\n");
            foreach (var (o, wi) in worst)
                sb.Append("<tr").Append(Math.Abs(wi) > report.WCritical ? " class=\"fail\"" : "")
                  .Append("><td class=\"num\">").Append(o.Index + 1).Append("</td><td>")
                  .Append(E(o.Input.Describe())).Append("</td><td class=\"num\">").Append(F(wi, 2)).Append("</td><td>")
                  .Append(Math.Abs(wi) > report.WCritical ? "fails" : "passes").Append("</td></tr>\n");
            sb.Append("</tbody>\n</table>\n");
        }
        else
            sb.Append(
                "<p class=\"note\">No observation can be tested (no redundancy, or none controlled): there are " +
                "no standardised residuals.</p>\n");
        sb.Append("</section>\n");

        foreach (var section in report.Leading) AppendSection(sb, section);

        // Plot.
        sb.Append("<section id=\"plot\">\n<h2>Network plot</h2>\n<figure>\n")
          .Append(NetworkPlotWriter.Render(report))
          .Append("<figcaption>Grid north up. Error ellipses are standard (1σ) absolute ellipses at ")
          .Append(report.Basis.Words).Append(", magnified as stated in the legend.")
          .Append(w is null ? "" : " Dashed thick lines: observations failing the w-test.")
          .Append(report.Observations.Rows.Any(r => ObservationLabels.IsLevelled(r.Input.Kind))
              ? " Dotted lines: levelled height differences (not sight lines); those to a point without a plan " +
                "position are named in the legend, not drawn."
              : "")
          .Append("</figcaption>\n</figure>\n</section>\n");

        // Histogram.
        sb.Append("<section id=\"residuals\">\n<h2>Standardised residuals</h2>\n");
        var ws = w?.Where(x => x is double d && double.IsFinite(d)).Select(x => x!.Value).ToList();
        if (ws is { Count: > 0 })
            sb.Append("<figure>\n").Append(Histogram(ws, report.WCritical))
              .Append(
                  "<figcaption>Histogram of the standardised residuals w (bars, as a density) against the standard " +
                  "normal density (curve) that w follows when the model is right; dashed lines at ±")
              .Append(F(report.WCritical, 2)).Append(", the critical value of the w-test.</figcaption>\n</figure>\n");
        else
            sb.Append(
                "<p class=\"note\">No standardised residuals are available (no observation can be tested): the " +
                "histogram is left out.</p>\n");
        sb.Append("</section>\n");

        // Coordinates.
        sb.Append("<section id=\"coordinates\">\n<h2>Adjusted coordinates</h2>\n<p>Lengths in ").Append(u.LengthSymbol)
          .Append("; standard deviations at ").Append(report.Basis.Words)
          .Append("; standard (1σ) error ellipses at ").Append(report.Basis.Words)
          .Append("; azimuth of the semi-major axis from grid north.</p>\n")
          .Append(TableHead(PointRow.Columns.Where(col => col.Key is not ("held" or "weighted"))
              .SelectMany(col => col.Key == "id"
                  ? new[] { (col.Header, col.Kind), ("Role", ValueKind.Text) } : [(col.Header, col.Kind)])));
        foreach (var row in report.Points.Rows)
        {
            var p = row.Source;
            var el = row.Ellipse;
            string role = row.HasPlan ? ReportFigures.RoleText(row.Role)
                : p.Input.IsFixed(Fixity.H) ? "fixed benchmark"
                : p.Input.SdH.HasValue ? "weighted benchmark" : "new height";
            sb.Append("<tr><td class=\"id\">").Append(E(p.Id)).Append("</td><td>").Append(role).Append("</td>");
            foreach (var v in new[]
                     {
                         u.Length(p.E), u.Length(p.N), u.Length(p.H),
                         u.SmallLength(row.SdE), u.SmallLength(row.SdN), u.SmallLength(row.SdH),
                         u.SmallLength(el?.A), u.SmallLength(el?.B), el is ErrorEllipse e ? u.Azimuth(e.Azimuth) : "-",
                     })
                sb.Append("<td class=\"num\">").Append(E(v)).Append("</td>");
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n</section>\n");

        // Observations.
        sb.Append("<section id=\"observations\">\n<h2>Observations</h2>\n")
          .Append("<p>Residual v = adjusted − observed. Lengths in ").Append(u.LengthSymbol)
          .Append(", angles in ").Append(u.AngleName).Append(", angular residuals and standard deviations in ")
          .Append(u.SmallAngleSymbol).Append(".</p>\n")
          .Append(TableHead(ObservationRow.Columns.Select(col => (col.Header, col.Kind))));
        foreach (var row in report.Observations.Rows)
        {
            var kind = row.Input.Kind;
            sb.Append("<tr").Append(row.FailsWTest ? " class=\"fail\"" : "").Append('>');
            foreach (var col in ObservationRow.Columns)
            {
                var cell = col.Cell(row);
                string text = cell.Number is not double x ? cell.Text ?? "-" : col.Unit switch
                {
                    ColumnUnit.ObservedValue => u.ObservationValue(kind, x),
                    ColumnUnit.ObservedPrecision => u.ObservationSmall(kind, x),
                    ColumnUnit.Statistic => F(x, 2) + (row.FailsWTest ? " ✗" : ""),
                    _ => F(x, 0),
                };
                sb.Append("<td").Append(CellClass(col.Kind)).Append('>').Append(E(text)).Append("</td>");
            }
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
        if (w is not null) sb.Append("<p class=\"note\">Rows marked ✗ fail the w-test (|w| &gt; ")
            .Append(F(report.WCritical, 2)).Append(").</p>\n");
        sb.Append("</section>\n");

        BudgetOutput.AppendHtml(sb, r, c);

        if (r.Orientations.Count > 0)
        {
            sb.Append(
                "<section id=\"orientations\">\n<h2>Orientation unknowns</h2>\n<p>One per direction set: the " +
                "azimuth of the circle zero; sd in ")
              .Append(u.SmallAngleSymbol).Append(".</p>\n")
              .Append(
                  "<table>\n<thead><tr><th>Set</th><th>Station</th><th class=\"num\">Orientation</th><th " +
                  "class=\"num\">sd</th></tr></thead>\n<tbody>\n");
            foreach (var o in r.Orientations)
                sb.Append("<tr><td>").Append(E(o.SetId)).Append("</td><td class=\"id\">").Append(E(o.Station))
                  .Append("</td><td class=\"num\">").Append(E(u.AngleValue(o.Orientation)))
                  .Append("</td><td class=\"num\">").Append(u.SmallAngle(o.Sd)).Append("</td></tr>\n");
            sb.Append("</tbody>\n</table>\n</section>\n");
        }

        RefractionOutput.AppendHtml(sb, r);
        BaselineSection.AppendHtml(sb, r, c);
        foreach (var section in report.Sections) AppendSection(sb, section);
        DiagnosisOutput.AppendHtml(sb, report);

        sb.Append("<section id=\"caution\">\n<h2>Caution</h2>\n<p class=\"caution\">")
            .Append(E(TextReportWriter.Caution.Replace("\n", " "))).Append("</p>\n");
        // The block the surveyor in charge signs, on the page of the caution it is signed under.
        sb.Append("<div id=\"signature\">\n<h3>Surveyor in charge</h3>\n<table class=\"signature\">\n<tbody>\n")
          .Append("<tr><th scope=\"row\">Name</th><td>").Append(E(c.Particulars?.Surveyor ?? "")).Append("</td></tr>\n")
          .Append("<tr><th scope=\"row\">Firm</th><td>").Append(E(c.Particulars?.Firm ?? "")).Append("</td></tr>\n")
          .Append("<tr><th scope=\"row\">Signature</th><td></td></tr>\n")
          .Append("<tr><th scope=\"row\">Date</th><td></td></tr>\n</tbody>\n</table>\n</div>\n</section>\n");
        sb.Append("<footer>Report written by ").Append(Generator.Name).Append(" on the run date ")
            .Append(c.RunDate.ToString("yyyy-MM-dd", Inv)).Append(".</footer>\n</body>\n</html>\n");
        return sb.ToString();
    }

    /// <summary>
    /// An SVG histogram of w as a density (bar area = share of observations) with the standard normal density
    /// φ(x) = exp(−x²/2)/√(2π) drawn over it, and the critical values of the w-test marked.
    /// </summary>
    internal static string Histogram(IReadOnlyList<double> w, double critical)
    {
        const double width = 720, height = 320, x0 = 56, x1 = 700, y0 = 20, y1 = 280, bin = 0.5;
        double lim = Math.Max(4.0, Math.Ceiling(w.Max(Math.Abs) / bin) * bin);
        int bins = (int)Math.Round(2 * lim / bin);
        var counts = new int[bins];
        foreach (double v in w)
        {
            int k = (int)Math.Floor((v + lim) / bin);
            counts[Math.Clamp(k, 0, bins - 1)]++;
        }
        double peak = Math.Max(0.45, counts.Max() / (w.Count * bin));
        double yMax = Math.Ceiling(peak * 10) / 10;
        double X(double v) => x0 + ((v + lim) / (2 * lim) * (x1 - x0));
        double Y(double d) => y1 - (d / yMax * (y1 - y0));
        var sb = new StringBuilder();
        sb.Append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"histogram\" viewBox=\"0 0 ").Append(N(width))
          .Append(' ').Append(N(height))
          .Append("\" width=\"").Append(N(width)).Append("\" height=\"").Append(N(height))
          .Append("\" font-family=\"Helvetica, Arial, sans-serif\" font-size=\"12\" role=\"img\">\n")
          .Append("<title>Histogram of standardised residuals (").Append(w.Count).Append(" observations)</title>\n")
          .Append("<rect x=\"0\" y=\"0\" width=\"").Append(N(width)).Append("\" height=\"").Append(N(height))
          .Append("\" fill=\"#FFFFFF\"/>\n");
        for (int k = 0; k < bins; k++)
        {
            if (counts[k] == 0) continue;
            double d = counts[k] / (w.Count * bin);
            double lo = -lim + (k * bin);
            sb.Append("<rect class=\"bar\" x=\"").Append(N(X(lo))).Append("\" y=\"").Append(N(Y(d)))
              .Append("\" width=\"").Append(N(X(lo + bin) - X(lo)))
              .Append("\" height=\"").Append(N(y1 - Y(d))).Append("\" fill=\"").Append(NetworkPlotWriter.FixedColour)
              .Append("\" fill-opacity=\"0.55\" stroke=\"#111111\" stroke-width=\"0.8\"><title>")
              .Append(counts[k]).Append(" in [").Append(F(lo, 1)).Append(", ").Append(F(lo + bin, 1))
              .Append(")</title></rect>\n");
        }
        var curve = new StringBuilder();
        for (int i = 0; i <= 200; i++)
        {
            double v = -lim + (2 * lim * i / 200);
            double phi = Math.Exp(-0.5 * v * v) / Math.Sqrt(2 * Math.PI);
            curve.Append(i == 0 ? "" : " ").Append(N(X(v))).Append(',').Append(N(Y(phi)));
        }
        sb.Append("<polyline class=\"normal-curve\" points=\"").Append(curve).Append("\" fill=\"none\" stroke=\"")
            .Append(NetworkPlotWriter.FailColour).Append("\" stroke-width=\"2\"/>\n");
        foreach (double c in new[] { -critical, critical })
            sb.Append("<line class=\"critical\" x1=\"").Append(N(X(c))).Append("\" y1=\"").Append(N(y0))
              .Append("\" x2=\"").Append(N(X(c))).Append("\" y2=\"").Append(N(y1))
              .Append("\" stroke=\"#111111\" stroke-dasharray=\"5 4\"/>\n");
        sb.Append("<line x1=\"").Append(N(x0)).Append("\" y1=\"").Append(N(y1)).Append("\" x2=\"").Append(N(x1))
            .Append("\" y2=\"").Append(N(y1)).Append("\" stroke=\"#111111\"/>\n");
        sb.Append("<line x1=\"").Append(N(x0)).Append("\" y1=\"").Append(N(y0)).Append("\" x2=\"").Append(N(x0))
            .Append("\" y2=\"").Append(N(y1)).Append("\" stroke=\"#111111\"/>\n");
        // Axis labels thinned to a 1-2-5 step wide enough for the longest label (about 7 px a character at 12 px,
        // plus a gap), so that they never overlap however wide the range of w.
        int chars = F(-lim, 0).Length;
        double xStep = LabelStep((chars * 7.5 + 12) * (2 * lim) / (x1 - x0), 1);
        for (double t = Math.Ceiling(-lim / xStep) * xStep; t <= lim + 1e-9; t += xStep)
            sb.Append("<text class=\"tick-w\" x=\"").Append(N(X(t))).Append("\" y=\"").Append(N(y1 + 16))
                .Append("\" text-anchor=\"middle\">").Append(F(t + 0.0, 0)).Append("</text>\n");
        double yStep = LabelStep(18 * yMax / (y1 - y0), 0.1);
        for (int k = 0; k * yStep <= yMax + 1e-9; k++)
            sb.Append("<text class=\"tick-density\" x=\"").Append(N(x0 - 6)).Append("\" y=\"")
                .Append(N(Y(k * yStep) + 4)).Append("\" text-anchor=\"end\">").Append(F(k * yStep, 1))
                .Append("</text>\n");
        sb.Append("<text x=\"").Append(N((x0 + x1) / 2)).Append("\" y=\"").Append(N(height - 4))
            .Append("\" text-anchor=\"middle\">standardised residual w</text>\n");
        sb.Append("<text x=\"14\" y=\"").Append(N((y0 + y1) / 2))
            .Append("\" text-anchor=\"middle\" transform=\"rotate(-90 14 ").Append(N((y0 + y1) / 2))
            .Append(")\">density</text>\n");
        sb.Append("</svg>\n");
        return sb.ToString();
    }

    /// <summary>The smallest step of 1, 2 or 5 × 10^k, and at least <paramref name="least"/>, not below
    /// <paramref name="wanted"/>.</summary>
    internal static double LabelStep(double wanted, double least)
    {
        if (!(wanted > least) || !double.IsFinite(wanted)) return least;
        double p = Math.Pow(10, Math.Floor(Math.Log10(wanted)));
        foreach (double m in new[] { 1.0, 2.0, 5.0, 10.0 })
            if (m * p >= wanted - 1e-12) return Math.Round(m * p, 10);
        return 10 * p;
    }

    /// <summary>
    /// Writes one table section of the model: units in the column headers, numbers right-aligned, and a first
    /// column that marks failing rows with a symbol (✗ fails, ! weak) besides the row's class, so that they stand
    /// out without colour.
    /// </summary>
    internal static void AppendSection(StringBuilder sb, ReportSection section)
    {
        sb.Append("<section id=\"").Append(section.Id).Append("\" class=\"table-section\">\n<h2>")
          .Append(E(section.Heading)).Append("</h2>\n");
        foreach (var line in Paragraphs(section.Before)) sb.Append("<p>").Append(E(line)).Append("</p>\n");
        if (section.HtmlSummary is string summary)
        {
            bool failed = section.Rows.Any(row => row.State == RowState.Fail);
            sb.Append("<p class=\"verdict ").Append(failed ? "fail" : "pass").Append("\"><strong>")
              .Append(failed ? "✗ " : "✓ ").Append(E(summary)).Append("</strong></p>\n");
        }
        bool marks = section.Rows.Any(row => row.State != RowState.Normal);
        // a column without a heading (a marker) is shown only when some row uses it
        var columns = Enumerable.Range(0, section.Columns.Count).Where(i => section.Columns[i].Header.Length > 0
            || section.Rows.Any(row => row.Cells[i].Trim().Length > 0)).ToList();
        sb.Append("<table class=\"model\">\n<thead><tr>");
        if (marks) sb.Append("<th class=\"mark\" title=\"failing rows are marked\">Mark</th>");
        foreach (var col in columns.Select(i => section.Columns[i]))
            sb.Append(col.Kind == ValueKind.Number ? "<th class=\"num\">" : "<th>")
              .Append(E(col.Header.Length > 0 ? col.HeaderWithUnit : "Note")).Append("</th>");
        sb.Append("</tr></thead>\n<tbody>\n");
        foreach (var row in section.Rows)
        {
            sb.Append(row.State switch { RowState.Fail => "<tr class=\"fail\">", RowState.Warn => "<tr class=\"warn\">",
                _ => "<tr>" });
            if (marks)
                sb.Append("<td class=\"mark\">").Append(row.State switch
                {
                    RowState.Fail => "<span title=\"fails\">✗</span>",
                    RowState.Warn => "<span title=\"weak\">!</span>",
                    _ => "",
                }).Append("</td>");
            foreach (int i in columns)
                sb.Append("<td").Append(CellClass(section.Columns[i].Kind)).Append('>')
                  .Append(E(row.Cells[i].Trim())).Append("</td>");
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
        var notes = section.Rows.SelectMany(row => row.After ?? []).Concat(section.After).ToList();
        foreach (var line in Paragraphs(notes)) sb.Append("<p class=\"note\">").Append(E(line.Trim())).Append("</p>\n");
        if (marks)
            sb.Append("<p class=\"note\">").Append(E(section.MarkNote ?? "Rows marked ✗ fail their test (or were set " +
                "aside for failing it); rows marked ! are weakly controlled or uncontrolled.")).Append("</p>\n");
        sb.Append("</section>\n");
    }

    /// <summary>The text report's lines as paragraphs: a line wrapped on from the one before joins it.</summary>
    private static List<string> Paragraphs(IEnumerable<string> lines)
    {
        var paragraphs = new List<string>();
        foreach (var line in lines.Select(l => l.Trim()).Where(l => l.Length > 0))
        {
            bool goesOn = paragraphs.Count > 0 && !paragraphs[^1].EndsWith('.') && !paragraphs[^1].EndsWith(':')
                && !paragraphs[^1].EndsWith(')') && (char.IsLower(line[0]) || line[0] == '\'');
            if (goesOn) paragraphs[^1] += " " + line;
            else paragraphs.Add(line);
        }
        return paragraphs;
    }

    /// <summary>The class attribute of a body cell: numbers right-aligned, point ids bold, references small.</summary>
    private static string CellClass(ValueKind kind) => kind switch
    {
        ValueKind.Number => " class=\"num\"",
        ValueKind.PointId => " class=\"id\"",
        ValueKind.Reference => " class=\"src\"",
        _ => "",
    };

    /// <summary>The opening of a table with its header row: numeric columns right-aligned (class <c>num</c>).</summary>
    private static string TableHead(IEnumerable<(string Header, ValueKind Kind)> columns)
    {
        var sb = new StringBuilder("<table>\n<thead><tr>");
        foreach (var (header, kind) in columns)
            sb.Append(kind == ValueKind.Number ? "<th class=\"num\">" : "<th>").Append(E(header)).Append("</th>");
        return sb.Append("</tr></thead>\n<tbody>\n").ToString();
    }

    private static void Dl(StringBuilder sb, string term, string value) =>
        sb.Append("<dt>").Append(E(term)).Append("</dt><dd>").Append(E(value)).Append("</dd>\n");

    private static void Tr(StringBuilder sb, string term, string value) =>
        sb.Append("<tr><th scope=\"row\">").Append(E(term)).Append("</th><td class=\"num\">").Append(E(value))
            .Append("</td></tr>\n");

    private static string F(double v, int d) => v.ToString("F" + d, Inv);

    private static string N(double v) => Math.Round(v, 2).ToString("0.##", Inv);

    private static string E(string s) => WebUtility.HtmlEncode(s);

    private const string Css = """
        :root { color: #111; background: #fff; }
        body { font-family: Helvetica, Arial, sans-serif; font-size: 14px; line-height: 1.4; margin: 24px auto;
        """ + " max-width: 1000px; padding: 0 16px; }\n" + """
        h1 { font-size: 22px; margin: 0 0 8px; }
        h2 { font-size: 18px; border-bottom: 2px solid #0072B2; padding-bottom: 2px; margin-top: 28px; }
        h3 { font-size: 15px; }
        dl.run { display: grid; grid-template-columns: max-content 1fr; gap: 2px 16px; margin: 0; }
        dl.run dt { font-weight: bold; }
        dl.run dd { margin: 0; }
        table { border-collapse: collapse; margin: 8px 0; font-size: 12.5px; }
        th, td { border: 1px solid #ccc; padding: 2px 6px; text-align: left; vertical-align: top; }
        thead th { background: #eef3f8; }
        td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        td.id { font-weight: bold; white-space: nowrap; }
        td.src { color: #555; font-size: 11px; }
        tr.fail td { background: #fbe3d6; font-weight: bold; }
        tr.warn td { background: #fff4cc; font-style: italic; }
        td.mark, th.mark { text-align: center; width: 1.5em; }
        table.signature { width: 60%; break-inside: avoid; }
        table.signature td { height: 2.2em; min-width: 20em; }
        table.figures th { font-weight: normal; background: #f6f6f6; }
        .verdict { font-size: 16px; padding: 6px 10px; border-left: 6px solid #999; background: #f6f6f6; }
        .verdict.pass { border-left-color: #009E73; }
        .verdict.fail { border-left-color: #D55E00; }
        .note { color: #444; font-style: italic; }
        .caution { border: 2px solid #D55E00; padding: 8px 12px; }
        figure { margin: 8px 0; }
        figure svg { max-width: 100%; height: auto; border: 1px solid #ddd; }
        figcaption { font-size: 12px; color: #333; margin-top: 4px; }
        footer { margin-top: 24px; font-size: 11px; color: #555; }
        @page { size: A4; margin: 14mm; }
        @media print {
          body { margin: 0; max-width: none; font-size: 11px; }
          section { break-before: page; }
          section#summary { break-before: auto; }
          h2 { break-after: avoid; }
          thead { display: table-header-group; }
          tr { break-inside: avoid; }
          figure svg { border: none; }
          table { font-size: 10px; }
        }

        """;
}
