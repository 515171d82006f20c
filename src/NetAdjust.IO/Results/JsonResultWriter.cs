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

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes an adjustment result as JSON (format <c>netadjust-result/1</c>, keys in docs/output-format.md).
/// Lengths in metres; angle values in decimal degrees; residuals and standard deviations of angular
/// observations in arcseconds. Output is deterministic: same result, same bytes. The document is serialised by
/// System.Text.Json (source-generated, <see cref="ResultJsonContext"/>) straight to a stream.
/// </summary>
public static class JsonResultWriter
{
    /// <summary>The format identifier written under <c>format</c>.</summary>
    public const string Format = "netadjust-result/1";

    /// <summary>Options of the JSON outputs: two-space indentation, LF line ends, non-ASCII text as is
    /// (UTF-8).</summary>
    internal static readonly JsonWriterOptions WriterOptions =
        new() { Indented = true, NewLine = "\n", Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    /// <summary>The same options for the serialiser, over the source-generated metadata of <see
    /// cref="ResultJson"/>.</summary>
    private static readonly JsonSerializerOptions SerializerOptions = new(ResultJsonContext.Default.Options)
    {
        NewLine = "\n", Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

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
        ArgumentNullException.ThrowIfNull(report);
        Serialise(stream, Document(report));
    }

    /// <summary>
    /// Serialises a document to a stream, then a line feed. The serialiser works from metadata (no fast path), so it
    /// writes in chunks of about its buffer size while it enumerates the rows: no whole document is held in memory.
    /// </summary>
    internal static void Serialise<T>(Stream stream, T document)
    {
        ArgumentNullException.ThrowIfNull(stream);
        JsonSerializer.Serialize(stream, document, (JsonTypeInfo<T>)SerializerOptions.GetTypeInfo(typeof(T)));
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

    /// <summary>The JSON document of one result.</summary>
    internal static ResultJson.Document Document(ResultReport report)
    {
        var r = report.Result;
        var c = report.Context;
        var s = r.Statistics;
        var g = s.GlobalTest;
        return new ResultJson.Document
        {
            Format = Format,
            Generator = Results.Generator.Name,
            Project = r.Network.Name,
            Input = c.InputName,
            RunDate = c.RunDate.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
            Solver = r.SolverName,
            Datum = r.Options.Datum.Describe(),
            Survey = c.Particulars is { } sp ? new(sp.Client, sp.Site, sp.Reference, sp.Surveyor, sp.Firm,
                sp.Observed.Select(Day), sp.Equipment.Select(e => new ResultJson.Equipment(e.Item, e.Serial,
                    e.Calibrated is DateOnly d ? Day(d) : null)), sp.Weather, sp.Note) : null,
            Warnings = ReportWarnings.ForJson(c),
            Units = new("m", "deg", "arcsec"),
            Statistics = new(s.Observations, s.Unknowns, s.DegreesOfFreedom, s.Vtpv, s.AprioriVarianceFactor,
                Finite(s.VarianceFactor), Finite(s.Sigma0), s.Iterations,
                new(g.Alpha, g.Statistic, Finite(g.Lower), Finite(g.Upper), g.Passed)),
            Points = report.Points.Rows.Select(p => Point(r, p)),
            Observations = report.Observations.Rows.Select(Observation),
            Orientations = r.Orientations.Select(o =>
                new ResultJson.Orientation(o.SetId, o.Station, Angle.FromRadians(o.Orientation).Degrees,
                    o.Sd * Angle.ArcsecondsPerRadian)),
            Refraction = RefractionOutput.Json(r),
            Gnss = BaselineSection.Json(r, c),
            Testing = Testing(r.Analysis),
            Relative = r.Analysis.Relative.Select(x => new ResultJson.Relative(x.From, x.To, x.Ellipse.A, x.Ellipse.B,
                x.Ellipse.AzimuthDegrees, x.Confidence.A, x.Confidence.B, x.Distance, x.SdDistance, Finite(x.Ratio),
                x.SdAzimuth * Angle.ArcsecondsPerRadian, x.Observed)),
            RelativeHeights = r.Analysis.RelativeHeights.Select(x =>
                new ResultJson.RelativeHeight(x.From, x.To, x.Difference, x.SdDifference, x.Confidence, x.Observed)),
            ControlTests = r.Analysis.Control.Select(x => Fill(new ResultJson.ControlTest
            {
                Point = x.PointId, Component = ObservationLabels.ComponentKey(x.Component), Residual = x.Residual,
                Redundancy = 0, W = null, Tau = null, Mdb = null, ExternalReliability = null,
                ExternalReliabilityPoint = null, BiasToNoise = null, Flag = null,
            }, x.Test, 1.0)),
            BlunderHunt = c.Hunt is BlunderHunt h ? Hunt(h) : null,
            Diagnosis = DiagnosisOutput.Json(report),
            Robust = c.Robust is RobustEstimate rb ? Robust(rb) : null,
            VarianceComponents = c.Components is VarianceComponentEstimate vc ? Components(vc) : null,
            Rounds = RoundsReport.Json(c),
            Grid = GridReport.Json(r, c),
            Misclosures = ResultJson.Misclosures.Of(c.Misclosures),
            Standards = ResultJson.Standards.Of(c.Standards),
        };
    }

    private static ResultJson.Point Point(AdjustmentResult r, PointRow row)
    {
        // The JSON keeps its documented a-priori standard deviations (docs/output-format.md), beside the
        // ellipse at the variance factor named under testing.variance_factor_basis.
        var p = row.Source;
        var pp = r.Analysis.Points[r.Network.IndexOf(p.Id)];
        var ellipse = pp.Ellipse is ErrorEllipse e && pp.Confidence is ErrorEllipse k
            ? new ResultJson.Ellipse(e.A, e.B, e.AzimuthDegrees, k.A, k.B) : null;
        return new(p.Id, Finite(p.E), Finite(p.N), Finite(p.H), row.Held, row.Weighted, Finite(p.SdE), Finite(p.SdN),
            Finite(p.SdH), Finite(p.CovEN), ellipse, Finite(pp.HeightConfidence));
    }

    private static ResultJson.Observation Observation(ObservationRow row)
    {
        var o = row.Source;
        var i = o.Input;
        double k = ObservationLabels.JsonSmallFactor(i.Kind);
        var components = new Dictionary<string, double>(StringComparer.Ordinal);
        if (ResultReport.BudgetOf(o) is { } budget)
            foreach (var ct in budget.Contributions) components.Add(ct.Name, ct.Value * k);
        else components.Add(BudgetOutput.Stated, i.StandardDeviation * k);
        return Fill(new ResultJson.Observation
        {
            Index = o.Index,
            Kind = ObservationLabels.Key(i.Kind),
            At = ObservationLabels.Station(i),
            From = i.From,
            To = i.To,
            Set = (i as Network.DirectionObservation)?.SetId,
            Observed = ObservationLabels.JsonValue(i.Kind, i.Value),
            Adjusted = ObservationLabels.JsonValue(i.Kind, o.Adjusted),
            Residual = o.Residual * k,
            Sd = i.StandardDeviation * k,
            SdComponents = components,
            SdAdjusted = o.SdAdjusted * k,
            Source = i.Source,
            Excluded = i.Excluded,
            SdFactor = i.SdFactor != 1.0 ? i.SdFactor : null,
            Redundancy = 0, W = null, Tau = null, Mdb = null, ExternalReliability = null,
            ExternalReliabilityPoint = null, BiasToNoise = null, Flag = null,
        }, row.Test, k);
    }

    /// <summary>The test members of an observation or control component (MDB in JSON units by <paramref name="k"/>).
    /// </summary>
    private static T Fill<T>(T row, ObservationTest t, double k) where T : ResultJson.Reliability => row with
    {
        Redundancy = t.Redundancy,
        W = Finite(t.W),
        Tau = Finite(t.Tau),
        Mdb = Finite(t.Mdb * k),
        ExternalReliability = Finite(t.ExternalReliability),
        ExternalReliabilityPoint = t.ExternalReliabilityPoint,
        BiasToNoise = Finite(t.BiasToNoiseRatio),
        Flag = t.Flag.Name(),
    };

    private static ResultJson.Testing Testing(NetworkAnalysis a) => new(
        a.Basis == VarianceFactorBasis.Known ? "known" : "estimated", a.VarianceFactor, a.Options.WTestAlpha,
        a.WCritical, a.Options.TypeIIError, a.Delta0, a.Options.TauAlpha,
        a.Options.TauAdjustment == MultipleTestAdjustment.Sidak ? "sidak" : "bonferroni", Finite(a.TauCritical),
        a.Options.ConfidenceLevel, a.EllipseScale, a.IntervalScale, a.ExternalReliabilityComputed, a.RedundancySum);

    private static ResultJson.BlunderHunt Hunt(BlunderHunt h) => new(h.StopReason, h.SetAside,
        h.Rounds.Select(x => new ResultJson.HuntRound(x.Round, x.DegreesOfFreedom, Finite(x.VarianceFactor),
            x.GlobalTestPassed, x.WorstIndex, Finite(x.WorstStatistic), Finite(x.Critical), x.SetAside)));

    private static ResultJson.Robust Robust(RobustEstimate rb) => new(
        rb.Method == RobustMethod.Huber ? "huber" : "danish", rb.Tuning, rb.Iterations, rb.Converged, rb.Suspected,
        Enumerable.Range(0, rb.WeightFactors.Count).Select(i =>
            new ResultJson.RobustObservation(i, rb.WeightFactors[i], Finite(rb.Standardised[i]))));

    private static ResultJson.VarianceComponents Components(VarianceComponentEstimate vc) => new(vc.Iterations,
        vc.Converged, vc.Groups.Select(g => new ResultJson.ComponentGroup(ObservationLabels.Key(g.Kind), g.Count,
            g.Redundancy, Finite(g.VarianceFactor), Finite(g.SdScale),
            Finite(g.ScaledSd * ObservationLabels.JsonSmallFactor(g.Kind)),
            Finite(g.ConstantPart), Finite(g.PpmPart), g.Note) { Group = g.Group }));

    /// <summary>A finite number, or null for a missing or non-finite value (written as JSON null).</summary>
    internal static double? Finite(double? v) => v is double x && double.IsFinite(x) ? x : null;
}
