using NetAdjust.Adjustment;
using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

public static partial class JsonResultWriter
{
    /// <summary>
    /// Key <c>gnss</c> (docs/output-format.md, "GNSS baselines"; left out when there are no baselines): the frame,
    /// one row per baseline (lengths in metres; the component tests of its ΔX, ΔY, ΔZ), and the frame parameters
    /// (rotations in arcseconds, the scale difference in ppm) when estimated. A national network has hundreds of
    /// thousands of baselines: the rows go to the stream as they are made, as the observations' do.
    /// </summary>
    private static void Gnss(JsonSink sink, JsonRow element, AdjustmentResult r, ReportContext c)
    {
        var tests = BaselineSection.Tests(r);
        if (tests.Count == 0) return;
        var j = sink.Json;
        var a = r.Analysis;
        j.WriteStartObject(Keys.Gnss);
        j.WriteString(Keys.Frame, c.GnssFrame);
        List(sink, element, Keys.Baselines, tests, (e, t) =>
        {
            var b = (BaselineObservation)r.Network.Observations[t.Rows[0]];
            e.WriteString(Keys.Id, t.BaselineId);
            e.WriteString(Keys.From, t.From);
            e.WriteString(Keys.To, t.To);
            e.WriteString(Keys.Group, b.Group);
            e.Real(Keys.Scale, b.GroupScale);
            e.Real(Keys.Dx, b.Dx.Metres);
            e.Real(Keys.Dy, b.Dy.Metres);
            e.Real(Keys.Dz, b.Dz.Metres);
            e.WriteStartObject(Keys.Residual);
            e.Real(Keys.X, t.Residual.X);
            e.Real(Keys.Y, t.Residual.Y);
            e.Real(Keys.Z, t.Residual.Z);
            e.WriteEndObject();
            Local(e, Keys.LocalResidual, t.LocalResidual);
            e.WriteStartObject(Keys.VectorTest);
            e.Num(Keys.Statistic, t.Statistic);
            e.WriteNumber(Keys.Dimension, t.Dimension);
            e.Num(Keys.Critical, t.CriticalValue);
            e.WriteBoolean(Keys.Passed, t.Passed);
            e.WriteEndObject();
            e.WriteStartArray(Keys.Components);
            foreach (int i in t.Rows)
            {
                var o = (BaselineObservation)r.Network.Observations[i];
                var x = a.Observations[i];
                e.WriteStartObject();
                e.WriteString(Keys.Component, o.Component.ToString().ToLowerInvariant());
                e.WriteNumber(Keys.Index, i);
                e.Real(Keys.Redundancy, x.Redundancy);
                e.Num(Keys.W, x.W);
                e.Num(Keys.Mdb, x.Mdb);
                e.Num(Keys.ExternalReliability, x.ExternalReliability);
                e.WriteString(Keys.Flag, x.Flag.Name());
                e.WriteEndObject();
            }
            e.WriteEndArray();
            if (t.LocalW is { } w) Local(e, Keys.LocalW, w);
            else e.WriteNull(Keys.LocalW);
            if (t.LocalMdb is { } m) Local(e, Keys.LocalMdb, m);
            else e.WriteNull(Keys.LocalMdb);
        });
        if (r.FrameParameters.Count > 0)
            List(sink, element, Keys.FrameParameters, r.FrameParameters, (e, p) =>
            {
                e.WriteString(Keys.Frame, p.Frame);
                e.WriteString(Keys.Parameter, BaselineSection.FrameKey(p.Parameter));
                e.Real(Keys.Value, BaselineSection.FrameValue(p.Parameter, p.Value));
                e.Real(Keys.Sd, BaselineSection.FrameValue(p.Parameter, p.Sd));
            });
        j.WriteEndObject();

        // north, east, up (in that order), each null when not known
        static void Local(JsonRow e, System.Text.Json.JsonEncodedText name, (double North, double East, double Up) v)
        {
            e.WriteStartObject(name);
            e.Num(Keys.North, v.North);
            e.Num(Keys.East, v.East);
            e.Num(Keys.Up, v.Up);
            e.WriteEndObject();
        }
    }

    /// <summary>
    /// Key <c>misclosures</c> (docs/output-format.md; left out when nothing was checked): the options, the level
    /// closures and traverses (lengths in metres, angles in arcseconds), and the GNSS baseline loops (key
    /// <c>baseline_loops</c>, left out when there are none). Observations are 1-based numbers of the observation
    /// list. The rows go to the stream as they are made.
    /// </summary>
    private static void Misclosures(JsonSink sink, JsonRow element, MisclosureReport? m)
    {
        if (m is null || m.IsEmpty) return;
        var j = sink.Json;
        var o = m.Options;
        j.WriteStartObject(Keys.Misclosures);
        Real(j, Keys.Confidence, o.Confidence);
        Num(j, Keys.LevelLoopConstantMm, o.LevelLoopConstant * 1000);
        Num(j, Keys.LevelSectionConstantMm, (o.LevelSectionConstant ?? o.LevelLoopConstant) * 1000);
        Num(j, Keys.MinimumTraverseRatio, o.MinimumTraverseRatio);
        List(sink, element, Keys.Levels, m.Levels, (e, l) =>
        {
            e.WriteString(Keys.Kind, l.Kind switch
            {
                LevelClosureKind.Loop => "loop",
                LevelClosureKind.Line => "line",
                _ => "section",
            });
            Route(e, l.Points, l.Observations);
            e.Real(Keys.Misclosure, l.Misclosure);
            e.Num(Keys.Length, l.Length);
            e.Num(Keys.Sd, l.Sd);
            e.Num(Keys.SdAllowance, l.SdAllowance);
            e.Num(Keys.Allowance, l.Allowance);
            e.Num(Keys.Ratio, l.Ratio);
            e.WriteBoolean(Keys.Passed, l.Passed);
        });
        List(sink, element, Keys.Traverses, m.Traverses, (e, t) =>
        {
            e.WriteString(Keys.Kind, t.Kind == TraverseKind.Link ? "link" : "closed");
            Route(e, t.Points, t.Observations);
            e.Num(Keys.AngularMisclosure, t.AngularMisclosure * Angle.ArcsecondsPerRadian);
            e.Num(Keys.AngularSd, t.AngularSd * Angle.ArcsecondsPerRadian);
            e.Num(Keys.AngularAllowance, t.AngularAllowance * Angle.ArcsecondsPerRadian);
            e.Real(Keys.LinearMisclosure, t.LinearMisclosure);
            e.Real(Keys.Length, t.Length);
            e.Num(Keys.PrecisionRatio, t.PrecisionRatio);
            e.Num(Keys.LinearStatistic, t.LinearStatistic);
            e.Real(Keys.LinearCritical, t.LinearCritical);
            e.Num(Keys.Ratio, t.Ratio);
            e.WriteBoolean(Keys.Passed, t.Passed);
        });
        if (m.BaselineLoops.Count > 0)
            List(sink, element, Keys.BaselineLoops, m.BaselineLoops, (e, l) =>
            {
                Route(e, l.Points, l.Observations);
                e.WriteStartArray(Keys.Groups);
                foreach (string? g in l.Groups) e.WriteStringValue(g);
                e.WriteEndArray();
                e.WriteBoolean(Keys.Trivial, l.Trivial);
                e.Real(Keys.Dx, l.Dx);
                e.Real(Keys.Dy, l.Dy);
                e.Real(Keys.Dz, l.Dz);
                e.Real(Keys.Misclosure, l.Misclosure);
                e.Real(Keys.Length, l.Length);
                e.Num(Keys.Ppm, l.Ppm);
                e.Num(Keys.East, l.East);
                e.Num(Keys.North, l.North);
                e.Num(Keys.Up, l.Up);
                e.Num(Keys.SdEast, l.SdEast);
                e.Num(Keys.SdNorth, l.SdNorth);
                e.Num(Keys.SdUp, l.SdUp);
                e.Num(Keys.Statistic, l.Statistic);
                e.Real(Keys.Critical, l.Critical);
                e.Num(Keys.Ratio, l.Ratio);
                e.Num(Keys.ComponentRatio, l.ComponentRatio);
                e.WriteBoolean(Keys.Passed, l.Passed);
            });
        j.WriteEndObject();

        // the points in running order and the 1-based numbers of the observations
        static void Route(JsonRow e, IReadOnlyList<string> points, IReadOnlyList<int> observations)
        {
            e.WriteStartArray(Keys.Points);
            foreach (string p in points) e.WriteStringValue(p);
            e.WriteEndArray();
            e.WriteStartArray(Keys.Observations);
            foreach (int i in observations) e.WriteNumberValue(i + 1);
            e.WriteEndArray();
        }
    }
}
