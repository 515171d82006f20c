using FsCheck;
using FsCheck.Fluent;
using NetAdjust.Units;

namespace NetAdjust.Tests.Units;

public class AngleTests
{
    [Theory]
    [InlineData("123-45-56.7", 123 + (45 / 60.0) + (56.7 / 3600))]
    [InlineData("0-00-00", 0.0)]
    [InlineData("359-59-59.99", 359 + (59 / 60.0) + (59.99 / 3600))]
    [InlineData("-0-30-00", -0.5)]
    [InlineData("+12-30-00", 12.5)]
    [InlineData("123°45'56.7\"", 123 + (45 / 60.0) + (56.7 / 3600))]
    [InlineData("123° 45′ 56.7″", 123 + (45 / 60.0) + (56.7 / 3600))]
    [InlineData("12°30'", 12.5)]
    [InlineData("45°", 45.0)]
    [InlineData(" 90-00-00 ", 90.0)]
    public void ParsesLegalDms(string text, double degrees)
    {
        var r = AnglePattern.Dms.Parse(text);
        Assert.True(r.Success, r.Error);
        Assert.Equal(degrees, r.Value.Degrees, 10);
    }

    [Theory]
    [InlineData("12-75-00", "minutes must be below 60")]
    [InlineData("12-30-60", "seconds must be below 60")]
    [InlineData("12-30", "three parts")]
    [InlineData("12.5-30-00", "degrees must be a whole number")]
    [InlineData("12-3.5-00", "minutes must be a whole number")]
    [InlineData("1,5", "three parts")]
    [InlineData("", "empty")]
    [InlineData("abc", "three parts")]
    [InlineData("12°30", "no unit mark")]
    [InlineData("--12-30-00", "not an angle")]
    public void RejectsIllegalDmsWithAPreciseMessage(string text, string expected)
    {
        var r = AnglePattern.Dms.Parse(text);
        Assert.False(r.Success);
        Assert.Contains(expected, r.Error);
    }

    [Theory]
    [InlineData("100", 90.0)]
    [InlineData("100g", 90.0)]
    [InlineData("100 gon", 90.0)]
    [InlineData("400", 360.0)]
    [InlineData("33.3333", 29.99997)]
    public void ParsesGons(string text, double degrees)
    {
        // common practice: 400 gon to the circle, 100 gon = 90°.
        var r = AnglePattern.Gons.Parse(text);
        Assert.True(r.Success, r.Error);
        Assert.Equal(degrees, r.Value.Degrees, 9);
    }

    [Theory]
    [InlineData("123.7655", 123.7655)]
    [InlineData("123.7655°", 123.7655)]
    [InlineData("123.7655d", 123.7655)]
    [InlineData("-0.25", -0.25)]
    public void ParsesDecimalDegrees(string text, double degrees)
    {
        var r = AnglePattern.Degrees.Parse(text);
        Assert.True(r.Success, r.Error);
        Assert.Equal(degrees, r.Value.Degrees, 12);
    }

    [Theory]
    [InlineData("1,5")]
    [InlineData("12-30-00")]
    [InlineData("")]
    public void RejectsIllegalDecimalDegrees(string text) => Assert.False(AnglePattern.Degrees.Parse(text).Success);

    [Fact]
    public void FormatsDmsWithCarryFromRounding()
    {
        // 29.99999" rounds to 30.0" and 59.96" to 60.0" → carried into the minutes and degrees.
        Assert.Equal("10-00-30.0", AnglePattern.Dms.Format(Angle.FromDms(10, 0, 29.99999)));
        Assert.Equal("11-00-00.0", AnglePattern.Dms.Format(Angle.FromDms(10, 59, 59.96)));
        Assert.Equal("-0-30-00.0", AnglePattern.Dms.Format(Angle.FromDegrees(-0.5)));
    }

    [Fact]
    public void ResidualReductionIsToMinusPiExclusivePiInclusive()
    {
        Assert.Equal(Math.PI, Angle.ReduceSigned(-Math.PI), 15);
        Assert.Equal(Math.PI, Angle.ReduceSigned(Math.PI), 15);
        Assert.Equal(-0.1, Angle.ReduceSigned((2 * Math.PI) - 0.1), 12);
        Assert.Equal(0.1, Angle.ReduceSigned((-4 * Math.PI) + 0.1), 12);
    }

    public static Arbitrary<double> Arcseconds() =>
        Gen.Choose(-1_296_000_00, 1_296_000_00).Select(i => i / 100.0).ToArbitrary();

    [FsCheck.Xunit.Property(Arbitrary = [typeof(AngleTests)])]
    public bool DmsRoundTripsToStatedResolution(double arcseconds)
    {
        // Format with 1 decimal of seconds: parsing back is within 0.05″ and formats identically.
        var a = Angle.FromArcseconds(arcseconds);
        string text = AnglePattern.Dms.Format(a);
        var back = AnglePattern.Dms.Parse(text).Value;
        return Math.Abs(back.Arcseconds - a.Arcseconds) <= 0.05 + 1e-7 && AnglePattern.Dms.Format(back) == text;
    }

    [FsCheck.Xunit.Property(Arbitrary = [typeof(AngleTests)])]
    public bool GonAndDegreeFormsRoundTrip(double arcseconds)
    {
        var a = Angle.FromArcseconds(arcseconds);
        var g = new AnglePattern(AngleFormat.Gons, 6);
        var d = new AnglePattern(AngleFormat.Degrees, 7);
        return Math.Abs(g.Parse(g.Format(a)).Value.Gons - a.Gons) <= 0.5e-6 + 1e-12
            && Math.Abs(d.Parse(d.Format(a)).Value.Degrees - a.Degrees) <= 0.5e-7 + 1e-12;
    }
}
