using System.Text.Json;
using NetAdjust.Cli;

namespace NetAdjust.Cli.Tests;

public class BudgetCommandTests
{
    private static string TotalLine(string output) =>
        output.Split('\n').Single(l => l.TrimStart().StartsWith("total", StringComparison.Ordinal));

    [Theory]
    // Rules of thumb (common practice) for a 5" ISO 17123-3 instrument: angle σ = √2·5"/√n; one face ×√2.
    [InlineData("1", "both", "7.07")]
    [InlineData("2", "both", "5.00")]
    [InlineData("3", "both", "4.08")]
    [InlineData("4", "both", "3.54")]
    [InlineData("1", "one", "10.00")]
    public void AngleBudgetPrintsTheExpectedTotal(string sets, string faces, string total)
    {
        var (code, output, err) =
            CliHarness.Run("budget", "angle", "--direction-sd", "5", "--sets", sets, "--faces", faces);
        Assert.Equal(0, code);
        Assert.Equal("", err);
        Assert.Contains($" {total} arcsec", TotalLine(output));
    }

    [Fact]
    public void DistanceBudgetMatchesTheHandComputation()
    {
        // Own scenario: 412.5 m, 3 mm + 2 ppm, centering 0.8 mm and 1.5 mm: √(9 + 0.680625 + 0.64 + 2.25) mm = 3.5455
        // mm.
        var (code, output, _) = CliHarness.Run("budget", "distance", "--length", "412.5", "--edm", "3 mm + 2 ppm",
            "--instrument-centering", "0.8 mm", "--target-centering", "1.5mm");
        Assert.Equal(0, code);
        Assert.Contains(" 0.00355 m", TotalLine(output));
        Assert.Contains("edm_proportional", output);
        Assert.Contains("0.00150 m", output.Split('\n').Single(l => l.Contains("target_centering")));
    }

    [Fact]
    public void JsonOutputAndFeet()
    {
        // 1000 ft, 0.01 ft + 5 ppm: b·D = 0.005 ft; σ = √(0.01² + 0.005²) ft = 0.0111803 ft.
        var (code, output, _) =
            CliHarness.Run("budget", "distance", "--length", "1000", "--edm", "0.01 + 5 ppm", "--units", "ft",
            "--json");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal("ft", doc.RootElement.GetProperty("unit").GetString());
        Assert.Equal(Math.Sqrt(0.0001 + 0.000025), doc.RootElement.GetProperty("sd").GetDouble(), 12);
        Assert.Equal(0.005, doc.RootElement.GetProperty("sd_components").GetProperty("edm_proportional").GetDouble(),
            12);
    }

    [Fact]
    public void LevelLineBudgetGrowsWithTheSquareRootOfTheReadings()
    {
        // Own level line: 0.5 mm per reading; 9 setups (18 readings) vs 36 setups (72 readings): σ doubles.
        static double Sd(string setups)
        {
            var (code, output, _) =
                CliHarness.Run("budget", "level", "--reading-sd", "0.5 mm", "--setups", setups, "--json");
            Assert.Equal(0, code);
            using var doc = JsonDocument.Parse(output);
            return doc.RootElement.GetProperty("sd").GetDouble();
        }
        Assert.Equal(0.0005 * Math.Sqrt(18), Sd("9"), 15);
        Assert.Equal(2.0, Sd("36") / Sd("9"), 12);
        var (c2, perKm, _) = CliHarness.Run("budget", "level", "--per-km", "1 mm", "--length", "4 km");
        Assert.Equal(0, c2);
        Assert.Contains(" 0.00200 m", TotalLine(perKm)); // ISO 17123-2: 1 mm × √4
    }

    [Theory]
    [InlineData("distance")]
    [InlineData("direction")]
    [InlineData("angle")]
    [InlineData("level")]
    public void HelpIsAvailableForEveryBudgetKind(string kind)
    {
        var (code, output, _) = CliHarness.Run("budget", kind, "--help");
        Assert.Equal(0, code);
        Assert.Contains("--units", output);
    }

    [Theory]
    [InlineData(new[] { "budget", "distance", "--length", "100", "--edm", "3 mm + x ppm" },
        "'x' in '3 mm + x ppm' is not a number of ppm")]
    [InlineData(new[] { "budget", "angle", "--direction-sd", "-5" }, "--direction-sd must be positive")]
    [InlineData(new[] { "budget", "distance", "--length", "100", "--edm", "3 mm", "--target-centering", "-2 mm" },
        "--target-centering must be zero or positive")]
    [InlineData(new[] { "budget", "level", "--per-km", "-1 mm", "--length", "2 km" }, "--per-km must be positive")]
    [InlineData(new[] { "budget", "angle", "--direction-sd", "5", "--sets", "two" },
        "--sets 'two' must be a whole number")]
    [InlineData(new[] { "budget", "direction", "--direction-sd", "5", "--instrument-centering", "1 mm" },
        "--length is needed")]
    public void BadSpecificationsGiveAClearErrorAndExitCode2(string[] args, string message)
    {
        var (code, output, err) = CliHarness.Run(args);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Equal("", output);
        Assert.Contains(message, err);
    }
}

public class AdjustBudgetReportTests
{
    private static string Demo()
    {
        return CliHarness.DataFile("brackenmoor.yaml");
    }

    [Fact]
    public void DemoReportShowsTheBudgetSummaryAndOnRequestEachObservation()
    {
        var (code, text, _) = CliHarness.Run("adjust", Demo(), "--date", "2026-12-01", "--budgets");
        Assert.Equal(0, code);
        Assert.Contains("ERROR BUDGETS", text);
        Assert.Contains("ERROR BUDGET PER OBSERVATION", text);
        // Distance 4 of the demo (BK01→S1, 189.9390 m): 2 mm + 2 ppm, 1 mm + 1 mm centering:
        // √(2² + 0.379878² + 1² + 1²) mm = 2.4788 mm.
        Assert.Contains(
            "     4 total 0.0025 = edm_constant 0.0020, edm_proportional 0.0004, instrument_centering 0.0010,", text);
        var budgetPart = text[text.IndexOf("ERROR BUDGETS", StringComparison.Ordinal)..text.IndexOf("CAUTION",
            StringComparison.Ordinal)];
        // the width is the report's: a line naming the data file is measured with the file as `data/...`, whatever
        // folder the checkout is in
        budgetPart = budgetPart.Replace(Path.GetDirectoryName(Demo())!, "data", StringComparison.Ordinal);
        Assert.All(budgetPart.Split('\n'), l => Assert.True(l.Length <= 100, l));

        var plain = CliHarness.Run("adjust", Demo(), "--date", "2026-12-01").Out;
        Assert.Contains("ERROR BUDGETS", plain);
        Assert.DoesNotContain("ERROR BUDGET PER OBSERVATION", plain);
    }
}
