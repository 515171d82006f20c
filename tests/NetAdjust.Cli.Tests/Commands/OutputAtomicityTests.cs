namespace NetAdjust.Cli.Tests.Commands;

/// <summary>Regression tests: a run that fails to write one output replaces none of them (docs/cli.md).</summary>
public sealed class OutputAtomicityTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-out-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string Demo => CliHarness.DataFile("brackenmoor.yaml");

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void WhenOneOutputCannotBeWrittenTheOtherKeepsItsEarlierContent(bool jsonIsTheGoodOne)
    {
        // docs/cli.md: "a failure leaves no partial file and earlier files untouched". The JSON used to be renamed into
        // place before the report was tried, so an unwritable --report (exit 4) still replaced an earlier JSON.
        string good = Path.Combine(_tmp, jsonIsTheGoodOne ? "earlier.json" : "earlier.txt");
        string bad = Path.Combine(_tmp, "no-such-folder", jsonIsTheGoodOne ? "r.txt" : "r.json");
        File.WriteAllText(good, "earlier result\n");
        string[] args = jsonIsTheGoodOne
            ? ["adjust", Demo, "--json", good, "--report", bad, "--date", "2026-12-01"]
            : ["adjust", Demo, "--json", bad, "--report", good, "--date", "2026-12-01"];
        var (code, stdout, stderr) = CliHarness.Run(args);
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("cannot write", stderr);
        Assert.Equal("earlier result\n", File.ReadAllText(good));
        Assert.Equal("", stdout);
        Assert.Equal(new[] { good }, Directory.GetFiles(_tmp)); // no temporary file left behind
    }

    [Fact]
    public void AnUnwritableExchangeOutputLeavesTheOtherOutputsUntouched()
    {
        // The exchange outputs (--csv, --html, ...) are written with --json and --report, all or none (docs/cli.md).
        string csv = Path.Combine(_tmp, "earlier.csv"), json = Path.Combine(_tmp, "earlier.json");
        File.WriteAllText(csv, "earlier csv\n");
        File.WriteAllText(json, "earlier json\n");
        var (code, _, stderr) =
            CliHarness.Run("adjust", Demo, "--json", json, "--csv", csv, "--html",
            Path.Combine(_tmp, "no-such-folder", "r.html"),
            "--date", "2026-12-01");
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("cannot write", stderr);
        Assert.Equal("earlier csv\n", File.ReadAllText(csv));
        Assert.Equal("earlier json\n", File.ReadAllText(json));
        Assert.Equal(2, Directory.GetFiles(_tmp).Length);
    }

    [Fact]
    public void BothOutputsAreWrittenWhenBothCan()
    {
        string json = Path.Combine(_tmp, "r.json"), report = Path.Combine(_tmp, "r.txt");
        File.WriteAllText(json, "earlier\n");
        var (code, stdout, stderr) =
            CliHarness.Run("adjust", Demo, "--json", json, "--report", report, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Equal("", stdout);
        Assert.StartsWith("{", File.ReadAllText(json));
        Assert.StartsWith("NetAdjust least-squares adjustment report", File.ReadAllText(report));
        Assert.Equal(2, Directory.GetFiles(_tmp).Length);
    }
}
