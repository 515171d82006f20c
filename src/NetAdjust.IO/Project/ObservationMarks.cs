using System.Globalization;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// The per-observation marks of the blunder-hunt loop: <c>exclude: true</c> sets an observation aside (it is still
/// reported, with its misclosure), <c>sd_factor: k</c> multiplies its standard deviation by k (re-weighting).
/// In YAML they are keys of the observation's mapping; in CSV the columns <c>exclude</c> and <c>sd_factor</c>.
/// </summary>
internal static class ObservationMarks
{
    public static readonly string[] Keys = ["exclude", "sd_factor"];

    /// <summary>Applies the marks found in a YAML observation mapping.</summary>
    public static Observation Apply(Observation o, YamlNode node, string file)
    {
        if (node is not YamlMappingNode m) return o;
        string? Get(string key) =>
            m.Children.TryGetValue(new YamlScalarNode(key), out var v) ? (v as YamlScalarNode)?.Value ?? "" : null;
        o = o with { BookedText = Get("value") ?? Get("dh") }; // the value's text as booked, for the diagnosis
        int line = (int)node.Start.Line;
        string item = (o with { Source = null }).Describe(); // the message names file and line itself
        var ex = Get("exclude");
        var f = Get("sd_factor");
        if (ex is null && f is null) return o;
        foreach (var key in Keys)
            if (m.Children.TryGetValue(new YamlScalarNode(key), out var v)) line = (int)v.Start.Line;
        return Apply(o, ex ?? "", f ?? "", file, line, item);
    }

    /// <summary>Applies marks given as text (empty text: no mark).</summary>
    public static Observation Apply(Observation o, string exclude, string sdFactor, string file, int line, string item)
    {
        var ex = OptionGrammars.YesNo.Parse(exclude);
        bool excluded = exclude.Trim().Length > 0
            && (ex.Success ? ex.Value : throw new ProjectFileException(file, line, item, "exclude: " + ex.Error));
        double factor = 1.0;
        if (sdFactor.Trim().Length > 0)
        {
            if (!double.TryParse(sdFactor, NumberStyles.Float, CultureInfo.InvariantCulture, out factor) ||
                !double.IsFinite(factor))
                throw new ProjectFileException(file, line, item, $"sd_factor '{sdFactor}' is not a number");
            if (!(factor > 0))
                throw new ProjectFileException(file, line, item,
                    "sd_factor must be positive: it multiplies the standard deviation (e.g. 3 makes σ three times " +
                    "larger)");
        }
        if (!excluded && factor == 1.0) return o;
        // A standard deviation derived from specifications (NaN here) is multiplied by the factor when it is derived.
        return o with { Excluded = excluded, SdFactor = factor, StandardDeviation = o.StandardDeviation * factor };
    }
}
