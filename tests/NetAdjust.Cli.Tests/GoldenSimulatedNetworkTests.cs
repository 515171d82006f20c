using System.Security.Cryptography;
using System.Text;

namespace NetAdjust.Cli.Tests;

/// <summary>
/// Deterministic output of a large run, across processes: a 1,000-point plane network drawn by <c>simulate</c> from a
/// fixed seed is adjusted by the built command, and the SHA-256 of every output equals the one committed in
/// Golden/simulated-1000/sha256.txt (recorded with the writers that built each document in memory, before they wrote
/// to the output stream; the files are megabytes each, so their hashes are kept instead of the files).
/// NETADJUST_UPDATE_GOLDEN=1 rewrites the hashes instead of comparing (DEVELOPERS.md); review and commit the change.
/// </summary>
public sealed class GoldenSimulatedNetworkTests : IDisposable
{
    private const string RunDate = "2026-12-01";

    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-golden-sim-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string HashFile => Path.Combine(CliHarness.RepoRoot, "tests", "NetAdjust.Cli.Tests", "Golden",
        "simulated-1000", "sha256.txt");

    // Variant → its extra options and output option → file name.
    private static readonly (string Variant, string[] Extra, (string Option, string File)[] Outputs)[] Runs =
    [
        ("plain", [],
        [
            ("--json", "result.json"), ("--report", "report.txt"), ("--html", "report.html"), ("--csv", "points.csv"),
            ("--landxml", "points.landxml"), ("--geojson", "network.geojson"), ("--svg", "plot.svg"),
        ]),
        ("snoop", ["--snoop"],
        [
            ("--json", "result.json"), ("--report", "report.txt"), ("--csv", "points.csv"),
            ("--landxml", "points.landxml"), ("--geojson", "network.geojson"),
        ]),
    ];

    [Fact]
    public void EveryOutputOfASimulatedThousandPointRunHasItsGoldenHash()
    {
        var sim = CliHarness.RunProcess(_tmp, "simulate", "--kind", "plane", "--points", "1000", "--seed", "17",
            "--out", "net1k.yaml");
        Assert.True(sim.Code == ExitCodes.Success, sim.Err);

        var actual = new List<string>();
        foreach (var (variant, extra, outputs) in Runs)
        {
            string dir = Path.Combine(_tmp, variant);
            Directory.CreateDirectory(dir);
            // Relative input path from the project's folder: the outputs name the input as given.
            var args = new List<string> { "adjust", "net1k.yaml", "--date", RunDate, "--quiet" };
            args.AddRange(extra);
            foreach (var (option, file) in outputs) { args.Add(option); args.Add(Path.Combine(dir, file)); }
            var run = CliHarness.RunProcess(_tmp, [.. args]);
            Assert.True(run.Code == ExitCodes.Success, run.Err);
            Assert.Equal("", run.Out);
            foreach (var (_, file) in outputs)
                actual.Add($"{variant} {Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(
                    Path.Combine(dir, file))))}  {file}");
        }

        if (Environment.GetEnvironmentVariable("NETADJUST_UPDATE_GOLDEN") == "1")
        {
            File.WriteAllText(HashFile, string.Join("\n", actual) + "\n", new UTF8Encoding(false));
            return;
        }
        var expected = File.ReadAllText(HashFile).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(expected, actual);
    }

    [Fact]
    public void TheReportOnStandardOutputIsTheReportFile()
    {
        var sim = CliHarness.RunProcess(_tmp, "simulate", "--kind", "plane", "--points", "1000", "--seed", "17",
            "--out", "net1k.yaml");
        Assert.True(sim.Code == ExitCodes.Success, sim.Err);
        var toFile = CliHarness.RunProcess(_tmp, "adjust", "net1k.yaml", "--date", RunDate, "--quiet", "--report",
            "report.txt");
        Assert.True(toFile.Code == ExitCodes.Success, toFile.Err);
        var toOut = CliHarness.RunProcess(_tmp, "adjust", "net1k.yaml", "--date", RunDate, "--quiet");
        Assert.True(toOut.Code == ExitCodes.Success, toOut.Err);
        Assert.Equal(File.ReadAllText(Path.Combine(_tmp, "report.txt")), toOut.Out);
    }
}
