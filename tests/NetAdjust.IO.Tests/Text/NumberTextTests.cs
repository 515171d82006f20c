using System.Globalization;
using System.Text;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using NetAdjust.IO.Text;

namespace NetAdjust.IO.Tests.Text;

/// <summary>
/// The fast number texts of the writers against the reference they must equal character for character: the .NET
/// runtime's own invariant formatting (<c>double.ToString("F<i>d</i>")</c>, and the default shortest round-trip
/// text that <see cref="System.Text.Json.Utf8JsonWriter"/> writes). Any difference would change the bytes of every
/// report and JSON document.
/// </summary>
public class NumberTextTests
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static string Shortest(double x)
    {
        Span<byte> utf8 = stackalloc byte[32];
        int n = NumberText.Shortest(x, utf8);
        return Encoding.UTF8.GetString(utf8[..n]);
    }

    /// <summary>Every double, drawn as any 64-bit pattern (NaN, infinities, subnormals, both zeros included).</summary>
    private static readonly Gen<double> AnyBits =
        ArbMap.Default.GeneratorFor<long>().Select(BitConverter.Int64BitsToDouble);

    /// <summary>Values as survey outputs hold them: coordinates, lengths, residuals and sds of either sign, with
    /// between 0 and 17 significant digits.</summary>
    private static readonly Gen<double> SurveyValues =
        from mantissa in ArbMap.Default.GeneratorFor<long>()
        from exponent in Gen.Choose(-12, 8)
        from digits in Gen.Choose(0, 10)
        select Math.Round(mantissa / 9.223372036854775807e18 * Math.Pow(10, exponent), digits + 4);

    [Property(MaxTest = 5000)]
    public Property FixedTextEqualsTheRuntimesForAnyDouble() =>
        Prop.ForAll(AnyBits.ToArbitrary(), Gen.Choose(0, 10).ToArbitrary(),
            (x, d) => NumberText.Fixed(x, d) == x.ToString("F" + d, Inv));

    [Property(MaxTest = 5000)]
    public Property FixedTextEqualsTheRuntimesForSurveyValues() =>
        Prop.ForAll(SurveyValues.ToArbitrary(), Gen.Choose(0, 8).ToArbitrary(),
            (x, d) => NumberText.Fixed(x, d) == x.ToString("F" + d, Inv));

    [Property(MaxTest = 5000)]
    public Property ShortestTextEqualsTheRuntimesForAnyDouble() =>
        Prop.ForAll(AnyBits.ToArbitrary(), x => Shortest(x) == x.ToString(Inv));

    [Property(MaxTest = 5000)]
    public Property ShortestTextEqualsTheRuntimesForSurveyValues() =>
        Prop.ForAll(SurveyValues.ToArbitrary(), x => Shortest(x) == x.ToString(Inv));

    /// <summary>A seeded sweep of a million values of the kinds a report holds, for both texts.</summary>
    [Fact]
    public void ASeededSweepOfReportValuesGivesTheRuntimesText()
    {
        var random = new Random(20261202);
        for (int i = 0; i < 1_000_000; i++)
        {
            double x = (i % 4) switch
            {
                0 => 100_000 + (random.NextDouble() * 900_000),                       // a grid coordinate
                1 => (random.NextDouble() - 0.5) * 0.02,                               // a residual (m)
                2 => random.NextDouble() * 360,                                        // an angle (degrees)
                _ => (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-9, 16)),  // anything else
            };
            int d = random.Next(0, 9);
            Assert.Equal(x.ToString("F" + d, Inv), NumberText.Fixed(x, d));
            Assert.Equal(x.ToString(Inv), Shortest(x));
        }
    }

    /// <summary>The edges where a fast path must hand over or get the layout right: exact ties (the runtime's
    /// rounding rule decides), negative values that round to zero, both zeros, the switch to exponent notation at
    /// 1e15 and 1e-5, the smallest and largest doubles, and the non-finite values.</summary>
    [Theory]
    [InlineData(0.125)]
    [InlineData(2.5)]
    [InlineData(-2.5)]
    [InlineData(1.0005)]
    [InlineData(-0.00001)]
    [InlineData(-0.00005)]
    [InlineData(0.0)]
    [InlineData(1e15)]
    [InlineData(999999999999999.9)]
    [InlineData(123456789012345.6)]
    [InlineData(1e16)]
    [InlineData(0.0001)]
    [InlineData(0.00001)]
    [InlineData(1e-7)]
    [InlineData(5e-324)]
    [InlineData(double.MaxValue)]
    [InlineData(double.MinValue)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    [InlineData(9007199254740993.0)]
    [InlineData(0.1 + 0.2)]
    [InlineData(100.0)]
    [InlineData(1.0 / 3.0)]
    public void EdgesGiveTheRuntimesText(double x)
    {
        for (int d = 0; d <= 10; d++) Assert.Equal(x.ToString("F" + d, Inv), NumberText.Fixed(x, d));
        Assert.Equal(x.ToString(Inv), Shortest(x));
    }

    /// <summary>Negative zero (kept apart from 0.0, which a theory's data would count as the same case).</summary>
    [Fact]
    public void NegativeZeroGivesTheRuntimesText() => EdgesGiveTheRuntimesText(-0.0);

    /// <summary>The fast paths do take the common values (else the writers would be no faster): a coordinate and a
    /// residual are settled without the runtime.</summary>
    [Fact]
    public void CommonValuesTakeTheFastPath()
    {
        Span<char> text = stackalloc char[48];
        Span<byte> utf8 = stackalloc byte[32];
        Assert.True(NumberText.TryFixed(512345.67891234, 4, text, out int n));
        Assert.Equal("512345.6789", new string(text[..n]));
        Assert.True(NumberText.TryShortest(-0.0012903559889967389, utf8, out n));
        Assert.Equal("-0.0012903559889967389", Encoding.UTF8.GetString(utf8[..n]));
    }
}
