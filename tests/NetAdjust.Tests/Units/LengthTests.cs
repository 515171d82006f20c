using NetAdjust.Units;

namespace NetAdjust.Tests.Units;

public class LengthTests
{
    [Fact]
    public void InternationalFootIsExactly0_3048Metre()
    {
        // Federal Register 24 FR 5348 (1 July 1959): 1 international foot = 0.3048 m exactly.
        Assert.Equal(0.3048, LengthUnit.InternationalFoot.MetresPerUnit);
        Assert.Equal(0.3048, Length.FromInternationalFeet(1).Metres);
    }

    [Fact]
    public void UsSurveyFootIs1200Over3937Metre()
    {
        // Federal Register 24 FR 5348 (1959) and 85 FR 62698 (2020): 1 US survey foot = 1200/3937 m.
        Assert.Equal(1200.0 / 3937.0, LengthUnit.UsSurveyFoot.MetresPerUnit);
        Assert.Equal(1200.0 / 3937.0, Length.FromUsSurveyFeet(1).Metres); // the correctly rounded quotient, bit-exact
        // 1200/3937 to 17 digits (docs/references.md §1).
        Assert.Equal(0.30480060960121924, Length.FromUsSurveyFeet(1).Metres, 1e-16);
    }

    [Fact]
    public void SurveyMileExceedsInternationalMileByAbout0_01056Foot()
    {
        // NIST/NOAA deprecation notice (85 FR 62698, 2020): the two feet differ by 2 ppm, about 0.01056 ft per mile.
        double diffFeet = Length.FromUsSurveyFeet(5280).InternationalFeet - 5280;
        Assert.Equal(0.01056, diffFeet, 5);
    }

    [Theory]
    [InlineData("412.3456", "m", 412.3456)]
    [InlineData("412.3456 m", "ft", 412.3456)]
    [InlineData("3mm", "m", 0.003)]
    [InlineData("3 mm", "usft", 0.003)]
    [InlineData("2.5 cm", "m", 0.025)]
    [InlineData("10 ft", "m", 3.048)]
    [InlineData("100", "ft", 30.48)]
    [InlineData("1.5e-3", "m", 0.0015)]
    [InlineData("-2.4368", "m", -2.4368)]
    [InlineData("0.45 km", "m", 450)]
    public void ParsesLegalLengths(string text, string unit, double metres)
    {
        var r = new LengthPattern(LengthUnit.FromSymbol(unit)!, 4).Parse(text);
        Assert.True(r.Success, r.Error);
        Assert.Equal(metres, r.Value.Metres, 12);
    }

    [Theory]
    [InlineData("412,3456", "not a length")]
    [InlineData("12 yd", "'yd'")]
    [InlineData("m", "not a length")]
    [InlineData("", "empty")]
    [InlineData("   ", "empty")]
    [InlineData("1.2.3", "not a length")]
    public void RejectsIllegalLengthsWithAMessage(string text, string expectedInMessage)
    {
        var r = LengthPattern.Metres.Parse(text);
        Assert.False(r.Success);
        Assert.Contains(expectedInMessage, r.Error);
    }

    [FsCheck.Xunit.Property]
    public bool LengthRoundTripsToStatedResolution(int micro, bool feet)
    {
        // Format then parse recovers the value to half a unit of the last decimal shown.
        var unit = feet ? LengthUnit.InternationalFoot : LengthUnit.Metre;
        var pattern = new LengthPattern(unit, 4);
        var length = Length.From(micro * 1e-6, unit);
        var back = pattern.Parse(pattern.Format(length)).Value;
        return Math.Abs(back.In(unit) - length.In(unit)) <= 0.5e-4 + 1e-12
            && pattern.Format(back) == pattern.Format(length);
    }
}
