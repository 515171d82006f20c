namespace NetAdjust.IO.Project;

/// <summary>
/// The documented limits on project input (docs/input-format.md, "Limits"). Input beyond them is refused with
/// file, line and item before it can exhaust the stack, memory or time. The values are this project's choices
/// (common practice: generous bounds around any real survey), not taken from a standard.
/// </summary>
public static class InputLimits
{
    /// <summary>Largest project file (YAML) read, in bytes (64 MiB; a project of a million points with their
    /// observations in CSV files has about 50 MB).</summary>
    public const long MaxFileBytes = 64L * 1024 * 1024;

    /// <summary>Largest CSV observation file read, in bytes (1 GiB; the 9.2 million observations of a million-point
    /// network take about 460 MB). The file is read a piece at a time; a text handed to <c>ProjectReader.Parse</c> by
    /// its own reading function must fit one string (at most about a billion characters).</summary>
    public const long MaxCsvFileBytes = 1024L * 1024 * 1024;

    /// <summary>Deepest nesting of YAML mappings and sequences (the format needs 4).</summary>
    public const int MaxNestingDepth = 32;

    /// <summary>Longest single value (an id, a number, a title) in characters.</summary>
    public const int MaxValueLength = 256;

    /// <summary>Longest WKT of a coordinate reference system (<c>crs: PROJCS[...]</c>), in characters.</summary>
    public const int MaxWktLength = 4096;

    /// <summary>Longest line of a CSV observation file, in characters.</summary>
    public const int MaxCsvLineLength = 4096;

    // Standard deviations: Stochastic.StandardDeviationLimits (checked in the stochastic model).

    /// <summary>Largest magnitude of a coordinate, a height or a measured length: 1e8 m (100,000 km).</summary>
    public const double MaxCoordinate = 1e8;

    /// <summary>Shortest measured distance (horizontal or slope): 1 mm. Centering errors divided by a shorter sight
    /// would give an angular standard deviation beyond any limit.</summary>
    public const double MinMeasuredLength = 1e-3;

    /// <summary>Number of characters of the input quoted in a message at most.</summary>
    public const int ExcerptLength = 40;

    /// <summary>The text clipped to a short excerpt for a message (never more than <see cref="ExcerptLength"/>
    /// characters).</summary>
    /// <param name="text">The input text.</param>
    /// <returns>The text, or its start followed by '…' and the full length.</returns>
    public static string Excerpt(string text) =>
        text.Length <= ExcerptLength ? text : text[..ExcerptLength] + $"… ({text.Length} characters)";

    /// <summary>A parser message clipped to 200 characters.</summary>
    internal static string Excerpt200(string text) => text.Length <= 200 ? text : text[..200] + "…";

    /// <summary>Null when the standard deviation (metres or radians) is in the sane range, else what is
    /// wrong.</summary>
    /// <param name="sd">The standard deviation in SI units.</param>
    /// <param name="angular">True for an angular standard deviation (radians).</param>
    internal static string? SdProblem(double sd, bool angular) =>
        Stochastic.StandardDeviationLimits.Problem(sd, angular);
}
