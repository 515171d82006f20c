using System.Globalization;
using System.Text.Json;
using System.Xml.Linq;
using nietras.SeparatedValues;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// Regression tests: the point outputs (coordinates CSV, LandXML, GeoJSON, the point table of the text and HTML
/// reports) give standard deviations and error ellipses at one variance factor and name it in the file. Before the
/// fix, standard deviations were at the a-priori factor and ellipses at the estimated one, unnamed.
/// The check is independent of how either is computed: for a 2×2 covariance matrix the squared semi-axes of the
/// standard error ellipse are its eigenvalues, so a² + b² = sd_E² + sd_N² (the trace; common practice, e.g.
/// docs/methods.md on error ellipses). With the estimated factor far from 1 (given sds ten times too small), a
/// file mixing two bases breaks the identity by a factor of about 100.
/// </summary>
public class VarianceFactorBasisTests
{
    // The Ashgrove network of TestProjects (invented) with standard deviations ten times smaller than the noise
    // it was simulated with, and the tests asked to use the estimated variance factor.
    private const string Project = """
        project: Ashgrove yard check, optimistic weights (invented)
        units: {length: m, angle: gon, angle_sd: mgon}
        default_sd: {direction: 0.1, distance: 0.0003}
        statistics: {variance_factor_basis: estimated}
        points:
          - {id: A, e: 1000, n: 1000, fix: en}
          - {id: B, e: 1500.0, n: 1000.0, sd_e: 0.002, sd_n: 0.002}
          - {id: C, e: 1250.0, n: 1400.0}
        setups:
          - at: A
            directions:
              - {to: B, value: 80.90272}
              - {to: C, value: 16.46305}
            distances:
              - {to: B, value: 500.0130}
              - {to: C, value: 471.7311}
          - at: C
            directions:
              - {to: A, value: 165.53347}
              - {to: B, value: 94.41433}
            distances:
              - {to: B, value: 471.7297}
          - at: B
            directions:
              - {to: A, value: 172.67730}
              - {to: C, value: 237.11855}
        """;

    private static (AdjustmentResult R, ReportContext C) Load()
    {
        var project = ProjectReader.Parse(Project, "optimistic.yaml", "/nonexistent",
            _ => throw new IOException("no files"));
        var r = Adjuster.Adjust(project.Network, project.Options);
        return (r, new ReportContext("optimistic.yaml", TestProjects.RunDate, project.Units));
    }

    [Fact]
    public void TheProjectReallyUsesAnEstimatedFactorFarFromTheAprioriOne()
    {
        var (r, _) = Load();
        Assert.Equal(VarianceFactorBasis.Estimated, r.Analysis.Basis);
        Assert.True(r.Analysis.VarianceFactor > 10 * r.Statistics.AprioriVarianceFactor);
    }

    [Fact]
    public void CoordinateCsvStandardDeviationsMatchItsEllipsesAndNameTheBasis()
    {
        var (r, c) = Load();
        using var reader = Sep.New(',')
            .Reader(o => o with { Unescape = true, CultureInfo = CultureInfo.InvariantCulture })
            .FromText(CoordinateCsvWriter.Write(r, c));
        int checkedRows = 0;
        foreach (var rec in reader)
        {
            Assert.Equal("estimated", rec["variance_factor_basis"].ToString());
            if (rec["ellipse_a_m"].ToString() == "") continue;
            var v = new double[4];
            string[] cols = ["sd_e_m", "sd_n_m", "ellipse_a_m", "ellipse_b_m"];
            for (int i = 0; i < 4; i++) v[i] = double.Parse(rec[cols[i]].ToString(), CultureInfo.InvariantCulture);
            AssertTrace(v[0], v[1], v[2], v[3], 1e-5);
            checkedRows++;
        }
        Assert.Equal(2, checkedRows); // B (weighted) and C (new)
    }

    [Fact]
    public void GeoJsonPointStandardDeviationsMatchTheirEllipsesAndNameTheBasis()
    {
        var (r, c) = Load();
        using var doc = JsonDocument.Parse(GeoJsonWriter.Write(r, c));
        var meta = doc.RootElement.GetProperty("netadjust");
        Assert.Contains("estimated variance factor", meta.GetProperty("standard_deviations").GetString());
        Assert.Contains("estimated variance factor", meta.GetProperty("ellipses").GetString());
        int checkedPoints = 0;
        foreach (var f in doc.RootElement.GetProperty("features").EnumerateArray())
        {
            var p = f.GetProperty("properties");
            if (p.GetProperty("feature").GetString() != "point") continue;
            if (p.GetProperty("ellipse_a").ValueKind == JsonValueKind.Null) continue;
            AssertTrace(p.GetProperty("sd_e").GetDouble(), p.GetProperty("sd_n").GetDouble(),
                p.GetProperty("ellipse_a").GetDouble(), p.GetProperty("ellipse_b").GetDouble(), 1e-5);
            checkedPoints++;
        }
        Assert.Equal(2, checkedPoints);
    }

    [Fact]
    public void LandXmlStandardDeviationsAreAtTheNamedBasisOfTheStatistics()
    {
        var (r, c) = Load();
        XNamespace ns = LandXmlWriter.Namespace;
        var points = XDocument.Parse(LandXmlWriter.Write(r, c)).Root!.Element(ns + "CgPoints")!;
        Assert.Equal("standard deviations at the estimated variance factor", points.Attribute("desc")!.Value);
        var c1 = points.Elements(ns + "CgPoint").Single(e => e.Attribute("name")!.Value == "C");
        var el = r.Analysis.Points[r.Network.IndexOf("C")].Ellipse!.Value;
        double D(string a) => double.Parse(c1.Attribute(a)!.Value, CultureInfo.InvariantCulture);
        AssertTrace(D("eastingStdError"), D("northingStdError"), el.A, el.B, 1e-5);
    }

    [Fact]
    public void TextAndHtmlPointTablesNameTheOneBasisOfTheirValues()
    {
        var (r, c) = Load();
        string text = TextReportWriter.Write(r, c);
        Assert.Contains("ADJUSTED COORDINATES (m; standard deviations at the estimated variance factor)", text);
        // The row of C: id, easting, northing, height "-", sd E, sd N, sd H "-".
        var row = text.Split('\n').First(l => l.StartsWith("  C ", StringComparison.Ordinal))
            .Split(' ', StringSplitOptions.RemoveEmptyEntries);
        var el = r.Analysis.Points[r.Network.IndexOf("C")].Ellipse!.Value;
        double sdE = double.Parse(row[4], CultureInfo.InvariantCulture);
        double sdN = double.Parse(row[5], CultureInfo.InvariantCulture);
        AssertTrace(sdE, sdN, el.A, el.B, 1e-4);
        string html = HtmlReportWriter.Write(r, c);
        Assert.Contains("standard deviations at the estimated variance factor; standard (1σ) error ellipses at the " +
                        "estimated variance factor", html);
    }

    /// <summary>a² + b² = sd_E² + sd_N², compared as the root of each side (lengths), to the file's rounding.</summary>
    private static void AssertTrace(double sdE, double sdN, double a, double b, double tolerance) =>
        Assert.Equal(Math.Sqrt((a * a) + (b * b)), Math.Sqrt((sdE * sdE) + (sdN * sdN)), tolerance);
}
