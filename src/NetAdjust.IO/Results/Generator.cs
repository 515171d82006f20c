using System.Reflection;

namespace NetAdjust.IO.Results;

/// <summary>
/// The program and version written into every report and JSON result (<c>generator</c>): "NetAdjust 0.1.0". All
/// NetAdjust packages share one version (Directory.Build.props), so this assembly's version is the tool's.
/// </summary>
internal static class Generator
{
    /// <summary>The version of the NetAdjust packages, e.g. "0.1.0" (the informational version, no build
    /// metadata).</summary>
    public static string Version { get; } = ReadVersion();

    /// <summary>Program name and version as written into outputs, e.g. "NetAdjust 0.1.0".</summary>
    public static string Name { get; } = "NetAdjust " + Version;

    private static string ReadVersion()
    {
        var assembly = typeof(Generator).Assembly;
        string? informational =
            assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion;
        if (string.IsNullOrEmpty(informational)) return assembly.GetName().Version?.ToString(3) ?? "0.0.0";
        int plus = informational.IndexOf('+', StringComparison.Ordinal);
        return plus < 0 ? informational : informational[..plus];
    }
}
