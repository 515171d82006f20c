using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>Regression: ellipse azimuths stay in [0°, 180°) after rounding (convention of docs/glossary.md).</summary>
public class EllipseAzimuthRoundingTests
{
    [Theory]
    [InlineData(179.99996, 4, 0.0)]
    [InlineData(179.99994, 4, 179.9999)]
    [InlineData(0.00004, 4, 0.0)]
    [InlineData(179.6, 0, 0.0)]
    [InlineData(90.26, 1, 90.3)]
    public void RoundedAzimuthWrapsAtAHalfTurn(double degrees, int decimals, double expected)
    {
        var e = new ErrorEllipse(0.003, 0.001, degrees * Math.PI / 180);
        Assert.Equal(expected, e.AzimuthDegreesRounded(decimals), 10);
    }
}
