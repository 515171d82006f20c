using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>Sight lengths for points without coordinates (their approximations are computed later by the adjustment).</summary>
public static partial class ProjectReader
{
    /// <summary>
    /// Collects every distance written in the setups, so that a direction or angle to a point given no coordinates
    /// can be weighted with the distance observed to it from any setup. Values that do not parse are skipped here:
    /// the main pass reports them with file and line.
    /// </summary>
    private static void PrescanDistances(Context ctx, YamlMappingNode root, LengthPattern lengths, Dictionary<(string, string), double> into)
    {
        if (ctx.Child(root, "setups") is not YamlSequenceNode setups) return;
        foreach (var node in setups)
        {
            if (node is not YamlMappingNode m || ctx.Child(m, "at") is not YamlScalarNode { Value: string at }) continue;
            if (ctx.Child(m, "distances") is not YamlSequenceNode dists) continue;
            foreach (var d in dists)
            {
                if (d is not YamlMappingNode dm || ctx.Child(dm, "to") is not YamlScalarNode { Value: string to } ||
                    ctx.Child(dm, "value") is not YamlScalarNode { Value: string text }) continue;
                var r = lengths.Parse(text);
                if (r.Success && r.Value.Metres > 0) into.TryAdd((at, to), r.Value.Metres);
            }
        }
    }
}
