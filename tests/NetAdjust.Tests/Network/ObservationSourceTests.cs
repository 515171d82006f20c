using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary>
/// <see cref="Observation.Source"/> is kept compactly (<see cref="SourceText"/>: a file and a line whose text is made
/// when asked), but it must behave as the plain string property it is in the public API: no source is null, and
/// equality and hash code are those of the text however it is kept (C# records compare their members; common
/// practice). Regression: an observation made without a source reported ":0".
/// </summary>
public class ObservationSourceTests
{
    private static DistanceObservation Plain() => new("A", "B", Length.FromMetres(123.456));

    [Fact]
    public void AnObservationMadeWithoutASourceHasNone()
    {
        var o = Plain();
        Assert.Null(o.Source);
        Assert.Null(o.BookedText);
        Assert.DoesNotContain("(", o.Describe(), StringComparison.Ordinal);
        var explicitNull = o with { Source = null };
        Assert.Equal(o, explicitNull);
        Assert.Equal(o.GetHashCode(), explicitNull.GetHashCode());
        Assert.NotEqual(o, o with { Source = "site.csv:0" });
    }

    [Theory]
    [InlineData("site.csv", 0)]
    [InlineData("site.csv", 41)]
    [InlineData("dir/obs 2.csv", 123456789)]
    public void AFileAndLineBehaveAsTheirText(string file, int line)
    {
        string text = $"{file}:{line.ToString(System.Globalization.CultureInfo.InvariantCulture)}";
        var compact = Plain() with { SourcePlace = SourceText.At(file, line) };
        var plain = Plain() with { Source = text };
        Assert.Equal(text, compact.Source);
        Assert.Equal(plain, compact);
        Assert.Equal(compact, plain);
        Assert.Equal(plain.GetHashCode(), compact.GetHashCode());
        Assert.NotEqual(Plain(), compact);
        Assert.NotEqual(Plain() with { Source = text + "0" }, compact);
        Assert.EndsWith($"({text})", compact.Describe(), StringComparison.Ordinal);
    }
}
