using System.Text.RegularExpressions;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Procedures;
using Xunit.Abstractions;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The grid demo (data/tarnholm-grid.yaml): what its README line says the reductions change, measured.
/// </summary>
public class GridDemoTests(ITestOutputHelper output)
{
    private static string DemoText =>
        File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data", "tarnholm-grid.yaml"));

    private static SurveyProject Parse(string text) =>
        ProjectReader.Parse(text, "tarnholm-grid.yaml", Path.GetTempPath(), _ => throw new FileNotFoundException());

    [Fact]
    public void TheDemoPassesTheGlobalTestWithItsGridSectionAndFailsWithout()
    {
        var project = Parse(DemoText);
        var reduction = GridReduction.Reduce(project.Network, project.Grid!, project.Options);
        var reduced = Adjuster.Adjust(reduction.Network, project.Options);
        // the same file without its grid section: crs only labels, the observations are used as measured
        var plainText = Regex.Replace(DemoText, @"^grid:\n(  .*\n)+", "", RegexOptions.Multiline);
        var plainProject = Parse(plainText);
        Assert.Null(plainProject.Grid);
        var plain = Adjuster.Adjust(plainProject.Network, plainProject.Options);
        output.WriteLine($"vTPv with the reductions {reduced.Statistics.Vtpv:F1}, without {plain.Statistics.Vtpv:F1}");
        // chi-square global test (docs/references.md §2), measured on both
        Assert.True(reduced.Statistics.GlobalTest.Passed);
        Assert.False(plain.Statistics.GlobalTest.Passed);
        // about −300 ppm: the combined factors of the README line (common practice: UTM 118 km from the central
        // meridian, 0.99977, times the elevation factor at about 500 m, 0.99992)
        var factors = reduction.Observations.Select(o => o.CombinedFactor).OfType<double>().ToList();
        Assert.InRange(factors.Min(), 0.99968, 0.99971);
        Assert.InRange(factors.Max(), 0.99968, 0.99971);
    }
}
