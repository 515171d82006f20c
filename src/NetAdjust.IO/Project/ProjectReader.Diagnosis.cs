using NetAdjust.Diagnosis;
using NetAdjust.IO.Text;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The <c>diagnosis</c> section: the kinds of blunder <c>adjust --diagnose</c> leaves untried and its
/// candidate lists (docs/input-format.md, "Blunder diagnosis").</summary>
public static partial class ProjectReader
{
    private static readonly string[] DiagnosisKeys = ["skip", "round_heights", "prism_constants"];

    /// <summary>The diagnosis options of the project; the defaults when it has no <c>diagnosis</c> section.</summary>
    private static DiagnosisOptions ReadDiagnosis(Context ctx, YamlMappingNode root, LengthPattern lengths)
    {
        var o = DiagnosisOptions.Default;
        if (ctx.Child(root, "diagnosis") is not YamlNode node) return o;
        var m = ctx.Mapping(node, "the diagnosis section");
        ctx.CheckKeys(m, DiagnosisKeys, "diagnosis");
        if (ctx.Child(m, "skip") is YamlNode skip)
        {
            var enabled = new HashSet<BlunderKind>(o.Enabled);
            foreach (var k in ctx.Sequence(skip, "diagnosis.skip"))
            {
                var kind = ctx.Choice(k, "diagnosis.skip", OptionGrammars.BlunderKinds);
                if (kind == BlunderKind.UnexplainedBias)
                    throw ctx.Error(k, "diagnosis.skip", "unexplained_bias cannot be skipped: it is the reference " +
                        "every named kind is compared with");
                enabled.Remove(kind);
            }
            o = o with { Enabled = enabled };
        }
        if (ctx.Child(m, "round_heights") is YamlNode rh)
            o = o with { RoundHeightsMetres = Lengths(ctx, rh, lengths, "diagnosis.round_heights", positive: true) };
        if (ctx.Child(m, "prism_constants") is YamlNode pc)
            o = o with { PrismConstantsMetres = Lengths(ctx, pc, lengths, "diagnosis.prism_constants", false) };
        return o;
    }

    /// <summary>A non-empty list of lengths within ±10 m (positive ones only when asked), in metres.</summary>
    private static List<double> Lengths(Context ctx, YamlNode node, LengthPattern lengths, string item, bool positive)
    {
        var list = new List<double>();
        foreach (var n in ctx.Sequence(node, item))
        {
            double v = ctx.ParseLength(n, lengths, ctx.Scalar(n, item), item).Metres;
            if (positive && !(v > 0)) throw ctx.Error(n, item, $"each amount must be positive, not {v} m");
            if (!(Math.Abs(v) <= 10)) throw ctx.Error(n, item, $"each amount must be within 10 m, not {v} m");
            list.Add(v);
        }
        return list.Count > 0 ? list : throw ctx.Error(node, item, "the list is empty: give at least one amount");
    }
}
