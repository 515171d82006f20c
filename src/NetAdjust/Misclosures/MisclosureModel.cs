using NetAdjust.Units;
namespace NetAdjust.Misclosures;

/// <summary>What a levelling closure closes.</summary>
public enum LevelClosureKind
{
    /// <summary>A loop of sections that returns to its first point.</summary>
    Loop,

    /// <summary>A line of sections from one benchmark to another (misclosure against their given heights).</summary>
    Line,

    /// <summary>The same section levelled twice (e.g. forward and backward): the section misclosure.</summary>
    Section,
}

/// <summary>What a traverse closes on.</summary>
public enum TraverseKind
{
    /// <summary>From a known point and reference azimuth to a known point (and, when observed, a reference azimuth);
    /// a loop that starts and ends on the same known point is a link traverse onto itself.</summary>
    Link,

    /// <summary>A polygon with no known point: its angles must sum to the polygon's sum and its legs close.</summary>
    Closed,
}

/// <summary>
/// Options of the checks before the adjustment (docs/methods.md, "Misclosures before the adjustment").
/// </summary>
public sealed record MisclosureOptions
{
    /// <summary>The default options: 95%, no levelling allowance constant, no minimum traverse ratio.</summary>
    public static MisclosureOptions Default { get; } = new();

    /// <summary>The confidence of the tests against the expected standard deviation, in (0, 1); 0.95 by default.
    /// </summary>
    public double Confidence { get; init; } = 0.95;

    /// <summary>The constant c of the levelling loop and line allowance c·√K (metres per √km, K the length in km);
    /// null for none (the expected standard deviation alone decides).</summary>
    public double? LevelLoopConstant { get; init; }

    /// <summary>The constant of the allowance of a section levelled twice, c·√E (metres per √km, E the shorter
    /// one-way length in km); null to use <see cref="LevelLoopConstant"/>.</summary>
    public double? LevelSectionConstant { get; init; }

    /// <summary>The least precision ratio k (1:k) a traverse's linear misclosure must reach; null for none.</summary>
    public double? MinimumTraverseRatio { get; init; }

    /// <summary>Checks the values.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When a value is out of range.</exception>
    public void Validate()
    {
        if (!(Confidence > 0 && Confidence < 1)) throw new ArgumentOutOfRangeException(nameof(Confidence));
        if (LevelLoopConstant is double c && !(c > 0 && double.IsFinite(c)))
            throw new ArgumentOutOfRangeException(nameof(LevelLoopConstant));
        if (LevelSectionConstant is double s && !(s > 0 && double.IsFinite(s)))
            throw new ArgumentOutOfRangeException(nameof(LevelSectionConstant));
        if (MinimumTraverseRatio is double k && !(k > 0 && double.IsFinite(k)))
            throw new ArgumentOutOfRangeException(nameof(MinimumTraverseRatio));
    }
}

/// <summary>
/// The misclosure of one level loop, line between benchmarks, or section levelled twice. Lengths in metres.
/// Made by the checks before the adjustment only (the constructor is internal).
/// </summary>
public sealed record LevelClosure
{
    /// <summary>Made by the checks before the adjustment.</summary>
    internal LevelClosure(LevelClosureKind Kind, IReadOnlyList<string> Points, IReadOnlyList<int> Observations,
        double Misclosure, double Length, double Sd, double SdAllowance, double? Allowance)
    {
        this.Kind = Kind; this.Points = Points; this.Observations = Observations; this.Misclosure = Misclosure;
        this.Length = Length; this.Sd = Sd; this.SdAllowance = SdAllowance; this.Allowance = Allowance;
    }

    /// <summary>Loop, line or section.</summary>
    public LevelClosureKind Kind { get; internal init; }

    /// <summary>The points in the order the closure runs (a loop repeats its first point at the end).</summary>
    public IReadOnlyList<string> Points { get; internal init; }

    /// <summary>Indices of the height differences in the network's observation list, in running order.</summary>
    public IReadOnlyList<int> Observations { get; internal init; }

    /// <summary>Σ Δh along the run, minus the given height difference of the end benchmarks for a line (m).</summary>
    internal double Misclosure { get; init; }

    /// <summary>The levelled length K (m): the sum of the sections' lengths (for a section levelled twice, the shorter
    /// run); NaN when a section's length is not known.</summary>
    internal double Length { get; init; }

    /// <summary>The expected standard deviation of the misclosure, √Σσᵢ² (m).</summary>
    internal double Sd { get; init; }

    /// <summary>The misclosure allowed by the expected standard deviation, z·σ (m).</summary>
    internal double SdAllowance { get; init; }

    /// <summary>c·√K (m); null when no constant is set or K is not known.</summary>
    internal double? Allowance { get; init; }

    /// <summary>Σ Δh along the run, minus the given height difference of the end benchmarks for a line.</summary>
    public Length MisclosureLength => Lengths.Metres(Misclosure);

    /// <summary>The levelled length K: the sum of the sections' lengths (for a section levelled twice, the shorter
    /// run); NaN when a section's length is not known.</summary>
    public Length LevelledLength => Lengths.Metres(Length);

    /// <summary>The expected standard deviation of the misclosure, √Σσᵢ².</summary>
    public Length SdMisclosure => Lengths.Metres(Sd);

    /// <summary>The misclosure allowed by the expected standard deviation, z·σ.</summary>
    public Length SdAllowanceLength => Lengths.Metres(SdAllowance);

    /// <summary>c·√K; null when no constant is set or K is not known.</summary>
    public Length? AllowanceLength => Lengths.Of(Allowance);

    /// <summary>The largest ratio |misclosure| / allowance over the allowances that apply (≤ 1 passes).</summary>
    public double Ratio => Math.Max(Math.Abs(Misclosure) / SdAllowance,
        Allowance is double a ? Math.Abs(Misclosure) / a : 0);

    /// <summary>True when the misclosure is within every allowance that applies.</summary>
    public bool Passed => Ratio <= 1;
}

/// <summary>
/// The misclosures of one traverse: angular (against its expected standard deviation) and linear (with its
/// precision ratio 1:k, tested against its expected covariance after the angles are balanced). SI units.
/// Made by the checks before the adjustment only (the constructor is internal).
/// </summary>
public sealed record TraverseClosure
{
    /// <summary>Made by the checks before the adjustment.</summary>
    internal TraverseClosure(TraverseKind Kind, IReadOnlyList<string> Points, IReadOnlyList<int> Observations,
        double AngularMisclosure, double AngularSd, double AngularAllowance, double LinearMisclosure, double Length,
        double LinearStatistic, double LinearCritical, double? MinimumRatio)
    {
        this.Kind = Kind; this.Points = Points; this.Observations = Observations;
        this.AngularMisclosure = AngularMisclosure; this.AngularSd = AngularSd;
        this.AngularAllowance = AngularAllowance; this.LinearMisclosure = LinearMisclosure; this.Length = Length;
        this.LinearStatistic = LinearStatistic; this.LinearCritical = LinearCritical; this.MinimumRatio = MinimumRatio;
    }

    /// <summary>Link or closed.</summary>
    public TraverseKind Kind { get; internal init; }

    /// <summary>The stations in running order (reference points not included).</summary>
    public IReadOnlyList<string> Points { get; internal init; }

    /// <summary>Indices of the angles, directions and distances used, in the network's order.</summary>
    public IReadOnlyList<int> Observations { get; internal init; }

    /// <summary>Carried minus known azimuth at the end (rad, in (−π, π]); NaN when the traverse ends on a known point
    /// without a closing angle.</summary>
    internal double AngularMisclosure { get; init; }

    /// <summary>Expected standard deviation of the angular misclosure, √Σσα² (rad); NaN likewise.</summary>
    internal double AngularSd { get; init; }

    /// <summary>z·σ (rad); NaN likewise.</summary>
    internal double AngularAllowance { get; init; }

    /// <summary>The length of the closing vector after the angles are balanced (m).</summary>
    internal double LinearMisclosure { get; init; }

    /// <summary>The traverse length Σd (m).</summary>
    internal double Length { get; init; }

    /// <summary>fᵀ C⁻¹ f of the closing vector f with its expected covariance C; NaN when C is singular.</summary>
    public double LinearStatistic { get; internal init; }

    /// <summary>The χ²(2) quantile at the check's confidence.</summary>
    public double LinearCritical { get; internal init; }

    /// <summary>The least precision ratio k required, or null.</summary>
    public double? MinimumRatio { get; internal init; }

    /// <summary>Carried minus known azimuth at the end (rad, in (−π, π]); NaN when the traverse ends on a known point
    /// without a closing angle.</summary>
    public Angle AngularMisclosureAngle => Lengths.Radians(AngularMisclosure);

    /// <summary>Expected standard deviation of the angular misclosure, √Σσα²; NaN likewise.</summary>
    public Angle SdAngularMisclosure => Lengths.Radians(AngularSd);

    /// <summary>z·σ; NaN likewise.</summary>
    public Angle AngularAllowanceAngle => Lengths.Radians(AngularAllowance);

    /// <summary>The length of the closing vector after the angles are balanced.</summary>
    public Length LinearMisclosureLength => Lengths.Metres(LinearMisclosure);

    /// <summary>The traverse length Σd.</summary>
    public Length TraverseLength => Lengths.Metres(Length);

    /// <summary>The precision ratio k of 1:k (length / linear misclosure); infinite for a zero misclosure.</summary>
    public double PrecisionRatio => LinearMisclosure > 0 ? Length / LinearMisclosure : double.PositiveInfinity;

    /// <summary>|angular misclosure| / its allowance; NaN when there is no angular check.</summary>
    public double AngularRatio => Math.Abs(AngularMisclosure) / AngularAllowance;

    /// <summary>√(fᵀC⁻¹f / χ²): the linear misclosure against its allowance (≤ 1 passes); NaN when not
    /// testable.</summary>
    public double LinearRatio => Math.Sqrt(LinearStatistic / LinearCritical);

    /// <summary>The largest of the ratios that apply (≤ 1 passes), including k_required / k.</summary>
    public double Ratio
    {
        get
        {
            double r = 0;
            if (double.IsFinite(AngularRatio)) r = Math.Max(r, AngularRatio);
            if (double.IsFinite(LinearRatio)) r = Math.Max(r, LinearRatio);
            if (MinimumRatio is double k) r = Math.Max(r, PrecisionRatio > 0 ? k / PrecisionRatio : 0);
            return r;
        }
    }

    /// <summary>True when every check that applies passes.</summary>
    public bool Passed => Ratio <= 1;
}

/// <summary>The checks before the adjustment: every level closure and traverse found in a network. Made by the checks
/// before the adjustment only (the constructor is internal).</summary>
public sealed record MisclosureReport
{
    /// <summary>Made by the checks before the adjustment.</summary>
    internal MisclosureReport(MisclosureOptions Options, IReadOnlyList<LevelClosure> Levels,
        IReadOnlyList<TraverseClosure> Traverses)
    {
        this.Options = Options; this.Levels = Levels; this.Traverses = Traverses;
    }

    /// <summary>The options used.</summary>
    public MisclosureOptions Options { get; internal init; }

    /// <summary>Level loops, lines between benchmarks and sections levelled twice, in the order found.</summary>
    public IReadOnlyList<LevelClosure> Levels { get; internal init; }

    /// <summary>Link and closed traverses, in the order found.</summary>
    public IReadOnlyList<TraverseClosure> Traverses { get; internal init; }

    /// <summary>Closed loops of GNSS baselines, shortest first (empty when the network has none).</summary>
    public IReadOnlyList<BaselineLoop> BaselineLoops { get; internal init; } = [];

    /// <summary>True when nothing was found to check.</summary>
    public bool IsEmpty => Levels.Count == 0 && Traverses.Count == 0 && BaselineLoops.Count == 0;
}
