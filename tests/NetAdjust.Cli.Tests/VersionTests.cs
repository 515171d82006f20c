using System.Text.Json;
using System.Xml.Linq;

namespace NetAdjust.Cli.Tests;

/// <summary>
/// One version for every package (Directory.Build.props), shown by <c>netadjust --version</c> and written into the
/// reports and the JSON result as <c>generator</c> (docs/cli.md, docs/output-format.md, CHANGELOG.md).
/// </summary>
public sealed class VersionTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-version-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    /// <summary>The version as the repository sets it, read from the build file rather than from the
    /// binaries.</summary>
    private static string DeclaredVersion()
    {
        var props = XDocument.Load(Path.Combine(CliHarness.RepoRoot, "Directory.Build.props"));
        return props.Descendants("Version").Single().Value.Trim();
    }

    [Fact]
    public void VersionOptionPrintsTheVersionOfTheBuildFile()
    {
        var run = CliHarness.RunProcess(CliHarness.RepoRoot, "--version");
        Assert.True(run.Code == 0, run.Err);
        Assert.Equal(DeclaredVersion(), run.Out.Trim());
    }

    [Fact]
    public void EveryReportAndJsonResultNamesTheGeneratorWithItsVersion()
    {
        string generator = "NetAdjust " + DeclaredVersion();
        string json = Path.Combine(_tmp, "result.json"), text = Path.Combine(_tmp, "report.txt");
        string html = Path.Combine(_tmp, "report.html"), seq = Path.Combine(_tmp, "sequence.json");
        var run = CliHarness.Run("adjust", CliHarness.DataFile("brackenmoor.yaml"), "--date", "2026-12-01", "--quiet",
            "--json", json, "--report", text, "--html", html);
        Assert.True(run.Code == 0, run.Err);
        using (var doc = JsonDocument.Parse(File.ReadAllText(json)))
            Assert.Equal(generator, doc.RootElement.GetProperty("generator").GetString());
        Assert.Contains($"\nGenerator : {generator}\n", File.ReadAllText(text), StringComparison.Ordinal);
        Assert.Contains($"<meta name=\"generator\" content=\"{generator}\">", File.ReadAllText(html),
            StringComparison.Ordinal);

        run = CliHarness.Run("adjust", CliHarness.DataFile("harrowgate-control.yaml"), "--date", "2026-12-01",
            "--quiet", "--sequence", "--json", seq);
        Assert.True(run.Code == 0, run.Err);
        using var sequence = JsonDocument.Parse(File.ReadAllText(seq));
        Assert.Equal(generator, sequence.RootElement.GetProperty("generator").GetString());
        Assert.All(sequence.RootElement.GetProperty("solutions").EnumerateArray(),
            s => Assert.Equal(generator, s.GetProperty("generator").GetString()));
    }
}
