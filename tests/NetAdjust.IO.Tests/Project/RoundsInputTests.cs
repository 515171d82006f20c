using System.Globalization;
using System.Text;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>Rounds in both faces in the project file (docs/input-format.md, "Rounds in both faces").</summary>
public class RoundsInputTests
{
    private const string Head = """
        units: {length: m, angle: dms}
        instruments:
          - {id: TS5, direction_sd: 5, zenith_sd: 5, edm: 2 mm + 2 ppm}
        points:
          - {id: A, e: 1000, n: 1000, h: 100, fix: enh}
          - {id: B, e: 1100, n: 1150, h: 104, fix: enh}
          - {id: C, e: 1180, n: 950, h: 98}

        """;

    private static SurveyProject Parse(string yaml) =>
        ProjectReader.Parse(yaml, "r.yaml", Path.GetTempPath(), File.ReadAllText);

    private static string Fmt(double degrees)
    {
        // degrees → d-m-s with 0.1″ (own helper; the angle grammar of docs/input-format.md)
        var a = Angle.FromDegrees(degrees);
        double total = Math.Round(a.Arcseconds, 1);
        int d = (int)(total / 3600);
        int m = (int)((total - (d * 3600)) / 60);
        double s = total - (d * 3600) - (m * 60);
        return string.Create(CultureInfo.InvariantCulture, $"{d}-{m:00}-{s:00.0}");
    }

    /// <summary>A setup at A with <paramref name="sets"/> sets to B and C, both faces or face left only.</summary>
    private static string Rounds(int sets, bool bothFaces, double faceRightOffsetArcsec = 0)
    {
        var sb = new StringBuilder(Head);
        sb.Append("setups:\n  - at: A\n    instrument: TS5\n    instrument_height: 1.55\n    rounds:\n");
        for (int s = 0; s < sets; s++)
        {
            sb.Append("      - readings:\n");
            foreach (var (to, hz, z) in new[] { ("B", 10.0, 88.5), ("C", 115.25, 91.25) })
            {
                double h = hz + (s * 45);
                sb.Append(CultureInfo.InvariantCulture,
                    $"          - {{to: {to}, hz_left: {Fmt(h)}, zenith_left: {Fmt(z)}");
                if (bothFaces)
                    sb.Append(CultureInfo.InvariantCulture,
                        $", hz_right: {Fmt(h + 180 + (faceRightOffsetArcsec / 3600))}, zenith_right: {Fmt(360 - z)}");
                sb.Append(", target_height: 1.7}\n");
            }
        }
        return sb.ToString();
    }

    [Fact]
    public void RoundsBecomeOneDirectionSetAndZenithAnglesWeightedAsTheirSetsAndFaces()
    {
        var project = Parse(Rounds(3, bothFaces: true));
        var obs = project.Network.Observations;
        var dirs = obs.OfType<DirectionObservation>().ToList();
        Assert.Equal(2, dirs.Count);
        Assert.All(dirs, d => Assert.Equal("A/1", d.SetId));
        Assert.Equal(0, dirs[0].Reading.Radians, 12);
        Assert.Equal(105.25, dirs[1].Reading.Degrees, 9);
        var zen = obs.OfType<ZenithObservation>().ToList();
        Assert.Equal(88.5, zen[0].Zenith.Degrees, 9);
        Assert.Equal(1.55, zen[0].InstrumentHeight.Metres);
        Assert.Equal(1.7, zen[0].TargetHeight.Metres);
        Assert.All(obs, o => Assert.Equal(new ObservingProcedure(3, Faces.Both), o.Weighting!.Procedure));
        Assert.Equal("r.yaml:14", dirs[0].Source); // the reading of B in the first set
        var rounds = Assert.Single(project.Rounds);
        Assert.Equal("A", rounds.Station);
        Assert.Equal(["r.yaml:13", "r.yaml:16", "r.yaml:19"], rounds.SetSources);
        Assert.Empty(project.Warnings);
    }

    // Rules of thumb of the trade (common practice), for a 5″ instrument in the sense of ISO 17123-3: an angle
    // measured in one set in both faces 7.1″, two sets 5.0″, three 4.1″, four 3.5″, one set in one face 10″. Here the
    // angle is the difference of the two reduced directions of the rounds, each weighted by the builder the
    // adjustment uses (ObservationBudgets → DirectionBudgetBuilder) with the sets and faces taken from the rounds.
    [Theory]
    [InlineData(1, true, 7.1)]
    [InlineData(2, true, 5.0)]
    [InlineData(3, true, 4.1)]
    [InlineData(4, true, 3.5)]
    [InlineData(1, false, 10.0)]
    public void AFiveSecondInstrumentGivesTheRulesOfThumbThroughRounds(int sets, bool bothFaces, double arcsec)
    {
        var net = Parse(Rounds(sets, bothFaces)).Network;
        var at = new GivenCoordinates(net);
        var sd = net.Observations.OfType<DirectionObservation>()
            .Select(d => ObservationBudgets.Of(d, at)!.Total).ToList();
        double angle = Math.Sqrt((sd[0] * sd[0]) + (sd[1] * sd[1])) * Angle.ArcsecondsPerRadian;
        // The rules are rounded to 0.1″: compare within half of that.
        Assert.Equal(arcsec, angle, 0.05);
    }

    [Fact]
    public void FacesThatDisagreeBeyondTheToleranceAreAnErrorNamingFileLineAndReading()
    {
        // 75″ between the faces against the default tolerance of 60″.
        var e = Assert.Throws<ProjectFileException>(() => Parse(Rounds(2, true, faceRightOffsetArcsec: 75)));
        Assert.Equal(14, e.Line);
        Assert.Contains("r.yaml:14", e.Message);
        Assert.Contains("reading of B in set 1", e.Message);
        Assert.Contains("75.0″", e.Message);
        // A stated tolerance of 90″ accepts them.
        Parse("reduction: {face_tolerance: 90}\n" + Rounds(2, true, faceRightOffsetArcsec: 75));
    }

    [Fact]
    public void ARawZenithAngleOutsideItsRangeIsAnErrorNamingFileLineAndReading()
    {
        var text = Rounds(2, true).Replace("zenith_left: 91-15-00.0", "zenith_left: 191-15-00.0");
        var e = Assert.Throws<ProjectFileException>(() => Parse(text));
        Assert.Equal(15, e.Line);
        Assert.Contains("reading of C in set 1", e.Message);
        Assert.Contains("between 0 and 180°", e.Message);
    }

    [Fact]
    public void RoundsRefuseTheKeysTheyReplaceAndNeedAnInstrument()
    {
        var e = Assert.Throws<ProjectFileException>(() =>
            Parse(Rounds(1, true).Replace("    instrument_height: 1.55\n",
                "    instrument_height: 1.55\n    sets: 2\n")));
        Assert.Contains("'sets' cannot stand beside 'rounds'", e.Message);
        e = Assert.Throws<ProjectFileException>(() => Parse(Rounds(1, true).Replace("    instrument: TS5\n", "")));
        Assert.Contains("rounds need the setup's 'instrument'", e.Message);
    }

    [Fact]
    public void ATargetHeightThatChangesBetweenTheSetsIsRefused()
    {
        string text = Rounds(2, true);
        int second = text.LastIndexOf("target_height: 1.7", StringComparison.Ordinal);
        text = text[..second] + "target_height: 1.8" + text[(second + "target_height: 1.7".Length)..];
        var e = Assert.Throws<ProjectFileException>(() => Parse(text));
        Assert.Equal(18, e.Line);
        Assert.Contains("changes between the sets", e.Message);
    }

    [Fact]
    public void ASpreadBeyondTheInstrumentsFigureIsAWarningNamingTheSetup()
    {
        // The third set reads C 30″ off in both faces: the spread test of a 5″ instrument fails.
        string text = Rounds(3, true);
        text = text.Replace("{to: C, hz_left: 205-15-00.0", "{to: C, hz_left: 205-15-30.0")
            .Replace("hz_right: 385-15-00.0", "hz_right: 385-15-30.0");
        var project = Parse(text);
        var w = Assert.Single(project.Warnings);
        Assert.Contains("the setup at A (r.yaml:9)", w);
        Assert.Contains("targets B, C", w);
        Assert.False(project.Rounds[0].Reduction.Passes);
    }
}
