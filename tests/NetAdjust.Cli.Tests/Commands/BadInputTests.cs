using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using NetAdjust.IO.Project;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// Regression tests for the hardening items of the bad-input review: each reproduces a case that crashed, hung,
/// or was silently accepted, and checks the documented behaviour (docs/cli.md exit codes, docs/input-format.md
/// "Limits" and "Warnings"). The CLI runs in process through <see cref="Program.Run"/>.
/// </summary>
public sealed class BadInputTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-harden-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string Data(string name) => Path.Combine(CliHarness.RepoRoot, "data", name);

    /// <summary>A copy of the Brackenmoor demo (project and level CSV) in the temporary folder, edited by
    /// <paramref name="edit"/>.</summary>
    private string Demo(Func<string, string>? edit = null, Func<string, string>? editCsv = null)
    {
        string yaml = File.ReadAllText(Data("brackenmoor.yaml"));
        string csv = File.ReadAllText(Data("brackenmoor-levels.csv"));
        File.WriteAllText(Path.Combine(_tmp, "brackenmoor-levels.csv"), editCsv is null ? csv : editCsv(csv));
        string path = Path.Combine(_tmp, "site.yaml");
        File.WriteAllText(path, edit is null ? yaml : edit(yaml));
        return path;
    }

    private static string Replace(string text, string old, string @new)
    {
        Assert.Contains(old, text);
        return text.Replace(old, @new, StringComparison.Ordinal);
    }

    private static int LineOf(string text, string fragment) =>
        text[..text.IndexOf(fragment, StringComparison.Ordinal)].Count(c => c == '\n') + 1;

    private string Write(string name, string text)
    {
        string path = Path.Combine(_tmp, name);
        File.WriteAllText(path, text);
        return path;
    }

    private string WriteBytes(string name, byte[] bytes)
    {
        string path = Path.Combine(_tmp, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    private static void AssertRefused(string file, int line, CliRun run,
        int code = ExitCodes.InvalidInput)
    {
        Assert.True(run.Code == code, $"exit {run.Code}: {run.Err}");
        Assert.Contains($"{Path.GetFileName(file)}:{line}:", run.Err);
        Assert.DoesNotContain("   at ", run.Err); // no stack trace
    }

    // 1. Deep nesting ended the process with a stack overflow; it is refused before the document model recurses.
    [Theory]
    [InlineData(50_000)]
    [InlineData(10_000)]
    [InlineData(InputLimits.MaxNestingDepth + 1)]
    public void DeepNestingIsRefusedBeforeTheParserRecurses(int depth)
    {
        string f = Write("deep.yaml", "points: " + new string('[', depth) + "\n");
        var run = CliHarness.Run("check", f);
        AssertRefused(f, 1, run);
        Assert.Contains("nested deeper", run.Err);
    }

    // 2. A line holding only ':' after a nested mapping gave exit 70.
    [Fact]
    public void ALoneColonAfterANestedMappingIsInvalidInput()
    {
        string f = Write("colon.yaml", "points:\n  - id: A\n    e: 1\n:\n");
        AssertRefused(f, 4, CliHarness.Run("check", f));
    }

    // 3. Standard deviations of 1e-300 or 1e300 gave exit 70 (weights not finite).
    [Theory]
    [InlineData("1e-300")]
    [InlineData("1e300")]
    [InlineData("0.0000001")]
    public void AStandardDeviationOutsideTheSaneRangeIsRefused(string sd)
    {
        string f = Demo(y => Replace(y, "  distance: 3 mm", "  distance: " + sd));
        var run = CliHarness.Run("adjust", f, "--quiet");
        AssertRefused(f, LineOf(File.ReadAllText(f), "  distance: " + sd), run);
        Assert.Contains("outside the accepted range", run.Err);
    }

    [Fact]
    public void AStandardDeviationOutsideTheSaneRangeInACsvIsRefused()
    {
        string f = Demo(editCsv: c => Replace(Replace(c, "kind,from,to,value,length,level",
            "kind,from,to,value,length,level,sd"),
            "-3.78618,610,DL10", "-3.78618,610,,1e-300").Replace("DL10\n", "DL10,\n"));
        var run = CliHarness.Run("adjust", f, "--quiet");
        AssertRefused(Path.Combine(_tmp, "brackenmoor-levels.csv"), 6, run);
    }

    [Fact]
    public void AnInstrumentBudgetOverATinySightIsRefusedWithItsLine()
    {
        // 1.1 mm passes the 1 mm limit of a measured distance (corpus case distance-tiny.yaml refuses 1e-300 m), but
        // the centering terms over so short a sight give a direction sd beyond 1 rad.
        string f = Demo(y => Replace(y, "{to: S1, value: 189.9390}", "{to: S1, value: 0.0011}"));
        var run = CliHarness.Run("adjust", f, "--quiet");
        Assert.NotEqual(ExitCodes.InternalError, run.Code);
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Matches(@"site\.yaml:\d+: direction BK01→S1: the standard deviation .* is outside the accepted range",
            run.Err);
    }

    // 4. An empty output path gave exit 70.
    [Fact]
    public void AnEmptyOutputPathIsRefused()
    {
        var run = CliHarness.Run("adjust", Data("brackenmoor.yaml"), "--json", "", "--quiet");
        Assert.Equal(ExitCodes.OutputFailed, run.Code);
        Assert.Contains("output path is empty", run.Err);
    }

    [Fact]
    public void AnEmptySimulateOutputPathIsRefused()
    {
        var run = CliHarness.Run("simulate", "--points", "20", "--out", "");
        Assert.Equal(ExitCodes.OutputFailed, run.Code);
        Assert.Contains("output path is empty", run.Err);
    }

    [Fact]
    public void AMessageQuotesOnlyAShortExcerptOfALongValue()
    {
        string f = Demo(y => Replace(y, "{to: S1, value: 189.9390}", "{to: S1, value: " + new string('7', 200) + "x}"));
        var run = CliHarness.Run("check", f);
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.DoesNotContain(new string('7', 41), run.Err);
    }

    // 5. When one output failed, earlier outputs had already been renamed over existing files.
    public static TheoryData<int> OutputPositions() => new() { 0, 1, 2, 3, 4, 5, 6 };

    [Theory]
    [MemberData(nameof(OutputPositions))]
    public void AFailedOutputLeavesEveryOtherOutputWithItsEarlierContent(int blocked)
    {
        string[] options = ["--json", "--html", "--svg", "--csv", "--landxml", "--geojson", "--report"];
        string dir = Path.Combine(_tmp, "out");
        Directory.CreateDirectory(dir);
        var args = new List<string> { "adjust", Data("brackenmoor.yaml"), "--quiet", "--date", "2026-12-01" };
        for (int k = 0; k < options.Length; k++)
        {
            string path = Path.Combine(dir, $"out{k}");
            if (k == blocked) Directory.CreateDirectory(path); // a folder stands where the output should go
            else File.WriteAllText(path, $"earlier {k}");
            args.AddRange([options[k], path]);
        }
        var run = CliHarness.Run([.. args]);
        Assert.Equal(ExitCodes.OutputFailed, run.Code);
        Assert.Contains($"out{blocked}", run.Err);
        for (int k = 0; k < options.Length; k++)
            if (k != blocked) Assert.Equal($"earlier {k}", File.ReadAllText(Path.Combine(dir, $"out{k}")));
        Assert.Equal(options.Length, Directory.GetFileSystemEntries(dir).Length); // no temporary or set-aside file left
    }

    [Fact]
    public void OutputsReplaceEarlierFilesWhenAllSucceed()
    {
        string json = Write("r.json", "earlier"), csv = Write("p.csv", "earlier");
        var run = CliHarness.Run("adjust", Data("brackenmoor.yaml"), "--quiet", "--json", json, "--csv", csv,
            "--report", Path.Combine(_tmp, "r.txt"));
        Assert.True(run.Code == 0, run.Err);
        Assert.StartsWith("{", File.ReadAllText(json));
        Assert.NotEqual("earlier", File.ReadAllText(csv));
        Assert.Equal(3, Directory.GetFileSystemEntries(_tmp).Length); // the three outputs and nothing set aside
    }

    // 6. Invalid UTF-8 was silently replaced by U+FFFD.
    [Fact]
    public void ALatin1ByteInTheTitleIsRefusedWithItsLine()
    {
        var bytes = Encoding.ASCII.GetBytes("units: {length: m}\nproject: caf").Concat(new byte[] { 0xE9 })
            .Concat(Encoding.ASCII.GetBytes("\npoints:\n  - {id: A, e: 1, n: 2, fix: en}\n")).ToArray();
        string f = WriteBytes("latin.yaml", bytes);
        var run = CliHarness.Run("check", f);
        AssertRefused(f, 2, run);
        Assert.Contains("UTF-8", run.Err);
    }

    [Fact]
    public void ALatin1ByteInACsvPointIdIsRefusedWithItsLine()
    {
        string f = Demo();
        string csvPath = Path.Combine(_tmp, "brackenmoor-levels.csv");
        var csv = File.ReadAllBytes(csvPath).ToList();
        int at = Encoding.ASCII.GetString(csv.ToArray()).IndexOf("BMK3,BMK4", StringComparison.Ordinal);
        csv[at + 3] = 0xD6; // 'Ö' in Latin-1
        File.WriteAllBytes(csvPath, csv.ToArray());
        AssertRefused(csvPath, 5, CliHarness.Run("check", f));
    }

    [Fact]
    public void ATruncatedSequenceAtTheEndIsRefused()
    {
        string f = WriteBytes("cut.yaml", Encoding.UTF8.GetBytes("points:\n  - {id: A, e: 1, n: 2, fix: en}\n# " +
            "").Concat(new byte[] { 0xE2, 0x82 }).ToArray());
        AssertRefused(f, 3, CliHarness.Run("check", f));
    }

    // 7. A second YAML document was silently ignored.
    [Fact]
    public void ASecondYamlDocumentIsRefused()
    {
        string f = Write("two.yaml", "points:\n  - {id: A, e: 1, n: 2, fix: en}\n---\npoints: []\n");
        var run = CliHarness.Run("check", f);
        AssertRefused(f, 3, run);
        Assert.Contains("second YAML document", run.Err);
    }

    // 8. A CSV with CR-only line ends was read as one comment line.
    [Theory]
    [InlineData("\r")]
    [InlineData("\r\n")]
    public void CsvLineEndsOfEveryKindAreRead(string newline)
    {
        string original = CliHarness.Run("check", Data("brackenmoor.yaml")).Out;
        Assert.Contains("26 observations", original);
        string f = Demo(editCsv: c => c.Replace("\n", newline, StringComparison.Ordinal));
        var run = CliHarness.Run("check", f);
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("26 observations", run.Out);
    }

    // 9. Huge values and endless files: sizes are capped and messages quote only a short excerpt.
    [Fact]
    public void AHugeValueIsRefusedWithAShortMessage()
    {
        string f = Write("long.yaml", "project: " + new string('x', 1_000_000) + "\npoints: []\n");
        var run = CliHarness.Run("check", f);
        AssertRefused(f, 1, run);
        Assert.True(run.Err.Length < 400, run.Err);
    }

    [Fact]
    public void AHugeCsvFieldIsRefusedWithAShortMessage()
    {
        string f = Demo(editCsv: c => c + "height_difference,BMK1," + new string('Q', 100_000) + ",1,100,DL10\n");
        var run = CliHarness.Run("check", f);
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.True(run.Err.Length < 400, run.Err);
    }

    [Fact]
    public void AFileBeyondTheSizeLimitIsRefusedWithoutReadingItAll()
    {
        string f = Path.Combine(_tmp, "big.yaml");
        using (var s = File.Create(f)) s.SetLength(InputLimits.MaxFileBytes + 1); // sparse: no disk used
        var run = CliHarness.Run("check", f);
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Contains("larger than the limit", run.Err);
    }

    [Fact]
    public void ACsvFileBeyondItsSizeLimitIsRefusedByName()
    {
        // The CSV limit is larger than the project file's (a million points, docs/input-format.md "Limits"); a file
        // one byte over it is refused before it is read, naming the CSV file.
        string csv = Path.Combine(_tmp, "huge.csv");
        using (var s = File.Create(csv)) s.SetLength(InputLimits.MaxCsvFileBytes + 1); // sparse: no disk used
        string f = Path.Combine(_tmp, "huge.yaml");
        File.WriteAllText(f, "points:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 100, n: 0}\n" +
            "files:\n  - huge.csv\n");
        var run = CliHarness.Run("check", f);
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Contains("huge.csv", run.Err);
        Assert.Contains("larger than the limit of 1024 MiB", run.Err);
    }

    [Fact]
    public void AnEndlessFileIsRefused()
    {
        if (!File.Exists("/dev/zero")) return; // an endless device exists on Linux and macOS only
        var run = CliHarness.Run("check", "/dev/zero");
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Contains("larger than the limit", run.Err);
    }

    // 10. check said "valid" where adjust failed.
    [Fact]
    public void CheckRefusesADatumHoldNamingAnUnknownPointWithItsLine()
    {
        string f = Demo(y => y + "datum: {mode: minimal, hold: NOPE}\n");
        var check = CliHarness.Run("check", f);
        AssertRefused(f, LineOf(File.ReadAllText(f), "datum:"), check);
        Assert.Contains("NOPE", check.Err);
        Assert.Equal(check.Code, CliHarness.Run("adjust", f, "--quiet").Code);
    }

    [Fact]
    public void CheckFailsLikeAdjustWhenTheControlLeavesTheDatumUndefined()
    {
        string f = Demo(y => Replace(y, "{id: BK01, e: 2150.000, n: 5320.000, fix: en}", "{id: BK01, e: " +
            "2150.000, n: 5320.000}"));
        var check = CliHarness.Run("check", f);
        var adjust = CliHarness.Run("adjust", f, "--quiet");
        Assert.Equal(ExitCodes.AdjustmentFailed, adjust.Code);
        Assert.Equal(adjust.Code, check.Code);
        Assert.Contains("datum is not defined", check.Err);
    }

    // 11. Observations set aside must not create unknowns or parts.
    [Fact]
    public void ADirectionSetWhollySetAsideCreatesNoOrientationUnknown()
    {
        string f = Demo(y => Replace(Replace(y, "{to: S1, value: 278-08-53.8}", "{to: S1, value: 278-08-53.8, " +
            "exclude: true}"),
            "{to: S3, value: 55-54-55.1}", "{to: S3, value: 55-54-55.1, exclude: true}"));
        string json = Path.Combine(_tmp, "r.json");
        var run = CliHarness.Run("adjust", f, "--quiet", "--json", json);
        Assert.True(run.Code == 0, run.Err);
        using var all = JsonDocument.Parse(File.ReadAllText(json));
        var baseline = Path.Combine(_tmp, "base.json");
        Assert.Equal(0, CliHarness.Run("adjust", Data("brackenmoor.yaml"), "--quiet", "--json", baseline).Code);
        using var before = JsonDocument.Parse(File.ReadAllText(baseline));
        int Unknowns(JsonDocument d) => d.RootElement.GetProperty("statistics").GetProperty("unknowns").GetInt32();
        Assert.Equal(Unknowns(before) - 1, Unknowns(all)); // the set's orientation is gone, nothing else
    }

    [Fact]
    public void APointReachedOnlyBySetAsideObservationsIsNoPartOfTheNetwork()
    {
        string f = Demo(editCsv: c => string.Join("\n", c.Split('\n').Select(l =>
            l.StartsWith("kind", StringComparison.Ordinal) ? l + ",exclude"
            : l.StartsWith('#') || l.Length == 0 ? l
            : l + (l.Contains("BMK5", StringComparison.Ordinal) ? ",true" : ","))));
        var run = CliHarness.Run("adjust", f, "--quiet");
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("warning: point BMK5", run.Err);
    }

    // 12. Coincident or absurd coordinates gave "datum not defined".
    [Fact]
    public void TwoJoinedPointsOnTheSameSpotAreNamed()
    {
        string f = Demo(y => Replace(y, "{id: S3, e: 2599.2, n: 5496.7}", "{id: S3, e: 2512.1, n: 5331.3}"));
        var run = CliHarness.Run("adjust", f, "--quiet");
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Contains("S2 and S3 have the same coordinates", run.Err);
        Assert.DoesNotContain("datum", run.Err);
    }

    [Fact]
    public void AnAbsurdCoordinateIsRefusedWithItsLine()
    {
        string f = Demo(y => Replace(y, "{id: S3, e: 2599.2, n: 5496.7}", "{id: S3, e: 1e308, n: 5496.7}"));
        var run = CliHarness.Run("adjust", f, "--quiet");
        AssertRefused(f, LineOf(File.ReadAllText(f), "{id: S3"), run);
        Assert.Contains("point S3", run.Err);
    }

    // 13. A tolerance below the spacing of doubles ran to the iteration limit.
    [Fact]
    public void AToleranceTheDoublesCannotMeetIsRefused()
    {
        // Northings of 5,500 km: doubles there are 9.3e-10 m apart (IEEE 754 binary64, common practice).
        string f = Demo(y => Regex.Replace(Replace(y, "  alpha: 0.05", "  alpha: 0.05\n  tolerance: 1e-10"),
            @"n: (5\d\d\d\.\d+)", m => "n: " + (5_500_000 + double.Parse(m.Groups[1].Value,
                System.Globalization.CultureInfo.InvariantCulture))
                .ToString("F3", System.Globalization.CultureInfo.InvariantCulture)));
        var run = CliHarness.Run("adjust", f, "--quiet");
        AssertRefused(f, LineOf(File.ReadAllText(f), "tolerance:"), run);
        Assert.Contains("adjustment.tolerance", run.Err);
        // The same project with the default tolerance adjusts.
        File.WriteAllText(f, File.ReadAllText(f).Replace("\n  tolerance: 1e-10", "", StringComparison.Ordinal));
        Assert.Equal(ExitCodes.Success, CliHarness.Run("adjust", f, "--quiet").Code);
    }

    // Line numbers of parser errors.
    [Theory]
    [InlineData("tab.yaml", "points:\n  - {id: A, e: 1, n: 2, fix: en}\n\t- {id: B}\n", 3)]
    [InlineData("alias.yaml", "points:\n  - {id: A, e: 1, n: 2, fix: en}\n  - {id: B, e: *foo}\n", 3)]
    [InlineData("open.yaml", "points:\n  - {id: A, e: 1, n: 2, fix: en}\n  - {id: B, e: 1", 3)]
    public void ParserErrorsNameTheLineOfTheOffendingCharacter(string name, string text, int line)
    {
        string f = Write(name, text);
        AssertRefused(f, line, CliHarness.Run("check", f));
    }

    // Warnings: legal but suspicious data.
    [Fact]
    public void AnUnreachedPointIsWarnedOnStandardErrorInTheReportAndInJson()
    {
        string f = Demo(y => Replace(y, "  - {id: BMK5}\n", "  - {id: BMK5}\n  - {id: LOST, e: 1000, n: 1000}\n"));
        string json = Path.Combine(_tmp, "r.json"), report = Path.Combine(_tmp, "r.txt");
        var run = CliHarness.Run("adjust", f, "--quiet", "--json", json, "--report", report);
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("warning: point LOST", run.Err);
        Assert.Contains("Warning   : point LOST", File.ReadAllText(report));
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Contains(doc.RootElement.GetProperty("warnings").EnumerateArray(), w
            => w.GetString()!.Contains("point LOST"));
        string html = Path.Combine(_tmp, "r.html"), seq = Path.Combine(_tmp, "s.txt");
        Assert.Equal(0, CliHarness.Run("adjust", f, "--quiet", "--html", html).Code);
        Assert.Contains("<dt>Warning</dt><dd>point LOST", File.ReadAllText(html));
        Assert.Equal(0, CliHarness.Run("adjust", f, "--quiet", "--sequence", "--report", seq).Code);
        Assert.Contains("Warning   : point LOST", File.ReadAllText(seq));
    }

    [Fact]
    public void NoWarningsKeyWithoutWarnings()
    {
        string json = Path.Combine(_tmp, "r.json");
        var run = CliHarness.Run("adjust", Data("brackenmoor.yaml"), "--quiet", "--json", json);
        Assert.Equal("", run.Err);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.False(doc.RootElement.TryGetProperty("warnings", out _));
    }

    [Theory]
    [InlineData("ids")]
    [InlineData("twice")]
    [InlineData("empty")]
    public void SuspiciousButLegalDataIsWarnedAndExitsZero(string which)
    {
        string f = which switch
        {
            "ids" => Demo(y => Replace(y, "  - {id: BMK5}\n", "  - {id: BMK5}\n  - {id: bmk5}\n")),
            "twice" => Demo(y => Replace(y, "  - brackenmoor-levels.csv", "  - brackenmoor-levels.csv\n  - " +
                "brackenmoor-levels.csv")),
            _ => Write("empty.yaml", "points:\n  - {id: A, e: 1, n: 2, fix: en}\n"),
        };
        string expected = which switch
        {
            "ids" => "differ only in case",
            "twice" => "listed more than once",
            _ => "no observations",
        };
        var check = CliHarness.Run("check", f);
        Assert.True(check.Code == 0, check.Err);
        Assert.Contains(expected, check.Err);
        var adjust = CliHarness.Run("adjust", f, "--quiet");
        Assert.True(adjust.Code == 0, adjust.Err);
        Assert.Contains("warning: ", adjust.Err);
    }

    // File access policy: the library opens files only through a replaceable resolver.
    [Fact]
    public void AConfinedResolverRefusesACsvOutsideItsFolderWhileTheDefaultReadsIt()
    {
        string inner = Path.Combine(_tmp, "project");
        Directory.CreateDirectory(inner);
        File.WriteAllText(Path.Combine(_tmp, "day1.csv"), "kind,from,to,value,sd\ndistance,A,B,100.0,0.003\n");
        string f = Path.Combine(inner, "p.yaml");
        File.WriteAllText(f, "points:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 100, n: 0}\nfiles:\n  - " +
            "../day1.csv\n");
        Assert.Single(ProjectReader.Read(f).Network.Observations);
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Read(f, InputFileResolver.ConfinedTo(inner)));
        Assert.Equal(5, e.Line);
        Assert.Contains("outside the folder", e.Message);
    }

    [Fact]
    public void AResolverCanServeFilesFromMemory()
    {
        var files = new Dictionary<string, string>
        {
            ["/virtual/p.yaml"] = "points:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 100, n: 0}\nfiles: " +
                "[obs.csv]\n",
            ["/virtual/obs.csv"] = "kind,from,to,value,sd\ndistance,A,B,100.0,0.003\n",
        };
        var project = ProjectReader.Read("/virtual/p.yaml", new MemoryResolver(files));
        Assert.Single(project.Network.Observations);
    }

    private sealed class MemoryResolver(Dictionary<string, string> files) : InputFileResolver
    {
        public override Stream Open(string fullPath) =>
            files.TryGetValue(fullPath, out var text) ? new MemoryStream(Encoding.UTF8.GetBytes(text))
                : throw new FileNotFoundException(fullPath);
    }
}
