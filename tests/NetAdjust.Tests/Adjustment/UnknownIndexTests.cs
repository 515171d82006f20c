using NetAdjust.Adjustment;
using NetAdjust.Geometry;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// The numbering of the unknowns (<see cref="UnknownIndex"/>): an unknown keeps the number it was first given, a
/// second addition of it changes nothing, and room made beforehand changes no number.
/// </summary>
public class UnknownIndexTests
{
    [Fact]
    public void AnUnknownKeepsItsFirstNumberAndIsListedOnce()
    {
        var index = new UnknownIndex();
        index.Add(new Unknown("P1", Parameter.E));
        index.Add(new Unknown("P1", Parameter.N));
        index.Add(new Unknown("P1", Parameter.E)); // again: nothing changes
        index.Add(new Unknown("S1", Parameter.Orientation));
        Assert.Equal(3, index.Count);
        Assert.Equal(0, index.IndexOf("P1", Parameter.E));
        Assert.Equal(1, index.IndexOf("P1", Parameter.N));
        Assert.Equal(2, index.IndexOf("S1", Parameter.Orientation));
        Assert.Equal(-1, index.IndexOf("P1", Parameter.H));
        Assert.Equal([new Unknown("P1", Parameter.E), new Unknown("P1", Parameter.N),
            new Unknown("S1", Parameter.Orientation)], index.Unknowns);
    }

    [Fact]
    public void RoomMadeBeforehandChangesNoNumber()
    {
        var plain = new UnknownIndex();
        var roomy = new UnknownIndex();
        roomy.EnsureCapacity(10);
        for (int i = 0; i < 1000; i++)
        {
            var u = new Unknown($"P{i % 700}", i % 2 == 0 ? Parameter.E : Parameter.N);
            plain.Add(u);
            roomy.Add(u);
            if (i == 500) roomy.EnsureCapacity(roomy.Count + 600);
        }
        Assert.Equal(plain.Unknowns, roomy.Unknowns);
        foreach (var u in plain.Unknowns)
            Assert.Equal(plain.IndexOf(u.Owner, u.Parameter), roomy.IndexOf(u.Owner, u.Parameter));
    }
}
