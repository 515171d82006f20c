using System.Text.Json;
using NetAdjust.Cli;

namespace NetAdjust.Cli.Tests;

/// <summary>End-to-end runs of the command, in process, on the demo data and on broken inputs.</summary>
public sealed class CliTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-cli-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string Demo => CliHarness.DataFile("brackenmoor.yaml");

    [Fact]
    public void AdjustsTheDemoAndWritesContractJson()
    {
        string json = Path.Combine(_tmp, "out.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", Demo, "--json", json, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("SUMMARY", stdout);
        Assert.Contains("CAUTION", stdout);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var root = doc.RootElement;
        Assert.Equal("netadjust-result/1", root.GetProperty("format").GetString());
        var st = root.GetProperty("statistics");
        Assert.Equal(st.GetProperty("observations").GetInt32() - st.GetProperty("unknowns").GetInt32(),
            st.GetProperty("degrees_of_freedom").GetInt32());
        // Every observation of the input is in the JSON under its kind: counted by hand in data/brackenmoor.yaml
        // (13 directions, 7 distances, 1 angle) and data/brackenmoor-levels.csv (5 height differences).
        var kinds = root.GetProperty("observations").EnumerateArray().GroupBy(o => o.GetProperty("kind").GetString()!)
            .ToDictionary(g => g.Key, g => g.Count());
        var expected = new Dictionary<string, int>
        {
            ["direction"] = 13, ["distance"] = 7, ["angle"] = 1, ["height_difference"] = 5,
        };
        Assert.Equal(expected.OrderBy(k => k.Key, StringComparer.Ordinal),
            kinds.OrderBy(k => k.Key, StringComparer.Ordinal));
        // Every point of the demo is listed; held points have zero sd.
        var bk01 = root.GetProperty("points").EnumerateArray().Single(p => p.GetProperty("id").GetString() == "BK01");
        Assert.Equal(0.0, bk01.GetProperty("sd_e").GetDouble());
    }

    [Fact]
    public void CheckAcceptsTheDemo()
    {
        var (code, stdout, _) = CliHarness.Run("check", Demo);
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("valid", stdout);
    }

    [Fact]
    public void CheckRejectsABrokenFileNamingFileLineAndItem()
    {
        string f = Path.Combine(_tmp, "broken.yaml");
        File.WriteAllText(f,
            "default_sd: {direction: 2}\npoints:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 9, n: " +
            "9}\nsetups:\n  - at: A\n    directions:\n      - {to: B, value: 12-75-00}\n");
        var (code, _, stderr) = CliHarness.Run("check", f);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("broken.yaml:8: direction A→B: minutes must be below 60 in '12-75-00'", stderr);
    }

    [Fact]
    public void MissingProjectFileIsInvalidInput()
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Path.Combine(_tmp, "nope.yaml"));
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("nope.yaml: the project file does not exist", stderr);
    }

    [Fact]
    public void UnknownOptionIsAUsageError()
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--colour", "red");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("--colour", stderr);
    }

    [Fact]
    public void DatumDefectIsAFailedAdjustment()
    {
        string f = Path.Combine(_tmp, "free.yaml");
        File.WriteAllText(f,
            "default_sd: {distance: 0.003}\npoints:\n  - {id: A, e: 0, n: 0}\n  - {id: B, e: 9, n: 9}\nsetups:\n  - " +
            "at: A\n    distances:\n      - {to: B, value: 12.7}\n");
        var (code, _, stderr) = CliHarness.Run("adjust", f);
        Assert.Equal(ExitCodes.AdjustmentFailed, code);
        Assert.Contains("datum is not defined", stderr);
    }

    [Fact]
    public void OutputOverAnInputIsRefusedAndTheInputIsUntouched()
    {
        string f = Path.Combine(_tmp, "p.yaml");
        File.Copy(Demo, f);
        File.Copy(CliHarness.DataFile("brackenmoor-levels.csv"), Path.Combine(_tmp, "brackenmoor-levels.csv"));
        byte[] before = File.ReadAllBytes(f);
        var (code, _, stderr) = CliHarness.Run("adjust", f, "--json", f);
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("refusing to overwrite an input file", stderr);
        Assert.Equal(before, File.ReadAllBytes(f));
        (code, _, _) = CliHarness.Run("adjust", f, "--report", Path.Combine(_tmp, "brackenmoor-levels.csv"));
        Assert.Equal(ExitCodes.OutputFailed, code);
    }

    [Fact]
    public void UnwritableOutputLeavesNoPartialFile()
    {
        string dir = Path.Combine(_tmp, "no-such-folder");
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--json", Path.Combine(dir, "r.json"));
        Assert.Equal(ExitCodes.OutputFailed, code);
        Assert.Contains("cannot write", stderr);
        Assert.False(Directory.Exists(dir));
    }

    [Fact]
    public void FailedGlobalTestIsAResultNotAnError()
    {
        // σ far too optimistic for the demo's observations: the global test fails, exit code still 0.
        string f = Path.Combine(_tmp, "tight.yaml");
        File.WriteAllText(f,
            File.ReadAllText(Demo).Replace("direction: 2.0", "direction: 0.05").Replace("angle: 2.8", "angle: 0.07")
            .Replace("direction_sd: 3,", "direction_sd: 0.05,").Replace("edm: 2 mm + 2 ppm",
                "edm: 0.05 mm").Replace("centering: 1.0 mm", "centering: 0 mm").Replace("  - brackenmoor-levels.csv\n",
                ""));
        var (code, stdout, stderr) = CliHarness.Run("adjust", f, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("FAILED", stdout);
    }

    [Fact]
    public void BadDateIsInvalidInput()
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--date", "1/12/2026");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("YYYY-MM-DD", stderr);
    }

    [Fact]
    public void HelpIsAvailableForEveryVerb()
    {
        foreach (var verb in new[] { "adjust", "check" })
        {
            var (code, stdout, _) = CliHarness.Run(verb, "--help");
            Assert.Equal(0, code);
            Assert.Contains("Usage", stdout);
        }
    }
}
