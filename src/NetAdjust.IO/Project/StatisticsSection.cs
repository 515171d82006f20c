using System.Globalization;
using NetAdjust.IO.Text;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// Reads the optional <c>statistics:</c> section of a project file (docs/input-format.md):
/// <code>
/// statistics:
///   w_alpha: 0.001               # significance level of the w-test (two-sided)
///   type_ii_error: 0.20          # β: probability of missing a bias of MDB size (power 0.80)
///   tau_alpha: 0.05              # overall level of the tau test
///   tau_adjustment: sidak        # sidak | bonferroni
///   variance_factor_basis: known # known | estimated
///   confidence: 0.95             # confidence ellipses and intervals
///   external_reliability: auto   # auto | always | never
///   relative_pairs:              # extra pairs for relative ellipses
///     - [BK01, S3]
/// </code>
/// </summary>
internal static class StatisticsSection
{
    private static readonly string[] Keys = ["w_alpha", "type_ii_error", "tau_alpha", "tau_adjustment", "variance_factor_basis", "confidence", "external_reliability", "relative_pairs"];

    public static AnalysisOptions Read(YamlMappingNode root, string file)
    {
        var o = AnalysisOptions.Default;
        if (!root.Children.TryGetValue(new YamlScalarNode("statistics"), out var node) || node is YamlScalarNode { Value: null or "" }) return o;
        if (node is not YamlMappingNode m) throw new ProjectFileException(file, Line(node), "statistics", "expected a mapping (key: value)");
        foreach (var (k, _) in m.Children)
        {
            string key = (k as YamlScalarNode)?.Value ?? "";
            if (!Keys.Contains(key)) throw new ProjectFileException(file, Line(k), "statistics", $"unknown key '{key}' (expected one of: {string.Join(", ", Keys)})");
        }
        string? Text(string key, out YamlNode? at)
        {
            at = null;
            if (!m.Children.TryGetValue(new YamlScalarNode(key), out var v)) return null;
            at = v;
            return v is YamlScalarNode s && s.Value is not null ? s.Value : throw new ProjectFileException(file, Line(v), "statistics." + key, "expected a single value here");
        }
        double? Probability(string key)
        {
            if (Text(key, out var at) is not string t) return null;
            return double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && v > 0 && v < 1
                ? v : throw new ProjectFileException(file, Line(at!), "statistics." + key, $"'{t}' must be a probability between 0 and 1");
        }
        T Choice<T>(string key, T current, TextChoice<T> grammar)
        {
            if (Text(key, out var at) is not string t) return current;
            var r = grammar.Parse(t);
            return r.Success ? r.Value : throw new ProjectFileException(file, Line(at!), "statistics." + key, r.Error!);
        }
        if (Probability("w_alpha") is double wa) o = o with { WTestAlpha = wa };
        if (Probability("type_ii_error") is double b) o = o with { TypeIIError = b };
        if (Probability("tau_alpha") is double ta) o = o with { TauAlpha = ta };
        if (Probability("confidence") is double c) o = o with { ConfidenceLevel = c };
        o = o with
        {
            TauAdjustment = Choice("tau_adjustment", o.TauAdjustment, OptionGrammars.TauAdjustment),
            VarianceFactor = Choice("variance_factor_basis", o.VarianceFactor, OptionGrammars.VarianceFactorBasis),
            ExternalReliability = Choice("external_reliability", o.ExternalReliability,
                OptionGrammars.ExternalReliability),
        };
        if (m.Children.TryGetValue(new YamlScalarNode("relative_pairs"), out var pairsNode))
        {
            if (pairsNode is not YamlSequenceNode seq) throw new ProjectFileException(file, Line(pairsNode), "statistics.relative_pairs", "expected a list of pairs such as [BK01, S3]");
            var pairs = new List<(string, string)>();
            foreach (var p in seq)
            {
                if (p is not YamlSequenceNode pair || pair.Children.Count != 2 || pair.Children.Any(x => x is not YamlScalarNode { Value: { Length: > 0 } }))
                    throw new ProjectFileException(file, Line(p), "statistics.relative_pairs", "each pair is a list of two point ids, e.g. [BK01, S3]");
                pairs.Add((((YamlScalarNode)pair.Children[0]).Value!, ((YamlScalarNode)pair.Children[1]).Value!));
            }
            o = o with { RelativePairs = pairs };
        }
        return o;
    }

    /// <summary>Checks that every listed pair names points of the network.</summary>
    public static void CheckPairs(YamlMappingNode root, string file, NetAdjust.Network.SurveyNetwork network)
    {
        if (!root.Children.TryGetValue(new YamlScalarNode("statistics"), out var node) || node is not YamlMappingNode m) return;
        if (!m.Children.TryGetValue(new YamlScalarNode("relative_pairs"), out var pairs) || pairs is not YamlSequenceNode seq) return;
        foreach (var p in seq.OfType<YamlSequenceNode>())
            foreach (var id in p.Children.OfType<YamlScalarNode>())
                if (id.Value is not null && !network.Contains(id.Value))
                    throw new ProjectFileException(file, Line(id), "statistics.relative_pairs", $"point {id.Value} is not defined in the points list");
    }

    private static int Line(YamlNode node) => (int)node.Start.Line;
}
