using System.Text.RegularExpressions;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// The plot draws only what was sighted: a levelled height difference runs along a levelling line, not along a
/// sight line between its two points (common practice), so it is drawn in its own dotted style between two plotted
/// points and named in the legend, not drawn, where a point has no plan position.
/// </summary>
public sealed class NetworkPlotLevellingTests
{
    [Fact]
    public void LevelledHeightDifferencesAreDrawnApartFromSightLinesOrListed()
    {
        var model = ReportPrecisionTests.Model();
        string svg = NetworkPlotWriter.WriteDocument(model);
        var lines = Regex.Matches(svg, "<line class=\"(obs[^\"]*)\"[^>]*><title>#(\\d+) ([a-z ]+) ")
            .Select(m => (Class: m.Groups[1].Value, Number: int.Parse(m.Groups[2].Value,
                System.Globalization.CultureInfo.InvariantCulture), Kind: m.Groups[3].Value)).ToList();
        // the seven sight lines (directions and distances between plan points) plain, the three levelled lines
        // between plan points dotted, the line to the benchmark without a plan position not drawn
        Assert.Equal(7, lines.Count(l => !l.Kind.StartsWith("height", StringComparison.Ordinal)));
        Assert.All(lines.Where(l => l.Kind.StartsWith("height difference", StringComparison.Ordinal)),
            l => Assert.Contains("obs-levelled", l.Class, StringComparison.Ordinal));
        Assert.All(lines.Where(l => !l.Kind.StartsWith("height difference", StringComparison.Ordinal)),
            l => Assert.DoesNotContain("obs-levelled", l.Class, StringComparison.Ordinal));
        Assert.Equal(3, lines.Count(l => l.Class.Contains("obs-levelled", StringComparison.Ordinal)));
        Assert.Matches($"<line class=\"obs obs-levelled\"[^>]*stroke=\"{NetworkPlotWriter.LevelledColour}\"" +
            $"[^>]*stroke-dasharray=\"{NetworkPlotWriter.LevelledDashes}\"", svg);
        int toBenchmark = model.Result.Observations.Single(o => o.Input.To == "BM9").Index + 1;
        Assert.DoesNotContain(lines, l => l.Number == toBenchmark); // BM9 has no plan position
        Assert.Contains(">levelled height difference</text>", svg);
        var listed = Regex.Match(svg, "<g class=\"levelled-not-drawn\">.*?</g>").Value;
        Assert.Contains(">1 levelled height difference</text>", listed);
        Assert.Contains($">#{toBenchmark} K1 to BM9</text>", listed);
    }

    [Fact]
    public void ANetworkWithoutLevellingHasNoLevelledLegend()
    {
        // control for the test above: the demo's sight lines alone (data/harrowfield-blunder.yaml, invented)
        var p = NetAdjust.IO.Project.ProjectReader.Read(
            Path.Combine(TestProjects.RepoRoot, "data", "harrowfield-blunder.yaml"));
        var r = NetAdjust.Adjustment.Adjuster.Adjust(p.Network, p.Options);
        string svg = NetworkPlotWriter.WriteDocument(r, new ReportContext("h.yaml", TestProjects.RunDate, p.Units));
        Assert.DoesNotContain("obs-levelled", svg);
        Assert.DoesNotContain("levelled", svg);
    }
}
