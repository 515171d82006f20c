using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>
/// The accuracy of an electronic distance meter as a constant part plus a part proportional to the distance
/// (e.g. <c>3 mm + 2 ppm</c>). The two parts are combined as independent errors (root-sum-square) by
/// <c>Stochastic.DistanceBudgetBuilder</c>.
/// </summary>
public sealed record EdmSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="constant">The constant part a (≥ 0), e.g. <c>Length.FromMillimetres(2)</c>.</param>
    /// <param name="ppm">The proportional part b, parts per million of the distance (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a part is negative or not finite.</exception>
    public EdmSpecification(Length constant, double ppm) : this(constant.Metres, ppm) { }

    /// <summary>Creates a specification from the constant part in metres (SI, for the reader).</summary>
    internal EdmSpecification(double constant, double ppm)
    {
        Checks.NonNegative(constant, "the EDM constant part");
        Checks.NonNegative(ppm, "the EDM proportional part (ppm)");
        Constant = constant;
        Ppm = ppm;
    }

    /// <summary>The constant part a, metres (SI, for the stochastic model).</summary>
    internal double Constant { get; }

    /// <summary>The constant part a.</summary>
    public Length ConstantPart => Length.FromMetres(Constant);

    /// <summary>The proportional part b, parts per million.</summary>
    public double Ppm { get; }

    /// <summary>
    /// Parses <c>A [unit] + B ppm</c>, e.g. <c>3 mm + 2 ppm</c>, <c>0.01 ft + 5ppm</c>, <c>2mm</c> (b = 0),
    /// <c>1.5 ppm</c> (a = 0). A bare number for a is read in <paramref name="unit"/>.
    /// Illegal: <c>3 mm + x ppm</c>, <c>3 mm + 2</c> (no ppm), <c>-3 mm + 2 ppm</c> (negative), empty text.
    /// </summary>
    /// <param name="text">The text.</param>
    /// <param name="unit">The unit of a bare constant part.</param>
    /// <returns>The specification, or a message naming what is wrong.</returns>
    public static ParseResult<EdmSpecification> Parse(string? text, LengthUnit unit)
    {
        if (string.IsNullOrWhiteSpace(text))
            return ParseResult<EdmSpecification>.Fail(
                "an EDM specification such as '3 mm + 2 ppm' is required, but the text is empty");
        string t = text.Trim();
        string[] parts = t.Split('+');
        double a = 0, b = 0;
        bool seenA = false, seenB = false;
        foreach (string raw in parts)
        {
            string p = raw.Trim();
            if (p.Length == 0)
                return ParseResult<EdmSpecification>.Fail(
                    $"'{t}' is not an EDM specification: write it as 'a mm + b ppm', e.g. '3 mm + 2 ppm'");
            if (p.EndsWith("ppm", StringComparison.Ordinal))
            {
                string num = p[..^3].Trim();
                if (seenB) return ParseResult<EdmSpecification>.Fail($"'{t}' gives the ppm part twice");
                if (!AnglePattern.TryNumber(num, out b))
                    return ParseResult<EdmSpecification>.Fail($"'{num}' in '{t}' is not a number of ppm");
                if (b < 0) return ParseResult<EdmSpecification>.Fail($"the ppm part in '{t}' must not be negative");
                seenB = true;
            }
            else
            {
                if (seenA)
                    return ParseResult<EdmSpecification>.Fail(
                        $"'{t}' gives the constant part twice, or its second part lacks 'ppm'");
                var r = new LengthPattern(unit, 4).Parse(p);
                if (!r.Success) return ParseResult<EdmSpecification>.Fail($"the constant part of '{t}': {r.Error}");
                a = r.Value.Metres;
                if (a < 0)
                    return ParseResult<EdmSpecification>.Fail($"the constant part in '{t}' must not be negative");
                seenA = true;
            }
        }
        return ParseResult<EdmSpecification>.Ok(new EdmSpecification(a, b));
    }
}
