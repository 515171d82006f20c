namespace NetAdjust.Standards;

/// <summary>What an accuracy standard measures.</summary>
public enum StandardKind
{
    /// <summary>Relative positional precision of pairs of points: the semi-major axis of the 95% relative error
    /// ellipse against an allowance a + b·ppm of the distance.</summary>
    RelativePrecision,

    /// <summary>FGDC-STD-007.2-1998 local and network accuracy at 95% (horizontal: the circular 95% radius; vertical:
    /// 1.96 σ), with the accuracy class reached, against a required class when one is set.</summary>
    GeodeticAccuracy,

    /// <summary>Levelling section and loop misclosures against c·√K allowances of a levelling order.</summary>
    Levelling,
}

/// <summary>Which pairs of points a relative-precision standard is applied to.</summary>
public enum PairSelection
{
    /// <summary>Pairs joined by an observation.</summary>
    Observed,

    /// <summary>Pairs listed in the project (statistics, relative pairs).</summary>
    Listed,

    /// <summary>Every pair of a chosen set of points (<see cref="AccuracyStandard.Points"/>).</summary>
    AllOf,
}

/// <summary>
/// One accuracy standard as data: its name, what it measures and its allowances, and where it comes from. The
/// built-in ones are in <see cref="AccuracyStandards.BuiltIn"/>; a project may define more (docs/input-format.md,
/// "Accuracy standards"). Lengths in metres.
/// </summary>
/// <param name="Name">A short name, unique among the standards of a run (e.g. <c>alta-nsps-2021</c>).</param>
/// <param name="Kind">What it measures.</param>
/// <param name="Source">The published source, or the project's own words for a standard the user defines.</param>
public sealed record AccuracyStandard(string Name, StandardKind Kind, string Source)
{
    /// <summary>The constant part a of the relative-precision allowance a + b·ppm (m).</summary>
    public double Constant { get; init; }

    /// <summary>The part b proportional to the distance, in parts per million.</summary>
    public double Ppm { get; init; }

    /// <summary>The pairs a relative-precision standard applies to.</summary>
    public PairSelection Pairs { get; init; } = PairSelection.Observed;

    /// <summary>The points whose pairs are checked with <see cref="PairSelection.AllOf"/>; empty otherwise.</summary>
    public IReadOnlyList<string> Points { get; init; } = [];

    /// <summary>The accuracy class (m) a geodetic-accuracy standard requires, or null to report the class reached
    /// without a decision.</summary>
    public double? RequiredClass { get; init; }

    /// <summary>The section allowance constant c of c·√E (m per √km, E the shorter one-way length in km).</summary>
    public double SectionConstant { get; init; }

    /// <summary>The loop allowance constant c of c·√F (m per √km, F the loop or line length in km).</summary>
    public double LoopConstant { get; init; }

    /// <summary>The allowance a + b·ppm·d of a relative-precision standard (m).</summary>
    /// <param name="distance">The distance between the two points (m).</param>
    public double Allowance(double distance) => Constant + (Ppm * 1e-6 * distance);
}

/// <summary>The built-in accuracy standards (docs/methods.md, "Accuracy standards"; docs/references.md).</summary>
public static class AccuracyStandards
{
    private const string Fgcc = "FGCC 1984, Standards and Specifications for Geodetic Control Networks, §3.5 " +
        "(geodetic leveling, misclosure allowances; docs/references.md)";

    private static AccuracyStandard Levelling(string name, double section, double loop) =>
        new(name, StandardKind.Levelling, Fgcc) { SectionConstant = section / 1000, LoopConstant = loop / 1000 };

    /// <summary>
    /// The built-in standards: <c>alta-nsps-2021</c> (2 cm + 50 ppm, observed pairs; ALTA/NSPS 2021 Minimum Standard
    /// Detail Requirements), <c>fgdc-1998</c> (FGDC-STD-007.2-1998, class reached without a decision), and the
    /// levelling orders of FGCC 1984: <c>fgcc-1984-first-i</c> (section 3 mm √E, loop 4 mm √F),
    /// <c>fgcc-1984-first-ii</c> (4, 5), <c>fgcc-1984-second-i</c> (6, 6), <c>fgcc-1984-second-ii</c> (8, 8),
    /// <c>fgcc-1984-third</c> (12, 12).
    /// </summary>
    public static IReadOnlyList<AccuracyStandard> BuiltIn { get; } =
    [
        new("alta-nsps-2021", StandardKind.RelativePrecision,
            "ALTA/NSPS Minimum Standard Detail Requirements for ALTA/NSPS Land Title Surveys, 2021, " +
            "relative positional precision") { Constant = 0.02, Ppm = 50 },
        new("fgdc-1998", StandardKind.GeodeticAccuracy,
            "FGDC-STD-007.2-1998, Geospatial Positioning Accuracy Standards, Part 2: Standards for Geodetic Networks"),
        Levelling("fgcc-1984-first-i", 3, 4),
        Levelling("fgcc-1984-first-ii", 4, 5),
        Levelling("fgcc-1984-second-i", 6, 6),
        Levelling("fgcc-1984-second-ii", 8, 8),
        Levelling("fgcc-1984-third", 12, 12),
    ];

    /// <summary>The built-in standard of that name (ordinal), or null.</summary>
    /// <param name="name">The name.</param>
    public static AccuracyStandard? Find(string name) => BuiltIn.FirstOrDefault(s => s.Name == name);

    /// <summary>The accuracy classes of FGDC-STD-007.2-1998 (m, ascending): 1, 2, 5 mm … 10 m.</summary>
    public static IReadOnlyList<double> GeodeticClasses { get; } =
        [0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10];

    /// <summary>The smallest accuracy class that a 95% value meets, or null when it exceeds the largest.</summary>
    /// <param name="value">The 95% accuracy (m).</param>
    public static double? ClassReached(double value) =>
        GeodeticClasses.Cast<double?>().FirstOrDefault(c => value <= c!.Value * (1 + 1e-12));

    /// <summary>
    /// The circular 95% radius of a horizontal error ellipse by the formula of FGDC-STD-007.2-1998:
    /// r95 = a·(1.960790 + 0.004071·C + 0.114276·C² + 0.371625·C³), C = b/a, from the standard ellipse's semi-axes
    /// a ≥ b (m). Good to about 0.2% of the exact radius of the bivariate normal (docs/methods.md).
    /// </summary>
    /// <param name="a">Semi-major axis of the standard ellipse (m), ≥ 0.</param>
    /// <param name="b">Semi-minor axis (m), 0 ≤ b ≤ a.</param>
    public static double CircularRadius95(double a, double b)
    {
        if (!(a > 0)) return 0;
        double c = Math.Clamp(b / a, 0, 1);
        return a * (1.960790 + (c * (0.004071 + (c * (0.114276 + (c * 0.371625))))));
    }
}
