namespace NetAdjust.Units;

/// <summary>
/// The outcome of parsing text: either a value or a message saying precisely what is wrong.
/// Parsing never throws for malformed text.
/// </summary>
/// <typeparam name="T">The parsed value type.</typeparam>
public readonly struct ParseResult<T>
{
    private readonly T _value;

    private ParseResult(T value, string? error)
    {
        _value = value;
        Error = error;
    }

    /// <summary>True when the text was parsed.</summary>
    public bool Success => Error is null;

    /// <summary>The message when parsing failed; null on success.</summary>
    public string? Error { get; }

    /// <summary>The parsed value.</summary>
    /// <exception cref="InvalidOperationException">When parsing failed.</exception>
    public T Value => Success ? _value : throw new InvalidOperationException(Error);

    /// <summary>A successful result.</summary>
    public static ParseResult<T> Ok(T value) => new(value, null);

    /// <summary>A failed result with its message.</summary>
    public static ParseResult<T> Fail(string message) => new(default!, message);
}
