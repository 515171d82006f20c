using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// CSV rows of GNSS baselines (docs/input-format.md, "GNSS baselines"): a row gives the three components that the
/// public <see cref="BaselineObservation.Components"/> makes of the same vector and covariance, whatever the order of
/// the columns and the form of the covariance; a bad row is refused with its file, line and item.
/// </summary>
public class CsvBaselineRowTests
{
    private const string Head = "project: t\ncrs: EPSG:25833\ngrid: {distances: grid, geoid_separation: 45.2}\n" +
        "points:\n  - {id: GA1, e: 512300, n: 5262100, h: 412.3, fix: enh}\n" +
        "  - {id: GA2, e: 516850, n: 5263402, h: 455.8}\n  - {id: GA3, e: 515204, n: 5258311, h: 390.1}\n" +
        "gnss:\n  groups: [{id: S2, scale: 2}]\nfiles: [b.csv]\n";

    private static SurveyProject Parse(string csv) =>
        ProjectReader.Parse(Head, "t.yaml", "/nonexistent",
            f => f.EndsWith("b.csv", StringComparison.Ordinal) ? csv : throw new FileNotFoundException());

    private static string R(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>One baseline as written in a row: its points, vector (m), σ (m), correlations, the covariance form,
    /// group and marks.</summary>
    public sealed record Written(string From, string To, double[] Vector, double[] Sd, double[] Rho, bool ByQ,
        string? Group, string Exclude, string SdFactor);

    private static readonly string[] AllColumns = ["kind", "from", "to", "dx", "dy", "dz", "sd_x", "sd_y", "sd_z",
        "r_xy", "r_xz", "r_yz", "q_xx", "q_yx", "q_yy", "q_zx", "q_zy", "q_zz", "group", "exclude", "sd_factor",
        "value", "sd"];

    private static Dictionary<string, string> Fields(Written w)
    {
        var f = new Dictionary<string, string>
        {
            ["kind"] = "baseline", ["from"] = w.From, ["to"] = w.To,
            ["dx"] = R(w.Vector[0]), ["dy"] = R(w.Vector[1]), ["dz"] = R(w.Vector[2]),
            ["group"] = w.Group ?? "", ["exclude"] = w.Exclude, ["sd_factor"] = w.SdFactor,
        };
        var cov = Covariance(w);
        if (w.ByQ)
            foreach (var (name, k) in new[] { ("q_xx", 0), ("q_yx", 3), ("q_yy", 4), ("q_zx", 6), ("q_zy", 7),
                         ("q_zz", 8) })
                f[name] = R(cov[k]);
        else
        {
            (f["sd_x"], f["sd_y"], f["sd_z"]) = (R(w.Sd[0]), R(w.Sd[1]), R(w.Sd[2]));
            (f["r_xy"], f["r_xz"], f["r_yz"]) = (R(w.Rho[0]), R(w.Rho[1]), w.Rho[2] == 0 ? "" : R(w.Rho[2]));
        }
        return f;
    }

    /// <summary>Σ = D R D from the σ and correlations, by the library's public function.</summary>
    private static double[] Covariance(Written w) =>
        BaselineObservation.CovarianceOf((Length.FromMetres(w.Sd[0]), Length.FromMetres(w.Sd[1]),
            Length.FromMetres(w.Sd[2])), w.Rho[0], w.Rho[1], w.Rho[2]);

    private static readonly Gen<Written> Baselines =
        from pair in Gen.Elements(("GA1", "GA2"), ("GA2", "GA3"), ("GA3", "GA1"))
        from vector in Gen.Choose(-90_000_000, 90_000_000).ArrayOf(3)
        from sd in Gen.Choose(5, 200).ArrayOf(3)
        from rho in Gen.Choose(-9, 9).ArrayOf(3) // ±0.45 at most: the correlations never contradict each other
        from byQ in Gen.Elements(false, true)
        from grouped in Gen.Elements(false, true)
        from marks in Gen.Elements(("", ""), ("yes", ""), ("", "2.5"), ("no", "1"))
        select new Written(pair.Item1, pair.Item2, [.. vector.Select(v => v / 1e4)], [.. sd.Select(s => s / 1e4)],
            [.. rho.Select(r => r / 20.0)], byQ, grouped ? "S2" : null, marks.Item1, marks.Item2);

    [Property(MaxTest = 300)]
    public Property ARowGivesTheComponentsOfThePublicModel() =>
        Prop.ForAll(Baselines.ArrayOf().Where(a => a.Length is > 0 and < 5).ToArbitrary(),
            Gen.Shuffle(AllColumns).ToArbitrary(), (rows, columns) =>
            {
                var text = string.Join("\n", [string.Join(",", columns),
                    .. rows.Select(w => { var f = Fields(w);
                        return string.Join(",", columns.Select(c => f.GetValueOrDefault(c, ""))); })]) + "\n";
                var project = Parse(text);
                var read = project.Network.Observations.OfType<BaselineObservation>().ToList();
                Assert.Equal(3 * rows.Length, read.Count);
                for (int i = 0; i < rows.Length; i++)
                {
                    var w = rows[i];
                    double scale = w.Group is null ? 1 : 2,
                        factor = w.SdFactor.Length > 0 ? double.Parse(w.SdFactor, CultureInfo.InvariantCulture) : 1;
                    string source = $"b.csv:{i + 2}";
                    var expected = BaselineObservation.Components(source, w.From, w.To,
                        (Length.FromMetres(w.Vector[0]), Length.FromMetres(w.Vector[1]),
                            Length.FromMetres(w.Vector[2])),
                        [.. Covariance(w).Select(c => c * scale)], project.Grid!);
                    for (int k = 0; k < 3; k++)
                    {
                        var (o, e) = (read[(3 * i) + k], expected[k]);
                        Assert.Equal((e.From, e.To, e.Component, e.Value), (o.From, o.To, o.Component, o.Value));
                        Assert.Equal((e.BaselineId, source, w.Group, scale, w.Exclude == "yes"),
                            (o.BaselineId, o.Source, o.Group, o.GroupScale, o.Excluded));
                        Assert.Equal(e.Covariance!, o.Covariance!, (a, b) => Math.Abs(a - b) <= 1e-15 * Math.Abs(b));
                        Assert.Equal(e.StandardDeviation * factor, o.StandardDeviation, 1e-15);
                        Assert.Same(project.Grid, o.Grid);
                    }
                }
            });

    private const string Header = "kind,from,to,dx,dy,dz,sd_x,sd_y,sd_z,r_xy,r_xz,r_yz,q_xx,q_yx,q_yy,q_zx,q_zy,q_zz," +
        "group,exclude,sd_factor,value,sd,at,length,set,instrument,level,setups";

    // the messages as the reader gives them (docs/input-format.md, "GNSS baselines"); columns after dz: sd_x, sd_y,
    // sd_z, r_xy, r_xz, r_yz, q_xx, q_yx, q_yy, q_zx, q_zy, q_zz, group, exclude, sd_factor, value, sd, at, length,
    // set, instrument, level, setups
    [Theory]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,,,5,,,,,,,", "the 'value' field is not used by a baseline")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,,,,,X,9,,,,", "the 'at' field is not used by a baseline")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,4", "the 'setups' field is not used by a baseline")]
    [InlineData("GA1,GA2,,2,3,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,", "the 'dx' field is empty")]
    [InlineData("GA1,GA2,1,2 q,3,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,",
        "dy: 'q' in '2 q' is not a length unit (use m, mm, cm, km, ft or usft)")]
    [InlineData("GA1,GA2,1,2,1e400,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,", "dz: '1e400' is not a length")]
    [InlineData("GA1,GA2,1,2,1e306km,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,",
        "dz: '1e306km' is too large to be a length")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,4e-6,,,,,,,,,,,,,,,,",
        "give either sd_x, sd_y, sd_z (with r_xy, r_xz, r_yz) or q_xx ... q_zz, not both")]
    [InlineData("GA1,GA2,1,2,3,,,,,,,,,,,,,,,,,,,,,,,",
        "no covariance: fill sd_x, sd_y, sd_z (and r_xy, r_xz, r_yz) or q_xx ... q_zz")]
    [InlineData("GA1,GA2,1,2,3,,,,,,,,1e-6,4e-6,0,0,9e-6,,,,,,,,,,,", "the 'q_xx' field is empty")]
    [InlineData("GA1,GA2,1,2,3,,,,,,,4e-6,abc,4e-6,0,0,9e-6,,,,,,,,,,,", "q_yx: 'abc' is not a number")]
    [InlineData("GA1,GA2,1,2,3,,,,,,,4e-6,0,4e-6,0,0,Infinity,,,,,,,,,,,", "q_zz: 'Infinity' is not a number")]
    [InlineData("GA1,GA2,1,2,3,,,,,,,4e-6,5e-6,4e-6,0,0,9e-6,,,,,,,,,,,", "the covariance is not positive definite " +
        "(a variance is not positive, or the correlations contradict each other)")]
    [InlineData("GA1,GA2,1,2,3,0.002,-1,0.004,,,,,,,,,,,,,,,,,,,,", "sd_y: a standard deviation must be positive")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,2mm,,,,,,,,,,,,,,,,,,,,", "sd_z: '2mm' is not a number")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,0.2,1,,,,,,,,,,,,,,,,,,",
        "r_xz: a correlation must lie between −1 and 1, not 1")]
    [InlineData("GA1,GA2,1,2,3,,,,0.2,,,,,,,,,,,,,,,,,,,", "the 'sd_x' field is empty")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,maybe,,,,,,,,,",
        "exclude: 'maybe' is not true or false: use true or false (also yes/no, 1/0)")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,,x,,,,,,,,", "sd_factor 'x' is not a number")]
    [InlineData("GA1,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,S7,,,,,,,,,,",
        "group 'S7' is not defined under gnss.groups in the project file")]
    public void ABadRowIsRefusedWithItsFileLineAndItem(string row, string problem)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse($"{Header}\n# a comment\nbaseline,{row}\n"));
        Assert.Equal($"b.csv:3: baseline GA1→GA2: {problem}", e.Message);
    }

    [Fact]
    public void ARowWithoutItsPointsNamesTheEmptyField()
    {
        var e = Assert.Throws<ProjectFileException>(() =>
            Parse($"{Header}\nbaseline,,GA2,1,2,3,0.002,0.002,0.004,,,,,,,,,,,,,,,,,,,,\n"));
        Assert.Equal("b.csv:2: baseline: the 'from' field is empty", e.Message);
    }
}
