using System.Text;

namespace NetAdjust.Cli.Tests;

/// <summary>
/// Deterministic output, checked across processes: the built command, run in a child process on each demo project of
/// data/ with a fixed --date, writes every output byte for byte as the committed golden files in
/// Golden/&lt;demo&gt;/&lt;variant&gt;/.
/// A change of output on purpose is recorded by running these tests with NETADJUST_UPDATE_GOLDEN=1, which rewrites the
/// golden files instead of comparing; the diff is then reviewed and committed (DEVELOPERS.md).
/// </summary>
public sealed class GoldenOutputTests : IDisposable
{
    private const string RunDate = "2026-12-01";

    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-golden-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    // Output option → golden file name.
    private static readonly (string Option, string File)[] Outputs =
    [
        ("--json", "result.json"), ("--report", "report.txt"), ("--html", "report.html"), ("--csv", "points.csv"),
        ("--landxml", "points.landxml"), ("--geojson", "network.geojson"), ("--svg", "plot.svg"),
    ];

    // Golden folder name → the extra options of the run.
    private static readonly Dictionary<string, string[]> Variants = new(StringComparer.Ordinal)
    {
        ["plain"] = [],
        ["snoop"] = ["--snoop"],
        ["sequence"] = ["--sequence"],
        ["components"] = ["--components"],
        ["robust-huber"] = ["--robust", "huber"],
    };

    // Golden folder name → the extra options of the runs made only on the demos with a planted blunder.
    private static readonly Dictionary<string, string[]> BlunderVariants = new(StringComparer.Ordinal)
    {
        ["diagnose"] = ["--diagnose"],
        ["snoop-diagnose"] = ["--snoop", "--diagnose"],
    };

    public static TheoryData<string, string> Cases()
    {
        var data = new TheoryData<string, string>();
        foreach (var demo in new[]
                 {
                     "brackenmoor", "brackenmoor-auto", "harrowfield-blunder", "harrowgate-control", "corvan-fell-3d",
                     "tarnholm-grid", "skelmoor-gnss",
                 })
            foreach (var variant in Variants.Keys)
                data.Add(demo, variant);
        foreach (var demo in new[] { "harrowfield-blunder", "corvan-fell-target-height" })
            foreach (var variant in BlunderVariants.Keys)
                data.Add(demo, variant);
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void EveryOutputOfADemoRunIsByteIdenticalToItsGoldenFile(string demo, string variant)
    {
        // Run from the repository root with a relative input path, as the outputs name the input as given.
        var args = new List<string> { "adjust", $"data/{demo}.yaml", "--date", RunDate, "--quiet" };
        args.AddRange(Variants.TryGetValue(variant, out var extra) ? extra : BlunderVariants[variant]);
        foreach (var (option, file) in Outputs) { args.Add(option); args.Add(Path.Combine(_tmp, file)); }
        var run = CliHarness.RunProcess(CliHarness.RepoRoot, [.. args]);
        Assert.True(run.Code == ExitCodes.Success, run.Err);
        Assert.Equal("", run.Err);
        Assert.Equal("", run.Out);

        string golden = Path.Combine(CliHarness.RepoRoot, "tests", "NetAdjust.Cli.Tests", "Golden", demo, variant);
        bool update = Environment.GetEnvironmentVariable("NETADJUST_UPDATE_GOLDEN") == "1";
        if (update) Directory.CreateDirectory(golden);
        var differing = new List<string>();
        foreach (var (_, file) in Outputs)
        {
            byte[] actual = File.ReadAllBytes(Path.Combine(_tmp, file));
            string path = Path.Combine(golden, file);
            if (update) { File.WriteAllBytes(path, actual); continue; }
            Assert.True(File.Exists(path), $"no golden file {path}; run with NETADJUST_UPDATE_GOLDEN=1 to write it");
            byte[] expected = File.ReadAllBytes(path);
            if (!expected.AsSpan().SequenceEqual(actual)) differing.Add($"{file}: {FirstDifference(expected, actual)}");
        }
        Assert.True(differing.Count == 0,
            $"{demo} {variant} differs from Golden/{demo}/{variant}:\n" + string.Join("\n", differing));
    }

    private static string FirstDifference(byte[] expected, byte[] actual)
    {
        int i = 0;
        while (i < expected.Length && i < actual.Length && expected[i] == actual[i]) i++;
        int line = 1 + expected.AsSpan(0, i).Count((byte)'\n');
        int from = Math.Max(0, i - 40);
        string Around(byte[] b) => Encoding.UTF8.GetString(b, from, Math.Min(b.Length, i + 40) - from); // from ≤ i
        return $"first difference at byte {i} (line {line}); golden …{Around(expected)}… now …{Around(actual)}…";
    }
}
