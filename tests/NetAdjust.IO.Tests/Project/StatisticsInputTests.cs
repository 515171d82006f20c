using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Tests.Project;

public class StatisticsInputTests
{
    private const string Head = """
        project: marks test (invented)
        units: {length: m, angle: deg, angle_sd: arcsec}
        default_sd: {distance: 3 mm, direction: 2.0, height_difference: 1 mm}
        points:
          - {id: A, e: 100, n: 100, h: 10, fix: enh}
          - {id: B, e: 200, n: 100}
          - {id: C, e: 150, n: 180}
        """;

    private static SurveyProject Parse(string yaml, string? csv = null) =>
        ProjectReader.Parse(yaml, "t.yaml", "/tmp", _ => csv ?? throw new IOException("no file"));

    [Fact]
    public void ExcludeAndSdFactorAreReadFromYaml()
    {
        var p = Parse(Head + """

            setups:
              - at: A
                distances:
                  - {to: B, value: 100.001, exclude: true}
                  - {to: C, value: 94.340, sd_factor: 3}
            levelling:
              - {from: A, to: B, dh: 1.234, sd: 2 mm, sd_factor: 2.5}
            """);
        var o = p.Network.Observations;
        Assert.True(o[0].Excluded);
        Assert.Equal(1.0, o[0].SdFactor);
        Assert.False(o[1].Excluded);
        Assert.Equal(0.009, o[1].StandardDeviation, 12);
        Assert.Equal(3.0, o[1].SdFactor);
        Assert.Equal(0.005, o[2].StandardDeviation, 12);
    }

    [Fact]
    public void SdFactorScalesAnErrorBudgetWithTheStandardDeviation()
    {
        // The budget's root-sum-square (error of a sum, docs/methods.md) must stay equal to the σ used.
        var p = Parse(Head.Replace("points:", """
            instruments:
              - {id: TSX, direction_sd: 3, zenith_sd: 3, edm: 2 mm + 2 ppm, centering: 1.0 mm, height: 1.5 mm}
            points:
            """) + """

            setups:
              - at: A
                instrument: TSX
                distances:
                  - {to: B, value: 100.001}
                  - {to: C, value: 94.340, sd_factor: 3}
            """);
        var model = StochasticModel.Build(p.Network, new NetAdjust.IO.Tests.Project.GivenCoordinates(p.Network),
            CenteringModel.Independent, 1.0);
        var plain = p.Network.Observations[0] with { StandardDeviation = model.StandardDeviations[0] };
        var scaled = p.Network.Observations[1] with { StandardDeviation = model.StandardDeviations[1] };
        var budget = model.Budgets[1];
        Assert.NotNull(budget);
        Assert.Equal(scaled.StandardDeviation, budget!.Total, 15);
        double rss = Math.Sqrt(budget.Contributions.Sum(c => c.Value * c.Value));
        Assert.Equal(scaled.StandardDeviation, rss, 15);
        Assert.Equal(3.0, scaled.SdFactor);
        Assert.True(scaled.StandardDeviation > 2.9 * plain.StandardDeviation); // about 3× (distances differ by 6 m)
    }

    [Fact]
    public void ExcludeAndSdFactorAreReadFromCsv()
    {
        var p = Parse(Head + "\nfiles: [obs.csv]\n", """
            kind,from,to,value,exclude,sd_factor
            distance,A,B,100.001,true,
            distance,A,C,94.340,,2
            distance,B,C,94.340,false,
            """);
        var o = p.Network.Observations;
        Assert.True(o[0].Excluded);
        Assert.Equal(0.006, o[1].StandardDeviation, 12);
        Assert.False(o[2].Excluded);
    }

    [Theory]
    [InlineData("{to: B, value: 100.001, exclude: maybe}", 11, "exclude: 'maybe' is not true or false: use true or false")]
    [InlineData("{to: B, value: 100.001, sd_factor: -1}", 11, "sd_factor must be positive")]
    [InlineData("{to: B, value: 100.001, sd_factor: x}", 11, "sd_factor 'x' is not a number")]
    public void BadMarksNameFileLineAndItem(string item, int line, string message)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Head + $"\nsetups:\n  - at: A\n    distances:\n      - {item}\n"));
        Assert.Equal("t.yaml", e.File);
        Assert.Equal(line, e.Line);
        Assert.Contains("A→B", e.Item);
        Assert.Contains(message, e.Problem);
    }

    [Fact]
    public void BadCsvMarkNamesTheLine()
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Head + "\nfiles: [obs.csv]\n", "kind,from,to,value,sd_factor\ndistance,A,B,100,0\n"));
        Assert.Equal(2, e.Line);
        Assert.Equal("obs.csv", e.File);
    }

    [Fact]
    public void TheStatisticsSectionSetsTheOptions()
    {
        var p = Parse(Head + """

            statistics:
              w_alpha: 0.01
              type_ii_error: 0.1
              tau_alpha: 0.1
              tau_adjustment: bonferroni
              variance_factor_basis: estimated
              confidence: 0.99
              external_reliability: never
              relative_pairs:
                - [A, C]
            setups:
              - at: A
                distances: [{to: B, value: 100.001}]
            """);
        var a = p.Options.Analysis;
        Assert.Equal(0.01, a.WTestAlpha);
        Assert.Equal(0.1, a.TypeIIError);
        Assert.Equal(0.1, a.TauAlpha);
        Assert.Equal(MultipleTestAdjustment.Bonferroni, a.TauAdjustment);
        Assert.Equal(VarianceFactorBasis.Estimated, a.VarianceFactor);
        Assert.Equal(0.99, a.ConfidenceLevel);
        Assert.Equal(ExternalReliabilityMode.Never, a.ExternalReliability);
        Assert.Equal([("A", "C")], a.RelativePairs);
    }

    [Theory]
    [InlineData("statistics:\n  w_alpha: 2\n", 9, "must be a probability")]
    [InlineData("statistics:\n  tau_adjustment: holm\n", 9, "'holm' is not a tau-test adjustment: use sidak or bonferroni")]
    [InlineData("statistics:\n  colour: red\n", 9, "unknown key 'colour'")]
    [InlineData("statistics:\n  relative_pairs:\n    - [A]\n", 10, "two point ids")]
    [InlineData("statistics:\n  relative_pairs:\n    - [A, Z9]\n", 10, "point Z9 is not defined")]
    public void BadStatisticsSectionsNameTheLine(string section, int line, string message)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Head + "\n" + section));
        Assert.Equal(line, e.Line);
        Assert.Contains(message, e.Problem);
    }
}
