using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The statistics members of the JSON result (docs/output-format.md): per observation <c>redundancy</c>, <c>w</c>,
/// <c>tau</c>, <c>mdb</c>, <c>external_reliability</c>, <c>flag</c>; per point <c>ellipse</c>; and the sections
/// <c>testing</c>, <c>relative</c>, <c>control_tests</c>, <c>blunder_hunt</c>, <c>robust</c>, <c>variance_components</c>.
/// MDBs of angular observations in arcseconds; ellipse azimuths in degrees; lengths in metres.
/// </summary>
internal static class StatisticsJson
{
    public static void WritePoint(Utf8JsonWriter w, AdjustmentResult r, AdjustedPoint p)
    {
        var pp = r.Analysis.Points[r.Network.IndexOf(p.Id)];
        if (pp.Ellipse is ErrorEllipse e && pp.Confidence is ErrorEllipse c)
        {
            w.WriteStartObject("ellipse");
            w.WriteNumber("a", e.A);
            w.WriteNumber("b", e.B);
            w.WriteNumber("azimuth", e.AzimuthDegrees);
            w.WriteNumber("a95", c.A);
            w.WriteNumber("b95", c.B);
            w.WriteEndObject();
        }
        else w.WriteNull("ellipse");
        JsonResultWriter.NumberOrNull(w, "sd_h95", pp.HeightConfidence);
    }

    public static void WriteObservation(Utf8JsonWriter w, AdjustmentResult r, AdjustedObservation o)
    {
        var t = r.Analysis.Observations[o.Index];
        double k = o.Input.Kind.IsAngular() ? Angle.ArcsecondsPerRadian : 1.0;
        w.WriteBoolean("excluded", o.Input.Excluded);
        if (o.Input.SdFactor != 1.0) w.WriteNumber("sd_factor", o.Input.SdFactor);
        WriteTest(w, t, k);
    }

    private static void WriteTest(Utf8JsonWriter w, ObservationTest t, double k)
    {
        w.WriteNumber("redundancy", t.Redundancy);
        JsonResultWriter.NumberOrNull(w, "w", t.W);
        JsonResultWriter.NumberOrNull(w, "tau", t.Tau);
        JsonResultWriter.NumberOrNull(w, "mdb", t.Mdb * k);
        JsonResultWriter.NumberOrNull(w, "external_reliability", t.ExternalReliability);
        if (t.ExternalReliabilityPoint is null) w.WriteNull("external_reliability_point"); else w.WriteString("external_reliability_point", t.ExternalReliabilityPoint);
        JsonResultWriter.NumberOrNull(w, "bias_to_noise", t.BiasToNoiseRatio);
        if (t.Flag.Name() is string f) w.WriteString("flag", f); else w.WriteNull("flag");
    }

    public static void WriteSections(Utf8JsonWriter w, AdjustmentResult r, ReportContext context)
    {
        var a = r.Analysis;
        w.WriteStartObject("testing");
        w.WriteString("variance_factor_basis", a.Basis == VarianceFactorBasis.Known ? "known" : "estimated");
        w.WriteNumber("variance_factor_used", a.VarianceFactor);
        w.WriteNumber("w_alpha", a.Options.WTestAlpha);
        w.WriteNumber("w_critical", a.WCritical);
        w.WriteNumber("type_ii_error", a.Options.TypeIIError);
        w.WriteNumber("delta0", a.Delta0);
        w.WriteNumber("tau_alpha", a.Options.TauAlpha);
        w.WriteString("tau_adjustment", a.Options.TauAdjustment == MultipleTestAdjustment.Sidak ? "sidak" : "bonferroni");
        JsonResultWriter.NumberOrNull(w, "tau_critical", a.TauCritical);
        w.WriteNumber("confidence", a.Options.ConfidenceLevel);
        w.WriteNumber("ellipse_scale", a.EllipseScale);
        w.WriteNumber("interval_scale", a.IntervalScale);
        w.WriteBoolean("external_reliability_computed", a.ExternalReliabilityComputed);
        w.WriteNumber("redundancy_sum", a.RedundancySum);
        w.WriteEndObject();

        w.WriteStartArray("relative");
        foreach (var rel in a.Relative)
        {
            w.WriteStartObject();
            w.WriteString("from", rel.From);
            w.WriteString("to", rel.To);
            w.WriteNumber("a", rel.Ellipse.A);
            w.WriteNumber("b", rel.Ellipse.B);
            w.WriteNumber("azimuth", rel.Ellipse.AzimuthDegrees);
            w.WriteNumber("a95", rel.Confidence.A);
            w.WriteNumber("b95", rel.Confidence.B);
            w.WriteNumber("distance", rel.Distance);
            w.WriteNumber("sd_distance", rel.SdDistance);
            JsonResultWriter.NumberOrNull(w, "ratio", double.IsFinite(rel.Ratio) ? rel.Ratio : null);
            w.WriteNumber("sd_azimuth", rel.SdAzimuth * Angle.ArcsecondsPerRadian);
            w.WriteBoolean("observed", rel.Observed);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("relative_heights");
        foreach (var rh in a.RelativeHeights)
        {
            w.WriteStartObject();
            w.WriteString("from", rh.From);
            w.WriteString("to", rh.To);
            w.WriteNumber("dh", rh.Difference);
            w.WriteNumber("sd_dh", rh.SdDifference);
            w.WriteNumber("dh95", rh.Confidence);
            w.WriteBoolean("observed", rh.Observed);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("control_tests");
        foreach (var c in a.Control)
        {
            w.WriteStartObject();
            w.WriteString("point", c.PointId);
            w.WriteString("component", c.Component);
            w.WriteNumber("residual", c.Residual);
            WriteTest(w, c.Test, 1.0);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        if (context.Hunt is BlunderHunt h)
        {
            w.WriteStartObject("blunder_hunt");
            w.WriteString("stop_reason", h.StopReason);
            w.WriteStartArray("set_aside");
            foreach (int i in h.SetAside) w.WriteNumberValue(i);
            w.WriteEndArray();
            w.WriteStartArray("rounds");
            foreach (var round in h.Rounds)
            {
                w.WriteStartObject();
                w.WriteNumber("round", round.Round);
                w.WriteNumber("degrees_of_freedom", round.DegreesOfFreedom);
                JsonResultWriter.NumberOrNull(w, "variance_factor", round.VarianceFactor);
                if (round.GlobalTestPassed is bool gp) w.WriteBoolean("global_test_passed", gp); else w.WriteNull("global_test_passed");
                if (round.WorstIndex is int wi) w.WriteNumber("worst_index", wi); else w.WriteNull("worst_index");
                JsonResultWriter.NumberOrNull(w, "worst_statistic", round.WorstStatistic);
                JsonResultWriter.NumberOrNull(w, "critical", round.Critical);
                w.WriteBoolean("set_aside", round.SetAside);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }

        if (context.Robust is RobustEstimate rb)
        {
            w.WriteStartObject("robust");
            w.WriteString("method", rb.Method == RobustMethod.Huber ? "huber" : "danish");
            w.WriteNumber("tuning", rb.Tuning);
            w.WriteNumber("iterations", rb.Iterations);
            w.WriteBoolean("converged", rb.Converged);
            w.WriteStartArray("suspected");
            foreach (int i in rb.Suspected) w.WriteNumberValue(i);
            w.WriteEndArray();
            w.WriteStartArray("observations");
            for (int i = 0; i < rb.WeightFactors.Count; i++)
            {
                w.WriteStartObject();
                w.WriteNumber("index", i);
                w.WriteNumber("weight_factor", rb.WeightFactors[i]);
                JsonResultWriter.NumberOrNull(w, "standardised_residual", rb.Standardised[i]);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }

        if (context.Components is VarianceComponentEstimate vc)
        {
            w.WriteStartObject("variance_components");
            w.WriteNumber("iterations", vc.Iterations);
            w.WriteBoolean("converged", vc.Converged);
            w.WriteStartArray("groups");
            foreach (var g in vc.Groups)
            {
                double k = g.Kind.IsAngular() ? Angle.ArcsecondsPerRadian : 1.0;
                w.WriteStartObject();
                w.WriteString("kind", g.Kind.Name());
                w.WriteNumber("count", g.Count);
                w.WriteNumber("redundancy", g.Redundancy);
                JsonResultWriter.NumberOrNull(w, "variance_factor", g.VarianceFactor);
                JsonResultWriter.NumberOrNull(w, "sd_scale", g.SdScale);
                JsonResultWriter.NumberOrNull(w, "scaled_sd", g.ScaledSd * k);
                JsonResultWriter.NumberOrNull(w, "constant_part", g.ConstantPart);
                JsonResultWriter.NumberOrNull(w, "ppm_part", g.PpmPart);
                if (g.Note is null) w.WriteNull("note"); else w.WriteString("note", g.Note);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
    }
}
