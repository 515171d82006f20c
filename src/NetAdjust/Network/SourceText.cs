using System.Globalization;

namespace NetAdjust.Network;

/// <summary>
/// The text of <see cref="Observation.Source"/>, kept compactly: either the text itself, or a file name and a line
/// number whose text, <c>file:line</c>, is made only when asked (a CSV reader's rows: no string per row while the
/// observation lives). Two are equal when their texts are equal, however each is kept; the hash code is that of the
/// text, so an observation's equality and hash code are those of its <see cref="Observation.Source"/> string.
/// </summary>
internal readonly struct SourceText : IEquatable<SourceText>
{
    /// <summary>The whole text (<see cref="_lineMark"/> = 0), or the file name.</summary>
    private readonly string? _text;

    /// <summary>The line number after the file name plus one, or 0 when <see cref="_text"/> is the whole text (so
    /// that the default value is no text at all, as an observation made without a source has).</summary>
    private readonly int _lineMark;

    /// <summary>A text as it is (null for none).</summary>
    public SourceText(string? text)
    {
        _text = text;
        _lineMark = 0;
    }

    private SourceText(string file, int line)
    {
        _text = file;
        _lineMark = line + 1;
    }

    /// <summary>The text <c>file:line</c>, made when asked.</summary>
    /// <param name="file">The file name as shown in messages.</param>
    /// <param name="line">The line number (1-based; not negative).</param>
    public static SourceText At(string file, int line)
    {
        ArgumentNullException.ThrowIfNull(file);
        ArgumentOutOfRangeException.ThrowIfNegative(line);
        return new SourceText(file, line);
    }

    /// <summary>The text (a new string for a file and line each time it is asked), or null.</summary>
    public string? Text => _lineMark == 0 ? _text
        : string.Concat(_text, ":", (_lineMark - 1).ToString(CultureInfo.InvariantCulture));

    /// <inheritdoc />
    public bool Equals(SourceText other)
    {
        if (_lineMark == 0 && other._lineMark == 0) return string.Equals(_text, other._text, StringComparison.Ordinal);
        if (_lineMark > 0 && other._lineMark > 0)
            return _lineMark == other._lineMark && string.Equals(_text, other._text, StringComparison.Ordinal);
        var (text, file, line) = _lineMark == 0 ? (_text, other._text!, other._lineMark - 1)
            : (other._text, _text!, _lineMark - 1);
        if (text is null) return false;
        Span<char> digits = stackalloc char[12];
        line.TryFormat(digits, out int n, default, CultureInfo.InvariantCulture);
        return text.Length == file.Length + 1 + n && text.StartsWith(file, StringComparison.Ordinal) &&
            text[file.Length] == ':' && text.AsSpan(file.Length + 1).SequenceEqual(digits[..n]);
    }

    /// <inheritdoc />
    public override bool Equals(object? obj) => obj is SourceText other && Equals(other);

    /// <summary>The hash code of the text (0 for none), made without the string for a file and line.</summary>
    public override int GetHashCode()
    {
        if (_lineMark == 0) return _text is null ? 0 : string.GetHashCode(_text.AsSpan());
        int length = _text!.Length + 12;
        Span<char> chars = length <= 256 ? stackalloc char[length] : new char[length];
        _text.AsSpan().CopyTo(chars);
        chars[_text.Length] = ':';
        (_lineMark - 1).TryFormat(chars[(_text.Length + 1)..], out int n, default, CultureInfo.InvariantCulture);
        return string.GetHashCode(chars[..(_text.Length + 1 + n)]);
    }

    /// <summary>True when the texts are equal.</summary>
    public static bool operator ==(SourceText left, SourceText right) => left.Equals(right);

    /// <summary>True when the texts differ.</summary>
    public static bool operator !=(SourceText left, SourceText right) => !left.Equals(right);

    /// <summary>The text, or "".</summary>
    public override string ToString() => Text ?? "";
}
