using NetAdjust.Geometry;
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
        double k = ctx.Number(n, "adjustment.refraction");
        // Values met in practice lie between about −1 and +1 (common practice); beyond ±2 it is a typing error.
        return k is >= -2 and <= 2 ? k
            : throw ctx.Error(n, "adjustment.refraction", $"the refraction coefficient {k} is outside −2 … 2");
    }

    private static void ReadTrigonometric(Context ctx, YamlMappingNode m, string at, string item, LengthPattern lengths,
        AnglePattern angles, ProjectUnits units, Dictionary<ObservationKind, double> defaults, SetupSpec spec,
        StochasticInputs specs, List<Pending> output)
    {
        var slopes = ctx.Child(m, "slope_distances");
        var zeniths = ctx.Child(m, "zeniths");
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
                { StandardDeviation = sd, Source = src, Refraction = specs.Refraction };
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
