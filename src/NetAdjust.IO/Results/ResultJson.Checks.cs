using NetAdjust.Misclosures;
using NetAdjust.Standards;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>The JSON of the checks before the adjustment and of the accuracy standards (docs/output-format.md).
/// </summary>
internal static partial class ResultJson
{
    private static double? Num(double v) => double.IsFinite(v) ? v : null;

    /// <summary>Key <c>misclosures</c>: level closures and traverses (lengths m, angles arcsec).</summary>
    internal sealed record Misclosures(double Confidence, double? LevelLoopConstantMm, double? LevelSectionConstantMm,
        double? MinimumTraverseRatio, IEnumerable<LevelClosure> Levels, IEnumerable<Traverse> Traverses)
    {
        public static Misclosures? Of(MisclosureReport? m) => m is null || m.IsEmpty ? null : new(
            m.Options.Confidence, m.Options.LevelLoopConstant * 1000,
            (m.Options.LevelSectionConstant ?? m.Options.LevelLoopConstant) * 1000, m.Options.MinimumTraverseRatio,
            m.Levels.Select(l => new LevelClosure(
                l.Kind switch
                {
                    LevelClosureKind.Loop => "loop",
                    LevelClosureKind.Line => "line",
                    _ => "section",
                },
                l.Points, l.Observations.Select(i => i + 1), l.Misclosure, Num(l.Length), Num(l.Sd),
                Num(l.SdAllowance), l.Allowance is double al ? Num(al) : null, Num(l.Ratio), l.Passed)),
            m.Traverses.Select(t => new Traverse(t.Kind == TraverseKind.Link ? "link" : "closed", t.Points,
                t.Observations.Select(i => i + 1), Num(t.AngularMisclosure * Angle.ArcsecondsPerRadian),
                Num(t.AngularSd * Angle.ArcsecondsPerRadian), Num(t.AngularAllowance * Angle.ArcsecondsPerRadian),
                t.LinearMisclosure, t.Length, Num(t.PrecisionRatio), Num(t.LinearStatistic), t.LinearCritical,
                Num(t.Ratio), t.Passed)))
        {
            BaselineLoops = m.BaselineLoops.Count == 0 ? null : m.BaselineLoops.Select(BaselineLoop.Of),
        };

        /// <summary>Key <c>baseline_loops</c>: GNSS baseline loops; left out when there are none.</summary>
        [System.Text.Json.Serialization.JsonIgnore(
            Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
        public IEnumerable<BaselineLoop>? BaselineLoops { get; init; }
    }

    /// <summary>One loop of GNSS baselines (lengths m); observations are 1-based numbers of the observation list
    /// (ΔX, ΔY, ΔZ of each baseline in running order).</summary>
    internal sealed record BaselineLoop(IEnumerable<string> Points, IEnumerable<int> Observations,
        IEnumerable<string?> Groups, bool Trivial, double Dx, double Dy, double Dz, double Misclosure, double Length,
        double? Ppm, double? East, double? North, double? Up, double? SdEast, double? SdNorth, double? SdUp,
        double? Statistic, double Critical, double? Ratio, double? ComponentRatio, bool Passed)
    {
        public static BaselineLoop Of(NetAdjust.Misclosures.BaselineLoop l) => new(l.Points,
            l.Observations.Select(i => i + 1), l.Groups, l.Trivial, l.Dx, l.Dy, l.Dz, l.Misclosure, l.Length,
            Num(l.Ppm), Num(l.East), Num(l.North), Num(l.Up), Num(l.SdEast), Num(l.SdNorth), Num(l.SdUp),
            Num(l.Statistic), l.Critical, Num(l.Ratio), Num(l.ComponentRatio), l.Passed);
    }

    /// <summary>One level closure; observations are 1-based numbers of the observation list.</summary>
    internal sealed record LevelClosure(string Kind, IEnumerable<string> Points, IEnumerable<int> Observations,
        double Misclosure, double? Length, double? Sd, double? SdAllowance, double? Allowance, double? Ratio,
        bool Passed);

    /// <summary>One traverse; observations are 1-based numbers of the observation list.</summary>
    internal sealed record Traverse(string Kind, IEnumerable<string> Points, IEnumerable<int> Observations,
        double? AngularMisclosure, double? AngularSd, double? AngularAllowance, double LinearMisclosure,
        double Length, double? PrecisionRatio, double? LinearStatistic, double LinearCritical, double? Ratio,
        bool Passed);

    /// <summary>Key <c>standards</c>: the standards applied, their items (worst first) and the caution.</summary>
    internal sealed record Standards(IEnumerable<Standard> Applied, IEnumerable<StandardItem> Items, string Caution)
    {
        public static Standards? Of(StandardsReport? s) => s is null || s.Standards.Count == 0 ? null : new(
            s.Standards.Select(x => new Standard(x.Name, x.Kind switch
            {
                StandardKind.RelativePrecision => "relative_precision",
                StandardKind.GeodeticAccuracy => "geodetic_accuracy",
                _ => "levelling",
            }, x.Source)),
            s.Items.Select(i => new StandardItem(i.Standard, i.Item, i.Quantity, Num(i.Value), i.Allowance,
                i.Ratio is double r && double.IsFinite(r) ? r : null,
                i.ClassReached, i.Passed)),
            StandardsReport.Caution);
    }

    /// <summary>One standard applied.</summary>
    internal sealed record Standard(string Name, string Kind, string Source);

    /// <summary>One checked item (lengths m).</summary>
    internal sealed record StandardItem(string Standard, string Item, string Quantity, double? Value,
        double? Allowance, double? Ratio, double? ClassReached, bool? Passed);
}
