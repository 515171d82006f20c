using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary>
/// <see cref="Observation.Excluded"/>, <see cref="Observation.SdFactor"/>, <see cref="Observation.Weighting"/> and
/// <see cref="Observation.SetupId"/> are kept together in one small record (null when all four have their defaults),
/// but they must behave as the four init-only properties of the public API: defaults false, 1, null, null; each set
/// alone, or after another, without touching the others; an observation set back to the defaults equal to (with the
/// hash code of) one never set; and records equal only when all four are (C# records compare their members; common
/// practice).
/// </summary>
public class ObservationMarksTests
{
    private static readonly ObservationWeighting Level =
        new() { Level = LevelSpecification.PerKm("L1", Length.FromMillimetres(0.7)) };

    private static DistanceObservation Plain() => new("A", "B", Length.FromMetres(123.456));

    [Fact]
    public void AnObservationMadeWithoutMarksHasTheDefaults()
    {
        var o = Plain();
        Assert.False(o.Excluded);
        Assert.Equal(1.0, o.SdFactor);
        Assert.Null(o.Weighting);
        Assert.Null(o.SetupId);
    }

    [Fact]
    public void EachMarkIsSetWithoutTouchingTheOthers()
    {
        var excluded = Plain() with { Excluded = true };
        Assert.True(excluded.Excluded);
        Assert.Equal((1.0, null, null), (excluded.SdFactor, excluded.Weighting, excluded.SetupId));
        var factor = excluded with { SdFactor = 2.5 };
        Assert.Equal((true, 2.5, null, null), (factor.Excluded, factor.SdFactor, factor.Weighting, factor.SetupId));
        var weighted = factor with { Weighting = Level };
        Assert.Equal((true, 2.5), (weighted.Excluded, weighted.SdFactor));
        Assert.Same(Level, weighted.Weighting);
        var setup = weighted with { SetupId = "A#1" };
        Assert.Equal((true, 2.5, "A#1"), (setup.Excluded, setup.SdFactor, setup.SetupId));
        Assert.Same(Level, setup.Weighting);
        Assert.False(excluded.SdFactor != 1.0 || Plain().Excluded); // the earlier records are unchanged
        var only = Plain() with { SetupId = "B#2" };
        Assert.Equal((false, 1.0, null, "B#2"), (only.Excluded, only.SdFactor, only.Weighting, only.SetupId));
    }

    [Fact]
    public void MarksSetBackToTheDefaultsAreNoMarks()
    {
        var back = Plain() with { Excluded = true, SdFactor = 3, SetupId = "A#1", Weighting = Level };
        back = back with { Excluded = false, SdFactor = 1.0, SetupId = null, Weighting = null };
        Assert.Equal(Plain(), back);
        Assert.Equal(Plain().GetHashCode(), back.GetHashCode());
    }

    [Fact]
    public void ObservationsAreEqualOnlyWhenEveryMarkIs()
    {
        var marked = Plain() with { Excluded = true, SdFactor = 3, SetupId = "A#1", Weighting = Level };
        var same = Plain() with { Weighting = Level, SetupId = "A#1", SdFactor = 3, Excluded = true };
        Assert.Equal(marked, same);
        Assert.Equal(marked.GetHashCode(), same.GetHashCode());
        Assert.NotEqual(marked, marked with { Excluded = false });
        Assert.NotEqual(marked, marked with { SdFactor = 3.5 });
        Assert.NotEqual(marked, marked with { SetupId = "A#2" });
        Assert.NotEqual(marked, marked with { Weighting = null });
        Assert.NotEqual(Plain(), Plain() with { Excluded = true });
    }

    [Fact]
    public void DefaultMarksCostNoMemory()
    {
        // a reader of many rows writes the defaults into every observation: they must not make a record each time
        static long Allocated(Func<Observation> make)
        {
            make();
            long before = GC.GetAllocatedBytesForCurrentThread();
            var o = make();
            long after = GC.GetAllocatedBytesForCurrentThread();
            GC.KeepAlive(o);
            return after - before;
        }
        long plain = Allocated(Plain);
        long defaults = Allocated(() => new DistanceObservation("A", "B", Length.FromMetres(123.456))
            { Excluded = false, SdFactor = 1.0, Weighting = null, SetupId = null });
        Assert.Equal(plain, defaults);
        // a mark does take its record
        Assert.True(Allocated(() => new DistanceObservation("A", "B", Length.FromMetres(123.456)) { SetupId = "A#1" })
            > plain);
    }
}
