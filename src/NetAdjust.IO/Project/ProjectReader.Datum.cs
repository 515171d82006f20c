using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.IO.Text;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The <c>datum:</c> section of a project file (docs/input-format.md, "Datum").</summary>
public static partial class ProjectReader
{
    /// <summary>Every point the <c>datum:</c> section names must be defined under <c>points</c> (error at its
    /// line).</summary>
    private static void CheckDatumPoints(Context ctx, YamlMappingNode root, IEnumerable<NetAdjust.Network.Point> points)
    {
        if (ctx.Child(root, "datum") is not YamlMappingNode m) return;
        var ids = points.Select(p => p.Id).ToHashSet(StringComparer.Ordinal);
        var named = new List<(YamlNode Node, string Key)>();
        foreach (var key in new[] { "hold", "azimuth_to", "hold_height" })
            if (ctx.Child(m, key) is YamlNode n) named.Add((n, key));
        if (ctx.Child(m, "points") is YamlSequenceNode list)
            named.AddRange(list.Select(n => (n, "points")));
        foreach (var (node, key) in named)
            if (ctx.Scalar(node, "datum." + key) is var id && !ids.Contains(id))
                throw ctx.Error(node, "datum." + key, $"point '{id}' is not defined under 'points'");
        // A held coordinate needs a value to hold.
        foreach (var (node, key) in named)
        {
            var p = points.First(q => q.Id == ctx.Scalar(node, key));
            if (key == "hold" && (p.E is null || p.N is null))
                throw ctx.Error(node, "datum.hold", $"point {p.Id} has no given easting and northing to hold " +
                    $"(give e and n)");
            if (key == "hold_height" && p.H is null)
                throw ctx.Error(node, "datum.hold_height", $"point {p.Id} has no given height to hold (give h)");
        }
    }

    private static DatumDefinition ReadDatum(Context ctx, YamlMappingNode root)
    {
        if (ctx.Child(root, "datum") is not YamlNode node) return DatumDefinition.ByControl;
        var m = ctx.Mapping(node, "datum");
        ctx.CheckKeys(m, ["mode", "hold", "azimuth_to", "hold_height", "points"], "datum");
        var mode = ctx.Child(m, "mode") is YamlNode mn
            ? ctx.Choice(mn, "datum.mode", OptionGrammars.DatumModes) : DatumMode.Control;
        string? hold = ctx.OptionalString(m, "hold"), azimuthTo = ctx.OptionalString(m, "azimuth_to"), holdHeight = ctx.OptionalString(m, "hold_height");
        List<string>? points = null;
        if (ctx.Child(m, "points") is YamlNode pn)
        {
            points = ctx.Sequence(pn, "datum.points").Select(x => ctx.Scalar(x, "datum.points")).ToList();
            if (points.Count == 0) throw ctx.Error(pn, "datum.points", "list at least one point, or leave the key out to use all points");
        }
        void Only(string key, string allowedMode)
        {
            if (ctx.Child(m, key) is YamlNode k)
                throw ctx.Error(k, "datum." + key,
                    $"'{key}' belongs to mode {allowedMode}, not to mode {OptionGrammars.DatumModes.Format(mode)}");
        }
        switch (mode)
        {
            case DatumMode.Control:
                Only("hold", "minimal"); Only("azimuth_to", "minimal"); Only("hold_height", "minimal"); Only("points", "free");
                return DatumDefinition.ByControl;
            case DatumMode.MinimalConstraints:
                Only("points", "free");
                return DatumDefinition.Minimal(hold, azimuthTo, holdHeight);
            default:
                Only("hold", "minimal"); Only("azimuth_to", "minimal"); Only("hold_height", "minimal");
                return DatumDefinition.Free(points);
        }
    }
}
