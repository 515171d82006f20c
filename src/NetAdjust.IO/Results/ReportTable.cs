namespace NetAdjust.IO.Results;

/// <summary>
/// A table of the report model: unit-tagged columns over typed rows. Each row is a record holding SI values
/// (metres, radians); each column says how to take one cell from a row, what the cell holds and in which unit it is
/// to be shown. Writers choose the columns they show and the number format; they never convert units themselves.
/// </summary>
/// <typeparam name="TRow">The row record.</typeparam>
/// <param name="Columns">The columns, in the order a full listing shows them.</param>
/// <param name="Rows">The rows, in result order.</param>
internal sealed record ReportTable<TRow>(IReadOnlyList<ReportColumn<TRow>> Columns, IReadOnlyList<TRow> Rows);

/// <summary>One column of a <see cref="ReportTable{TRow}"/>.</summary>
/// <typeparam name="TRow">The row record.</typeparam>
/// <param name="Key">The machine name (the CSV header before its unit suffix), e.g. <c>easting</c>.</param>
/// <param name="Header">The heading for people, e.g. <c>Easting</c>.</param>
/// <param name="Unit">The unit class of the cells.</param>
/// <param name="Cell">Takes the cell from a row.</param>
internal sealed record ReportColumn<TRow>(string Key, string Header, ColumnUnit Unit, Func<TRow, ReportCell> Cell);

/// <summary>The unit class of a column: what a number in it measures.</summary>
internal enum ColumnUnit
{
    /// <summary>Text or a plain count: no unit.</summary>
    None,

    /// <summary>A length in metres, shown in the project's length unit.</summary>
    Length,

    /// <summary>An azimuth already in decimal degrees (rounded where the model says so).</summary>
    Degrees,

    /// <summary>An observed quantity: an angle (radians) or a length (metres), by the row's observation kind.</summary>
    ObservedValue,

    /// <summary>A residual or standard deviation of an observation: small angle (radians) or length, by kind.</summary>
    ObservedPrecision,
}

/// <summary>One typed cell: text, a number, or nothing (a value that does not exist, e.g. no easting for a benchmark).</summary>
/// <param name="Text">The text, for a text cell.</param>
/// <param name="Number">The number (in the column's unit class, SI for lengths), for a number cell.</param>
internal readonly record struct ReportCell(string? Text, double? Number)
{
    /// <summary>A text cell.</summary>
    public static ReportCell Of(string text) => new(text, null);

    /// <summary>A number cell, empty when the value is missing or not finite.</summary>
    public static ReportCell Of(double? number) => new(null, number is double x && double.IsFinite(x) ? x : null);

    /// <summary>True when the cell holds neither text nor a number.</summary>
    public bool IsEmpty => Text is null && Number is null;
}
