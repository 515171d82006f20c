using System.Globalization;
using NetAdjust.Geodesy;
using NetAdjust.IO.Project;
using NetAdjust.Units;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// A combined project of GNSS baselines, a levelled height difference and a grid distance (invented, simulated from
/// a chosen truth with small invented errors) through <c>check</c> and <c>adjust</c> end to end (docs/input-format.md,
/// "GNSS baselines"; docs/output-format.md).
/// </summary>
public sealed class GnssCliTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-gnss-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private const string Head = """
        project: Harrowdene combined control (invented)
        crs: EPSG:25833
        grid: {distances: grid, geoid_separation: 45.2}
        points:
          - {id: GA1, e: 512300.000, n: 5262100.000, h: 412.300, fix: enh}
          - {id: GA2}
          - {id: GA3}
          - {id: GA4}

        """;

    private static readonly (string Id, double E, double N, double H)[] Truth =
    [
        ("GA1", 512_300.000, 5_262_100.000, 412.300), ("GA2", 516_850.412, 5_263_402.187, 455.812),
        ("GA3", 515_204.733, 5_258_311.504, 390.127), ("GA4", 511_093.250, 5_257_618.926, 501.744),
    ];

    private static string Project()
    {
        var projection = ProjectReader.Parse(Head, "g.yaml", "/x", _ => "").Grid!.Projection!;
        GeocentricPosition Xyz(int i)
        {
            var (lat, lon) = projection.Inverse(Truth[i].E, Truth[i].N);
            return Geocentric.ToGeocentric(projection.Ellipsoid, new GeodeticPosition(Angle.FromRadians(lat),
                Angle.FromRadians(lon), Length.FromMetres(Truth[i].H + 45.2)));
        }
        (int A, int B)[] pairs = [(0, 1), (0, 2), (0, 3), (1, 2), (1, 3), (2, 3)];
        double[][] errors = [[1.2, -0.8, 2.1], [-1.9, 0.4, -1.1], [0.7, 1.5, -2.6], [-0.3, -1.2, 1.8],
            [1.1, 0.9, 0.5], [-0.6, -0.2, -1.4]];
        string F(double v) => v.ToString("F4", CultureInfo.InvariantCulture);
        var sb = new System.Text.StringBuilder(Head);
        sb.Append("gnss:\n  groups:\n    - {id: S1}\n    - {id: S2, scale: 1.5}\n  baselines:\n");
        for (int k = 0; k < pairs.Length; k++)
        {
            var (a, b) = (Xyz(pairs[k].A), Xyz(pairs[k].B));
            sb.Append($"    - {{from: {Truth[pairs[k].A].Id}, to: {Truth[pairs[k].B].Id}, ")
              .Append($"dx: {F(b.X.Metres - a.X.Metres + (errors[k][0] / 1000))}, ")
              .Append($"dy: {F(b.Y.Metres - a.Y.Metres + (errors[k][1] / 1000))}, ")
              .Append($"dz: {F(b.Z.Metres - a.Z.Metres + (errors[k][2] / 1000))}, ")
              .Append($"sd: [0.002, 0.0018, 0.0035], corr: [0.3, -0.4, -0.2], group: S{1 + (k % 2)}}}\n");
        }
        double dh = Truth[1].H - Truth[0].H + 0.0008;
        double d = Math.Sqrt(Math.Pow(Truth[3].E - Truth[0].E, 2) + Math.Pow(Truth[3].N - Truth[0].N, 2)) - 0.0011;
        sb.Append($"levelling:\n  - {{from: GA1, to: GA2, dh: {F(dh)}, sd: 0.003}}\n")
          .Append($"setups:\n  - at: GA1\n    distances:\n      - {{to: GA4, value: {F(d)}, sd: 0.004}}\n");
        return sb.ToString();
    }

    [Fact]
    public void ACombinedProjectIsCheckedAndAdjustedWithTheBaselineSections()
    {
        string path = Path.Combine(_tmp, "harrowdene.yaml");
        File.WriteAllText(path, Project());
        Assert.Equal(ExitCodes.Success, CliHarness.Run("check", path).Code);
        string report = Path.Combine(_tmp, "out.txt"), json = Path.Combine(_tmp, "out.json");
        var run = CliHarness.Run("adjust", path, "--report", report, "--json", json, "--components",
            "--date", "2026-12-01");
        Assert.True(run.Code == ExitCodes.Success, run.Out + run.Err);
        string text = File.ReadAllText(report);
        Assert.Contains("GNSS BASELINES", text);
        Assert.Contains("GNSS BASELINE COMPONENTS", text);
        Assert.Contains("baseline S2", text); // the variance components by group of baselines
        Assert.Contains("\"gnss\":", File.ReadAllText(json));
        // 18 baseline components, 1 height difference, 1 distance; 9 unknowns (GA2..GA4 placed by the baselines)
        Assert.Contains("\"unknowns\": 9", File.ReadAllText(json));
    }
}
