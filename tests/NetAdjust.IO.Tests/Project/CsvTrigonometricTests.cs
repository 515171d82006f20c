using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Tests.Project;

/// <summary>Slope distances and zenith angles in CSV observation files, and CSV rows weighted from the project's
/// instrument and target specifications (docs/input-format.md, "CSV observation files").</summary>
public class CsvTrigonometricTests
{
    private const string Head = """
        units: {length: m, angle: dms}
        adjustment: {refraction: 0.14, refraction_sd: 0.04}
        instruments:
          - {id: TS, direction_sd: 1, zenith_sd: 2, edm: 1 mm + 1.5 ppm, centering: 0.5 mm, height: 1 mm}
          - {id: OLD, direction_sd: 5}
        targets:
          - {id: PR, centering: 1 mm, height: 2 mm}
        refraction_groups:
          - {id: DAY2, k: 0.11, sd: 0.02}
        points:
          - {id: A, e: 1000, n: 1000, h: 100, fix: enh}
          - {id: B, e: 1300, n: 1400, h: 110, fix: en}
        files:
          - obs.csv

        """;

    private const string Header =
        "kind,from,to,value,sd,instrument_height,target_height,instrument,target,sets,faces,refraction_group\n";

    private static SurveyProject Parse(string csv, string head = Head) =>
        ProjectReader.Parse(head, "t.yaml", Path.GetTempPath(), _ => csv);

    private const string Rows =
        "zenith,A,B,88-51-17,,1.550,1.700,TS,PR,2,,\n" +
        "slope_distance,A,B,500.1234,,1.550,1.700,TS,PR,2,,\n";

    [Fact]
    public void SlopeDistancesAndZenithAnglesAreReadWithTheirHeightsAndTheProjectsRefraction()
    {
        var net = Parse(Header + Rows).Network;
        var z = Assert.IsType<ZenithObservation>(net.Observations[0]);
        var d = Assert.IsType<SlopeDistanceObservation>(net.Observations[1]);
        Assert.Equal((88 + (51 / 60.0) + (17 / 3600.0)) * Math.PI / 180, z.Value, 1e-12);
        Assert.Equal((1.55, 1.7), (z.InstrumentHeight.Metres, z.TargetHeight.Metres));
        Assert.Equal((1.55, 1.7), (d.InstrumentHeight.Metres, d.TargetHeight.Metres));
        Assert.Equal(500.1234, d.Value);
        Assert.Equal((0.14, 0.04, (string?)null), (z.Refraction, z.RefractionSd, z.RefractionGroup));
        Assert.Equal(("obs.csv:2", "obs.csv:3"), (z.Source, d.Source));
        // weighted from TS and PR, 2 sets in both faces
        Assert.True(double.IsNaN(z.StandardDeviation));
        Assert.Equal(("TS", "PR", 2, Faces.Both), (z.Weighting!.Instrument!.Id, z.Weighting.Target!.Id,
            z.Weighting.Procedure.Sets, z.Weighting.Procedure.Faces));
        Assert.Equal("TS", d.Weighting!.Instrument!.Id);
    }

    [Fact]
    public void ARowMayNameARefractionGroupAndGiveAnSdThatOverridesTheInstrument()
    {
        var net = Parse(Header + "zenith,A,B,88-51-17,3,1.550,1.700,TS,,,,DAY2\n").Network;
        var z = Assert.IsType<ZenithObservation>(net.Observations[0]);
        Assert.Equal((0.11, 0.02, "DAY2"), (z.Refraction, z.RefractionSd, z.RefractionGroup));
        Assert.Null(z.Weighting); // an explicit sd comes first, as in the project file
        Assert.Equal(3 * Math.PI / 648000, z.StandardDeviation, 1e-15);
    }

    [Fact]
    public void CsvRowsAreWeightedAsTheSameObservationsInASetupOfTheProjectFile()
    {
        // The same sightings written in a setup (docs/input-format.md, "Slope distances and zenith angles"): the
        // budgets (ISO 17123-3 zenith sd over 2 sets, heights, refraction, EDM, centering) are the same.
        var fromCsv = Parse(Header + Rows);
        string yaml = Head.Replace("files:\n  - obs.csv\n", "") + "setups:\n  - at: A\n    instrument: TS\n" +
            "    target: PR\n    sets: 2\n    instrument_height: 1.550\n" +
            "    zeniths:\n      - {to: B, value: 88-51-17, target_height: 1.700}\n" +
            "    slope_distances:\n      - {to: B, value: 500.1234, target_height: 1.700}\n";
        var fromYaml = ProjectReader.Parse(yaml, "t.yaml", Path.GetTempPath(), File.ReadAllText);
        var a = Adjuster.Adjust(fromCsv.Network, fromCsv.Options);
        var b = Adjuster.Adjust(fromYaml.Network, fromYaml.Options);
        for (int i = 0; i < 2; i++)
        {
            Assert.Equal(b.Observations[i].Budget!.Contributions.Select(c => (c.Name, c.Value)),
                a.Observations[i].Budget!.Contributions.Select(c => (c.Name, c.Value)));
        }
        Assert.True(a.Observations[0].Budget!.ValueOf(ContributionNames.Refraction) > 0);
        Assert.Equal(b.Points[1].H!.Value, a.Points[1].H!.Value, 1e-9);
    }

    [Fact]
    public void DistancesAndDirectionsInCsvAreWeightedFromANamedInstrument()
    {
        // Before, only levelling could be weighted from specifications in CSV.
        string csv = "kind,at,from,to,value,instrument,target,sets,faces\n" +
            "distance,,A,B,500.0012,TS,PR,,\n" + "direction,A,,B,0-00-00,TS,PR,3,one\n";
        var net = Parse(csv).Network;
        Assert.Equal("TS", net.Observations[0].Weighting!.Instrument!.Id);
        Assert.Equal((3, Faces.One), (net.Observations[1].Weighting!.Procedure.Sets,
            net.Observations[1].Weighting!.Procedure.Faces));
    }

    [Theory]
    [InlineData("zenith,A,B,88-51-17,,-1.5,1.700,TS,,,,", "between 0 and 100 m")]
    [InlineData("zenith,A,B,88-51-17,,1.5,,TS,,,,", "the 'target_height' field is empty")]
    [InlineData("zenith,A,B,188-51-17,,1.5,1.7,TS,,,,", "between 0 and 180°")]
    [InlineData("slope_distance,A,B,500.1,,1.5,1.7,TS,,,,", "needs a zenith angle")]
    [InlineData("slope_distance,A,B,-5,,1.5,1.7,TS,,,,", "must be positive")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,XX,,,,", "instrument 'XX' is not defined")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,OLD,,,,", "has no zenith_sd")]
    [InlineData("slope_distance,A,B,500.1,,1.5,1.7,OLD,,,,", "has no EDM")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,TS,NONE,,,", "target 'NONE' is not defined")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,TS,,0,,", "'sets' must be a whole number")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,TS,,,three,", "faces")]
    [InlineData("zenith,A,B,88-51-17,2,1.5,1.7,,PR,,,", "the 'target' field needs an 'instrument'")]
    [InlineData("zenith,A,B,88-51-17,,1.5,1.7,TS,,,,DAY9", "refraction group 'DAY9' is not defined")]
    [InlineData("distance,A,B,500.1,,1.5,,TS,,,,", "the 'instrument_height' field is for slope distances")]
    [InlineData("slope_distance,A,B,500.1,,1.5,1.7,TS,,,,DAY2", "'refraction_group' field is for zenith angles")]
    [InlineData("height_difference,A,B,1.2,,,,TS,,,,", "not weighted from an instrument")]
    public void BadTotalStationRowsAreErrorsWithFileLineAndItem(string row, string what)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Header + row + "\n"));
        Assert.StartsWith("obs.csv:2: ", e.Message);
        Assert.Contains(what, e.Message);
    }

    [Fact]
    public void ASlopeDistanceAloneIsAcceptedWhenBothHeightsAreHeld()
    {
        var held = Head.Replace("h: 110, fix: en}", "h: 110, fix: enh}");
        var net = Parse(Header + "slope_distance,A,B,500.1,2 mm,1.5,1.7,,,,,\n", held).Network;
        Assert.IsType<SlopeDistanceObservation>(Assert.Single(net.Observations));
    }
}
