using System.Text;
using System.Text.Json;

namespace NetAdjust.IO.Results;

/// <summary>The project's warnings in the text report and the JSON result; nothing at all when there are
/// none.</summary>
internal static class ReportWarnings
{
    public static void AppendText(StringBuilder sb, ReportContext c)
    {
        foreach (var w in c.Warnings) sb.Append("Warning   : ").Append(w).Append('\n');
    }

    public static void WriteJson(Utf8JsonWriter w, ReportContext c)
    {
        if (c.Warnings.Count == 0) return;
        w.WriteStartArray("warnings");
        foreach (var s in c.Warnings) w.WriteStringValue(s);
        w.WriteEndArray();
    }
}
