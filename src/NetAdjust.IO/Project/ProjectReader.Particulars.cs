using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

public static partial class ProjectReader
{
    /// <summary>Reads the optional <c>survey</c> section (docs/input-format.md, "Survey particulars").</summary>
    private static SurveyParticulars? ReadParticulars(Context ctx, YamlMappingNode root)
    {
        if (ctx.Child(root, "survey") is not YamlNode node) return null;
        var m = ctx.Mapping(node, "survey");
        ctx.CheckKeys(m,
            ["client", "site", "reference", "surveyor", "firm", "observed", "equipment", "weather", "note"], "survey");
        DateOnly Date(YamlNode n, string item)
        {
            string s = ctx.Scalar(n, item).Trim();
            return DateOnly.TryParseExact(s, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)
                ? d : throw ctx.Error(n, item, $"'{s}' is not a date in the form YYYY-MM-DD");
        }
        var observed = new List<DateOnly>();
        if (ctx.Child(m, "observed") is YamlNode obs)
        {
            if (obs is YamlScalarNode) observed.Add(Date(obs, "survey.observed"));
            else foreach (var d in ctx.Sequence(obs, "survey.observed")) observed.Add(Date(d, "survey.observed"));
        }
        var equipment = new List<SurveyEquipment>();
        if (ctx.Child(m, "equipment") is YamlNode eq)
            foreach (var e in ctx.Sequence(eq, "survey.equipment"))
            {
                var em = ctx.Mapping(e, "an item of survey.equipment");
                ctx.CheckKeys(em, ["item", "serial", "calibrated"], "survey.equipment");
                string item = ctx.Child(em, "item") is YamlNode i ? ctx.Scalar(i, "survey.equipment.item")
                    : throw ctx.Error(e, "survey.equipment", "an item of equipment needs 'item' (what it is)");
                equipment.Add(new SurveyEquipment(item, ctx.OptionalString(em, "serial"),
                    ctx.Child(em, "calibrated") is YamlNode cal ? Date(cal, "survey.equipment.calibrated") : null));
            }
        return new SurveyParticulars(ctx.OptionalString(m, "client"), ctx.OptionalString(m, "site"),
            ctx.OptionalString(m, "reference"), ctx.OptionalString(m, "surveyor"), ctx.OptionalString(m, "firm"),
            observed, equipment, ctx.OptionalString(m, "weather"), ctx.OptionalString(m, "note"));
    }
}
