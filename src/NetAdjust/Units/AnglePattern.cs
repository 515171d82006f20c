using System.Globalization;

namespace NetAdjust.Units;

/// <summary>
/// Parses and formats angles as text in one <see cref="AngleFormat"/>, culture-invariantly.
/// Immutable; parsing never throws for malformed text and returns a <see cref="ParseResult{T}"/> instead.
/// </summary>
/// <remarks>
/// Accepted grammar (documented with examples in docs/input-format.md; the same lists drive the tests):
/// <list type="bullet">
/// <item>DMS, hyphenated: <c>[+|-]D-M-S[.fff]</c>, e.g. <c>123-45-56.7</c>, <c>-0-30-00</c>, <c>359-59-59.99</c>;
/// minutes are whole, 0..59; seconds 0 ≤ s &lt; 60.</item>
/// <item>DMS with symbols: <c>123°45'56.7"</c>, <c>123° 45′ 56.7″</c>, <c>12°30'</c>, <c>45°</c>.</item>
/// <item>Decimal degrees: <c>123.7655</c>, <c>123.7655°</c>, <c>123.7655d</c>.</item>
/// <item>Gons: <c>137.5167</c>, <c>137.5167g</c>, <c>137.5167 gon</c>.</item>
/// </list>
/// Illegal: <c>12-75-00</c> (minutes ≥ 60), <c>12-30-60</c> (seconds ≥ 60), <c>12-30</c> (hyphen form needs three
/// parts), <c>12.5-30-00</c> (degrees must be whole in DMS), <c>1,5</c> (comma decimal separator), empty text.
/// </remarks>
public sealed class AnglePattern
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Creates a pattern.</summary>
    /// <param name="format">The text form.</param>
    /// <param name="decimals">Decimals written: of seconds for DMS, of degrees or gons otherwise (0..10).</param>
    public AnglePattern(AngleFormat format, int decimals)
    {
        if (decimals is < 0 or > 10)
            throw new ArgumentOutOfRangeException(nameof(decimals), decimals, "decimals must be 0..10");
        Style = format;
        Decimals = decimals;
    }

    /// <summary>DMS with one decimal of seconds.</summary>
    public static AnglePattern Dms { get; } = new(AngleFormat.Dms, 1);

    /// <summary>Decimal degrees with six decimals.</summary>
    public static AnglePattern Degrees { get; } = new(AngleFormat.Degrees, 6);

    /// <summary>Gons with five decimals.</summary>
    public static AnglePattern Gons { get; } = new(AngleFormat.Gons, 5);

    /// <summary>The text form.</summary>
    public AngleFormat Style { get; }

    /// <summary>Decimals written by <see cref="Format"/>.</summary>
    public int Decimals { get; }

    /// <summary>Formats an angle (the sign is kept; no reduction to a range is made).</summary>
    /// <param name="angle">The angle.</param>
    /// <returns>Text that <see cref="Parse"/> reads back to within half a unit of the last decimal.</returns>
    public string Format(Angle angle)
    {
        switch (Style)
        {
            case AngleFormat.Degrees:
                return angle.Degrees.ToString("F" + Decimals, Inv);
            case AngleFormat.Gons:
                return angle.Gons.ToString("F" + Decimals, Inv);
            default:
                double scale = Math.Pow(10, Decimals);
                double units = Math.Round(Math.Abs(angle.Arcseconds) * scale, MidpointRounding.AwayFromZero);
                long secScale = (long)scale;
                long total = (long)units;
                long fraction = total % secScale;
                long wholeSeconds = total / secScale;
                long s = wholeSeconds % 60;
                long m = (wholeSeconds / 60) % 60;
                long d = wholeSeconds / 3600;
                string sign = angle.Radians < 0 && total != 0 ? "-" : "";
                string sec = s.ToString("00", Inv);
                if (Decimals > 0) sec += "." + fraction.ToString(new string('0', Decimals), Inv);
                return $"{sign}{d.ToString(Inv)}-{m.ToString("00", Inv)}-{sec}";
        }
    }

    /// <summary>
    /// Formats an angle as a direction in [0, full turn): the angle is reduced into that range, and a value that rounds
    /// up to a full turn at this pattern's resolution is written as zero (359-59-59.97 → <c>0-00-00.0</c>, never
    /// <c>360-00-00.0</c>).
    /// </summary>
    /// <param name="angle">The angle.</param>
    /// <returns>Text that <see cref="Parse"/> reads back to within half a unit of the last decimal, modulo a full
    /// turn.</returns>
    public string FormatDirection(Angle angle)
    {
        string text = Format(Angle.FromRadians(Angle.Reduce0To2Pi(angle.Radians)));
        var back = Parse(text);
        bool fullTurn = back.Success && back.Value.Radians >= (2 * Math.PI) - 1e-12; // rounded up to 360°, 400 gon
        return fullTurn ? Format(Angle.FromRadians(0)) : text;
    }

    /// <summary>Parses text in this pattern's format.</summary>
    /// <param name="text">The text; surrounding white space is ignored.</param>
    /// <returns>The angle, or a message naming what is wrong.</returns>
    public ParseResult<Angle> Parse(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
            return ParseResult<Angle>.Fail("an angle is required, but the text is empty");
        string t = text.Trim();
        return Style switch
        {
            AngleFormat.Degrees => ParseDecimal(t, ["°", "d"], Angle.FromDegrees, "decimal degrees"),
            AngleFormat.Gons => ParseDecimal(t, ["gon", "g"], Angle.FromGons, "gons"),
            _ => ParseDms(t),
        };
    }

    private static ParseResult<Angle> ParseDecimal(string t, string[] suffixes, Func<double, Angle> make, string what)
    {
        string body = t;
        foreach (var s in suffixes)
        {
            if (body.EndsWith(s, StringComparison.Ordinal))
            {
                body = body[..^s.Length].TrimEnd();
                break;
            }
        }
        if (!TryNumber(body, out double v)) return ParseResult<Angle>.Fail($"'{t}' is not a number of {what}");
        return ParseResult<Angle>.Ok(make(v));
    }

    private static ParseResult<Angle> ParseDms(string t)
    {
        bool negative = false;
        string body = t;
        if (body.StartsWith('-')) { negative = true; body = body[1..]; }
        else if (body.StartsWith('+')) body = body[1..];
        if (body.Length == 0 || body.StartsWith('-') || body.StartsWith('+'))
            return ParseResult<Angle>.Fail($"'{t}' is not an angle in degrees-minutes-seconds");

        string dPart, mPart, sPart;
        if (body.Contains('°'))
        {
            // Symbol form: D°[M'][S"]
            string norm = body.Replace('′', '\'').Replace('″', '"').Replace("''", "\"");
            int iDeg = norm.IndexOf('°');
            dPart = norm[..iDeg].Trim();
            string rest = norm[(iDeg + 1)..].Trim();
            mPart = "0"; sPart = "0";
            int iMin = rest.IndexOf('\'');
            if (iMin >= 0) { mPart = rest[..iMin].Trim(); rest = rest[(iMin + 1)..].Trim(); }
            int iSec = rest.IndexOf('"');
            if (iSec >= 0)
            {
                sPart = rest[..iSec].Trim();
                if (rest[(iSec + 1)..].Trim().Length > 0)
                    return ParseResult<Angle>.Fail($"unexpected text after the seconds in '{t}'");
            }
            else if (rest.Length > 0)
                return ParseResult<Angle>.Fail($"'{rest}' in '{t}' has no unit mark (' for minutes, \" for seconds)");
        }
        else
        {
            string[] parts = body.Split('-');
            if (parts.Length != 3)
                return ParseResult<Angle>.Fail(
                    $"'{t}' is not degrees-minutes-seconds: write three parts, e.g. 123-45-56.7");
            (dPart, mPart, sPart) = (parts[0].Trim(), parts[1].Trim(), parts[2].Trim());
        }

        if (!int.TryParse(dPart, NumberStyles.None, CultureInfo.InvariantCulture, out int d))
            return ParseResult<Angle>.Fail($"degrees must be a whole number in '{t}'");
        if (!int.TryParse(mPart, NumberStyles.None, CultureInfo.InvariantCulture, out int m))
            return ParseResult<Angle>.Fail($"minutes must be a whole number in '{t}'");
        if (m >= 60) return ParseResult<Angle>.Fail($"minutes must be below 60 in '{t}'");
        if (!TryNumber(sPart, out double s) || sPart.StartsWith('-') || sPart.StartsWith('+'))
            return ParseResult<Angle>.Fail($"seconds must be a number in '{t}'");
        if (s >= 60) return ParseResult<Angle>.Fail($"seconds must be below 60 in '{t}'");
        return ParseResult<Angle>.Ok(Angle.FromDms(d, m, s, negative));
    }

    internal static bool TryNumber(string s, out double v) =>
        double.TryParse(s, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent,
            CultureInfo.InvariantCulture, out v) && double.IsFinite(v);
}
