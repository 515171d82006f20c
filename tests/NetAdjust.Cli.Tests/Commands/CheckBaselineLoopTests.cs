namespace NetAdjust.Cli.Tests.Commands;

/// <summary><c>netadjust check</c> on the GNSS demo: the baseline loops before the adjustment.</summary>
public class CheckBaselineLoopTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("netadjust-check-gnss-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static string Demo => File.ReadAllText(CliHarness.DataFile("skelmoor-gnss.yaml"));

    [Fact]
    public void CheckListsTheDemosLoopsAcrossSessions()
    {
        var run = CliHarness.Run("check", CliHarness.DataFile("skelmoor-gnss.yaml"));
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("GNSS BASELINE LOOPS BEFORE THE ADJUSTMENT", run.Out);
        var rows = Rows(run.Out);
        // six baselines among four marks: cycle rank 6 − 4 + 1 = 3 (common practice)
        Assert.Equal(3, rows.Count);
        Assert.All(rows, r => Assert.EndsWith("pass", r));
        Assert.DoesNotContain("(one session)", run.Out);
    }

    [Fact]
    public void FiveCentimetresOnOneBaselineFailTheLoopsThatHoldItAndNameItsLine()
    {
        // +50 mm on ΔZ of SK01→SK03 (line 31 of the demo): the only loop through it fails and names line 31; the
        // other two loops do not hold it and pass (their misclosures are unchanged)
        string text = Demo;
        Assert.Contains("dz: -981.4347", text);
        string path = Path.Combine(_dir, "skelmoor-gnss.yaml");
        File.WriteAllText(path, text.Replace("dz: -981.4347", "dz: -981.3847"));
        var run = CliHarness.Run("check", path);
        Assert.True(run.Code == 0, run.Err); // a failing loop is a result, not an error
        var rows = Rows(run.Out);
        Assert.Equal(3, rows.Count);
        var failing = Assert.Single(rows, r => r.EndsWith("FAIL", StringComparison.Ordinal));
        Assert.Contains("SK03", failing);
        string block = run.Out[run.Out.IndexOf(failing, StringComparison.Ordinal)..];
        int next = block.IndexOf("\n  loop", 1, StringComparison.Ordinal);
        if (next > 0) block = block[..next];
        Assert.Contains("skelmoor-gnss.yaml:31", block);
    }

    private static List<string> Rows(string output) => [.. output.Split('\n')
        .Where(l => l.StartsWith("  loop", StringComparison.Ordinal) ||
            l.StartsWith("  repeat", StringComparison.Ordinal))
        .Select(l => l.TrimEnd())];
}
