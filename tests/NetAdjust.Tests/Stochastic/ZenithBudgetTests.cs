using NetAdjust.Network;
using NetAdjust.Stochastic;

namespace NetAdjust.Tests.Stochastic;

/// <summary>The error budget of a zenith angle (docs/methods.md, "Zenith angles and slope distances").</summary>
public class ZenithBudgetTests
{
    private const double Arcsec = Math.PI / 648000;

    [Theory]
    [InlineData(1, Faces.Both, 3.0)]
    [InlineData(2, Faces.Both, 2.1213203435596424)]
    [InlineData(1, Faces.One, 4.242640687119285)]
    public void PointingAndReadingFollowTheIsoZenithSdSetsAndFaces(int sets, Faces faces, double expectedArcsec)
    {
        // ISO 17123-3: σ of one zenith angle observed once in both faces; n sets are a mean (σ/√n), one face is √2
        // worse (common practice). 3″/√2 = 2.121″, 3″·√2 = 4.243″.
        var ts = new TotalStationSpecification("ts", 1 * Arcsec, 3 * Arcsec, null, 0.0005, 0.001);
        var b = ZenithBudgetBuilder.Build(ts, null, new ObservingProcedure(sets, faces), 200);
        Assert.Equal(expectedArcsec, b.ValueOf(ContributionNames.ZenithPointingReading) / Arcsec, 1e-9);
    }

    [Fact]
    public void InstrumentAndTargetHeightsEnterAsTheirSdOverTheHorizontalDistance()
    {
        // A height error σ_h moves the line of sight by σ_h at the far end: σ_h/s radians (common practice).
        var ts = new TotalStationSpecification("ts", 1 * Arcsec, 3 * Arcsec, null, 0.0005, 0.001);
        var target = new TargetSpecification("prism", 0.001, 0.002);
        var b = ZenithBudgetBuilder.Build(ts, target, ObservingProcedure.Default, 200);
        Assert.Equal(0.001 / 200, b.ValueOf(ContributionNames.InstrumentHeight), 1e-15);
        Assert.Equal(0.002 / 200, b.ValueOf(ContributionNames.TargetHeight), 1e-15);
        double total = Math.Sqrt(Math.Pow(3 * Arcsec, 2) + Math.Pow(0.001 / 200, 2) + Math.Pow(0.002 / 200, 2));
        Assert.Equal(total, b.Total, 1e-15);
    }
}
