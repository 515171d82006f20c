using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The <c>datum:</c> section of a project file (docs/input-format.md, "Datum").</summary>
public static partial class ProjectReader
{
    private static DatumDefinition ReadDatum(Context ctx, YamlMappingNode root)
    {
        if (ctx.Child(root, "datum") is not YamlNode node) return DatumDefinition.ByControl;
        var m = ctx.Mapping(node, "datum");
        ctx.CheckKeys(m, ["mode", "hold", "azimuth_to", "hold_height", "points"], "datum");
        string mode = ctx.OptionalString(m, "mode") ?? "control";
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
                throw ctx.Error(k, "datum." + key, $"'{key}' belongs to mode {allowedMode}, not to mode {mode}");
        }
        switch (mode)
        {
            case "control":
                Only("hold", "minimal"); Only("azimuth_to", "minimal"); Only("hold_height", "minimal"); Only("points", "free");
                return DatumDefinition.ByControl;
            case "minimal":
                Only("points", "free");
                return DatumDefinition.Minimal(hold, azimuthTo, holdHeight);
            case "free":
                Only("hold", "minimal"); Only("azimuth_to", "minimal"); Only("hold_height", "minimal");
                return DatumDefinition.Free(points);
            default:
                throw ctx.Error(ctx.Child(m, "mode")!, "datum.mode", $"'{mode}' is not a datum mode: use control, minimal or free");
        }
    }
}
