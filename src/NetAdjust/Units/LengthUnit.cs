namespace NetAdjust.Units;

/// <summary>A unit of length known to NetAdjust, with its exact definition in metres.</summary>
public sealed class LengthUnit
{
    private LengthUnit(string symbol, string name, double metresPerUnit)
    {
        Symbol = symbol;
        Name = name;
        MetresPerUnit = metresPerUnit;
    }

    /// <summary>The symbol used in project files and reports (e.g. <c>m</c>, <c>ft</c>, <c>usft</c>).</summary>
    public string Symbol { get; }

    /// <summary>The unit's name in words.</summary>
    public string Name { get; }

    /// <summary>Metres in one unit.</summary>
    public double MetresPerUnit { get; }

    /// <summary>The metre.</summary>
    public static LengthUnit Metre { get; } = new("m", "metre", 1.0);

    /// <summary>The millimetre.</summary>
    public static LengthUnit Millimetre { get; } = new("mm", "millimetre", 0.001);

    /// <summary>The centimetre.</summary>
    public static LengthUnit Centimetre { get; } = new("cm", "centimetre", 0.01);

    /// <summary>The kilometre.</summary>
    public static LengthUnit Kilometre { get; } = new("km", "kilometre", 1000.0);

    /// <summary>The international foot, 0.3048 m exactly (Federal Register 24 FR 5348, 1959).</summary>
    public static LengthUnit InternationalFoot { get; } = new("ft", "international foot", 0.3048);

    /// <summary>The US survey foot, 1200/3937 m (deprecated from 2023: 85 FR 62698, 2020).</summary>
    public static LengthUnit UsSurveyFoot { get; } = new("usft", "US survey foot", 1200.0 / 3937.0);

    /// <summary>All units, in the order they are documented.</summary>
    public static IReadOnlyList<LengthUnit> All { get; } =
        [Metre, Millimetre, Centimetre, Kilometre, InternationalFoot, UsSurveyFoot];

    /// <summary>Finds a unit by its symbol (case-sensitive: <c>m</c>, <c>mm</c>, <c>cm</c>, <c>km</c>, <c>ft</c>,
    /// <c>usft</c>).</summary>
    /// <param name="symbol">The symbol.</param>
    /// <returns>The unit, or null when the symbol is unknown.</returns>
    public static LengthUnit? FromSymbol(string symbol) => All.FirstOrDefault(u => u.Symbol == symbol);

    /// <inheritdoc />
    public override string ToString() => Symbol;
}
