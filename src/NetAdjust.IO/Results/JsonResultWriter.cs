using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes an adjustment result as JSON (format <c>netadjust-result/1</c>, keys in docs/output-format.md).
/// Lengths in metres; angle values in decimal degrees; residuals and standard deviations of angular
/// observations in arcseconds. Output is deterministic: same result, same bytes.
/// </summary>
public static class JsonResultWriter
{
    /// <summary>The format identifier written under <c>format</c>.</summary>
    public const string Format = "netadjust-result/1";

    /// <summary>Renders the result as UTF-8 JSON text.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details (input file, run date).</param>
    public static string Write(AdjustmentResult result, ReportContext context)
    {
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            WriteBody(w, result, context);
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(ms.ToArray()) + "\n";
    }

    /// <summary>Writes the members of one result object (without the enclosing braces).</summary>
    internal static void WriteBody(Utf8JsonWriter w, AdjustmentResult r, ReportContext context)
    {
        w.WriteString("format", Format);
        w.WriteString("project", r.Network.Name);
        w.WriteString("input", context.InputName);
        w.WriteString("run_date", context.RunDate.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture));
        w.WriteString("solver", r.SolverName);
        w.WriteString("datum", r.Options.Datum.Describe());
        w.WriteStartObject("units");
        w.WriteString("length", "m");
        w.WriteString("angle", "deg");
        w.WriteString("angular_residual_and_sd", "arcsec");
        w.WriteEndObject();

        var s = r.Statistics;
        w.WriteStartObject("statistics");
        w.WriteNumber("observations", s.Observations);
        w.WriteNumber("unknowns", s.Unknowns);
        w.WriteNumber("degrees_of_freedom", s.DegreesOfFreedom);
        w.WriteNumber("vtpv", s.Vtpv);
        w.WriteNumber("apriori_variance_factor", s.AprioriVarianceFactor);
        NumberOrNull(w, "variance_factor", s.VarianceFactor);
        NumberOrNull(w, "sigma0", s.Sigma0);
        w.WriteNumber("iterations", s.Iterations);
        w.WriteStartObject("global_test");
        w.WriteNumber("alpha", s.GlobalTest.Alpha);
        w.WriteNumber("statistic", s.GlobalTest.Statistic);
        NumberOrNull(w, "lower", s.GlobalTest.Lower);
        NumberOrNull(w, "upper", s.GlobalTest.Upper);
        if (s.GlobalTest.Passed is bool passed) w.WriteBoolean("passed", passed); else w.WriteNull("passed");
        w.WriteEndObject();
        w.WriteEndObject();

        w.WriteStartArray("points");
        foreach (var p in r.Points)
        {
            w.WriteStartObject();
            w.WriteString("id", p.Id);
            NumberOrNull(w, "e", p.E);
            NumberOrNull(w, "n", p.N);
            NumberOrNull(w, "h", p.H);
            w.WriteString("fixed", FixityText(p.Input.Fixed));
            w.WriteString("weighted", (p.Input.SdE.HasValue ? "e" : "") + (p.Input.SdN.HasValue ? "n" : "") + (p.Input.SdH.HasValue ? "h" : ""));
            NumberOrNull(w, "sd_e", p.SdE);
            NumberOrNull(w, "sd_n", p.SdN);
            NumberOrNull(w, "sd_h", p.SdH);
            NumberOrNull(w, "cov_en", p.CovEN);
            StatisticsJson.WritePoint(w, r, p);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("observations");
        foreach (var o in r.Observations)
        {
            var i = o.Input;
            bool ang = i.Kind.IsAngular();
            double k = ang ? Angle.ArcsecondsPerRadian : 1.0;
            w.WriteStartObject();
            w.WriteNumber("index", o.Index);
            w.WriteString("kind", i.Kind.Name());
            if (i.At is null) w.WriteNull("at"); else w.WriteString("at", i.At);
            w.WriteString("from", i.From);
            w.WriteString("to", i.To);
            if (i is DirectionObservation d) w.WriteString("set", d.SetId);
            w.WriteNumber("observed", ang ? Angle.FromRadians(i.Value).Degrees : i.Value);
            w.WriteNumber("adjusted", ang ? Angle.FromRadians(o.Adjusted).Degrees : o.Adjusted);
            w.WriteNumber("residual", o.Residual * k);
            w.WriteNumber("sd", i.StandardDeviation * k);
            BudgetOutput.WriteComponents(w, o, k);
            w.WriteNumber("sd_adjusted", o.SdAdjusted * k);
            if (i.Source is not null) w.WriteString("source", i.Source);
            StatisticsJson.WriteObservation(w, r, o);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("orientations");
        foreach (var o in r.Orientations)
        {
            w.WriteStartObject();
            w.WriteString("set", o.SetId);
            w.WriteString("station", o.Station);
            w.WriteNumber("orientation", Angle.FromRadians(o.Orientation).Degrees);
            w.WriteNumber("sd", o.Sd * Angle.ArcsecondsPerRadian);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        StatisticsJson.WriteSections(w, r, context);
    }

    internal static string FixityText(Fixity f) =>
        ((f & Fixity.E) != 0 ? "e" : "") + ((f & Fixity.N) != 0 ? "n" : "") + ((f & Fixity.H) != 0 ? "h" : "");

    /// <summary>Writes a finite number, or null for a missing or non-finite value.</summary>
    internal static void NumberOrNull(Utf8JsonWriter w, string name, double? v)
    {
        if (v is double x && double.IsFinite(x)) w.WriteNumber(name, x);
        else w.WriteNull(name);
    }
}
