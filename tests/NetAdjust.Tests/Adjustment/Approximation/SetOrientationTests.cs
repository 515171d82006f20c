using NetAdjust.Adjustment.Approximation;
using NetAdjust.Geometry;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>
/// The orientation of a direction set: azimuth − reading, averaged on the circle (common practice: a set's zero
/// is the mean of its orientation values over the located targets).
/// </summary>
public class SetOrientationTests
{
    private const double Deg = Math.PI / 180;

    [Fact]
    public void OrientationIsTheMeanOfAzimuthMinusReading()
    {
        // Station (0, 0); target north (azimuth 0°) read 350.0°, target east (90°) read 80.2°: orientation values
        // 10.0° and 9.8° (mod 360°), mean 9.9°.
        double? w = SetOrientation.Mean(new PlanePoint(0, 0),
            [(new PlanePoint(0, 100), 350.0 * Deg), (new PlanePoint(100, 0), 80.2 * Deg)]);
        Assert.NotNull(w);
        Assert.Equal(9.9 * Deg, Angle.Reduce0To2Pi(w.Value), 12);
    }

    [Fact]
    public void ValuesEitherSideOfZeroAverageNearZeroNotNearHalfCircle()
    {
        // 359.9° and 0.3°: the circular mean is 0.1°; the plain arithmetic mean would be 180.1°.
        double? w = SetOrientation.Mean([359.9 * Deg, 0.3 * Deg]);
        Assert.NotNull(w);
        Assert.Equal(0.1 * Deg, Angle.ReduceSigned(w.Value), 12);
    }

    [Fact]
    public void NoSightingGivesNoOrientation()
    {
        Assert.Null(SetOrientation.Mean([]));
        Assert.Null(SetOrientation.Mean(new PlanePoint(0, 0), []));
    }
}
