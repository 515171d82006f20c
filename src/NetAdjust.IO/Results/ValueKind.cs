namespace NetAdjust.IO.Results;

/// <summary>What the cells of a column hold (tables align and style them by it).</summary>
internal enum ValueKind
{
    /// <summary>Text (names, flags).</summary>
    Text,

    /// <summary>Point ids.</summary>
    PointId,

    /// <summary>Where a value came from (input file and line).</summary>
    Reference,

    /// <summary>Numbers (right-aligned in tables).</summary>
    Number,
}
