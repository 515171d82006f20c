using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;

namespace NetAdjust.IO.Tests;

/// <summary>The <c>datum:</c> section of project files, and the demo adjusted without approximate coordinates.</summary>
public class DatumSectionTests
{
    private static SurveyProject Parse(string yaml) => ProjectReader.Parse(yaml, "site.yaml", "/proj", p => throw new FileNotFoundException("no such file", p));

    private const string Points = """
        default_sd: {distance: 0.003}
        points:
          - {id: A, e: 0, n: 0}
          - {id: B, e: 100, n: 0}
        setups:
          - at: A
            distances:
              - {to: B, value: 100.001}
        """;

    [Fact]
    public void DefaultIsTheControl() => Assert.Equal(DatumMode.Control, Parse(Points).Options.Datum.Mode);

    [Fact]
    public void ReadsMinimalConstraints()
    {
        var d = Parse(Points + "\ndatum: {mode: minimal, hold: A, azimuth_to: B}\n").Options.Datum;
        Assert.Equal(DatumMode.MinimalConstraints, d.Mode);
        Assert.Equal("A", d.HoldPoint);
        Assert.Equal("B", d.AzimuthTo);
    }

    [Fact]
    public void ReadsAFreeNetworkOverChosenPoints()
    {
        var d = Parse(Points + "\ndatum:\n  mode: free\n  points: [A, B]\n").Options.Datum;
        Assert.Equal(DatumMode.InnerConstraints, d.Mode);
        Assert.Equal(["A", "B"], d.InnerPoints!);
    }

    [Theory]
    [InlineData("datum: {mode: loose}", "site.yaml:9", "'loose' is not a datum mode")]
    [InlineData("datum: {mode: free, hold: A}", "site.yaml:9", "'hold' belongs to mode minimal")]
    [InlineData("datum: {mode: minimal, points: [A]}", "site.yaml:9", "'points' belongs to mode free")]
    [InlineData("datum: {mode: free, centre: A}", "site.yaml:9", "unknown key 'centre'")]
    public void BadDatumSectionsNameFileLineAndItem(string line, string where, string what)
    {
        var e = Assert.ThrowsAny<InvalidInputException>(() => Parse(Points + "\n" + line + "\n"));
        Assert.Contains(where, e.Message);
        Assert.Contains(what, e.Message);
    }

    private static string Data(string name)
    {
        return Path.Combine(NetAdjust.IO.Tests.Results.TestProjects.RepoRoot, "data", name);
    }

    [Fact]
    public void TheDemoWithoutApproximateCoordinatesGivesTheSameAdjustment()
    {
        // data/brackenmoor-auto.yaml is data/brackenmoor.yaml with the traverse stations' approximate coordinates
        // removed. Its sight lengths (for the weights from the instrument specification) then come from the observed
        // distances; so that both runs share one stochastic model, the reference run uses the same observations with
        // the approximate coordinates of data/brackenmoor.yaml.
        var auto = ProjectReader.Read(Data("brackenmoor-auto.yaml")).Network;
        var original = ProjectReader.Read(Data("brackenmoor.yaml")).Network;
        Assert.Contains(auto.Points, p => p.E is null);
        var given = Adjuster.Adjust(new Network.SurveyNetwork(auto.Name, original.Points, auto.Observations));
        var computed = Adjuster.Adjust(auto);
        Assert.Equal(given.Points.Count, computed.Points.Count);
        for (int i = 0; i < given.Points.Count; i++)
        {
            Assert.Equal(given.Points[i].E ?? double.NaN, computed.Points[i].E ?? double.NaN, 7);
            Assert.Equal(given.Points[i].N ?? double.NaN, computed.Points[i].N ?? double.NaN, 7);
            Assert.Equal(given.Points[i].H ?? double.NaN, computed.Points[i].H ?? double.NaN, 7);
        }
        Assert.Equal(given.Statistics.Vtpv, computed.Statistics.Vtpv, 9);
    }
}
