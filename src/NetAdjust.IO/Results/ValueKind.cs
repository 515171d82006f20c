namespace NetAdjust.IO.Results;

/// <summary>What the cells of a column hold.</summary>
internal enum ValueKind
{
    /// <summary>Text (ids, names, flags).</summary>
    Text,

    /// <summary>Numbers (right-aligned in tables).</summary>
    Number,
}
