using NetAdjust.IO.Project;
using NetAdjust.Network;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The <c>gnss</c> section and CSV baseline rows (docs/input-format.md, "GNSS baselines").</summary>
public class GnssInputTests
{
    private const string Head = "project: t\ncrs: EPSG:25833\ngrid: {distances: grid, geoid_separation: 45.2}\n" +
        "points:\n  - {id: GA1, e: 512300, n: 5262100, h: 412.3, fix: enh}\n" +
        "  - {id: GA2, e: 516850, n: 5263402, h: 455.8}\n  - {id: GA3, e: 515204, n: 5258311, h: 390.1}\n";

    private const string Baseline =
        "    - {from: GA1, to: GA2, dx: 1234.5678, dy: -345.6789, dz: 987.6543, sd: [0.0021, 0.0018, 0.0035], " +
        "corr: [0.31, -0.42, -0.18]}\n";

    private static SurveyProject Parse(string gnss, string? csv = null, string head = Head) =>
        ProjectReader.Parse(head + gnss + (csv is null ? "" : "files: [b.csv]\n"), "t.yaml", "/nonexistent",
            f => f.EndsWith("b.csv", StringComparison.Ordinal) && csv is not null ? csv
                : throw new FileNotFoundException());

    private static ProjectFileException Refused(string gnss, string? csv = null, string head = Head) =>
        Assert.Throws<ProjectFileException>(() => Parse(gnss, csv, head));

    [Fact]
    public void ABaselineWithSdAndCorrelationsGivesThreeComponentsSharingItsCovariance()
    {
        var p = Parse("gnss:\n  frame: \"ITRF2014 @ 2026.9\"\n  baselines:\n" + Baseline);
        var b = p.Network.Observations.OfType<BaselineObservation>().ToList();
        Assert.Equal(3, b.Count);
        Assert.Equal([BaselineComponent.X, BaselineComponent.Y, BaselineComponent.Z], b.Select(o => o.Component));
        Assert.Equal([1234.5678, -345.6789, 987.6543], b.Select(o => o.Value));
        Assert.Single(b.Select(o => o.BaselineId).Distinct());
        // Σ = D R D (common practice): σx σy r_xy = 0.0021 · 0.0018 · 0.31
        var cov = b[0].Covariance!;
        Assert.Equal(0.0021 * 0.0021, cov[0], 15);
        Assert.Equal(0.0021 * 0.0018 * 0.31, cov[1], 15);
        Assert.Equal(0.0021 * 0.0035 * -0.42, cov[2], 15);
        Assert.Equal(0.0018 * 0.0035 * -0.18, cov[5], 15);
        Assert.Equal(0.0035, b[2].StandardDeviation, 15);
        Assert.NotNull(b[0].Grid?.Projection);
        Assert.Equal("ITRF2014 @ 2026.9", p.GnssFrame);
        Assert.Equal("t.yaml:11", b[0].Source);
    }

    [Fact]
    public void TheLowerTriangleAndAGroupScaleAreTaken()
    {
        var p = Parse("gnss:\n  groups:\n    - {id: S1, scale: 1.5}\n  baselines:\n" +
            "    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, cov: [4e-6, 1e-6, 9e-6, -2e-6, 0.5e-6, 16e-6], " +
            "group: S1}\n");
        var b = p.Network.Observations.OfType<BaselineObservation>().ToList();
        // lower triangle row by row: qxx, qyx, qyy, qzx, qzy, qzz; the group's variance factor scales all of it
        double[] expected = [4e-6, 1e-6, -2e-6, 1e-6, 9e-6, 0.5e-6, -2e-6, 0.5e-6, 16e-6];
        Assert.Equal(expected.Select(v => v * 1.5), b[0].Covariance!, (x, y) => Math.Abs(x - y) < 1e-18);
        Assert.Equal(Math.Sqrt(9e-6 * 1.5), b[1].StandardDeviation, 15);
        Assert.All(b, o => Assert.Equal("S1", o.Group));
        Assert.All(b, o => Assert.Equal(1.5, o.GroupScale));
    }

    [Fact]
    public void CsvBaselineRowsAreRead()
    {
        var p = Parse("gnss:\n  groups: [{id: S2, scale: 2}]\n",
            "kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,r_xy,r_xz,r_yz,group\n" +
            "baseline,GA2,GA3,-1645.1,-1240.2,-3890.3,0.002,0.002,0.004,0.1,,-0.2,S2\n");
        var b = p.Network.Observations.OfType<BaselineObservation>().ToList();
        Assert.Equal(3, b.Count);
        Assert.Equal(-3890.3, b[2].Value);
        Assert.Equal(0.002 * 0.004 * 0.0 * 2, b[0].Covariance![2]); // an empty correlation is 0
        Assert.Equal(0.002 * 0.002 * 0.1 * 2, b[0].Covariance![1], 15);
        Assert.Equal("b.csv:2", b[0].Source);
        Assert.Equal(2, b[0].GroupScale);
    }

    [Fact]
    public void FrameParametersAreReadWithTheirStandardDeviations()
    {
        var p = Parse("gnss:\n  frame_parameters: rotations_and_scale\n  frame_rotation_sd: 0.5\n" +
            "  frame_scale_sd: 2\n  baselines:\n" + Baseline);
        var f = p.Network.Observations.OfType<BaselineObservation>().First().Frame!;
        Assert.Equal(FrameParameterSet.RotationsAndScale, f.Parameters);
        Assert.Equal(0.5, f.RotationSd!.Value.Arcseconds, 12);
        Assert.Equal(2, f.ScalePpmSd);
    }

    [Fact]
    public void BaselinesOfEveryInputShareTheProjectsGridAndFrame()
    {
        // the gnss section's frame parameters and the grid section apply to the baselines of the project file and
        // of its CSV files alike, whichever comes first in the file
        var p = Parse("gnss:\n  frame_parameters: rotations\n  groups: [{id: S2, scale: 2}, {id: S1}]\n" +
            "  baselines:\n" + Baseline, "kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,group,sd_factor\n" +
            "baseline,GA2,GA3,-1645.1,-1240.2,-3890.3,0.002,0.002,0.004,S2,\n" +
            "baseline,GA3,GA1,3100.2,2700.9,4001.5,0.002,0.002,0.004,S1,3\n");
        var b = p.Network.Observations.OfType<BaselineObservation>().ToList();
        Assert.Equal(9, b.Count);
        var frame = b[0].Frame;
        Assert.Equal(FrameParameterSet.Rotations, frame!.Parameters);
        Assert.All(b, o => Assert.Same(frame, o.Frame));
        Assert.All(b, o => Assert.Same(p.Grid, o.Grid));
        Assert.Equal([1, 1, 1, 2, 2, 2, 1, 1, 1], b.Select(o => o.GroupScale));
        // a group's variance factor multiplies the covariance; sd_factor multiplies σ (common practice)
        Assert.Equal(0.004 * 0.004 * 2, b[5].Covariance![8], 1e-20);
        Assert.Equal(0.004 * 3, b[8].StandardDeviation, 15);
    }

    [Theory]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dz: 3, sd: [0.002, 0.002, 0.004]}\n", 10, "'dy' is missing")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, sd: [0.002, 0.002, 0.004], corr: [0.3, 1.2, 0]}\n",
        10, "between −1 and 1")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, sd: [0.002, 0.002, 0.004], corr: [0.9, 0.9, -0.9]}\n",
        10, "not positive definite")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, cov: [4e-6, 1e-5, 9e-6, 0, 0, 16e-6]}\n", 10,
        "not positive definite")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, sd: [0.002, 0.002, 0.004], group: S9}\n", 10,
        "group 'S9' is not defined")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3, sd: [0.002, 0.002]}\n", 10, "3 numbers")]
    [InlineData("    - {from: GA1, to: GA2, dx: 1, dy: 2, dz: 3}\n", 10, "'sd' is missing")]
    public void BadBaselinesAreRefusedWithFileLineAndItem(string baseline, int line, string problem)
    {
        var e = Refused("gnss:\n  baselines:\n" + baseline);
        Assert.Equal("t.yaml", e.File);
        Assert.Equal(line, e.Line);
        Assert.Contains("GA1→GA2", e.Message);
        Assert.Contains(problem, e.Message);
    }

    [Fact]
    public void BaselinesWithoutAProjectionAreRefused()
    {
        string head = "project: t\npoints:\n  - {id: GA1, e: 0, n: 0, h: 0, fix: enh}\n" +
            "  - {id: GA2, e: 1, n: 1, h: 0}\n";
        var e = Refused("gnss:\n  baselines:\n" + Baseline, head: head);
        Assert.Equal(7, e.Line);
        Assert.Contains("map projection", e.Message);
    }

    [Fact]
    public void BadCsvBaselineRowsNameTheirLine()
    {
        var e = Refused("gnss:\n  groups: [{id: S2}]\n",
            "kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,group\n# c\nbaseline,GA2,GA3,1,2,3,0.002,0,0.004,S2\n");
        Assert.Equal(("b.csv", 3), (e.File, e.Line));
        Assert.Contains("sd_y", e.Message);
        e = Refused("", "kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,group\nbaseline,GA2,GA3,1,2,3,0.002,0.001,0.004,S7\n");
        Assert.Equal(("b.csv", 2), (e.File, e.Line));
        Assert.Contains("group 'S7'", e.Message);
    }
}
