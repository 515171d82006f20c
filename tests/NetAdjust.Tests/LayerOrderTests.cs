using System.Text.RegularExpressions;

namespace NetAdjust.Tests;

/// <summary>
/// The layers of the library (docs/architecture.md, "Layers"): a namespace of src/NetAdjust uses only the namespaces
/// to its left. Checked on the sources as text (using directives and qualified names outside comments), so a call
/// into a higher layer fails here and not only in review.
/// </summary>
public class LayerOrderTests
{
    /// <summary>The order of docs/architecture.md, lowest first.</summary>
    internal static readonly string[] Layers =
    [
        "Units", "Geodesy", "Network", "Reduction", "Geometry", "Observations", "Simulation", "Stochastic",
        "Misclosures", "LinearAlgebra", "Adjustment", "Statistics", "Standards", "Procedures", "Diagnosis",
    ];

    private static readonly Regex Comment = new(@"//.*", RegexOptions.Compiled);

    private static readonly Regex Use = new(
        @"using NetAdjust\.(?<ns>\w+)\b|NetAdjust\.(?<ns>\w+)\.[A-Z]|(?<![\w.""])(?<ns>\w+)\.[A-Z]",
        RegexOptions.Compiled);

    [Fact]
    public void EveryNamespaceUsesOnlyTheLayersBelowIt()
    {
        string src = Path.Combine(HouseStyleTests.RepoRoot(), "src", "NetAdjust");
        var folders = Directory.EnumerateDirectories(src).Select(Path.GetFileName)
            .Where(n => n is not ("bin" or "obj")).Order(StringComparer.Ordinal).ToList();
        // every folder is a layer of the list (a new namespace must be placed in it and in the docs)
        Assert.Equal(Layers.Order(StringComparer.Ordinal), folders);

        var upward = new List<string>();
        foreach (string layer in Layers)
        {
            int rank = Array.IndexOf(Layers, layer);
            var files = Directory.EnumerateFiles(Path.Combine(src, layer), "*.cs", SearchOption.AllDirectories)
                .Where(f => !f.Contains("/obj/") && !f.Contains("/bin/")).Order(StringComparer.Ordinal);
            foreach (string file in files)
            {
                string text = Comment.Replace(File.ReadAllText(file), "");
                var used = Use.Matches(text).Select(m => m.Groups["ns"].Value)
                    .Where(n => Array.IndexOf(Layers, n) > rank).Distinct().Order(StringComparer.Ordinal);
                upward.AddRange(used.Select(n => $"{Path.GetRelativePath(src, file)} uses {n}"));
            }
        }
        Assert.True(upward.Count == 0, "namespaces that use a layer above them:\n" + string.Join("\n", upward));
    }

    [Fact]
    public void TheCheckSeesAnUpwardUse()
    {
        // the detector itself: a qualified use and a using directive of a higher layer are found; prose is not
        string text = Comment.Replace("using NetAdjust.Statistics;\nvar x = Procedures.DataSnooping.Run(n);\n" +
            "// Diagnosis.BlunderDiagnosis in a comment\n", "");
        var found = Use.Matches(text).Select(m => m.Groups["ns"].Value).Where(n => Layers.Contains(n)).ToList();
        Assert.Equal(["Statistics", "Procedures"], found);
    }
}
