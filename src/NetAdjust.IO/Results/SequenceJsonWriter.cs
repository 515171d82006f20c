using System.Globalization;
using System.Text;
using System.Text.Json;
using NetAdjust.Statistics;
using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the minimally-constrained-then-constrained sequence as JSON (format <c>netadjust-sequence/1</c>):
/// <c>solutions</c> holds the two results in the single-result format (minimally-constrained first), then
/// <c>constraint_test</c>, <c>control_discrepancies</c> and <c>coordinate_shifts</c>. Lengths in metres.
/// </summary>
public static class SequenceJsonWriter
{
    /// <summary>The format identifier written under <c>format</c>.</summary>
    public const string Format = "netadjust-sequence/1";

    /// <summary>Renders the sequence as UTF-8 JSON text.</summary>
    /// <param name="s">The sequence result.</param>
    /// <param name="context">Run details.</param>
    public static string Write(SequenceResult s, ReportContext context) =>
        JsonResultWriter.ToText(stream => Write(stream, s, context));

    /// <summary>Writes the sequence as UTF-8 JSON to a stream (ending with a line feed).</summary>
    /// <param name="stream">The stream; left open.</param>
    /// <param name="s">The sequence result.</param>
    /// <param name="context">Run details.</param>
    public static void Write(Stream stream, SequenceResult s, ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentNullException.ThrowIfNull(s);
        var t = s.Test;
        using (var sink = new JsonSink(stream))
        {
            var j = sink.Json;
            j.WriteStartObject();
            j.WriteString("format", Format);
            j.WriteString("generator", Generator.Name);
            j.WriteString("minimal_datum", s.MinimalDatum);
            j.WriteStartArray("solutions");
            JsonResultWriter.WriteDocument(sink, ResultReport.Build(s.Minimal, context));
            JsonResultWriter.WriteDocument(sink, ResultReport.Build(s.Constrained, context));
            j.WriteEndArray();
            JsonResultWriter.Section(j, ConstraintTest, new ResultJson.ConstraintTest(t.Alpha, t.AddedConstraints,
                t.VtpvIncrease, new(t.ChiSquare, JsonResultWriter.Finite(t.ChiSquareCritical), t.PassedChiSquare),
                new(JsonResultWriter.Finite(t.F), JsonResultWriter.Finite(t.FCritical), t.PassedF),
                t.SigmaEstimated ? "f" : "chi_square", t.Passed));
            JsonResultWriter.Section(j, ControlDiscrepancies, s.Discrepancies.Select(d => new ResultJson.Discrepancy(
                d.Id, F(d.DE), F(d.DN), F(d.DH), F(d.SdE), F(d.SdN), F(d.SdH), F(d.WE), F(d.WN), F(d.WH),
                F(d.MaxAbsW), DiscrepancyVerdict.Of(s, d, s.Minimal.Analysis.WCritical),
                DiscrepancyVerdict.NotTestable(s, d))));
            JsonResultWriter.Section(j, CoordinateShifts,
                s.Shifts.Select(c => new ResultJson.Shift(c.Id, F(c.DE), F(c.DN), F(c.DH), F(c.Horizontal))));
            JsonResultWriter.Section(j, ControlTestability, s.Testability.Select(x => new ResultJson.Testability(x.Id,
                x.Component.ToString(), F(x.Redundancy), x.Testable, x.CannotBeToldApartFrom)));
            j.WriteEndObject();
            sink.Pass();
        }
        stream.WriteByte((byte)'\n');
    }

    private static readonly JsonEncodedText ConstraintTest = JsonEncodedText.Encode("constraint_test"),
        ControlDiscrepancies = JsonEncodedText.Encode("control_discrepancies"),
        CoordinateShifts = JsonEncodedText.Encode("coordinate_shifts"),
        ControlTestability = JsonEncodedText.Encode("control_testability");

    private static double? F(double? v) => JsonResultWriter.Finite(v);
}
