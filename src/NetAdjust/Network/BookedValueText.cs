namespace NetAdjust.Network;

/// <summary>
/// The text of <see cref="Observation.BookedText"/>, kept compactly: a plain decimal such as <c>182.929550247</c>,
/// <c>-0.5</c> or <c>007</c> (an optional minus sign, 1 to 15 digits, at most one decimal point with digits on both
/// sides) as its digits in one number with its sign, digit count and decimal places, from which the same text is made
/// when asked (a CSV reader's rows: no string per row while the observation lives); any other text as it is. Two are
/// equal when their texts are equal, however each is kept; the hash code is that of the text.
/// </summary>
internal readonly struct BookedValueText : IEquatable<BookedValueText>
{
    private const int MaxDigits = 15; // every number of 15 decimal digits fits in the 52 bits below the shape
    private const int ShapeShift = 52;
    private const ulong DigitsMask = (1UL << ShapeShift) - 1;

    /// <summary>The text, when it is kept as it is (<see cref="_packed"/> = 0).</summary>
    private readonly string? _text;

    /// <summary>0 for a text kept as it is; else the digits of a plain decimal (sign and point left out) in the low 52
    /// bits and its shape above them (the struct is 16 bytes, one per observation of a large file).</summary>
    private readonly ulong _packed;

    /// <summary>The digits of a plain decimal.</summary>
    private ulong Digits => _packed & DigitsMask;

    /// <summary>0 for a text kept as it is; else 1 | negative &lt;&lt; 1 | decimal places &lt;&lt; 2 | digit count
    /// &lt;&lt; 7 (12 bits: places and count are at most 15).</summary>
    private int Shape => (int)(_packed >> ShapeShift);

    /// <summary>A text as it is (null for none).</summary>
    public BookedValueText(string? text)
    {
        _text = text;
    }

    private BookedValueText(ulong digits, int shape)
    {
        _packed = digits | ((ulong)shape << ShapeShift);
    }

    /// <summary>The characters of a booked value: a plain decimal kept as its digits, any other text as a
    /// string.</summary>
    public static BookedValueText Of(ReadOnlySpan<char> chars)
    {
        int i = 0, count = 0, places = -1;
        bool negative = chars.Length > 0 && chars[0] == '-';
        if (negative) i = 1;
        ulong digits = 0;
        for (; i < chars.Length; i++)
        {
            char c = chars[i];
            if (c is >= '0' and <= '9')
            {
                if (++count > MaxDigits) return new BookedValueText(chars.ToString());
                digits = (digits * 10) + (ulong)(c - '0');
                if (places >= 0) places++;
            }
            else if (c == '.' && places < 0 && count > 0) places = 0;
            else return new BookedValueText(chars.ToString());
        }
        if (count == 0 || places == 0) return new BookedValueText(chars.ToString());
        return new BookedValueText(digits, 1 | (negative ? 2 : 0) | (Math.Max(places, 0) << 2) | (count << 7));
    }

    private int Length => ((Shape >> 1) & 1) + (Shape >> 7) + (((Shape >> 2) & 31) > 0 ? 1 : 0);

    /// <summary>Writes the plain decimal's text into <paramref name="chars"/> (of <see cref="Length"/>).</summary>
    private void Format(Span<char> chars)
    {
        int places = (Shape >> 2) & 31;
        ulong d = Digits;
        int k = chars.Length - 1;
        for (int n = 0; n < Shape >> 7; n++)
        {
            if (places > 0 && n == places) chars[k--] = '.';
            chars[k--] = (char)('0' + (int)(d % 10));
            d /= 10;
        }
        if ((Shape & 2) != 0) chars[0] = '-';
    }

    /// <summary>The text (a new string for a plain decimal each time it is asked), or null.</summary>
    public string? Text => Shape == 0 ? _text : string.Create(Length, this, static (chars, b) => b.Format(chars));

    /// <inheritdoc />
    public bool Equals(BookedValueText other)
    {
        if (Shape == 0 && other.Shape == 0) return string.Equals(_text, other._text, StringComparison.Ordinal);
        if (Shape != 0 && other.Shape != 0) return _packed == other._packed;
        var (text, plain) = Shape == 0 ? (_text, other) : (other._text, this);
        if (text is null || text.Length != plain.Length) return false;
        Span<char> chars = stackalloc char[plain.Length];
        plain.Format(chars);
        return text.AsSpan().SequenceEqual(chars);
    }

    /// <inheritdoc />
    public override bool Equals(object? obj) => obj is BookedValueText other && Equals(other);

    /// <summary>The hash code of the text (0 for none), made without the string for a plain decimal.</summary>
    public override int GetHashCode()
    {
        if (Shape == 0) return _text is null ? 0 : string.GetHashCode(_text.AsSpan());
        Span<char> chars = stackalloc char[Length];
        Format(chars);
        return string.GetHashCode(chars);
    }

    /// <summary>True when the texts are equal.</summary>
    public static bool operator ==(BookedValueText left, BookedValueText right) => left.Equals(right);

    /// <summary>True when the texts differ.</summary>
    public static bool operator !=(BookedValueText left, BookedValueText right) => !left.Equals(right);

    /// <summary>The text, or "".</summary>
    public override string ToString() => Text ?? "";
}
