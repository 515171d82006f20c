using System.Text;

namespace NetAdjust.IO.Results;

/// <summary>The project's warnings in the text report and the JSON result; nothing at all when there are
/// none.</summary>
internal static class ReportWarnings
{
    public static void AppendText(StringBuilder sb, ReportContext c)
    {
        foreach (var w in c.Warnings) sb.Append("Warning   : ").Append(w).Append('\n');
    }

    /// <summary>The warnings for the JSON result, or null (no key) when there are none.</summary>
    public static IReadOnlyList<string>? ForJson(ReportContext c) => c.Warnings.Count == 0 ? null : c.Warnings;
}
