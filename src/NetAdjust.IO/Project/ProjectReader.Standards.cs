using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Standards;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// Plans, the <c>checks:</c> section (the checks before the adjustment) and the <c>standards:</c> section
/// (accuracy standards) of a project file (docs/input-format.md, "Plans", "Checks" and "Accuracy standards").
/// </summary>
public static partial class ProjectReader
{
    /// <summary>The text a planned observation's missing value is read as (a right angle, or 1 length unit);
    /// replaced at the design coordinates.</summary>
    private static string PlannedValue(ObservationKind kind, ProjectUnits units) =>
        !kind.IsAngular() ? "1" : units.Angle switch
        {
            Units.AngleFormat.Dms => "90-00-00",
            Units.AngleFormat.Gons => "100",
            _ => "90",
        };

    /// <summary>
    /// Reads a plan: a project file whose observations may leave out <c>value</c> (and <c>dh</c>); every
    /// observation then takes the value of its equation at the design coordinates of the points
    /// (<see cref="NetworkDesign.AtDesign"/>). Everything else is read as by <see cref="Read(string)"/>.
    /// </summary>
    /// <param name="path">Path of the YAML plan.</param>
    /// <param name="resolver">Opens the files; null for the file system.</param>
    /// <exception cref="ProjectFileException">When a file is missing or invalid.</exception>
    /// <exception cref="InvalidInputException">When the network is inconsistent or a point lacks design
    /// coordinates.</exception>
    public static SurveyProject ReadPlan(string path, InputFileResolver? resolver = null)
    {
        resolver ??= InputFileResolver.FileSystem;
        string full;
        try { full = resolver.Resolve(Directory.GetCurrentDirectory(), path); }
        catch (Exception e)
            when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        { throw new ProjectFileException(path, 0, "", $"the plan cannot be read ({FirstLine(e.Message)})"); }
        string text = ReadText(resolver, full, path, "the plan");
        return Parse(text, path, Path.GetDirectoryName(full)!, resolver, planned: true);
    }

    private static SurveyNetwork AtDesign(SurveyNetwork network) => NetworkDesign.AtDesign(network);

    private static (MisclosureOptions Checks, IReadOnlyList<AccuracyStandard> Standards,
        Func<AnalysisOptions, IReadOnlyList<(string, string)>> Pairs) ReadChecksAndStandards(Context ctx,
        YamlMappingNode root, SurveyNetwork network)
    {
        var checks = ReadChecks(ctx, root);
        var standards = new List<AccuracyStandard>();
        var extra = new List<(string, string)>();
        if (ctx.Child(root, "standards") is YamlNode node)
            foreach (var item in ctx.Sequence(node, "standards"))
            {
                var s = ReadStandard(ctx, item, network);
                if (standards.Any(x => x.Name == s.Name))
                    throw ctx.Error(item, "standards", $"standard '{s.Name}' is listed twice");
                standards.Add(s);
                if (s.Pairs == PairSelection.AllOf)
                    for (int i = 0; i < s.Points.Count; i++)
                        for (int j = i + 1; j < s.Points.Count; j++) extra.Add((s.Points[i], s.Points[j]));
            }
        return (checks, standards, a => extra.Count == 0 ? a.RelativePairs
            : [.. a.RelativePairs, .. extra.Where(p => !a.RelativePairs.Contains(p) &&
                !a.RelativePairs.Contains((p.Item2, p.Item1))).Distinct()]);
    }

    private static MisclosureOptions ReadChecks(Context ctx, YamlMappingNode root)
    {
        var o = MisclosureOptions.Default;
        if (ctx.Child(root, "checks") is not YamlNode node) return o;
        var m = ctx.Mapping(node, "checks");
        ctx.CheckKeys(m, ["confidence", "level_loop_mm", "level_section_mm", "level_standard", "traverse_ratio"],
            "checks");
        if (ctx.Child(m, "confidence") is YamlNode c)
        {
            double v = ctx.Number(c, "checks.confidence");
            if (!(v > 0.5 && v < 1)) throw ctx.Error(c, "checks.confidence", "the confidence must be above 0.5 and " +
                "below 1, e.g. 0.95");
            o = o with { Confidence = v };
        }
        if (ctx.Child(m, "level_standard") is YamlNode ls)
        {
            string name = ctx.Scalar(ls, "checks.level_standard");
            var s = AccuracyStandards.Find(name);
            if (s is not { Kind: StandardKind.Levelling })
                throw ctx.Error(ls, "checks.level_standard", $"'{name}' is not a levelling standard: use one of " +
                    string.Join(", ", AccuracyStandards.BuiltIn.Where(b => b.Kind == StandardKind.Levelling)
                        .Select(b => b.Name)));
            o = o with { LevelLoopConstant = s.LoopConstant, LevelSectionConstant = s.SectionConstant };
        }
        if (ctx.Child(m, "level_loop_mm") is YamlNode ll)
            o = o with { LevelLoopConstant = Positive(ctx, ll, "checks.level_loop_mm") / 1000 };
        if (ctx.Child(m, "level_section_mm") is YamlNode lsec)
            o = o with { LevelSectionConstant = Positive(ctx, lsec, "checks.level_section_mm") / 1000 };
        if (ctx.Child(m, "traverse_ratio") is YamlNode tr)
            o = o with { MinimumTraverseRatio = Positive(ctx, tr, "checks.traverse_ratio") };
        return o;
    }

    private static double Positive(Context ctx, YamlNode node, string item)
    {
        double v = ctx.Number(node, item);
        return v > 0 && v < 1e9 ? v : throw ctx.Error(node, item,
            $"'{v.ToString(CultureInfo.InvariantCulture)}' must be a positive number");
    }

    private static AccuracyStandard ReadStandard(Context ctx, YamlNode node, SurveyNetwork network)
    {
        if (node is YamlScalarNode)
        {
            string name = ctx.Scalar(node, "standards");
            return AccuracyStandards.Find(name) ?? throw ctx.Error(node, "standards",
                $"'{name}' is not a built-in standard: use one of " +
                $"{string.Join(", ", AccuracyStandards.BuiltIn.Select(b => b.Name))}, or define it as a mapping " +
                "with 'name' and 'kind'");
        }
        var m = ctx.Mapping(node, "a standard");
        string id = ctx.RequiredString(m, "name", "a standard");
        string item = $"standard {id}";
        ctx.CheckKeys(m, ["name", "kind", "source", "constant_mm", "ppm", "pairs", "points", "class_mm",
            "section_mm", "loop_mm"], item);
        var kindNode = ctx.Child(m, "kind") ?? throw ctx.Error(m, item, "'kind' is missing");
        string kindText = ctx.Scalar(kindNode, item + " kind");
        var kind = kindText switch
        {
            "relative_precision" => StandardKind.RelativePrecision,
            "geodetic_accuracy" => StandardKind.GeodeticAccuracy,
            "levelling" => StandardKind.Levelling,
            _ => throw ctx.Error(kindNode, item + " kind",
                $"'{kindText}' is not a kind of standard: use relative_precision, geodetic_accuracy or levelling"),
        };
        if (AccuracyStandards.Find(id) is not null)
            throw ctx.Error(m, item, $"'{id}' is the name of a built-in standard: give yours another name");
        var s = new AccuracyStandard(id, kind, ctx.OptionalString(m, "source") ?? "defined in the project");
        string[] allowed = kind switch
        {
            StandardKind.RelativePrecision => ["constant_mm", "ppm", "pairs", "points"],
            StandardKind.GeodeticAccuracy => ["class_mm"],
            _ => ["section_mm", "loop_mm"],
        };
        foreach (var key in new[] { "constant_mm", "ppm", "pairs", "points", "class_mm", "section_mm", "loop_mm" })
            if (!allowed.Contains(key) && ctx.Child(m, key) is YamlNode k)
                throw ctx.Error(k, item, $"'{key}' does not belong to a standard of kind {kindText}");
        double Need(string key) => ctx.Child(m, key) is YamlNode n ? NonNegative(ctx, n, $"{item} {key}")
            : throw ctx.Error(m, item, $"'{key}' is missing");
        switch (kind)
        {
            case StandardKind.RelativePrecision:
                s = s with { Constant = Need("constant_mm") / 1000, Ppm = Need("ppm") };
                if (ctx.Child(m, "pairs") is YamlNode pn)
                {
                    string p = ctx.Scalar(pn, item + " pairs");
                    s = s with
                    {
                        Pairs = p switch
                        {
                            "observed" => PairSelection.Observed,
                            "listed" => PairSelection.Listed,
                            "all" => PairSelection.AllOf,
                            _ => throw ctx.Error(pn, item + " pairs",
                                $"'{p}' is not a choice of pairs: use observed, listed or all"),
                        },
                    };
                }
                if (s.Pairs == PairSelection.AllOf)
                {
                    var pts = ctx.Child(m, "points") ?? throw ctx.Error(m, item, "'points' is missing: list the " +
                        "points whose pairs are checked");
                    var ids = ctx.Sequence(pts, item + " points").Select(x =>
                    {
                        string pid = ctx.Scalar(x, item + " points");
                        return network.Contains(pid) ? pid
                            : throw ctx.Error(x, item + " points", $"point '{pid}' is not defined under 'points'");
                    }).Distinct().ToList();
                    if (ids.Count < 2) throw ctx.Error(pts, item + " points", "list at least two points");
                    s = s with { Points = ids };
                }
                else if (ctx.Child(m, "points") is YamlNode extra)
                    throw ctx.Error(extra, item, "'points' belongs to pairs: all");
                break;
            case StandardKind.GeodeticAccuracy:
                if (ctx.Child(m, "class_mm") is YamlNode cn)
                {
                    double c = NonNegative(ctx, cn, item + " class_mm") / 1000;
                    if (!AccuracyStandards.GeodeticClasses.Any(x => Math.Abs(x - c) < 1e-9))
                        throw ctx.Error(cn, item + " class_mm", "not an accuracy class of FGDC-STD-007.2-1998: use " +
                            "1, 2, 5, 10, 20, 50, 100, 200, 500, 1000, 2000, 5000 or 10000");
                    s = s with { RequiredClass = c };
                }
                break;
            default:
                s = s with { SectionConstant = Need("section_mm") / 1000, LoopConstant = Need("loop_mm") / 1000 };
                break;
        }
        return s;
    }

    private static double NonNegative(Context ctx, YamlNode node, string item)
    {
        double v = ctx.Number(node, item);
        return v >= 0 && v < 1e9 ? v : throw ctx.Error(node, item,
            $"'{v.ToString(CultureInfo.InvariantCulture)}' must be zero or a positive number");
    }
}
