using NetAdjust.Diagnosis;

namespace NetAdjust.Tests.Diagnosis;

public class TranspositionTests
{
    [Fact]
    public void DecimalTextGivesEveryAdjacentSwapLeftToRight()
    {
        // Worked by hand (docs/diagnosis.md, "Transposition"): 1-2, 2-3 | 4-5, 5-6, 6-7; no swap crosses the point.
        Assert.Equal(["213.4567", "132.4567", "123.5467", "123.4657", "123.4576"],
            BlunderDiagnosis.Transpositions("123.4567"));
    }

    [Fact]
    public void EqualDigitsAndDuplicatesAreLeftOut()
    {
        // Worked by hand: in 112.2 the pair 1-1 gives the text unchanged; 1-2 gives 121.2; the 2 before the point
        // and the one after it are not adjacent characters.
        Assert.Equal(["121.2"], BlunderDiagnosis.Transpositions("112.2"));
        // Worked by hand: 1010 gives 0110, 1100, 1001 (two different swaps never give one text: each changes
        // its own pair of places).
        Assert.Equal(["0110", "1100", "1001"], BlunderDiagnosis.Transpositions("1010"));
        Assert.Empty(BlunderDiagnosis.Transpositions("7.7"));
        Assert.Empty(BlunderDiagnosis.Transpositions(""));
    }

    [Fact]
    public void DmsWithSymbolsSwapsWithinEachField()
    {
        // Worked by hand: 123°45'12.3" — degrees 1-2, 2-3; minutes 4-5; seconds 1-2; the marks stay in place.
        Assert.Equal(["213°45'12.3\"", "132°45'12.3\"", "123°54'12.3\"", "123°45'21.3\""],
            BlunderDiagnosis.Transpositions("123°45'12.3\""));
    }

    [Fact]
    public void HyphenatedDmsSwapsWithinEachField()
    {
        // Worked by hand for the project's DMS form D-M-S.s: 87-06-58.4 — 8-7; 0-6; 5-8; the decimal 4 stands alone.
        // 60 minutes and 85 seconds are texts a transposition can give; the diagnosis drops those it cannot read.
        Assert.Equal(["78-06-58.4", "87-60-58.4", "87-06-85.4"], BlunderDiagnosis.Transpositions("87-06-58.4"));
    }
}

public class TranspositionValueTests
{
    [Theory]
    // booked text, candidate, booked SI value, expected SI value of the candidate (hand-worked)
    [InlineData("419.3846", "419.3486", 419.3846, 419.3486)]
    [InlineData("419.3846 ft", "419.3486 ft", 127.8291, 127.8291 * 419.3486 / 419.3846)] // the unit factor kept
    public void ACandidateTextKeepsTheUnitOfTheBookedText(string booked, string text, double value, double expected)
    {
        var o = new NetAdjust.Network.DistanceObservation("A", "B", NetAdjust.Units.Length.FromMetres(value));
        Assert.Equal(expected, BlunderDiagnosis.ValueOfText(o, booked, text)!.Value, 1e-9);
        double back = BlunderDiagnosis.ValueOfText(o, text, booked)!.Value;
        Assert.Equal(booked, BlunderDiagnosis.TextOfValue(o, text, back)); // written back in the text's unit
    }

    [Fact]
    public void ADmsCandidateAddsItsDifferenceInArcseconds()
    {
        // Hand-worked: 87-06-58.4 → 78-06-58.4 is 9° less.
        var o = new NetAdjust.Network.ZenithObservation("A", "B", NetAdjust.Units.Angle.FromDms(87, 6, 58.4),
            NetAdjust.Units.Length.FromMetres(1.5), NetAdjust.Units.Length.FromMetres(1.6));
        double v = BlunderDiagnosis.ValueOfText(o, "87-06-58.4", "78-06-58.4")!.Value;
        Assert.Equal(NetAdjust.Units.Angle.FromDms(78, 6, 58.4).Radians, v, 1e-12);
        Assert.Null(BlunderDiagnosis.ValueOfText(o, "87-06-58.4", "87-60-58.4")); // 60 minutes cannot be read
        Assert.Equal("78-06-58.4", BlunderDiagnosis.TextOfValue(o, "87-06-58.4", v));
    }
}
