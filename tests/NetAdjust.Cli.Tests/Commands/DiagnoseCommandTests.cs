using System.Text.Json;
using NetAdjust.IO.Text;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// <c>adjust --diagnose</c> and <c>--diagnose-skip</c> (docs/cli.md): the diagnosis of the demo with a planted blunder
/// (data/harrowfield-blunder.yaml: +40 mm on the distance H3→H4, the harrowfield scenario of
/// NetAdjust.Simulation.DemoScenarios) names the observation's file and line in its edit, and a wrong kind name or a
/// combination that does not apply is refused with exit code 2 and a message, nothing written.
/// </summary>
public sealed class DiagnoseCommandTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-diagnose-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string Demo => CliHarness.DataFile("harrowfield-blunder.yaml");

    /// <summary>The line of the demo file that holds the planted blunder.</summary>
    private static int BlunderLine => File.ReadLines(Demo).ToList().FindIndex(t =>
        t.Contains("{to: H4, value: 419.3795}", StringComparison.Ordinal)) + 1;

    [Fact]
    public void TheSuggestedEditNamesTheFileAndLineOfTheObservation()
    {
        Assert.True(BlunderLine > 0);
        string json = Path.Combine(_tmp, "result.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", Demo, "--diagnose", "--date", "2026-12-01", "--quiet",
            "--json", json);
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("BLUNDER DIAGNOSIS", stdout, StringComparison.Ordinal);
        Assert.Contains($"#26 distance H3→H4 ({Demo}:{BlunderLine}): w = ", stdout, StringComparison.Ordinal);
        // The edit line: file and line of the observation, the key, the booked text, then the suggested text.
        string edit = Assert.Single(stdout.Split('\n'), l => l.Contains(" -> ", StringComparison.Ordinal)).Trim();
        Assert.StartsWith($"{Demo}:{BlunderLine}  value  419.3795 -> ", edit, StringComparison.Ordinal);
        Assert.Contains("NetAdjust never changes the input", stdout, StringComparison.Ordinal);

        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var suspect = doc.RootElement.GetProperty("diagnosis").GetProperty("suspects")[0];
        Assert.Equal(25, suspect.GetProperty("observation").GetProperty("index").GetInt32());
        Assert.Equal(edit, suspect.GetProperty("suggested_edit").GetString());
        // the reference hypothesis is always among those ranked (docs/diagnosis.md)
        Assert.Contains("unexplained_bias", suspect.GetProperty("ranked").EnumerateArray()
            .Select(h => h.GetProperty("kind").GetString()));
    }

    [Fact]
    public void AGnssBaselineAmongTheSuspectsIsDiagnosedWithoutAWrongPointTrial()
    {
        // Regression (found by FuzzTests): in data/skelmoor-gnss.yaml with the direction T1→T2 booked 291° too small,
        // a baseline component is among the suspects; its trials used to end in an internal error (exit 70): no
        // value edit and no target edit for a baseline. A value edit now changes that component alone; the
        // wrong-point trial is not offered for baselines (a wrong point moves all three components of a baseline;
        // docs/diagnosis.md, "Catalogue").
        string dir = Directory.CreateDirectory(Path.Combine(_tmp, "gnss")).FullName;
        string demo = Path.Combine(dir, "skelmoor-gnss.yaml");
        string text = File.ReadAllText(CliHarness.DataFile("skelmoor-gnss.yaml"));
        const string booked = "{to: T2, value: 291-19-21.4}";
        Assert.Contains(booked, text, StringComparison.Ordinal);
        File.WriteAllText(demo, text.Replace(booked, "{to: T2, value: 0-19-21.4}", StringComparison.Ordinal));
        string json = Path.Combine(dir, "result.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--diagnose", "--quiet", "--date", "2026-12-01",
            "--json", json);
        Assert.True(code == ExitCodes.Success, $"exit {code}: {stderr}");
        Assert.Contains("BLUNDER DIAGNOSIS", stdout, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var baselines = doc.RootElement.GetProperty("diagnosis").GetProperty("suspects").EnumerateArray()
            .Where(s => s.GetProperty("observation").GetProperty("kind").GetString() == "baseline").ToList();
        Assert.NotEmpty(baselines);
        foreach (var suspect in baselines)
        {
            var kinds = suspect.GetProperty("ranked").EnumerateArray().Select(h => h.GetProperty("kind").GetString())
                .ToList();
            Assert.Contains("unexplained_bias", kinds);
            Assert.DoesNotContain("wrong_point", kinds);
        }
    }

    [Fact]
    public void WithTheHuntEachSetAsideObservationIsDiagnosedInItsRound()
    {
        // data/corvan-fell-target-height.yaml books the target height on CF3 at CF2 as 2.654 m; the prism stood at
        // 1.654 m (data/README.md). The hunt sets aside the zenith angle (#12), then the slope distance (#13); each
        // is diagnosed in its round and both are one blunder with one edit.
        string demo = CliHarness.DataFile("corvan-fell-target-height.yaml");
        int line = File.ReadLines(demo).ToList().FindIndex(t => t.Contains("target_height: 2.654",
            StringComparison.Ordinal)) + 1;
        Assert.True(line > 0);
        string json = Path.Combine(_tmp, "result.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--snoop", "--diagnose", "--quiet", "--json",
            json);
        Assert.True(code == ExitCodes.Success, stderr);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var d = doc.RootElement.GetProperty("diagnosis");
        Assert.Equal("hunt_rounds", d.GetProperty("diagnosed").GetString());
        var suspects = d.GetProperty("suspects").EnumerateArray().ToList();
        Assert.Equal([11, 12], suspects.Select(x => x.GetProperty("observation").GetProperty("index").GetInt32()));
        Assert.All(suspects, x =>
        {
            Assert.True(x.GetProperty("explained").GetBoolean());
            Assert.Equal("target_height", x.GetProperty("ranked")[0].GetProperty("kind").GetString());
            Assert.Equal($"{demo}:{line}  target_height  2.654 -> 1.654", x.GetProperty("suggested_edit").GetString());
        });
        Assert.Single(stdout.Split('\n'), l => l.Contains(" -> ", StringComparison.Ordinal));
        Assert.Contains("Suggested edit: the same as for #12.", stdout, StringComparison.Ordinal);
    }

    [Fact]
    public void TheInputIsNeverChanged()
    {
        byte[] before = File.ReadAllBytes(Demo);
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--snoop", "--diagnose", "--quiet");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Equal(before, File.ReadAllBytes(Demo));
    }

    [Fact]
    public void ASkippedKindIsNotTried()
    {
        var (code, stdout, stderr) = CliHarness.Run("adjust", Demo, "--diagnose", "--diagnose-skip",
            "prism_constant, wrong_point", "--quiet");
        Assert.True(code == ExitCodes.Success, stderr);
        string section = stdout[stdout.IndexOf("BLUNDER DIAGNOSIS", StringComparison.Ordinal)..];
        Assert.DoesNotContain(" prism_constant ", section, StringComparison.Ordinal);
        Assert.DoesNotContain(" wrong_point ", section, StringComparison.Ordinal);
        Assert.Contains(" unexplained_bias ", section, StringComparison.Ordinal);
    }

    [Fact]
    public void TheProjectsSkipListAndTheCommandLinesAddUp()
    {
        string copy = Path.Combine(_tmp, "harrowfield-skip.yaml");
        File.WriteAllText(copy, File.ReadAllText(Demo) + "diagnosis:\n  skip: [prism_constant]\n");
        var (code, stdout, stderr) = CliHarness.Run("adjust", copy, "--diagnose", "--quiet");
        Assert.True(code == ExitCodes.Success, stderr);
        string section = stdout[stdout.IndexOf("BLUNDER DIAGNOSIS", StringComparison.Ordinal)..];
        Assert.DoesNotContain(" prism_constant ", section, StringComparison.Ordinal);
        Assert.Contains(" wrong_point ", section, StringComparison.Ordinal);
        (code, stdout, stderr) = CliHarness.Run("adjust", copy, "--diagnose", "--diagnose-skip", "wrong_point",
            "--quiet");
        Assert.True(code == ExitCodes.Success, stderr);
        section = stdout[stdout.IndexOf("BLUNDER DIAGNOSIS", StringComparison.Ordinal)..];
        Assert.DoesNotContain(" prism_constant ", section, StringComparison.Ordinal);
        Assert.DoesNotContain(" wrong_point ", section, StringComparison.Ordinal);
    }

    [Fact]
    public void AnUnknownKindNameIsRefusedWithItsMessage()
    {
        string report = Path.Combine(_tmp, "report.txt");
        var (code, stdout, stderr) = CliHarness.Run("adjust", Demo, "--diagnose", "--diagnose-skip",
            "target_height,prism", "--report", report);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Equal("", stdout);
        Assert.Contains("--diagnose-skip: " + OptionGrammars.BlunderKinds.Parse("prism").Error, stderr,
            StringComparison.Ordinal);
        Assert.Contains("target_height", stderr, StringComparison.Ordinal); // the legal words are listed
        Assert.False(File.Exists(report));
    }

    [Theory]
    [InlineData("unexplained_bias", "cannot be skipped")]
    [InlineData(",", "name at least one kind of blunder")]
    [InlineData("target_height,,face_mix_up", "an empty kind between commas")]
    public void ASkipListThatCannotBeMetIsRefused(string skip, string message)
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--diagnose", "--diagnose-skip", skip);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains(message, stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void TheSkipListNeedsTheDiagnosis()
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--diagnose-skip", "transposition");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--diagnose-skip applies only with --diagnose", stderr, StringComparison.Ordinal);
    }

    [Fact]
    public void TheSequenceDoesNotTakeTheDiagnosis()
    {
        var (code, _, stderr) = CliHarness.Run("adjust", Demo, "--sequence", "--diagnose");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--sequence cannot be combined with --diagnose", stderr, StringComparison.Ordinal);
    }
}
