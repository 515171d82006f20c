using System.Globalization;
using System.Text;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Diagnosis;

public static partial class BlunderDiagnosis
{
    /// <summary>
    /// The transposition candidates of a booked value: every text obtained by swapping two adjacent digits of
    /// <paramref name="bookedText"/> (two digit characters next to each other; a decimal point, a sign, a DMS
    /// separator or a unit mark stands between digits, so no swap crosses it), from left to right, without
    /// duplicates and without the unchanged text (a swap of two equal digits). The unit of the text is kept.
    /// Example: <c>123.4567</c> gives <c>213.4567</c>, <c>132.4567</c>, <c>123.5467</c>, <c>123.4657</c>,
    /// <c>123.4576</c>.
    /// </summary>
    /// <param name="bookedText">The booked text (decimal, or degrees-minutes-seconds such as
    /// <c>123-45-12.3</c> or <c>123°45'12.3"</c>).</param>
    /// <returns>The candidate texts; empty for null or text with no two adjacent different digits.</returns>
    public static IReadOnlyList<string> Transpositions(string bookedText)
    {
        var list = new List<string>();
        if (string.IsNullOrEmpty(bookedText)) return list;
        var seen = new HashSet<string>(StringComparer.Ordinal) { bookedText };
        for (int i = 0; i + 1 < bookedText.Length; i++)
        {
            char a = bookedText[i], b = bookedText[i + 1];
            if (!char.IsAsciiDigit(a) || !char.IsAsciiDigit(b) || a == b) continue;
            var sb = new StringBuilder(bookedText);
            sb[i] = b; sb[i + 1] = a;
            string t = sb.ToString();
            if (seen.Add(t)) list.Add(t);
        }
        return list.AsReadOnly();
    }

    /// <summary>The booked text of an observation, or its value in the kind's usual unit (metres with four
    /// decimals, DMS with one decimal of seconds) when the reader did not keep it.</summary>
    internal static string BookedOrFormatted(Observation o) =>
        o.BookedText is { Length: > 0 } t ? t.Trim()
        : ObservationKinds.ValueIsAngle(o.Kind) ? AnglePattern.Dms.FormatDirection(Angle.FromRadians(o.Value))
        : o.Value.ToString("F4", CultureInfo.InvariantCulture);

    /// <summary>The SI value of another text in the unit of the booked text: a plain number scales with the booked
    /// value (the unit factor kept); a DMS text adds its difference from the booked DMS angle. Null when the text
    /// cannot be read so.</summary>
    internal static double? ValueOfText(Observation o, string booked, string text)
    {
        var (bn, bs) = SplitUnit(booked);
        var (tn, ts) = SplitUnit(text);
        if (bs == ts && AnglePattern.TryNumber(bn, out double b) && AnglePattern.TryNumber(tn, out double t))
            return b != 0 ? o.Value * (t / b) : null;
        if (!ObservationKinds.ValueIsAngle(o.Kind)) return null;
        var pb = AnglePattern.Dms.Parse(booked);
        var pt = AnglePattern.Dms.Parse(text);
        return pb.Success && pt.Success ? o.Value + (pt.Value.Radians - pb.Value.Radians) : null;
    }

    /// <summary>The text of a corrected SI value in the unit and style of the booked text (decimals kept).</summary>
    internal static string TextOfValue(Observation o, string booked, double corrected)
    {
        var (number, unit) = SplitUnit(booked);
        if (AnglePattern.TryNumber(number, out double b) && b != 0 && o.Value != 0)
        {
            int dot = number.IndexOf('.', StringComparison.Ordinal);
            int decimals = dot < 0 ? 0 : number.Length - dot - 1;
            return (b * corrected / o.Value).ToString("F" + decimals, CultureInfo.InvariantCulture) + unit;
        }
        if (ObservationKinds.ValueIsAngle(o.Kind))
        {
            int sd = booked.LastIndexOf('.');
            int decimals = sd < 0 ? 0 : booked.Skip(sd + 1).TakeWhile(char.IsAsciiDigit).Count();
            return new AnglePattern(AngleFormat.Dms, Math.Clamp(decimals, 0, 10))
                .FormatDirection(Angle.FromRadians(corrected));
        }
        return corrected.ToString("F4", CultureInfo.InvariantCulture);
    }

    /// <summary>A decimal text split into its number and a trailing unit mark kept as written (<c>419.3846 ft</c> →
    /// <c>419.3846</c>, <c> ft</c>; <c>123.4567°</c> → <c>123.4567</c>, <c>°</c>).</summary>
    private static (string Number, string Unit) SplitUnit(string text)
    {
        int end = text.Length;
        while (end > 0 && !char.IsAsciiDigit(text[end - 1]) && text[end - 1] != '.') end--;
        return (text[..end], text[end..]);
    }
}
