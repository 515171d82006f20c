using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Misclosures;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Standards;

/// <summary>
/// One checked item of an accuracy standard: a pair, a point or a levelling closure. Lengths in metres.
/// Made by the standards check only (the constructor is internal).
/// </summary>
public sealed record StandardItem
{
    /// <summary>Made by the standards check.</summary>
    internal StandardItem(string Standard, string Item, string Quantity, double Value, double? Allowance,
        double? ClassReached)
    {
        this.Standard = Standard; this.Item = Item; this.Quantity = Quantity; this.Value = Value;
        this.Allowance = Allowance; this.ClassReached = ClassReached;
    }

    /// <summary>The standard's name.</summary>
    public string Standard { get; internal init; }

    /// <summary>The pair (<c>A–B</c>), the point, or the closure (its points).</summary>
    public string Item { get; internal init; }

    /// <summary>What is measured, e.g. <c>relative 95%</c>, <c>network horizontal</c>, <c>loop</c>.</summary>
    public string Quantity { get; internal init; }

    /// <summary>The 95% value or the misclosure's size (m).</summary>
    internal double Value { get; init; }

    /// <summary>The allowance (m); null when the standard sets none (a class is reported instead).</summary>
    internal double? Allowance { get; init; }

    /// <summary>The accuracy class reached (m), for geodetic accuracy; null otherwise.</summary>
    internal double? ClassReached { get; init; }

    /// <summary>The 95% value or the misclosure's size.</summary>
    public Length ValueLength => Lengths.Metres(Value);

    /// <summary>The allowance; null when the standard sets none (a class is reported instead).</summary>
    public Length? AllowanceLength => Lengths.Of(Allowance);

    /// <summary>The accuracy class reached, for geodetic accuracy; null otherwise.</summary>
    public Length? ClassReachedLength => Lengths.Of(ClassReached);

    /// <summary>Value / allowance (≤ 1 passes); null without an allowance.</summary>
    public double? Ratio => Allowance is double a ? (a > 0 ? Value / a : double.PositiveInfinity) : null;

    /// <summary>True when within the allowance; null without one.</summary>
    public bool? Passed => Ratio is double r ? r <= 1 : null;
}

/// <summary>The outcome of applying accuracy standards: every item, worst first within each standard. Made by the
/// standards check only (the constructor is internal).</summary>
public sealed record StandardsReport
{
    /// <summary>Made by the standards check.</summary>
    internal StandardsReport(IReadOnlyList<AccuracyStandard> Standards, IReadOnlyList<StandardItem> Items)
    {
        this.Standards = Standards; this.Items = Items;
    }

    /// <summary>The standards applied, in the order given.</summary>
    public IReadOnlyList<AccuracyStandard> Standards { get; internal init; }

    /// <summary>The items, grouped by standard in that order, each group worst (largest ratio) first.</summary>
    public IReadOnlyList<StandardItem> Items { get; internal init; }

    /// <summary>The caution every report of standards carries.</summary>
    public const string Caution = "A computed pass is evidence for the surveyor in charge, not a certification: " +
        "local regulations and the contract decide whether the work complies.";
}

/// <summary>
/// Applies accuracy standards to an adjustment result (relative precision of pairs, FGDC local and network
/// accuracy) and to the levelling closures of the checks before it (docs/methods.md, "Accuracy standards").
/// Reads a finished result; adjusts nothing.
/// </summary>
public static class StandardsCheck
{
    /// <summary>The scale from a standard ellipse to the 95% one, √χ²(0.95; 2) = 2.4477 (MathNet).</summary>
    public static double Ellipse95 { get; } = Math.Sqrt(ChiSquared.InvCDF(2, 0.95));

    /// <summary>The scale from a standard deviation to a two-sided 95% interval, 1.959964.</summary>
    public static double Interval95 { get; } = Normal.InvCDF(0, 1, 0.975);

    /// <summary>Applies the standards.</summary>
    /// <param name="result">The adjustment result (its analysis gives the ellipses at its variance factor).</param>
    /// <param name="standards">The standards, in the order to report them.</param>
    /// <param name="closures">The levelling closures for levelling standards; null when none were checked.</param>
    /// <returns>The items, worst first within each standard.</returns>
    public static StandardsReport Apply(AdjustmentResult result, IReadOnlyList<AccuracyStandard> standards,
        MisclosureReport? closures = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(standards);
        var items = new List<StandardItem>();
        foreach (var s in standards)
        {
            var group = s.Kind switch
            {
                StandardKind.RelativePrecision => Relative(result.Analysis, s),
                StandardKind.GeodeticAccuracy => Geodetic(result, s),
                _ => Levelling(closures, s),
            };
            // worst first: the largest ratio, or the largest value where the standard sets no allowance
            items.AddRange(group.OrderByDescending(i => i.Ratio ?? i.Value));
        }
        return new StandardsReport(standards, items);
    }

    private static IEnumerable<StandardItem> Relative(NetworkAnalysis a, AccuracyStandard s)
    {
        var set = new HashSet<string>(s.Points, StringComparer.Ordinal);
        foreach (var p in a.Relative)
        {
            bool take = s.Pairs switch
            {
                PairSelection.Observed => p.Observed,
                PairSelection.Listed => !p.Observed,
                _ => set.Contains(p.From) && set.Contains(p.To),
            };
            if (!take) continue;
            yield return new StandardItem(s.Name, $"{p.From}–{p.To}", "relative 95%", p.Ellipse.A * Ellipse95,
                s.Allowance(p.Distance), null);
        }
    }

    private static IEnumerable<StandardItem> Geodetic(AdjustmentResult result, AccuracyStandard s)
    {
        var a = result.Analysis;
        StandardItem Item(string id, string what, double v) =>
            new(s.Name, id, what, v, s.RequiredClass, AccuracyStandards.ClassReached(v));
        var local = new Dictionary<string, List<double>>(StringComparer.Ordinal);
        var localH = new Dictionary<string, List<double>>(StringComparer.Ordinal);
        void Add(Dictionary<string, List<double>> d, string id, double v)
        {
            if (!d.TryGetValue(id, out var l)) d[id] = l = [];
            l.Add(v);
        }
        foreach (var p in a.Relative.Where(p => p.Observed))
        {
            double r = AccuracyStandards.CircularRadius95(p.Ellipse.A, p.Ellipse.B);
            Add(local, p.From, r); Add(local, p.To, r);
        }
        foreach (var p in a.RelativeHeights.Where(p => p.Observed))
        {
            double r = Interval95 * p.SdDifference;
            Add(localH, p.From, r); Add(localH, p.To, r);
        }
        for (int i = 0; i < result.Points.Count; i++)
        {
            var point = result.Points[i];
            var pp = a.Points[i];
            bool heldPlane = point.Input.IsFixed(Network.Fixity.EN);
            bool heldHeight = point.Input.IsFixed(Network.Fixity.H);
            if (pp.Ellipse is ErrorEllipse e && !heldPlane)
                yield return Item(point.Id, "network horizontal", AccuracyStandards.CircularRadius95(e.A, e.B));
            if (pp.SdHeight is double sh && !heldHeight)
                yield return Item(point.Id, "network vertical", Interval95 * sh);
            // local accuracy: the average over the directly connected points (FGDC-STD-007.2-1998, from memory)
            if (local.TryGetValue(point.Id, out var l)) yield return Item(point.Id, "local horizontal", l.Average());
            if (localH.TryGetValue(point.Id, out var lh)) yield return Item(point.Id, "local vertical", lh.Average());
        }
    }

    private static IEnumerable<StandardItem> Levelling(MisclosureReport? closures, AccuracyStandard s)
    {
        if (closures is null) yield break;
        foreach (var c in closures.Levels)
        {
            double constant = c.Kind == LevelClosureKind.Section ? s.SectionConstant : s.LoopConstant;
            if (!double.IsFinite(c.Length)) continue;
            string what = c.Kind switch
            {
                LevelClosureKind.Section => "section",
                LevelClosureKind.Line => "line",
                _ => "loop",
            };
            yield return new StandardItem(s.Name, string.Join("-", c.Points), what, Math.Abs(c.Misclosure),
                constant * Math.Sqrt(c.Length / 1000), null);
        }
    }
}
