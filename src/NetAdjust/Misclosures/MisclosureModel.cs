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
/// </summary>
/// <param name="Kind">Loop, line or section.</param>
/// <param name="Points">The points in the order the closure runs (a loop repeats its first point at the end).</param>
/// <param name="Observations">Indices of the height differences in the network's observation list, in running
/// order.</param>
/// <param name="Misclosure">Σ Δh along the run, minus the given height difference of the end benchmarks for a
/// line (m).</param>
/// <param name="Length">The levelled length K (m): the sum of the sections' lengths (for a section levelled twice,
/// the shorter run); NaN when a section's length is not known.</param>
/// <param name="Sd">The expected standard deviation of the misclosure, √Σσᵢ² (m).</param>
/// <param name="SdAllowance">The misclosure allowed by the expected standard deviation, z·σ (m).</param>
/// <param name="Allowance">c·√K (m); null when no constant is set or K is not known.</param>
public sealed record LevelClosure(LevelClosureKind Kind, IReadOnlyList<string> Points,
    IReadOnlyList<int> Observations, double Misclosure, double Length, double Sd, double SdAllowance,
    double? Allowance)
{
    /// <summary>The largest ratio |misclosure| / allowance over the allowances that apply (≤ 1 passes).</summary>
    public double Ratio => Math.Max(Math.Abs(Misclosure) / SdAllowance,
        Allowance is double a ? Math.Abs(Misclosure) / a : 0);

    /// <summary>True when the misclosure is within every allowance that applies.</summary>
    public bool Passed => Ratio <= 1;
}

/// <summary>
/// The misclosures of one traverse: angular (against its expected standard deviation) and linear (with its
/// precision ratio 1:k, tested against its expected covariance after the angles are balanced). SI units.
/// </summary>
/// <param name="Kind">Link or closed.</param>
/// <param name="Points">The stations in running order (reference points not included).</param>
/// <param name="Observations">Indices of the angles, directions and distances used, in the network's
/// order.</param>
/// <param name="AngularMisclosure">Carried minus known azimuth at the end (rad, in (−π, π]); NaN when the
/// traverse ends on a known point without a closing angle.</param>
/// <param name="AngularSd">Expected standard deviation of the angular misclosure, √Σσα² (rad); NaN likewise.</param>
/// <param name="AngularAllowance">z·σ (rad); NaN likewise.</param>
/// <param name="LinearMisclosure">The length of the closing vector after the angles are balanced (m).</param>
/// <param name="Length">The traverse length Σd (m).</param>
/// <param name="LinearStatistic">fᵀ C⁻¹ f of the closing vector f with its expected covariance C; NaN when C is
/// singular.</param>
/// <param name="LinearCritical">The χ²(2) quantile at the check's confidence.</param>
/// <param name="MinimumRatio">The least precision ratio k required, or null.</param>
public sealed record TraverseClosure(TraverseKind Kind, IReadOnlyList<string> Points,
    IReadOnlyList<int> Observations, double AngularMisclosure, double AngularSd, double AngularAllowance,
    double LinearMisclosure, double Length, double LinearStatistic, double LinearCritical, double? MinimumRatio)
{
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

/// <summary>The checks before the adjustment: every level closure and traverse found in a network.</summary>
/// <param name="Options">The options used.</param>
/// <param name="Levels">Level loops, lines between benchmarks and sections levelled twice, in the order found.</param>
/// <param name="Traverses">Link and closed traverses, in the order found.</param>
public sealed record MisclosureReport(MisclosureOptions Options, IReadOnlyList<LevelClosure> Levels,
    IReadOnlyList<TraverseClosure> Traverses)
{
    /// <summary>Closed loops of GNSS baselines, shortest first (empty when the network has none).</summary>
    public IReadOnlyList<BaselineLoop> BaselineLoops { get; init; } = [];

    /// <summary>True when nothing was found to check.</summary>
    public bool IsEmpty => Levels.Count == 0 && Traverses.Count == 0 && BaselineLoops.Count == 0;
}
