using System.Text.Json;
using NetAdjust.Cli;
using NetAdjust.Procedures;

namespace NetAdjust.Cli.Tests;

/// <summary>Datum defects end with exit code 3 and their own message; the sequence option writes both solutions.</summary>
public sealed class DatumCliTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-datum-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    // A triangle A, B, C (invented), directions at each corner; distances optional; control and extras per case.
    private static string Triangle(string fixA, string fixB, bool distances, string extraPoints = "", string extraSetups = "") => $"""
        default_sd: {"{"}direction: 2, distance: 0.003, azimuth: 3{"}"}
        units: {"{"}angle: deg{"}"}
        points:
          - {"{"}id: A, e: 1000, n: 1000{fixA}{"}"}
          - {"{"}id: B, e: 1100, n: 1000{fixB}{"}"}
          - {"{"}id: C, e: 1050, n: 1080{"}"}
        {extraPoints}
        setups:
          - at: A
            directions: [{"{"}to: B, value: 90{"}"}, {"{"}to: C, value: 32.0054{"}"}]
        {(distances ? "    distances: [{to: B, value: 100.0}, {to: C, value: 94.3398}]" : "    azimuths: [{to: B, value: 90}]")}
          - at: B
            directions: [{"{"}to: A, value: 270{"}"}, {"{"}to: C, value: 327.9946{"}"}]
          - at: C
            directions: [{"{"}to: A, value: 212.0054{"}"}, {"{"}to: B, value: 147.9946{"}"}]
        {(distances ? "    distances: [{to: B, value: 94.3398}]" : "")}
        {extraSetups}
        """;

    private (int Code, string Err) Adjust(string yaml)
    {
        string f = Path.Combine(_tmp, "t.yaml");
        File.WriteAllText(f, yaml);
        var (code, _, err) = CliHarness.Run("adjust", f, "--date", "2026-12-01");
        return (code, err);
    }

    [Fact]
    public void EachDatumDefectHasItsOwnMessageAndExitCode3()
    {
        var cases = new (string Yaml, string Expected)[]
        {
            (Triangle("", "", true), "The datum is not defined: no fixed point."),
            (Triangle(", fix: en", "", true), "The datum is not defined: no orientation."),
            (Triangle(", fix: en", "", false), "The datum is not defined: no distance."),
            (Triangle(", fix: en", ", fix: en", true, "  - {id: X, e: 2000, n: 2000}\n  - {id: Y, e: 2100, n: 2000}",
                "  - at: X\n    distances: [{to: Y, value: 100.0}]"), "The datum is not defined: the plane network falls apart into 2 parts"),
        };
        var seen = new HashSet<string>();
        foreach (var (yaml, expected) in cases)
        {
            var (code, err) = Adjust(yaml);
            Assert.Equal(ExitCodes.AdjustmentFailed, code);
            Assert.StartsWith("error: adjustment failed: " + expected, err);
            Assert.DoesNotContain("singular", err, StringComparison.OrdinalIgnoreCase);
            Assert.True(seen.Add(expected));
        }
    }

    [Fact]
    public void AFreeNetworkFromTheProjectFileAdjusts()
    {
        string f = Path.Combine(_tmp, "free.yaml");
        File.WriteAllText(f, Triangle("", "", true) + "\ndatum: {mode: free}\n");
        var (code, stdout, stderr) = CliHarness.Run("adjust", f, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("Datum     : free network, inner constraints over all points", stdout);
    }

    [Fact]
    public void SequenceWritesBothSolutionsAndTheConstraintTest()
    {
        string demo = CliHarness.DataFile("brackenmoor.yaml");
        string json = Path.Combine(_tmp, "seq.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", demo, "--sequence", "--json", json, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains("TEST OF THE ADDED CONSTRAINTS", stdout);
        Assert.Contains("CONTROL DISCREPANCIES", stdout);
        Assert.Contains("COORDINATE SHIFTS", stdout);
        Assert.Contains("STEP 2: CONSTRAINED SOLUTION", stdout);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var root = doc.RootElement;
        Assert.Equal("netadjust-sequence/1", root.GetProperty("format").GetString());
        var sols = root.GetProperty("solutions").EnumerateArray().ToList();
        Assert.Equal(2, sols.Count);
        Assert.All(sols, s => Assert.Equal("netadjust-result/1", s.GetProperty("format").GetString()));
        Assert.StartsWith("minimal constraints", sols[0].GetProperty("datum").GetString());
        Assert.StartsWith("control points", sols[1].GetProperty("datum").GetString());
        var test = root.GetProperty("constraint_test");
        // The demo's control (BK01 held, BK02 its reference object) is exactly minimal: nothing to test.
        Assert.Equal(0, test.GetProperty("added_constraints").GetInt32());
        Assert.Equal(JsonValueKind.Null, test.GetProperty("passed").ValueKind);
    }

    [Fact]
    public void TheControlCheckDemoFlagsTheDisturbedMark()
    {
        // data/harrowgate-control.yaml: HV03 was moved 5 cm in the simulation (data/tools/simulate_control_check.py).
        string json = Path.Combine(_tmp, "hv.json");
        var (code, stdout, stderr) = CliHarness.Run("adjust", CliHarness.DataFile("harrowgate-control.yaml"),
            "--sequence", "--json", json, "--date", "2026-12-01");
        Assert.True(code == ExitCodes.Success, stderr);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var root = doc.RootElement;
        Assert.False(root.GetProperty("constraint_test").GetProperty("passed").GetBoolean());
        Assert.True(root.GetProperty("solutions")[0].GetProperty("statistics").GetProperty("global_test").GetProperty("passed").GetBoolean());
        var worst = root.GetProperty("control_discrepancies").EnumerateArray().OrderByDescending(d => d.GetProperty("max_abs_w").GetDouble()).First();
        Assert.Equal("HV03", worst.GetProperty("id").GetString());
        Assert.StartsWith("  HV03 ", stdout.Split('\n').Single(l => l.EndsWith("<- largest", StringComparison.Ordinal)));
    }

    [Fact]
    public void TheDemoWithoutApproximateCoordinatesAdjusts()
    {
        // Equality with the given approximations is tested in NetAdjust.IO.Tests (same stochastic model).
        var (code, report, err) = CliHarness.Run("adjust", CliHarness.DataFile("brackenmoor-auto.yaml"), "--date", "2026-12-01");
        Assert.True(code == 0, err);
        Assert.Contains("Global test", report);
    }
}
