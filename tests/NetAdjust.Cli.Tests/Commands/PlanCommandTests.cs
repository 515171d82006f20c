using System.Text.Json;

namespace NetAdjust.Cli.Tests.Commands;

public class PlanCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("netadjust-plan-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    // An invented plan: two held points, three new ones, directions and distances planned without values.
    private const string Plan = """
        project: Planned control (invented)
        units: {length: m, angle: dms, angle_sd: arcsec}
        instruments:
          - {id: TS5, direction_sd: 5, zenith_sd: 5, edm: 3 mm + 2 ppm, centering: 1.0 mm, height: 1 mm}
          - {id: TS1, direction_sd: 1, zenith_sd: 1, edm: 1 mm + 1 ppm, centering: 1.0 mm, height: 1 mm}
        targets:
          - {id: PR, centering: 1.0 mm, height: 1 mm}
        points:
          - {id: D1, e: 5000, n: 5000, fix: en}
          - {id: D2, e: 5400, n: 5050, fix: en}
          - {id: Q1, e: 5120, n: 5330}
          - {id: Q2, e: 5380, n: 5390}
          - {id: Q3, e: 5250, n: 5600}
        setups:
          - at: Q1
            instrument: TS5
            target: PR
            directions: [{to: D1}, {to: D2}, {to: Q2}, {to: Q3}]
            distances: [{to: D1}, {to: Q2}, {to: Q3}]
          - at: Q2
            instrument: TS5
            target: PR
            directions: [{to: D2}, {to: Q1}, {to: Q3}]
            distances: [{to: D2}, {to: Q3}]
          - at: D1
            instrument: TS5
            target: PR
            directions: [{to: D2}, {to: Q1}, {to: Q3}]
            distances: [{to: Q3}]
        standards:
          - {name: site, kind: relative_precision, constant_mm: 8, ppm: 10}
          - fgdc-1998
        """;

    private string Write(string name, string text)
    {
        string path = Path.Combine(_dir, name);
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void PlanReportsExpectedPrecisionAndTheStandards()
    {
        string plan = Write("plan.yaml", Plan);
        string json = Path.Combine(_dir, "plan.json");
        var run = CliHarness.Run("plan", plan, "--date", "2026-12-01", "--json", json);
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("this is a plan", run.Out);
        Assert.Contains("ACCURACY STANDARDS", run.Out);
        Assert.Contains("not a certification", run.Out);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var points = doc.RootElement.GetProperty("points");
        Assert.True(points.GetArrayLength() == 5);
        var items = doc.RootElement.GetProperty("standards").GetProperty("items");
        Assert.True(items.GetArrayLength() > 0);
        // worst first within the standard: the ratios of "site" do not increase
        var ratios = items.EnumerateArray().Where(i => i.GetProperty("standard").GetString() == "site")
            .Select(i => i.GetProperty("ratio").GetDouble()).ToList();
        Assert.Equal(ratios.OrderByDescending(r => r), ratios);
        // no residuals in a plan
        foreach (var o in doc.RootElement.GetProperty("observations").EnumerateArray())
            Assert.True(Math.Abs(o.GetProperty("residual").GetDouble()) < 1e-6);
    }

    [Fact]
    public void SetsUpToPrintsTheTableAndTheRecommendation()
    {
        string plan = Write("plan.yaml", Plan);
        var run = CliHarness.Run("plan", plan, "--date", "2026-12-01", "--sets-up-to", "4");
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("PROCEDURE RECOMMENDATION (standard site", run.Out);
        Assert.Contains("TS5", run.Out);
        Assert.Contains("TS1", run.Out);
        Assert.Contains("Recommended:", run.Out);
    }

    [Fact]
    public void SimulatedProjectAdjustsAndIsTheSameForTheSameSeed()
    {
        string plan = Write("plan.yaml", Plan);
        string a = Path.Combine(_dir, "drawn-a.yaml"), b = Path.Combine(_dir, "drawn-b.yaml");
        Assert.Equal(0, CliHarness.Run("plan", plan, "--date", "2026-12-01", "--simulate", a, "--seed", "5").Code);
        Assert.Equal(0, CliHarness.Run("plan", plan, "--date", "2026-12-01", "--simulate", b, "--seed", "5").Code);
        Assert.Equal(File.ReadAllText(Path.Combine(_dir, "drawn-a-observations.csv")),
            File.ReadAllText(Path.Combine(_dir, "drawn-b-observations.csv")));
        var adjusted = CliHarness.Run("adjust", a, "--date", "2026-12-01", "--quiet");
        Assert.True(adjusted.Code == 0, adjusted.Err);
    }

    [Fact]
    public void PlannedPointWithoutCoordinatesNamesItsLine()
    {
        string plan = Write("plan.yaml", Plan.Replace("{id: Q3, e: 5250, n: 5600}", "{id: Q3}"));
        var run = CliHarness.Run("plan", plan);
        Assert.Equal(2, run.Code);
        Assert.Contains("plan.yaml:", run.Err);
        Assert.Contains("Q3", run.Err);
    }

    [Fact]
    public void AdjustWithoutValuesIsStillRefused()
    {
        // a plan is read only by 'plan': 'adjust' requires measured values
        string plan = Write("plan.yaml", Plan);
        var run = CliHarness.Run("adjust", plan, "--quiet");
        Assert.Equal(2, run.Code);
        Assert.Contains("'value' is missing", run.Err);
    }

    [Fact]
    public void SetsUpToWithoutAStandardIsInvalidInput()
    {
        string plan = Write("plan.yaml", Plan[..Plan.IndexOf("standards:", StringComparison.Ordinal)]);
        var run = CliHarness.Run("plan", plan, "--sets-up-to", "3");
        Assert.Equal(2, run.Code);
        Assert.Contains("--sets-up-to needs a standard", run.Err);
    }
}
