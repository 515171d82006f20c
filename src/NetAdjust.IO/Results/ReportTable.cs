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
