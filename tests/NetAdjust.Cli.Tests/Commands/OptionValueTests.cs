namespace NetAdjust.Cli.Tests.Commands;

/// <summary>Review regression: a non-numeric --snoop-limit is a usage error with a plain message
/// (docs/cli.md).</summary>
public class OptionValueTests
{
    [Theory]
    [InlineData("abc")]
    [InlineData("2.5")]
    public void ANonNumericSnoopLimitIsAUsageErrorWithoutDotNetTypeNames(string value)
    {
        string demo = CliHarness.DataFile("harrowfield-blunder.yaml");
        var (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--snoop", "--snoop-limit", value);
        Assert.Equal(ExitCodes.Usage, code);
        Assert.DoesNotContain("NetAdjust least-squares adjustment report", stdout);
        Assert.Contains($"--snoop-limit '{value}' must be a whole number", stderr);
        Assert.DoesNotContain("System.Int32", stderr);
    }

    [Fact]
    public void AWholeSnoopLimitStillWorksAndTheDefaultIsTen()
    {
        string demo = CliHarness.DataFile("harrowfield-blunder.yaml");
        var (code, stdout, stderr) =
            CliHarness.Run("adjust", demo, "--snoop", "--snoop-limit", "1", "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("BLUNDER HUNT", stdout);
        (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--snoop", "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("Stopped: no observation fails the test.", stdout);
    }
}
