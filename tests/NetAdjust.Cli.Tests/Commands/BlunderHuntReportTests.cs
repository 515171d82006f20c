using NetAdjust.Procedures;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>Regression tests for the blunder-hunt section of the text report, found in review.</summary>
public class BlunderHuntReportTests
{
    [Fact]
    public void TheHuntLogNamesTheObservationUnclippedAndListsWhereToMarkIt()
    {
        // The demo plants one blunder, +40 mm on the distance H3→H4 (data/tools/simulate_blunder_demo.py). The log
        // column showed "#26 distance H3→H4 (data/harrowfi~": the observation must be readable in the table, and the
        // file and line where the surveyor marks it 'exclude: true' must be given in full.
        string demo = CliHarness.DataFile("harrowfield-blunder.yaml");
        var (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--snoop", "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        var lines = stdout.Split('\n');
        var hunt = lines.SkipWhile(l => !l.StartsWith("BLUNDER HUNT", StringComparison.Ordinal)).TakeWhile(l => l.Length > 0).ToList();
        Assert.NotEmpty(hunt);
        var round1 = hunt.Single(l => l.TrimStart().StartsWith("1 ", StringComparison.Ordinal));
        Assert.Contains("distance H3→H4", round1);
        Assert.Contains("set aside", round1);
        Assert.DoesNotContain("~", string.Join("\n", hunt));
        int line = File.ReadLines(demo).ToList().FindIndex(t => t.Contains("{to: H4, value: 419.3795}", StringComparison.Ordinal)) + 1;
        Assert.True(line > 0);
        Assert.Contains(hunt, l => l.Contains($"distance H3→H4 ({demo}:{line})", StringComparison.Ordinal));
        Assert.All(lines, l => Assert.True(l.Length <= 100 || l.StartsWith("CAUTION", StringComparison.Ordinal) || l.Contains(demo, StringComparison.Ordinal), l));
    }
}
