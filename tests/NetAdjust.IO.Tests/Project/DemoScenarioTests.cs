using System.Text.RegularExpressions;
using NetAdjust.IO.Project;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Units;
using Xunit;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The C# demo scenarios (NetAdjust.Simulation.DemoScenarios, written by DemoProjectWriter) against the committed
/// demo projects of data/: the same points, control values, stations and sightings in the same order, the committed
/// observations consistent with the scenario's truth within their standard deviations, and the same file layout.
/// The committed numbers were drawn by an earlier generator, so the drawn values themselves are not compared.
/// </summary>
public class DemoScenarioTests
{
    public static TheoryData<DemoScenario, string, string> Committed => new()
    {
        { DemoScenario.Brackenmoor, "brackenmoor.yaml", "brackenmoor.yaml" },
        { DemoScenario.Brackenmoor, "brackenmoor-auto.yaml", "brackenmoor-auto.yaml" },
        { DemoScenario.Harrowfield, "harrowfield-blunder.yaml", "harrowfield-blunder.yaml" },
        { DemoScenario.Harrowgate, "harrowgate-control.yaml", "harrowgate-control.yaml" },
    };

    [Theory]
    [MemberData(nameof(Committed))]
    public void The_scenario_has_the_committed_points_and_sightings(
        DemoScenario scenario, string committed, string drawnName)
    {
        var survey = DemoScenarios.Draw(scenario, DemoScenarios.DefaultSeed(scenario));
        var old = ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", committed)).Network;
        var drawn = Drawn(survey, committed)[drawnName];
        var files = Drawn(survey, committed);
        var fresh = ProjectReader.Parse(drawn, drawnName, "/demo", p => files[Path.GetFileName(p)]).Network;

        Assert.Equal(old.Points.Select(p => (p.Id, p.Fixed)), fresh.Points.Select(p => (p.Id, p.Fixed)));
        foreach (var (a, b) in old.Points.Zip(fresh.Points))
        {
            if (a.Fixed != Fixity.None) Assert.Equal((a.E, a.N, a.H), (b.E, b.N, b.H)); // the scenario's control
            Assert.Equal(a.E is null, b.E is null);
            if (a.E is double e && a.Fixed == Fixity.None) // approximations: jitter up to 0.4 m, rounded to 0.1 m
            {
                Assert.InRange(Math.Abs(e - survey.Truth[a.Id].E), 0, 0.45);
                Assert.InRange(Math.Abs(a.N!.Value - survey.Truth[a.Id].N), 0, 0.45);
            }
        }
        Assert.Equal(old.Observations.Select(Key), fresh.Observations.Select(Key));
        Assert.Equal(old.Observations.Count, survey.Setups.Sum(s => s.Observations.Count) + survey.Levelling.Count);
    }

    /// <summary>
    /// Every committed observation lies within 4.5 σ of the value computed from the scenario's truth (directions
    /// after removing their set's mean orientation); the planted blunder lies off by its size. 4.5 σ: common practice
    /// for a bound that honest normal noise passes (probability of exceeding it about 7e-6 per observation).
    /// </summary>
    [Theory]
    [MemberData(nameof(Committed))]
    public void The_committed_observations_fit_the_scenario_truth(DemoScenario scenario, string committed, string _)
    {
        var survey = DemoScenarios.Draw(scenario, DemoScenarios.DefaultSeed(scenario));
        var old = ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", committed)).Network;
        var sdOf = survey.Setups.SelectMany(s => s.Observations).Concat(survey.Levelling)
            .ToDictionary(Key, o => o.StandardDeviation);
        var t = survey.Truth;
        double Az(string a, string b) => Math.Atan2(t[b].E - t[a].E, t[b].N - t[a].N);
        double Dist(string a, string b) => Math.Sqrt(Math.Pow(t[b].E - t[a].E, 2) + Math.Pow(t[b].N - t[a].N, 2));
        static double Wrap(double x) => Math.IEEERemainder(x, 2 * Math.PI);
        int checkedCount = 0;
        foreach (var set in old.Observations.OfType<DirectionObservation>().GroupBy(d => d.SetId))
        {
            double zero = set.Average(d => Wrap(Az(d.Station, d.Target) - d.Reading.Radians - Wrap(
                Az(set.First().Station, set.First().Target) - set.First().Reading.Radians))) + Wrap(
                Az(set.First().Station, set.First().Target) - set.First().Reading.Radians);
            foreach (var d in set)
            {
                Within(Wrap(d.Reading.Radians + zero - Az(d.Station, d.Target)), 0, sdOf[Key(d)]);
                checkedCount++;
            }
        }
        foreach (var o in old.Observations)
        {
            switch (o)
            {
                case AngleObservation a:
                    double angle = Az(a.Station, a.Foresight) - Az(a.Station, a.Backsight);
                    Within(Wrap(a.Measured.Radians - angle), 0, sdOf[Key(a)]);
                    break;
                case DistanceObservation d:
                    double bias = survey.Blunders.Where(b => (b.At, b.To) == (d.From, d.To)).Sum(b => b.Size);
                    Within(d.Distance.Metres - Dist(d.From, d.To), bias, sdOf[Key(d)]);
                    break;
                case HeightDifferenceObservation h:
                    Within(h.Difference.Metres - (t[h.To].H - t[h.From].H), 0, sdOf[Key(h)]);
                    break;
                default:
                    continue;
            }
            checkedCount++;
        }
        Assert.Equal(old.Observations.Count, checkedCount);
    }

    /// <summary>The drawn files have the committed layout: line for line the same once numbers are masked.</summary>
    [Theory]
    [MemberData(nameof(Committed))]
    public void The_drawn_files_have_the_committed_layout(DemoScenario scenario, string committed, string drawnName)
    {
        var files = Drawn(DemoScenarios.Draw(scenario, 7), committed);
        foreach (var (name, text) in files)
        {
            string path = Path.Combine(TestProjects.RepoRoot, "data", name);
            if (!File.Exists(path)) continue; // e.g. the auto variant drawn beside another name
            Assert.Equal(Mask(File.ReadAllText(path)), Mask(text));
        }
        Assert.True(files.ContainsKey(drawnName));
    }

    [Fact]
    public void The_same_seed_gives_the_same_files_and_another_seed_other_values()
    {
        var a = DemoProjectWriter.Format(DemoScenarios.Draw(DemoScenario.Harrowgate, 3), "x");
        var b = DemoProjectWriter.Format(DemoScenarios.Draw(DemoScenario.Harrowgate, 3), "x");
        var c = DemoProjectWriter.Format(DemoScenarios.Draw(DemoScenario.Harrowgate, 4), "x");
        Assert.Equal(a, b);
        Assert.NotEqual(a[0].Text, c[0].Text);
    }

    /// <summary>The files of a draw, named as the committed files are (the demo's base name).</summary>
    private static Dictionary<string, string> Drawn(DemoSurvey survey, string committed)
    {
        string baseName = committed.Replace("-auto", "", StringComparison.Ordinal)[..^".yaml".Length];
        return DemoProjectWriter.Format(survey, baseName).ToDictionary(f => f.Name, f => f.Text);
    }

    private static string Key(Observation o) => o switch
    {
        DirectionObservation d => $"direction {d.Station} {d.Target}",
        AngleObservation a => $"angle {a.Station} {a.Backsight} {a.Foresight}",
        DistanceObservation d => $"distance {d.From} {d.To}",
        HeightDifferenceObservation h => $"dh {h.From} {h.To}",
        _ => o.Kind.ToString(),
    };

    private static void Within(double misfit, double expected, double sd) =>
        Assert.True(Math.Abs(misfit - expected) <= 4.5 * sd,
            $"misfit {misfit} not within 4.5 sigma ({sd}) of {expected}");

    /// <summary>Masks numbers and the generator's name, which differ between draws and generators.</summary>
    private static string Mask(string text) => Regex.Replace(
        Regex.Replace(text, @"(data/tools/\S+\.py|netadjust simulate --scenario \S+ --seed \d+)", "GENERATOR"),
        @"-?\d+(\.\d+)?(-\d\d-\d\d\.\d)?", "#");
}
