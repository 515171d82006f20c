namespace NetAdjust.IO.Results;

/// <summary>One column of a <see cref="ReportTable{TRow}"/>.</summary>
/// <typeparam name="TRow">The row record.</typeparam>
/// <param name="Key">The machine name (the CSV header before its unit suffix), e.g. <c>easting</c>.</param>
/// <param name="Header">The heading for people, e.g. <c>Easting</c>.</param>
/// <param name="Unit">The unit class of the cells.</param>
/// <param name="Kind">What the cells hold: text or numbers.</param>
/// <param name="Cell">Takes the cell from a row.</param>
internal sealed record ReportColumn<TRow>(string Key, string Header, ColumnUnit Unit, ValueKind Kind,
    Func<TRow, ReportCell> Cell);
