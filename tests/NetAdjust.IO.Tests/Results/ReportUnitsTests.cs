using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// The report's units format every value as the patterns of the library do (<see cref="LengthPattern.Format"/>,
/// <see cref="AnglePattern.FormatDirection"/>, and an azimuth that rounds up to a half turn written as zero), though
/// they make their formats once and parse a value back only near the turn: same text for every unit, including the
/// values that round up to the full or half turn.
/// </summary>
public sealed class ReportUnitsTests
{
    public static TheoryData<string, AngleFormat> Units() => new()
    {
        { "m", AngleFormat.Dms }, { "m", AngleFormat.Degrees }, { "m", AngleFormat.Gons },
        { "ft", AngleFormat.Dms }, { "usft", AngleFormat.Degrees }, { "mm", AngleFormat.Gons },
    };

    /// <summary>Directions spread over the circle, plus those next to zero and to the full and half turns, where the
    /// rounding of the last decimal carries into the degrees.</summary>
    private static IEnumerable<double> Radians()
    {
        var random = new Random(17);
        for (int i = 0; i < 2000; i++) yield return (random.NextDouble() * 4 * Math.PI) - Math.PI;
        foreach (double turn in new[] { 0.0, Math.PI, 2 * Math.PI })
            foreach (double step in new[] { 1e-15, 1e-12, 1e-9, 1e-7, 2.4e-6, 5e-6, 2.5e-5, 8.7e-5, 1e-4, 1e-3, 0.0099,
                         0.01, 0.0101, 0.05 })
            {
                yield return turn - step;
                yield return turn + step;
            }
    }

    [Theory]
    [MemberData(nameof(Units))]
    public void AnglesAreWrittenAsTheDirectionPatternWritesThem(string length, AngleFormat format)
    {
        var units = new ReportUnits(new ProjectUnits(LengthUnit.FromSymbol(length)!, format, AngleSdUnit.Arcsecond));
        var pattern = new AnglePattern(format, format == AngleFormat.Dms ? 1 : 5);
        foreach (double rad in Radians())
            Assert.Equal(pattern.FormatDirection(Angle.FromRadians(rad)), units.AngleValue(rad));
    }

    [Theory]
    [MemberData(nameof(Units))]
    public void AzimuthsThatRoundUpToAHalfTurnAreWrittenAsZero(string length, AngleFormat format)
    {
        var units = new ReportUnits(new ProjectUnits(LengthUnit.FromSymbol(length)!, format, AngleSdUnit.Arcsecond));
        // the azimuth of an ellipse axis lies in [0, half turn); written as the pattern writes it, or as zero when
        // it rounds up to the half turn (common practice: an axis at 180 degrees is the axis at 0)
        var pattern = format == AngleFormat.Dms ? new AnglePattern(AngleFormat.Dms, 0) : new AnglePattern(format, 2);
        foreach (double rad in Radians().Select(r => Math.Abs(r) % Math.PI))
        {
            string text = pattern.Format(Angle.FromRadians(rad));
            var back = pattern.Parse(text);
            string expected = back.Success && back.Value.Radians >= Math.PI - 1e-12
                ? pattern.Format(Angle.Zero) : text;
            Assert.Equal(expected, units.Azimuth(rad));
        }
        Assert.Equal(pattern.Format(Angle.Zero), units.Azimuth(Math.PI - 1e-9));
    }

    [Theory]
    [MemberData(nameof(Units))]
    public void LengthsAreWrittenAsTheLengthPatternWritesThem(string length, AngleFormat format)
    {
        var unit = LengthUnit.FromSymbol(length)!;
        var units = new ReportUnits(new ProjectUnits(unit, format, AngleSdUnit.Arcsecond));
        var pattern = new LengthPattern(unit, ReportUnits.Decimals);
        var random = new Random(5);
        for (int i = 0; i < 2000; i++)
        {
            double m = (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-5, 7));
            Assert.Equal(pattern.Format(Length.FromMetres(m)), units.Length(m));
            Assert.Equal(pattern.Format(Length.FromMetres(m)), units.SmallLength(m));
        }
        Assert.Equal("-", units.Length(double.NaN));
        Assert.Equal("-", units.Length(null));
    }
}
