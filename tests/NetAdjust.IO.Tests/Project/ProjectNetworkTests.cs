using NetAdjust.IO.Project;
using NetAdjust.Network;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The network the project reader makes is the one the public constructor makes of the same points and observations:
/// the same index, the CSV rows' ids the points' own strings, and the same errors worded and ordered alike.
/// </summary>
public class ProjectNetworkTests
{
    private static SurveyProject Parse(string yaml, string csv) =>
        ProjectReader.Parse(yaml, "p.yaml", Path.GetTempPath(), _ => csv);

    private const string Project = """
        units: {length: m, angle: dms}
        default_sd: {distance: 3 mm}
        points:
          - {id: A, e: 1000, n: 2000, fix: en}
          - {id: B, e: 1100, n: 2000}
          - {id: C, e: 1100, n: 2100}
        files: [obs.csv]
        """;

    private const string Csv = """
        kind,from,to,value
        distance,A,B,100.001
        distance,B,C,99.998
        distance,C,A,141.42
        """;

    [Fact]
    public void TheReadersNetworkIsThePublicConstructorsNetwork()
    {
        var net = Parse(Project, Csv).Network;
        var again = new SurveyNetwork(net.Name, net.Points, net.Observations);
        Assert.Equal(["A", "B", "C"], net.Points.Select(p => p.Id));
        foreach (var p in net.Points) Assert.Equal(again.IndexOf(p.Id), net.IndexOf(p.Id));
        Assert.Equal(again.Observations, net.Observations);
        // the CSV rows' ids are the points' own strings
        Assert.Same(net.Points[0].Id, net.Observations[0].From);
        Assert.Same(net.Points[2].Id, net.Observations[2].From);
        // the list cannot be changed through a cast
        Assert.IsNotType<List<Observation>>(net.Observations);
        Assert.False(net.Observations is IList<Observation> { IsReadOnly: false });
    }

    [Fact]
    public void APointDefinedTwiceOrAnUndefinedPointIsNamedAsByThePublicConstructor()
    {
        // the second A (line 7) is the one defined twice
        string twice = Project.Replace("  - {id: C, e: 1100, n: 2100}",
            "  - {id: C, e: 1100, n: 2100}\n  - {id: A, e: 5, n: 5}");
        var e = Assert.Throws<InvalidInputException>(() => Parse(twice, Csv));
        Assert.Contains("p.yaml:7: point A is defined twice", e.Message);
        // an undefined point of a CSV row, and the duplicate, worded and ordered as the public constructor words them
        var both = Assert.Throws<InvalidInputException>(() => Parse(twice, Csv + "\ndistance,C,N9,10.0"));
        var points = new[]
        {
            new Point("A") { E = 1000, N = 2000, Fixed = Fixity.EN, Source = "p.yaml:4" },
            new Point("B") { E = 1100, N = 2000, Source = "p.yaml:5" },
            new Point("C") { E = 1100, N = 2100, Source = "p.yaml:6" },
            new Point("A") { E = 5, N = 5, Source = "p.yaml:7" },
        };
        Observation D(string from, string to, double m, int line) =>
            new DistanceObservation(from, to, NetAdjust.Units.Length.FromMetres(m))
            { Sd = NetAdjust.Units.Length.FromMetres(0.003), Source = $"obs.csv:{line}" };
        var expected = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("p", points,
            [D("A", "B", 100.001, 2), D("B", "C", 99.998, 3), D("C", "A", 141.42, 4), D("C", "N9", 10.0, 5)]));
        Assert.Equal(expected.Message, both.Message);
        Assert.Contains("point N9 is not defined", both.Message);
    }
}
