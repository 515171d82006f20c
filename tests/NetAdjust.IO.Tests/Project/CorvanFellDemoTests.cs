using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The Corvan Fell demo (data/corvan-fell-3d.yaml, invented): a 3D traverse booked as rounds, drawn from a
/// chosen truth by <see cref="DemoScenarios"/>.</summary>
public class CorvanFellDemoTests
{
    private static string Committed => File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data",
        "corvan-fell-3d.yaml"));

    [Fact]
    public void TheCommittedFileIsTheDrawOfItsSeed()
    {
        var survey = DemoScenarios.Draw(DemoScenario.CorvanFell, DemoScenarios.DefaultSeed(DemoScenario.CorvanFell));
        var (name, text) = Assert.Single(DemoProjectWriter.Format(survey, "corvan-fell-3d"));
        Assert.Equal("corvan-fell-3d.yaml", name);
        Assert.Equal(Committed, text);
    }

    [Fact]
    public void TheAdjustedStationsLieWithinTheirStandardDeviationsOfTheTruth()
    {
        // The truth the file was drawn from; 4.5 σ per component: common practice for a bound that honest normal
        // noise passes (about 7e-6 per component).
        var survey = DemoScenarios.Draw(DemoScenario.CorvanFell, DemoScenarios.DefaultSeed(DemoScenario.CorvanFell));
        var project = ProjectReader.Parse(Committed, "corvan-fell-3d.yaml", "/demo", File.ReadAllText);
        var result = Adjuster.Adjust(project.Network, project.Options);
        Assert.True(result.Statistics.GlobalTest.Passed);
        foreach (var id in new[] { "CF2", "CF3", "CF4", "CF5", "CF6" })
        {
            var p = result.Points.Single(x => x.Input.Id == id);
            var t = survey.Truth[id];
            Assert.InRange(Math.Abs(p.E!.Value - t.E), 0, 4.5 * p.SdE!.Value);
            Assert.InRange(Math.Abs(p.N!.Value - t.N), 0, 4.5 * p.SdN!.Value);
            if (id != "CF4") Assert.InRange(Math.Abs(p.H!.Value - t.H), 0, 4.5 * p.SdH!.Value);
        }
    }

    [Fact]
    public void TheRoundsGiveBackTheSimulatedInstrumentErrors()
    {
        // Simulated: collimation 6″, index error −9″. One target's estimate, half a face difference of readings with
        // 2″·√2 each, has σ 2″; a set's mean of 2–3 targets at most 1.4″, so ±5″ is over 3.5σ; the mean over the
        // twelve sets (σ about 0.4″) within ±2″.
        var rounds = ProjectReader.Parse(Committed, "corvan-fell-3d.yaml", "/demo", File.ReadAllText).Rounds;
        var sets = rounds.SelectMany(r => r.Reduction.Sets).ToList();
        Assert.Equal(12, sets.Count);
        double sec = 1 / Angle.ArcsecondsPerRadian;
        Assert.All(sets, s => Assert.InRange(s.Collimation / sec, 6 - 5, 6 + 5));
        Assert.All(sets, s => Assert.InRange(s.IndexError / sec, -9 - 5, -9 + 5));
        Assert.InRange(sets.Average(s => s.Collimation) / sec, 6 - 2, 6 + 2);
        Assert.InRange(sets.Average(s => s.IndexError) / sec, -9 - 2, -9 + 2);
        Assert.All(rounds, r => Assert.True(r.Reduction.Passes));
    }
}
