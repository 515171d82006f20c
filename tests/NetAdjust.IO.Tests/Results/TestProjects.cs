using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// Projects for the writer tests: the demo (data/brackenmoor.yaml, invented site) and a small invented
/// trilateration-and-directions network in feet and gons with a declared CRS, weighted control and a point id
/// that holds a comma (to exercise CSV quoting). Values simulated from a chosen truth with a few mm of noise.
/// </summary>
internal static class TestProjects
{
    public static readonly DateOnly RunDate = new(2026, 12, 1);

    public const string Ashgrove = """
        project: Ashgrove yard check (invented)
        crs: EPSG:27700
        units: {length: ft, angle: gon, angle_sd: mgon}
        default_sd: {direction: 1.0, distance: 0.01 ft}
        points:
          - {id: "A,1", e: 1000, n: 1000, fix: en}
          - {id: B, e: 1500.0, n: 1000.0, sd_e: 0.02, sd_n: 0.02}
          - {id: C, e: 1250.0, n: 1400.0}
        setups:
          - at: "A,1"
            directions:
              - {to: B, value: 80.90272}
              - {to: C, value: 16.46305}
            distances:
              - {to: B, value: 500.0130}
              - {to: C, value: 471.7311}
          - at: C
            directions:
              - {to: "A,1", value: 165.53347}
              - {to: B, value: 94.41433}
            distances:
              - {to: B, value: 471.7297}
          - at: B
            directions:
              - {to: "A,1", value: 172.67730}
              - {to: C, value: 237.11855}
        """;

    /// <summary>The repository root (the folder holding NetAdjust.sln).</summary>
    public static string RepoRoot
    {
        get
        {
            var d = new DirectoryInfo(AppContext.BaseDirectory);
            while (d is not null && !File.Exists(Path.Combine(d.FullName, "NetAdjust.sln"))) d = d.Parent;
            return d?.FullName ?? throw new InvalidOperationException("NetAdjust.sln not found above the test folder");
        }
    }

    public static (AdjustmentResult Result, ReportContext Context) Demo()
    {
        var project = ProjectReader.Read(Path.Combine(RepoRoot, "data", "brackenmoor.yaml"));
        return (Adjuster.Adjust(project.Network, project.Options),
            new ReportContext("data/brackenmoor.yaml", RunDate, project.Units) { Crs = project.Crs });
    }

    public static (AdjustmentResult Result, ReportContext Context) AshgroveFeet()
    {
        var project = ProjectReader.Parse(Ashgrove, "ashgrove.yaml", "/nonexistent", _ =>
            throw new IOException("no files"));
        return (Adjuster.Adjust(project.Network, project.Options),
            new ReportContext("ashgrove.yaml", RunDate, project.Units) { Crs = project.Crs });
    }
}
