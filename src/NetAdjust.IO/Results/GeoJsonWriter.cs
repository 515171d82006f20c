using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the network as GeoJSON for GIS: the points (with their standard deviations and ellipse axes), one line
/// per observation between points with plan positions, and each standard error ellipse as a polygon at true size.
/// Coordinates are the project's plane grid coordinates [easting, northing(, height)] in the project's length unit.
/// When the project declares a coordinate reference system (<c>crs: EPSG:code</c>) it is written in the
/// <c>crs</c> member that GIS readers understand (the 2008 GeoJSON form); otherwise the file states
/// <c>"coordinates": "local"</c> under the <c>netadjust</c> member. Either way the file departs from RFC 7946,
/// which allows only WGS 84 longitude and latitude: docs/output-format.md says how to read it.
/// </summary>
public static class GeoJsonWriter
{
    /// <summary>The format identifier written under <c>netadjust.format</c>.</summary>
    public const string Format = "netadjust-geojson/1";

    /// <summary>Vertices of each ellipse polygon (the ring is closed by repeating the first).</summary>
    public const int EllipseVertices = 72;

    /// <summary>Decimals written for coordinates (in the length unit).</summary>
    public const int Decimals = 6;

    /// <summary>Renders the GeoJSON text.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details: the run date, the length unit and the coordinate reference system.</param>
    public static string Write(AdjustmentResult result, ReportContext context) =>
        Write(ResultReport.Build(result, context));

    /// <summary>Renders the GeoJSON text of the report model.</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report) => JsonResultWriter.ToText(s => Write(s, report));

    /// <summary>Writes the GeoJSON of the report model to a stream (UTF-8, ending with a line feed).</summary>
    /// <param name="stream">The stream; left open.</param>
    /// <param name="report">The report model.</param>
    public static void Write(Stream stream, ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentNullException.ThrowIfNull(report);
        var result = report.Result;
        var context = report.Context;
        var unit = context.Units.Length;
        double k = 1.0 / unit.MetresPerUnit;
        using (var j = new Utf8JsonWriter(stream, JsonResultWriter.WriterOptions))
        {
            j.WriteStartObject();
            j.WriteString("type", "FeatureCollection");
            j.WriteString("name", result.Network.Name);
            if (context.Crs is string crs)
            {
                j.WriteStartObject("crs");
                j.WriteString("type", "name");
                j.WriteStartObject("properties");
                j.WriteString("name", "urn:ogc:def:crs:EPSG::" + crs[(crs.IndexOf(':') + 1)..]);
                j.WriteEndObject();
                j.WriteEndObject();
            }
            j.WriteStartObject("netadjust");
            j.WriteString("format", Format);
            j.WriteString("generator", Generator.Name);
            j.WriteString("input", context.InputName);
            j.WriteString("run_date",
                context.RunDate.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture));
            j.WriteString("coordinates", context.Crs is null ? "local" : context.Crs);
            j.WriteString("axis_order", "easting, northing, height");
            j.WriteString("length_unit", unit.Symbol);
            if (context.Solution is string solution) j.WriteString("solution", solution);
            j.WriteString("ellipses",
                "standard (1 sigma) absolute error ellipses at true size, at " + report.Basis.Words);
            j.WriteString("standard_deviations", "standard (1 sigma), at " + report.Basis.Words);
            j.WriteString("residual_units", "m for lengths, arcsec for angles");
            j.WriteEndObject();

            j.WriteStartArray("features");
            var plan = new Dictionary<string, AdjustedPoint>(StringComparer.Ordinal);
            foreach (var row in report.Points.Rows)
            {
                if (!row.HasPlan) continue;
                var p = row.Source;
                plan[p.Id] = p;
                var el = row.Ellipse;
                j.WriteStartObject();
                j.WriteString("type", "Feature");
                j.WriteString("id", "point:" + p.Id);
                j.WriteStartObject("geometry");
                j.WriteString("type", "Point");
                j.WriteStartArray("coordinates");
                Num(j, p.E!.Value * k); Num(j, p.N!.Value * k);
                if (p.H is double h) Num(j, h * k);
                j.WriteEndArray();
                j.WriteEndObject();
                j.WriteStartObject("properties");
                j.WriteString("feature", "point");
                j.WriteString("id", p.Id);
                j.WriteString("role", ReportFigures.RoleText(row.Role));
                NumOrNull(j, "sd_e", row.SdE * k);
                NumOrNull(j, "sd_n", row.SdN * k);
                NumOrNull(j, "sd_h", row.SdH * k);
                NumOrNull(j, "ellipse_a", el?.A * k);
                NumOrNull(j, "ellipse_b", el?.B * k);
                NumOrNull(j, "ellipse_azimuth_deg", row.EllipseAzimuthDegrees);
                j.WriteEndObject();
                j.WriteEndObject();
                FlushWhenFull(j);
            }

            foreach (var row in report.Observations.Rows)
            {
                var o = row.Source;
                var i = o.Input;
                string[] ids = i.Kind == ObservationKind.Angle ? [i.From, i.At!, i.To] : [i.From, i.To];
                if (!ids.All(plan.ContainsKey)) continue;
                bool ang = ObservationLabels.IsAngular(i.Kind);
                double rk = ObservationLabels.JsonSmallFactor(i.Kind);
                double? wi = row.W;
                j.WriteStartObject();
                j.WriteString("type", "Feature");
                j.WriteString("id", "observation:" + (o.Index +
                    1).ToString(System.Globalization.CultureInfo.InvariantCulture));
                j.WriteStartObject("geometry");
                j.WriteString("type", "LineString");
                j.WriteStartArray("coordinates");
                foreach (var id in ids)
                {
                    j.WriteStartArray();
                    Num(j, plan[id].E!.Value * k); Num(j, plan[id].N!.Value * k);
                    j.WriteEndArray();
                }
                j.WriteEndArray();
                j.WriteEndObject();
                j.WriteStartObject("properties");
                j.WriteString("feature", "observation");
                j.WriteNumber("number", o.Index + 1);
                j.WriteString("kind", ObservationLabels.Key(i.Kind));
                if (ObservationLabels.Station(i) is not string at) j.WriteNull("at"); else j.WriteString("at", at);
                j.WriteString("from", i.From);
                j.WriteString("to", i.To);
                j.WriteNumber("residual", Math.Round(o.Residual * rk, ang ? 3 : 6));
                j.WriteNumber("sd", Math.Round(i.StandardDeviation * rk, ang ? 3 : 6));
                NumOrNull(j, "w", wi is double x ? Math.Round(x, 3) : null);
                if (wi is not null) j.WriteBoolean("w_test_failed", row.FailsWTest);
                else j.WriteNull("w_test_failed");
                j.WriteEndObject();
                j.WriteEndObject();
                FlushWhenFull(j);
            }

            foreach (var row in report.Points.Rows)
            {
                if (row.Ellipse is not ErrorEllipse el) continue;
                var p = row.Source;
                j.WriteStartObject();
                j.WriteString("type", "Feature");
                j.WriteString("id", "ellipse:" + p.Id);
                j.WriteStartObject("geometry");
                j.WriteString("type", "Polygon");
                j.WriteStartArray("coordinates");
                j.WriteStartArray();
                foreach (var (e, n) in EllipseRing(p.E!.Value, p.N!.Value, el, EllipseVertices))
                {
                    j.WriteStartArray();
                    Num(j, e * k); Num(j, n * k);
                    j.WriteEndArray();
                }
                j.WriteEndArray();
                j.WriteEndArray();
                j.WriteEndObject();
                j.WriteStartObject("properties");
                j.WriteString("feature", "ellipse");
                j.WriteString("id", p.Id);
                j.WriteString("level", "standard (1 sigma)");
                Num(j, "a", el.A * k);
                Num(j, "b", el.B * k);
                j.WriteNumber("azimuth_deg", row.EllipseAzimuthDegrees!.Value);
                j.WriteEndObject();
                j.WriteEndObject();
                FlushWhenFull(j);
            }
            j.WriteEndArray();
            j.WriteEndObject();
        }
        stream.WriteByte((byte)'\n');
    }

    /// <summary>
    /// The closed ring of an ellipse polygon, counter-clockwise (RFC 7946 §3.1.6), in metres: the point at
    /// parameter t is centre + a cos t · u + b sin t · v, with u the unit vector at the azimuth of a and v at the
    /// azimuth of a − 90° (so that increasing t turns counter-clockwise).
    /// </summary>
    internal static IEnumerable<(double E, double N)> EllipseRing(double e0, double n0, ErrorEllipse el, int vertices)
    {
        double ue = Math.Sin(el.Azimuth), un = Math.Cos(el.Azimuth);
        double ve = -un, vn = ue;
        for (int i = 0; i <= vertices; i++)
        {
            double t = 2 * Math.PI * (i % vertices) / vertices;
            double c = Math.Cos(t) * el.A, s = Math.Sin(t) * el.B;
            yield return (e0 + (c * ue) + (s * ve), n0 + (c * un) + (s * vn));
        }
    }

    /// <summary>Bytes a JSON writer gathers before it passes them on to its stream.</summary>
    internal const int FlushThreshold = 1 << 16;

    /// <summary>Passes what the writer holds on to its stream once it holds <see cref="FlushThreshold"/> bytes (a
    /// <see cref="Utf8JsonWriter"/> over a stream writes only when flushed).</summary>
    internal static void FlushWhenFull(Utf8JsonWriter j)
    {
        if (j.BytesPending >= FlushThreshold) j.Flush();
    }

    private static void Num(Utf8JsonWriter j, double v) => j.WriteNumberValue(Math.Round(v, Decimals));

    private static void Num(Utf8JsonWriter j, string name, double v) => j.WriteNumber(name, Math.Round(v, Decimals));

    private static void NumOrNull(Utf8JsonWriter j, string name, double? v)
    {
        if (v is double x && double.IsFinite(x)) j.WriteNumber(name, Math.Round(x, Decimals));
        else j.WriteNull(name);
    }
}
