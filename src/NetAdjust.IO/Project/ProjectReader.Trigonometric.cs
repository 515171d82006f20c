using NetAdjust.Geometry;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// Slope distances and zenith angles of a setup, with the setup's instrument height and each sighting's target
/// height (docs/input-format.md, "Slope distances and zenith angles"); the project's refraction coefficient.
/// </summary>
public static partial class ProjectReader
{
    /// <summary>The refraction coefficient k under <c>adjustment.refraction</c>, or the default 0.13.</summary>
    private static double ReadRefraction(Context ctx, YamlMappingNode root)
    {
        if (ctx.Child(root, "adjustment") is not YamlMappingNode adj || ctx.Child(adj, "refraction") is not YamlNode n)
            return SpatialGeometry.DefaultRefraction;
        return CheckedK(ctx, n, "adjustment.refraction");
    }

    /// <summary>σ_k of the project's k when <c>adjustment.refraction_sd</c> is not given (common practice).</summary>
    private const double DefaultRefractionSd = SpatialGeometry.DefaultRefractionSd;

    /// <summary>A group of zenith angles with its own refraction coefficient (e.g. one day's sights).</summary>
    /// <param name="Id">The group's id.</param>
    /// <param name="K">Its assumed k, or the start value when estimated.</param>
    /// <param name="Sd">σ_k of the assumed k.</param>
    /// <param name="Estimate">True when k is an unknown of the adjustment.</param>
    private sealed record RefractionGroup(string Id, double K, double Sd, bool Estimate);

    private static double CheckedK(Context ctx, YamlNode n, string item)
    {
        double k = ctx.Number(n, item);
        // Values met in practice lie between about −1 and +1 (common practice); beyond ±2 it is a typing error.
        return k is >= -2 and <= 2 ? k
            : throw ctx.Error(n, item, $"the refraction coefficient {k} is outside −2 … 2");
    }

    private static double CheckedKSd(Context ctx, YamlNode n, string item)
    {
        double sd = ctx.Number(n, item);
        return sd is >= 0 and <= 2 ? sd
            : throw ctx.Error(n, item, $"the standard deviation of the refraction coefficient must lie between 0 " +
                $"and 2, not {sd}");
    }

    /// <summary>
    /// <c>adjustment.refraction_sd</c> (σ_k of the project's k) and the top-level <c>refraction_groups</c>: each
    /// <c>id</c>, with <c>k</c> and <c>sd</c> defaulting to the project's, and <c>estimate</c> (k as an unknown).
    /// </summary>
    private static void ReadRefractionGroups(Context ctx, YamlMappingNode root, StochasticInputs specs)
    {
        if (ctx.Child(root, "adjustment") is YamlMappingNode adj && ctx.Child(adj, "refraction_sd") is YamlNode sdn)
            specs.RefractionSd = CheckedKSd(ctx, sdn, "adjustment.refraction_sd");
        if (ctx.Child(root, "refraction_groups") is not YamlNode groups) return;
        foreach (var node in ctx.Sequence(groups, "refraction_groups"))
        {
            var m = ctx.Mapping(node, "a refraction group");
            string id = ctx.RequiredString(m, "id", "a refraction group");
            string item = "refraction group " + id;
            ctx.CheckKeys(m, ["id", "k", "sd", "estimate"], item);
            if (specs.RefractionGroups.ContainsKey(id))
                throw ctx.Error(node, item, $"refraction group {id} is defined twice");
            double k = ctx.Child(m, "k") is YamlNode kn ? CheckedK(ctx, kn, item + " k") : specs.Refraction;
            double sd = ctx.Child(m, "sd") is YamlNode sn ? CheckedKSd(ctx, sn, item + " sd") : specs.RefractionSd;
            bool estimate = ctx.Child(m, "estimate") is YamlNode en
                && ctx.Choice(en, item + " estimate", OptionGrammars.YesNo, "estimate");
            if (estimate && ctx.Child(m, "sd") is YamlNode given)
                throw ctx.Error(given, item + " sd", "an estimated refraction coefficient takes no 'sd': the " +
                    "adjustment gives its standard deviation");
            specs.RefractionGroups[id] = new RefractionGroup(id, k, estimate ? 0 : sd, estimate);
        }
    }

    /// <summary>The setup's <c>refraction_group</c>, or null for the project's k.</summary>
    private static RefractionGroup? ReadSetupRefractionGroup(Context ctx, YamlMappingNode m, string item,
        StochasticInputs specs)
    {
        if (ctx.Child(m, "refraction_group") is not YamlNode n) return null;
        string id = ctx.Scalar(n, item + " refraction_group");
        return specs.RefractionGroups.TryGetValue(id, out var g) ? g
            : throw ctx.Error(n, item + " refraction_group",
                $"refraction group '{id}' is not defined under 'refraction_groups'");
    }

    /// <summary>What CSV rows may name: the instruments, targets and refraction groups, and the held heights.
    /// </summary>
    private static CsvObservationReader.CsvSpecifications CsvSpecifications(StochasticInputs s) => new(
        id => s.Instruments.GetValueOrDefault(id), id => s.Targets.GetValueOrDefault(id),
        id => id is null ? new(s.Refraction, s.RefractionSd, null, false)
            : s.RefractionGroups.TryGetValue(id, out var g) ? new(g.K, g.Sd, g.Id, g.Estimate) : null,
        id => s.Points.TryGetValue(id, out var p) && p.IsFixed(Fixity.H));

    private static void ReadTrigonometric(Context ctx, YamlMappingNode m, string at, string item, LengthPattern lengths,
        AnglePattern angles, ProjectUnits units, Dictionary<ObservationKind, double> defaults, SetupSpec spec,
        StochasticInputs specs, List<Pending> output)
    {
        var slopes = ctx.Child(m, "slope_distances");
        var zeniths = ctx.Child(m, "zeniths");
        var group = ReadSetupRefractionGroup(ctx, m, item, specs);
        if (slopes is null && zeniths is null) return;
        var hiNode = ctx.Child(m, "instrument_height")
            ?? throw ctx.Error(m, item, "'instrument_height' is missing: slope distances and zenith angles need it");
        var hi = ctx.ParseLength(hiNode, lengths, ctx.Scalar(hiNode, item + " instrument_height"),
            item + " instrument_height");
        if (!(hi.Metres >= 0) || hi.Metres > 100)
            throw ctx.Error(hiNode, item + " instrument_height",
                $"the instrument height must be between 0 and 100 m above the mark, not {hi.Metres} m");

        Length TargetHeight(YamlNode node, string what)
        {
            var mm = ctx.Mapping(node, what);
            var th = ctx.Child(mm, "target_height") ?? throw ctx.Error(node, what, "'target_height' is missing");
            var t = ctx.ParseLength(th, lengths, ctx.Scalar(th, what + " target_height"), what + " target_height");
            return Math.Abs(t.Metres) <= 100 ? t
                : throw ctx.Error(th, what + " target_height", $"the target height {t.Metres} m is not within ±100 m");
        }

        var zenithTargets = new HashSet<string>(StringComparer.Ordinal);
        if (zeniths is not null)
            foreach (var zn in ctx.Sequence(zeniths, item + " zeniths"))
            {
                var (to, value, sd, src, budget, target) = ReadSighting(ctx, zn, ObservationKind.Zenith, units,
                    defaults, Keys(ObservationKind.Zenith), item, spec, specs);
                string what = $"zenith angle to {to} in the {item}";
                var z = ctx.ParseAngle(zn, angles, value, what);
                if (!(z.Radians > 0 && z.Radians < Math.PI))
                    throw ctx.Error(zn, what,
                        $"a zenith angle must lie between 0 and 180° (0 at the zenith), not {value}");
                var o = new ZenithObservation(at, to, z, hi, TargetHeight(zn, what))
                {
                    StandardDeviation = sd, Source = src, Refraction = group?.K ?? specs.Refraction,
                    RefractionSd = group?.Sd ?? specs.RefractionSd, RefractionGroup = group?.Id,
                    RefractionEstimated = group?.Estimate ?? false,
                };
                zenithTargets.Add(to);
                output.Add(new(o, budget, target, zn, what));
            }
        if (slopes is not null)
            foreach (var sn in ctx.Sequence(slopes, item + " slope_distances"))
            {
                var (to, value, sd, src, budget, target) = ReadSighting(ctx, sn, ObservationKind.SlopeDistance, units,
                    defaults, Keys(ObservationKind.SlopeDistance), item, spec, specs);
                string what = $"slope distance to {to} in the {item}";
                var d = ctx.ParseLength(sn, lengths, value, what);
                if (!(d.Metres > 0)) throw ctx.Error(sn, what, $"a slope distance must be positive, not {value}");
                bool heightsHeld = specs.Points.TryGetValue(at, out var p) && p.IsFixed(Fixity.H)
                    && specs.Points.TryGetValue(to, out var q) && q.IsFixed(Fixity.H);
                if (!zenithTargets.Contains(to) && !heightsHeld)
                    throw ctx.Error(sn, what, "a slope distance needs a zenith angle to the same target in the " +
                        "same setup (or both heights held): alone it cannot separate the horizontal distance from " +
                        "the height difference");
                output.Add(new(new SlopeDistanceObservation(at, to, d, hi, TargetHeight(sn, what))
                { StandardDeviation = sd, Source = src }, budget, target, sn, what));
            }
    }
}
