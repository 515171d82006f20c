using System.Globalization;

namespace NetAdjust.Units;

/// <summary>
/// Parses and formats lengths as text, culture-invariantly. A bare number is read in the pattern's unit;
/// a number followed by a unit symbol (<c>m</c>, <c>mm</c>, <c>cm</c>, <c>km</c>, <c>ft</c>, <c>usft</c>) is read in
/// that unit.
/// </summary>
/// <remarks>
/// Legal: <c>412.3456</c>, <c>412.3456 m</c>, <c>3mm</c>, <c>0.02 ft</c>, <c>1.5e-3</c>.
/// Illegal: <c>412,3456</c> (comma), <c>12 yd</c> (unknown unit), <c>m</c> (no number), empty text.
/// </remarks>
public sealed class LengthPattern
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Creates a pattern.</summary>
    /// <param name="unit">The unit of bare numbers and of formatted output.</param>
    /// <param name="decimals">Decimals written by <see cref="Format"/> (0..12).</param>
    public LengthPattern(LengthUnit unit, int decimals)
    {
        if (decimals is < 0 or > 12)
            throw new ArgumentOutOfRangeException(nameof(decimals), decimals, "decimals must be 0..12");
        Unit = unit;
        Decimals = decimals;
    }

    /// <summary>Metres with four decimals.</summary>
    public static LengthPattern Metres { get; } = new(LengthUnit.Metre, 4);

    /// <summary>The unit of bare numbers and of formatted output.</summary>
    public LengthUnit Unit { get; }

    /// <summary>Decimals written.</summary>
    public int Decimals { get; }

    /// <summary>Formats a length as a bare number in <see cref="Unit"/>.</summary>
    /// <param name="length">The length.</param>
    public string Format(Length length) => length.In(Unit).ToString("F" + Decimals, Inv);

    /// <summary>Parses a length.</summary>
    /// <param name="text">The text; surrounding white space is ignored.</param>
    /// <returns>The length, or a message naming what is wrong.</returns>
    public ParseResult<Length> Parse(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
            return ParseResult<Length>.Fail("a length is required, but the text is empty");
        string t = text.Trim();
        int i = t.Length;
        while (i > 0 && char.IsLetter(t[i - 1])) i--;
        string number = t[..i].TrimEnd();
        string symbol = t[i..];
        LengthUnit unit = Unit;
        if (symbol.Length > 0)
        {
            // "1.5e" would leave "e" as a unit: only accept known symbols.
            var u = LengthUnit.FromSymbol(symbol);
            if (u is null)
                return ParseResult<Length>.Fail(
                    $"'{symbol}' in '{t}' is not a length unit (use m, mm, cm, km, ft or usft)");
            unit = u;
        }
        if (!AnglePattern.TryNumber(number, out double v)) return ParseResult<Length>.Fail($"'{t}' is not a length");
        return ParseResult<Length>.Ok(Length.From(v, unit));
    }
}
