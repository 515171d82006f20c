using NetAdjust.Adjustment;
using System.Text.Json;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Tests.Project;

/// <summary>Slope distances and zenith angles in the project file (docs/input-format.md).</summary>
public class TrigonometricInputTests
{
    private const string Head = """
        units: {length: m, angle: dms}
        adjustment: {refraction: 0.2}
        instruments:
          - {id: TS, direction_sd: 1, zenith_sd: 2, edm: 1 mm + 1.5 ppm, centering: 0.5 mm, height: 1 mm}
        targets:
          - {id: PR, centering: 1 mm, height: 2 mm}
        points:
          - {id: A, e: 1000, n: 1000, h: 100, fix: enh}
          - {id: B, e: 1300, n: 1400, h: 110}

        """;

    private static SurveyProject Parse(string yaml) =>
        ProjectReader.Parse(yaml, "t.yaml", Path.GetTempPath(), File.ReadAllText);

    private static string Setup(string hi = "1.550", string zenith = "88-37-00", string slope = "500.1234",
        string zenithLine = "  - {to: B, value: ZEN, target_height: 1.700}\n") =>
        Head + "setups:\n  - at: A\n    instrument: TS\n    target: PR\n    sets: 2\n" +
        $"    instrument_height: {hi}\n" +
        (zenithLine.Length > 0 ? "    zeniths:\n    " + zenithLine.Replace("ZEN", zenith) : "") +
        "    slope_distances:\n" + $"      - {{to: B, value: {slope}, target_height: 1.700}}\n";

    [Fact]
    public void ASetupReadsSlopeDistancesAndZenithAnglesWithTheirHeightsAndTheProjectsRefraction()
    {
        var net = Parse(Setup()).Network;
        var z = Assert.IsType<ZenithObservation>(net.Observations[0]);
        var d = Assert.IsType<SlopeDistanceObservation>(net.Observations[1]);
        Assert.Equal((88 + (37 / 60.0)) * Math.PI / 180, z.Value, 1e-12);
        Assert.Equal(1.55, z.InstrumentHeight.Metres);
        Assert.Equal(1.7, z.TargetHeight.Metres);
        Assert.Equal(0.2, z.Refraction);
        Assert.Equal(500.1234, d.Value);
        Assert.Equal("t.yaml:17", z.Source);
        // Weighted from the instrument: EDM for the slope distance, zenith σ (2″/√2 for 2 sets) and heights.
        Assert.NotNull(z.Weighting);
        Assert.NotNull(d.Weighting);
    }

    [Fact]
    public void TheRefractionCoefficientIsCommonPractice013WhenNotSet()
    {
        var net = Parse(Setup().Replace("adjustment: {refraction: 0.2}\n", "")).Network;
        Assert.Equal(0.13, Assert.IsType<ZenithObservation>(net.Observations[0]).Refraction);
    }

    [Theory]
    [InlineData("0-00-00", "t.yaml:17", "zenith angle to B in the setup at A", "between 0 and 180°")]
    [InlineData("180-00-00", "t.yaml:17", "zenith angle to B in the setup at A", "between 0 and 180°")]
    [InlineData("200-00-00", "t.yaml:17", "zenith angle to B in the setup at A", "between 0 and 180°")]
    public void AZenithAngleOutsideZeroTo180IsAnError(string zenith, string where, string item, string what)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Setup(zenith: zenith)));
        Assert.StartsWith(where + ": " + item, e.Message);
        Assert.Contains(what, e.Message);
    }

    [Fact]
    public void ANegativeInstrumentHeightIsAnError()
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Setup(hi: "-1.5")));
        Assert.StartsWith("t.yaml:15: setup at A instrument_height", e.Message);
        Assert.Contains("between 0 and 100 m", e.Message);
    }

    [Fact]
    public void ASlopeDistanceWithoutAZenithAngleWhereTheHeightIsUnknownIsAnError()
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Setup(zenithLine: "")));
        Assert.StartsWith("t.yaml:17: slope distance to B in the setup at A", e.Message);
        Assert.Contains("needs a zenith angle to the same target", e.Message);
        // With both heights held the slope distance alone is accepted.
        var held = Setup(zenithLine: "").Replace("h: 110}", "h: 110, fix: h}");
        Assert.Single(Parse(held).Network.Observations);
    }

    [Fact]
    public void AMissingTargetHeightIsAnError()
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Setup().Replace(", target_height: 1.700}\n    slope",
            "}\n    slope")));
        Assert.StartsWith("t.yaml:17: zenith angle to B in the setup at A", e.Message);
        Assert.Contains("'target_height' is missing", e.Message);
    }

    [Fact]
    public void AZenithAngleIsWeightedFromTheZenithSdSetsAndHeightSds()
    {
        // 2″ ISO zenith σ, 2 sets in both faces: 2″/√2 (common practice); heights 1 mm and 2 mm over s = 500 m.
        // B held in plan (one sighting cannot place it); its height is the unknown.
        var p = Parse(Setup().Replace("h: 110}", "h: 110, fix: en}"));
        var r = Adjuster.Adjust(p.Network, p.Options);
        var budget = r.Observations[0].Budget!;
        const double arcsec = Math.PI / 648000;
        Assert.Equal(2 / Math.Sqrt(2) * arcsec, budget.ValueOf(ContributionNames.ZenithPointingReading), 1e-12);
        double s = Math.Sqrt((300 * 300) + (400 * 400));
        Assert.Equal(0.001 / s, budget.ValueOf(ContributionNames.InstrumentHeight), 1e-9);
        Assert.Equal(0.002 / s, budget.ValueOf(ContributionNames.TargetHeight), 1e-9);
        // B gets a height unknown with its standard deviation.
        Assert.True(r.Points[1].SdH > 0);
    }

    [Theory]
    [InlineData("slope_distance,A,B,500.12,2 mm", "slope distance A→B")]
    [InlineData("zenith,A,B,88-37-00,3", "zenith A→B")]
    public void ACsvRowOfTheseKindsWithoutHeightsIsRefusedWithFileAndLineNotReadAsAnotherKind(string row, string item)
    {
        // Regression: a CSV row of an unlisted kind fell through to a height difference. These kinds are read from
        // CSV now (CsvTrigonometricTests), with their instrument and target heights.
        string yaml = Head + "files:\n  - obs.csv\n";
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(yaml, "t.yaml", Path.GetTempPath(),
            _ => "kind,from,to,value,sd\n" + row + "\n"));
        Assert.StartsWith($"obs.csv:2: {item}", e.Message);
        Assert.Contains("the 'instrument_height' field is empty", e.Message);
    }

    [Fact]
    public void JsonNamesTheKindsGivesZenithResidualsInArcsecAndHeightsWithTheirSd()
    {
        var p = Parse(Setup().Replace("h: 110}", "h: 110, fix: en}"));
        var r = Adjuster.Adjust(p.Network, p.Options);
        string json = JsonResultWriter.Write(r, new ReportContext("t.yaml", new DateOnly(2026, 12, 1), p.Units));
        using var doc = JsonDocument.Parse(json);
        var obs = doc.RootElement.GetProperty("observations");
        Assert.Equal("zenith", obs[0].GetProperty("kind").GetString());
        Assert.Equal("slope_distance", obs[1].GetProperty("kind").GetString());
        // Residuals of angles are in arcsec (docs/output-format.md), like directions and angles.
        Assert.Equal(r.Observations[0].Residual * 648000 / Math.PI, obs[0].GetProperty("residual").GetDouble(), 1e-9);
        Assert.Equal(r.Observations[1].Residual, obs[1].GetProperty("residual").GetDouble(), 1e-12);
        var b = doc.RootElement.GetProperty("points")[1];
        Assert.Equal(r.Points[1].H!.Value, b.GetProperty("h").GetDouble(), 1e-9);
        Assert.True(b.GetProperty("sd_h").GetDouble() > 0);
    }
}
