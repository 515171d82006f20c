using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization.Metadata;
using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;
using NetAdjust.Units;
using NetAdjust.IO.Text;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes an adjustment result as JSON (format <c>netadjust-result/1</c>, keys in docs/output-format.md).
/// Lengths in metres; angle values in decimal degrees; residuals and standard deviations of angular
/// observations in arcseconds. Output is deterministic: same result, same bytes. The document is written member by
/// member with a <see cref="Utf8JsonWriter"/> straight to a stream, the long lists row by row from the report model;
/// the sections of the other procedures (when run) through System.Text.Json's source-generated metadata
/// (<see cref="ResultJsonContext"/>).
/// </summary>
public static partial class JsonResultWriter
{
    /// <summary>The format identifier written under <c>format</c>.</summary>
    public const string Format = "netadjust-result/1";

    /// <summary>Options of the JSON outputs: two-space indentation, LF line ends, non-ASCII text as is
    /// (UTF-8).</summary>
    internal static readonly JsonWriterOptions WriterOptions =
        new() { Indented = true, NewLine = "\n", Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The same options for the serialiser, over the source-generated metadata of <see
    /// cref="ResultJson"/>; made on first use only (the plain adjustment's document needs no metadata).</summary>
    private static readonly Lazy<JsonSerializerOptions> SerializerOptions = new(() =>
        new(ResultJsonContext.Default.Options)
        {
            NewLine = "\n", Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        });

    /// <summary>Renders the result as UTF-8 JSON text.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details (input file, run date).</param>
    public static string Write(AdjustmentResult result, ReportContext context) =>
        Write(ResultReport.Build(result, context));

    /// <summary>Renders the report model's result as UTF-8 JSON text.</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report) => ToText(s => Write(s, report));

    /// <summary>Writes the report model's result as UTF-8 JSON to a stream (ending with a line feed).</summary>
    /// <param name="stream">The stream; left open.</param>
    /// <param name="report">The report model.</param>
    public static void Write(Stream stream, ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentNullException.ThrowIfNull(report);
        using (var sink = new JsonSink(stream)) WriteDocument(sink, report);
        stream.WriteByte((byte)'\n');
    }

    /// <summary>Collects what a stream writer writes as UTF-8 text.</summary>
    internal static string ToText(Action<Stream> write)
    {
        using var ms = new MemoryStream();
        write(ms);
        return Encoding.UTF8.GetString(ms.GetBuffer(), 0, (int)ms.Length);
    }

    private static string Day(DateOnly d) => d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>
    /// Writes a section through the source-generated metadata, as the value of the member <paramref name="name"/>;
    /// nothing (no key) when the section is null.
    /// </summary>
    internal static void Section<T>(Utf8JsonWriter j, JsonEncodedText name, T? section) where T : class
    {
        if (section is null) return;
        j.WritePropertyName(name);
        JsonSerializer.Serialize(j, section, (JsonTypeInfo<T>)SerializerOptions.Value.GetTypeInfo(typeof(T)));
    }

    /// <summary>
    /// Writes the JSON object of one result (the whole <c>netadjust-result/1</c> document, or one of a sequence's
    /// solutions), passing the bytes on to the writer's stream as the rows are written.
    /// </summary>
    internal static void WriteDocument(JsonSink sink, ResultReport report)
    {
        var j = sink.Json;
        var r = report.Result;
        var c = report.Context;
        var s = r.Statistics;
        var g = s.GlobalTest;
        j.WriteStartObject();
        j.WriteString(Keys.Format, Format);
        j.WriteString(Keys.Generator, Results.Generator.Name);
        j.WriteString(Keys.Project, r.Network.Name);
        j.WriteString(Keys.Input, c.InputName);
        j.WriteString(Keys.RunDate, Day(c.RunDate));
        j.WriteString(Keys.Solver, r.SolverName);
        j.WriteString(Keys.Datum, r.Options.Datum.Describe());
        sink.PassWhenFull();
        Section(j, Keys.Survey, c.Particulars is { } sp ? new ResultJson.Particulars(sp.Client, sp.Site, sp.Reference,
            sp.Surveyor, sp.Firm, sp.Observed.Select(Day), sp.Equipment.Select(e => new ResultJson.Equipment(e.Item,
                e.Serial, e.Calibrated is DateOnly d ? Day(d) : null)), sp.Weather, sp.Note) : null);
        if (ReportWarnings.ForJson(c) is { } warnings)
        {
            j.WriteStartArray(Keys.Warnings);
            foreach (var w in warnings) j.WriteStringValue(w);
            j.WriteEndArray();
        }
        j.WriteStartObject(Keys.Units);
        j.WriteString(Keys.Length, "m");
        j.WriteString(Keys.Angle, "deg");
        j.WriteString(Keys.AngularResidualAndSd, "arcsec");
        j.WriteEndObject();

        j.WriteStartObject(Keys.Statistics);
        j.WriteNumber(Keys.Observations, s.Observations);
        j.WriteNumber(Keys.Unknowns, s.Unknowns);
        j.WriteNumber(Keys.DegreesOfFreedom, s.DegreesOfFreedom);
        Real(j, Keys.Vtpv, s.Vtpv);
        Real(j, Keys.AprioriVarianceFactor, s.AprioriVarianceFactor);
        Num(j, Keys.VarianceFactor, s.VarianceFactor);
        Num(j, Keys.Sigma0, s.Sigma0);
        j.WriteNumber(Keys.Iterations, s.Iterations);
        j.WriteStartObject(Keys.GlobalTest);
        Real(j, Keys.Alpha, g.Alpha);
        Real(j, Keys.Statistic, g.Statistic);
        Num(j, Keys.Lower, g.Lower);
        Num(j, Keys.Upper, g.Upper);
        Bool(j, Keys.Passed, g.Passed);
        j.WriteEndObject();
        j.WriteEndObject();

        var element = new JsonRow(); // one buffer for the objects of the long lists
        List(sink, element, Keys.Points, report.Points.Rows, (e, row) => Point(e, r, row));
        List(sink, element, Keys.Observations, report.Observations.Rows, Observation);

        j.WriteStartArray(Keys.Orientations);
        foreach (var o in r.Orientations)
        {
            j.WriteStartObject();
            j.WriteString(Keys.Set, o.SetId);
            j.WriteString(Keys.Station, o.Station);
            Real(j, Keys.Orientation, Angle.FromRadians(o.Orientation).Degrees);
            Real(j, Keys.Sd, o.Sd * Angle.ArcsecondsPerRadian);
            j.WriteEndObject();
            sink.PassWhenFull();
        }
        j.WriteEndArray();

        Section(j, Keys.Refraction, RefractionOutput.Json(r));
        Gnss(sink, element, r, c);
        Testing(j, r.Analysis);

        List(sink, element, Keys.Relative, r.Analysis.Relative, (e, x) =>
        {
            e.WriteString(Keys.From, x.From);
            e.WriteString(Keys.To, x.To);
            e.Real(Keys.A, x.Ellipse.A);
            e.Real(Keys.B, x.Ellipse.B);
            e.Real(Keys.Azimuth, x.Ellipse.AzimuthDegrees);
            e.Real(Keys.A95, x.Confidence.A);
            e.Real(Keys.B95, x.Confidence.B);
            e.Real(Keys.Distance, x.Distance);
            e.Real(Keys.SdDistance, x.SdDistance);
            e.Num(Keys.Ratio, x.Ratio);
            e.Real(Keys.SdAzimuth, x.SdAzimuth * Angle.ArcsecondsPerRadian);
            e.WriteBoolean(Keys.Observed, x.Observed);
        });
        List(sink, element, Keys.RelativeHeights, r.Analysis.RelativeHeights, (e, x) =>
        {
            e.WriteString(Keys.From, x.From);
            e.WriteString(Keys.To, x.To);
            e.Real(Keys.Dh, x.Difference);
            e.Real(Keys.SdDh, x.SdDifference);
            e.Real(Keys.Dh95, x.Confidence);
            e.WriteBoolean(Keys.Observed, x.Observed);
        });
        List(sink, element, Keys.ControlTests, r.Analysis.Control, (e, x) =>
        {
            e.WriteString(Keys.Point, x.PointId);
            e.WriteString(Keys.Component, ObservationLabels.ComponentKey(x.Component));
            e.Real(Keys.Residual, x.Residual);
            Reliability(e, x.Test, 1.0);
        });

        Section(j, Keys.BlunderHunt, c.Hunt is BlunderHunt h ? Hunt(h) : null);
        Section(j, Keys.Diagnosis, DiagnosisOutput.Json(report));
        if (c.Robust is RobustEstimate rb) Robust(sink, rb);
        Section(j, Keys.VarianceComponents, c.Components is VarianceComponentEstimate vc ? Components(vc) : null);
        Section(j, Keys.Rounds, RoundsReport.Json(c));
        Section(j, Keys.Grid, GridReport.Json(r, c));
        Misclosures(sink, element, c.Misclosures);
        Section(j, Keys.Standards, ResultJson.Standards.Of(c.Standards));
        j.WriteEndObject();
        sink.Pass();
    }

    /// <summary>A long list of the document: one object per item, rendered by <paramref name="element"/> and passed
    /// on to the stream as the list grows.</summary>
    private static void List<T>(JsonSink sink, JsonRow element, JsonEncodedText name, IEnumerable<T> items,
        Action<JsonRow, T> write)
    {
        var j = sink.Json;
        j.WriteStartArray(name);
        foreach (var item in items)
        {
            write(element.Start(j), item);
            element.WriteTo(j);
            sink.PassWhenFull();
        }
        j.WriteEndArray();
    }

    private static void Point(JsonRow j, AdjustmentResult r, PointRow row)
    {
        // The JSON keeps its documented a-priori standard deviations (docs/output-format.md), beside the
        // ellipse at the variance factor named under testing.variance_factor_basis.
        var p = row.Source;
        var pp = r.Analysis.Points[r.Network.IndexOf(p.Id)];
        j.WriteString(Keys.Id, p.Id);
        j.Num(Keys.E, p.E);
        j.Num(Keys.N, p.N);
        j.Num(Keys.H, p.H);
        j.WriteString(Keys.Fixed, row.Held);
        j.WriteString(Keys.Weighted, row.Weighted);
        j.Num(Keys.SdE, p.SdE);
        j.Num(Keys.SdN, p.SdN);
        j.Num(Keys.SdH, p.SdH);
        j.Num(Keys.CovEN, p.CovEN);
        if (pp.Ellipse is ErrorEllipse e && pp.Confidence is ErrorEllipse k)
        {
            j.WriteStartObject(Keys.Ellipse);
            j.Real(Keys.A, e.A);
            j.Real(Keys.B, e.B);
            j.Real(Keys.Azimuth, e.AzimuthDegrees);
            j.Real(Keys.A95, k.A);
            j.Real(Keys.B95, k.B);
            j.WriteEndObject();
        }
        else j.WriteNull(Keys.Ellipse);
        j.Num(Keys.SdH95, pp.HeightConfidence);
    }

    private static void Observation(JsonRow j, ObservationRow row)
    {
        var o = row.Source;
        var i = o.Input;
        double k = ObservationLabels.JsonSmallFactor(i.Kind);
        j.WriteNumber(Keys.Index, o.Index);
        j.WriteString(Keys.Kind, ObservationLabels.Key(i.Kind));
        j.WriteString(Keys.At, ObservationLabels.Station(i));
        j.WriteString(Keys.From, i.From);
        j.WriteString(Keys.To, i.To);
        if ((i as Network.DirectionObservation)?.SetId is string set) j.WriteString(Keys.Set, set);
        j.Real(Keys.Observed, ObservationLabels.JsonValue(i.Kind, i.Value));
        j.Real(Keys.Adjusted, ObservationLabels.JsonValue(i.Kind, o.Adjusted));
        j.Real(Keys.Residual, o.Residual * k);
        j.Real(Keys.Sd, i.StandardDeviation * k);
        j.WriteStartObject(Keys.SdComponents);
        if (ResultReport.BudgetOf(o) is { } budget)
        {
            // one member per name, as a dictionary keeps them (a repeated name is an error of the budget)
            var names = new HashSet<string>(StringComparer.Ordinal);
            foreach (var ct in budget.Contributions)
            {
                if (!names.Add(ct.Name))
                    throw new ArgumentException($"error budget of observation {o.Index + 1}: '{ct.Name}' twice");
                j.Real(ct.Name, ct.Value * k);
            }
        }
        else j.Real(Keys.Stated, i.StandardDeviation * k);
        j.WriteEndObject();
        j.Real(Keys.SdAdjusted, o.SdAdjusted * k);
        if (i.Source is string source) j.WriteString(Keys.Source, source);
        j.WriteBoolean(Keys.Excluded, i.Excluded);
        if (i.SdFactor != 1.0) j.Real(Keys.SdFactor, i.SdFactor);
        Reliability(j, row.Test, k);
    }

    /// <summary>The test members of an observation or control component (MDB in JSON units by <paramref name="k"/>),
    /// written last in its object.</summary>
    private static void Reliability(JsonRow j, ObservationTest t, double k)
    {
        j.Real(Keys.Redundancy, t.Redundancy);
        j.Num(Keys.W, t.W);
        j.Num(Keys.Tau, t.Tau);
        j.Num(Keys.Mdb, t.Mdb * k);
        j.Num(Keys.ExternalReliability, t.ExternalReliability);
        j.WriteString(Keys.ExternalReliabilityPoint, t.ExternalReliabilityPoint);
        j.Num(Keys.BiasToNoise, t.BiasToNoiseRatio);
        j.WriteString(Keys.Flag, t.Flag.Name());
    }

    private static void Testing(Utf8JsonWriter j, NetworkAnalysis a)
    {
        j.WriteStartObject(Keys.Testing);
        j.WriteString(Keys.VarianceFactorBasis, a.Basis == VarianceFactorBasis.Known ? "known" : "estimated");
        Real(j, Keys.VarianceFactorUsed, a.VarianceFactor);
        Real(j, Keys.WAlpha, a.Options.WTestAlpha);
        Real(j, Keys.WCritical, a.WCritical);
        Real(j, Keys.TypeIIError, a.Options.TypeIIError);
        Real(j, Keys.Delta0, a.Delta0);
        Real(j, Keys.TauAlpha, a.Options.TauAlpha);
        j.WriteString(Keys.TauAdjustment, a.Options.TauAdjustment == MultipleTestAdjustment.Sidak ? "sidak"
            : "bonferroni");
        Num(j, Keys.TauCritical, a.TauCritical);
        Real(j, Keys.Confidence, a.Options.ConfidenceLevel);
        Real(j, Keys.EllipseScale, a.EllipseScale);
        Real(j, Keys.IntervalScale, a.IntervalScale);
        j.WriteBoolean(Keys.ExternalReliabilityComputed, a.ExternalReliabilityComputed);
        Real(j, Keys.RedundancySum, a.RedundancySum);
        j.WriteEndObject();
    }

    private static ResultJson.BlunderHunt Hunt(BlunderHunt h) => new(h.StopReason, h.SetAside,
        h.Rounds.Select(x => new ResultJson.HuntRound(x.Round, x.DegreesOfFreedom, Finite(x.VarianceFactor),
            x.GlobalTestPassed, x.WorstIndex, Finite(x.WorstStatistic), Finite(x.Critical), x.SetAside)));

    /// <summary>The robust estimation (key <c>robust</c>), its rows one per observation.</summary>
    private static void Robust(JsonSink sink, RobustEstimate rb)
    {
        var j = sink.Json;
        j.WriteStartObject(Keys.Robust);
        j.WriteString(Keys.Method, rb.Method == RobustMethod.Huber ? "huber" : "danish");
        Real(j, Keys.Tuning, rb.Tuning);
        j.WriteNumber(Keys.Iterations, rb.Iterations);
        j.WriteBoolean(Keys.Converged, rb.Converged);
        j.WriteStartArray(Keys.Suspected);
        foreach (int i in rb.Suspected) j.WriteNumberValue(i);
        j.WriteEndArray();
        j.WriteStartArray(Keys.Observations);
        for (int i = 0; i < rb.WeightFactors.Count; i++)
        {
            j.WriteStartObject();
            j.WriteNumber(Keys.Index, i);
            Real(j, Keys.WeightFactor, rb.WeightFactors[i]);
            Num(j, Keys.StandardisedResidual, rb.Standardised[i]);
            j.WriteEndObject();
            sink.PassWhenFull();
        }
        j.WriteEndArray();
        j.WriteEndObject();
    }

    private static ResultJson.VarianceComponents Components(VarianceComponentEstimate vc) => new(vc.Iterations,
        vc.Converged, vc.Groups.Select(g => new ResultJson.ComponentGroup(ObservationLabels.Key(g.Kind), g.Count,
            g.Redundancy, Finite(g.VarianceFactor), Finite(g.SdScale),
            Finite(g.ScaledSd * ObservationLabels.JsonSmallFactor(g.Kind)),
            Finite(g.ConstantPart), Finite(g.PpmPart), g.Note) { Group = g.Group }));

    /// <summary>A number member: the value when finite, else null (a missing or non-finite value).</summary>
    internal static void Num(Utf8JsonWriter j, JsonEncodedText name, double? v)
    {
        if (v is double x && double.IsFinite(x)) Real(j, name, x);
        else j.WriteNull(name);
    }

    /// <summary>A number member, as <see cref="Utf8JsonWriter.WriteNumber(JsonEncodedText, double)"/> writes it (the
    /// shortest text that reads back to the value), most values formatted by <see cref="NumberText"/>'s faster path.
    /// </summary>
    internal static void Real(Utf8JsonWriter j, JsonEncodedText name, double x)
    {
        j.WritePropertyName(name);
        RealValue(j, x);
    }

    /// <inheritdoc cref="Real(Utf8JsonWriter, JsonEncodedText, double)"/>
    internal static void Real(Utf8JsonWriter j, string name, double x)
    {
        j.WritePropertyName(name);
        RealValue(j, x);
    }

    private static void RealValue(Utf8JsonWriter j, double x)
    {
        Span<byte> text = stackalloc byte[32];
        if (NumberText.TryShortest(x, text, out int n)) j.WriteRawValue(text[..n], skipInputValidation: true);
        else j.WriteNumberValue(x);
    }

    private static void Bool(Utf8JsonWriter j, JsonEncodedText name, bool? v)
    {
        if (v is bool b) j.WriteBoolean(name, b);
        else j.WriteNull(name);
    }

    /// <summary>A finite number, or null for a missing or non-finite value (written as JSON null).</summary>
    internal static double? Finite(double? v) => v is double x && double.IsFinite(x) ? x : null;
}
