using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Procedures;
using NetAdjust.Simulation;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The grid demo (data/tarnholm-grid.yaml, invented): drawn from a chosen grid truth by
/// <see cref="DemoScenarios"/> through the ProjNET projection of WGS 84 / UTM zone 33N.</summary>
public class TarnholmGridDemoTests
{
    private static readonly int Seed = DemoScenarios.DefaultSeed(DemoScenario.Tarnholm);

    private static string Committed => File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data",
        "tarnholm-grid.yaml"));

    private static SurveyProject Parse(string text) =>
        ProjectReader.Parse(text, "tarnholm-grid.yaml", Path.GetTempPath(), _ => throw new FileNotFoundException());

    [Fact]
    public void TheCommittedFileIsTheDrawOfItsSeed()
    {
        var (name, text) = Assert.Single(DemoProjectWriter.Format(DemoProjectWriter.Draw(DemoScenario.Tarnholm, Seed),
            "tarnholm-grid"));
        Assert.Equal("tarnholm-grid.yaml", name);
        Assert.Equal(Committed, text);
    }

    [Theory]
    [InlineData(20261202)]
    [InlineData(7)]
    public void AReducedDrawPassesTheGlobalTestAndGivesBackItsTruth(int seed)
    {
        var survey = DemoProjectWriter.Draw(DemoScenario.Tarnholm, seed);
        var (_, text) = Assert.Single(DemoProjectWriter.Format(survey, "tarnholm-grid"));
        var project = Parse(text);
        var reduction = GridReduction.Reduce(project.Network, project.Grid!, project.Options);
        var result = Adjuster.Adjust(reduction.Network, project.Options);
        // chi-square global test (docs/references.md §2) with the reductions
        Assert.True(result.Statistics.GlobalTest.Passed);
        // 4.5 σ per component: common practice for a bound that honest normal noise passes (about 7e-6 each)
        foreach (var id in new[] { "S1", "S2", "S3", "S4", "S5" })
        {
            var p = result.Points.Single(x => x.Input.Id == id);
            var t = survey.Truth[id];
            Assert.InRange(Math.Abs(p.E!.Value - t.E), 0, 4.5 * p.SdE!.Value);
            Assert.InRange(Math.Abs(p.N!.Value - t.N), 0, 4.5 * p.SdN!.Value);
        }
    }

    [Fact]
    public void TheGroundDistancesAreLongerThanTheGridByTheCombinedFactor()
    {
        // Each drawn ground distance times its combined factor (from the reduction) is the grid distance of the
        // truth within 4.5 σ of the 1.5 mm noise (common practice); unreduced it would be about 0.2 m too long.
        var survey = DemoProjectWriter.Draw(DemoScenario.Tarnholm, Seed);
        var project = Parse(Committed);
        var reduction = GridReduction.Reduce(project.Network, project.Grid!, project.Options);
        var lines = reduction.Observations.Where(o => o.Observed is Network.DistanceObservation).ToList();
        Assert.Equal(13, lines.Count);
        foreach (var o in lines)
        {
            var d = (Network.DistanceObservation)o.Observed;
            var (a, b) = (survey.Truth[d.From], survey.Truth[d.To]);
            double grid = Math.Sqrt(Math.Pow(b.E - a.E, 2) + Math.Pow(b.N - a.N, 2));
            Assert.InRange(d.Distance.Metres * o.CombinedFactor!.Value - grid, -4.5 * 0.0015, 4.5 * 0.0015);
            Assert.True(d.Distance.Metres - grid > 0.1);
        }
    }
}
