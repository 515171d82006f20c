using System.Globalization;
using System.Runtime.InteropServices;
using NetAdjust.Geodesy;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The <c>gnss</c> section of a project: GNSS baselines, their groups and frame parameters
/// (docs/input-format.md, "GNSS baselines").</summary>
public static partial class ProjectReader
{
    private static readonly string[] GnssKeys =
        ["frame", "groups", "frame_parameters", "frame_rotation_sd", "frame_scale_sd", "baselines"];

    private static readonly string[] GnssGroupKeys = ["id", "scale"];

    /// <summary>The id of the frame whose parameters the baselines share.</summary>
    internal const string GnssFrameId = "gnss";

    /// <summary>What the <c>gnss</c> section declares for all baselines (those of CSV files too).</summary>
    private sealed class GnssInputs
    {
        public string? FrameLabel { get; set; }
        public BaselineFrame? Frame { get; set; }
        public Dictionary<string, double> Groups { get; } = new(StringComparer.Ordinal);
        public YamlNode? Node { get; set; }

        /// <summary>The project's grid system (null: none), which the baselines are made with.</summary>
        public GridSystem? Grid { get; init; }
    }

    /// <summary>Reads the <c>gnss</c> section: its groups and frame parameters, and its baselines into
    /// <paramref name="observations"/> (three component observations each).</summary>
    private static GnssInputs ReadGnss(Context ctx, YamlMappingNode root, List<Observation> observations,
        GridSystem? grid)
    {
        var g = new GnssInputs { Grid = grid };
        if (ctx.Child(root, "gnss") is not YamlNode node) return g;
        g.Node = node;
        var m = ctx.Mapping(node, "gnss");
        ctx.CheckKeys(m, GnssKeys, "gnss");
        g.FrameLabel = ctx.OptionalString(m, "frame");
        if (ctx.Child(m, "groups") is YamlNode groups)
            foreach (var gn in ctx.Sequence(groups, "gnss.groups"))
            {
                var gm = ctx.Mapping(gn, "a group of baselines");
                string id = RequiredId(ctx, gm, "id", "a group of baselines");
                string item = "gnss group " + id;
                ctx.CheckKeys(gm, GnssGroupKeys, item);
                double scale = 1;
                if (ctx.Child(gm, "scale") is YamlNode sn)
                {
                    scale = ctx.Number(sn, item + " scale");
                    if (!(scale > 0 && scale <= 1e4))
                        throw ctx.Error(sn, item, "scale: the variance factor of a group must be positive (e.g. 1.5; " +
                            "at most 10000)");
                }
                if (!g.Groups.TryAdd(id, scale)) throw ctx.Error(gn, item, "the group is defined twice");
            }
        var set = FrameParameterSet.None;
        if (ctx.Child(m, "frame_parameters") is YamlNode fp)
            set = ctx.Choice(fp, "gnss.frame_parameters", OptionGrammars.FrameParameterSets);
        Angle? rotationSd = null;
        double? scaleSd = null;
        if (ctx.Child(m, "frame_rotation_sd") is YamlNode rs)
        {
            if (set == FrameParameterSet.None)
                throw ctx.Error(rs, "gnss.frame_rotation_sd", "is given without gnss.frame_parameters");
            double v = ctx.Number(rs, "gnss.frame_rotation_sd");
            if (!(v > 0)) throw ctx.Error(rs, "gnss.frame_rotation_sd", "must be positive (arcseconds)");
            rotationSd = Angle.FromArcseconds(v);
        }
        if (ctx.Child(m, "frame_scale_sd") is YamlNode ss)
        {
            if (set != FrameParameterSet.RotationsAndScale)
                throw ctx.Error(ss, "gnss.frame_scale_sd", "is given without a scale in gnss.frame_parameters");
            double v = ctx.Number(ss, "gnss.frame_scale_sd");
            if (!(v > 0)) throw ctx.Error(ss, "gnss.frame_scale_sd", "must be positive (ppm)");
            scaleSd = v;
        }
        if (set != FrameParameterSet.None)
            g.Frame = new BaselineFrame(GnssFrameId, set) { RotationSd = rotationSd, ScalePpmSd = scaleSd };
        if (ctx.Child(m, "baselines") is YamlNode bl)
            foreach (var bn in ctx.Sequence(bl, "gnss.baselines"))
                observations.AddRange(Guarded(ctx, bn, "a baseline", () => ReadBaseline(ctx, bn, g)));
        return g;
    }

    private static IReadOnlyList<Observation> ReadBaseline(Context ctx, YamlNode node, GnssInputs g)
    {
        var m = ctx.Mapping(node, "a baseline");
        string from = RequiredId(ctx, m, "from", "a baseline");
        string to = RequiredId(ctx, m, "to", "a baseline");
        string item = $"baseline {from}→{to}";
        ctx.CheckKeys(m, [.. Keys(ObservationKind.Baseline)], item);
        Length Component(string key)
        {
            if (ctx.Child(m, key) is not YamlNode v)
                throw ctx.Error(m, item, $"'{key}' is missing (a baseline has dx, dy and dz in metres)");
            return ctx.ParseLength(v, LengthPattern.Metres, ctx.Scalar(v, $"{item} {key}"), $"{item} {key}");
        }
        var vector = (Component("dx"), Component("dy"), Component("dz"));
        double[] cov;
        var covNode = ctx.Child(m, "cov");
        var sdNode = ctx.Child(m, "sd");
        var corrNode = ctx.Child(m, "corr");
        if (covNode is not null)
        {
            if (sdNode is not null || corrNode is not null)
                throw ctx.Error(covNode, item, "give either 'cov' or 'sd' with 'corr', not both");
            var q = Numbers(ctx, covNode, item + " cov", 6);
            cov = [q[0], q[1], q[3], q[1], q[2], q[4], q[3], q[4], q[5]];
        }
        else
        {
            if (sdNode is null)
                throw ctx.Error(m, item, "'sd' is missing: give sd: [σx, σy, σz] in metres (and corr), or cov");
            var sd = Numbers(ctx, sdNode, item + " sd", 3);
            for (int i = 0; i < 3; i++)
                if (!(sd[i] > 0)) throw ctx.Error(sdNode, item, "sd: a standard deviation must be positive");
            double[] r = corrNode is null ? [0, 0, 0] : Numbers(ctx, corrNode, item + " corr", 3);
            for (int i = 0; i < 3; i++)
                if (!(r[i] > -1 && r[i] < 1))
                    throw ctx.Error(corrNode!, item, $"corr: a correlation must lie between −1 and 1, not " +
                        r[i].ToString("R", CultureInfo.InvariantCulture));
            cov = BaselineObservation.CovarianceOf((Length.FromMetres(sd[0]), Length.FromMetres(sd[1]),
                Length.FromMetres(sd[2])), r[0], r[1], r[2]);
        }
        if (BaselineObservation.CovarianceProblem(cov) is string problem)
            throw ctx.Error(covNode ?? corrNode ?? sdNode!, item, problem);
        string? group = null;
        if (ctx.Child(m, "group") is YamlNode gn)
        {
            group = ctx.Scalar(gn, item + " group");
            if (!g.Groups.ContainsKey(group))
                throw ctx.Error(gn, item, $"group '{group}' is not defined under gnss.groups" +
                    (g.Groups.Count == 0 ? "" : $" (defined: {string.Join(", ", g.Groups.Keys)})"));
        }
        string source = $"{ctx.File}:{Line(node)}";
        return [.. Baseline(source, from, to, vector, cov, group, g.Grid, g.Frame).Select(o =>
            ObservationMarks.Apply(o, node, ctx.File))];
    }

    /// <summary>The three components of one baseline as read, with the project's grid system and frame parameters
    /// (the group's scale is applied once all are read, <see cref="FinishBaselines"/>). The covariance is checked
    /// (<see cref="BaselineObservation.CovarianceProblem"/> null) and kept as it is.</summary>
    /// <exception cref="ArgumentException">When a point id or a component is refused.</exception>
    internal static BaselineObservation[] Baseline(string source, string from, string to,
        (Length X, Length Y, Length Z) vector, double[] cov, string? group, GridSystem? grid, BaselineFrame? frame) =>
        BaselineObservation.Made(source, from, to, vector, ImmutableCollectionsMarshal.AsImmutableArray(cov), grid,
            frame, source, group);

    private static double[] Numbers(Context ctx, YamlNode node, string item, int count)
    {
        var list = ctx.Sequence(node, item).ToList();
        if (list.Count != count)
            throw ctx.Error(node, item, $"expected a list of {count} numbers, found {list.Count}");
        return [.. list.Select(n => ctx.Number(n, item))];
    }

    /// <summary>
    /// Baselines need the project's projection (their components are made with the grid system and the frame
    /// parameters as they are read): refuses baselines without one, and frame parameters without baselines; checks
    /// the groups CSV rows name and applies the scales of the groups that have one (≠ 1) to their components (a
    /// component of such a group is made anew; the others are left as they are).
    /// </summary>
    private static void FinishBaselines(Context ctx, GnssInputs g, GridSystem? grid, List<Observation> observations,
        bool holdsBaselines)
    {
        // the list is searched only when the reader's checks saw a baseline among the observations
        var first = holdsBaselines ? observations.OfType<BaselineObservation>().FirstOrDefault() : null;
        if (first is null)
        {
            if (g.Frame is not null && g.Node is not null)
                throw ctx.Error(g.Node, "gnss.frame_parameters", "frame parameters need baselines");
            return;
        }
        if (grid?.Projection is null)
        {
            var (file, line) = SourceOf(first);
            throw new ProjectFileException(file, line, first.Describe().Split(" (")[0],
                "a GNSS baseline needs the project's map projection: give 'crs' and a 'grid' section " +
                "(docs/input-format.md, \"Grid and ground\"), with heights and the geoid separation (h = H + N)");
        }
        for (int i = 0; i < observations.Count; i++)
        {
            if (observations[i] is not BaselineObservation { Group: string group } b) continue;
            if (!g.Groups.TryGetValue(group, out double scale))
            {
                var (file, line) = SourceOf(b);
                throw new ProjectFileException(file, line, $"baseline {b.From}→{b.To}",
                    $"group '{group}' is not defined under gnss.groups in the project file");
            }
            // a scale of 1 leaves the covariance and the standard deviation as they are (not checked again)
            if (scale != 1.0)
                observations[i] = b with
                {
                    GroupScale = scale, Covariance = [.. b.Covariance!.Select(c => c * scale)],
                    StandardDeviation = b.StandardDeviation * Math.Sqrt(scale),
                };
        }
    }

    private static (string File, int Line) SourceOf(Observation o)
    {
        string s = o.Source ?? "";
        int colon = s.LastIndexOf(':');
        return colon > 0 && int.TryParse(s[(colon + 1)..], NumberStyles.None, CultureInfo.InvariantCulture,
            out int line) ? (s[..colon], line) : (s, 0);
    }
}
