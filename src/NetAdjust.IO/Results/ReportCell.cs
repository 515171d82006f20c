namespace NetAdjust.IO.Results;

/// <summary>
/// One typed cell: text, a number, or nothing (a value that does not exist, e.g. no easting for a benchmark).
/// </summary>
/// <param name="Text">The text, for a text cell.</param>
/// <param name="Number">The number (in the column's unit class, SI for lengths), for a number cell.</param>
internal readonly record struct ReportCell(string? Text, double? Number)
{
    /// <summary>A text cell.</summary>
    public static ReportCell Of(string text) => new(text, null);

    /// <summary>A number cell, empty when the value is missing or not finite.</summary>
    public static ReportCell Of(double? number) => new(null, number is double x && double.IsFinite(x) ? x : null);
}
