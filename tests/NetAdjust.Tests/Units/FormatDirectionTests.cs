using NetAdjust.Units;

namespace NetAdjust.Tests.Units;

/// <summary>
/// Directions, azimuths and orientations are written in [0, full turn) (common practice; docs/glossary.md: azimuths in
/// [0, 360°)). Review regression: 359-59-59.98 was printed as 360-00-00.0.
/// </summary>
public class FormatDirectionTests
{
    [Theory]
    [InlineData(359, 59, 59.97, "0-00-00.0")]
    [InlineData(359, 59, 59.94, "359-59-59.9")]
    [InlineData(0, 0, 0.04, "0-00-00.0")]
    [InlineData(360, 0, 0.0, "0-00-00.0")]
    [InlineData(725, 30, 0.0, "5-30-00.0")]
    public void DmsStaysBelowAFullTurnAfterRounding(int d, int m, double s, string expected) =>
        Assert.Equal(expected, AnglePattern.Dms.FormatDirection(Angle.FromDms(d, m, s)));

    [Fact]
    public void NegativeAnglesAreReducedIntoTheFirstTurn()
    {
        Assert.Equal("359-30-00.0", AnglePattern.Dms.FormatDirection(Angle.FromDegrees(-0.5)));
        Assert.Equal("399.50000", AnglePattern.Gons.FormatDirection(Angle.FromGons(-0.5)));
    }

    [Fact]
    public void GonsAndDegreesRoundingUpToAFullTurnPrintZero()
    {
        Assert.Equal("0.00000", AnglePattern.Gons.FormatDirection(Angle.FromGons(399.999996)));
        Assert.Equal("399.99999", AnglePattern.Gons.FormatDirection(Angle.FromGons(399.999991)));
        Assert.Equal("0.000000", AnglePattern.Degrees.FormatDirection(Angle.FromDegrees(359.9999996)));
    }
}
