using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.Tests.Observations;

/// <summary>
/// The evaluation the iterations use (<see cref="ObservationKindRegistry.EvaluateInto"/>: the plane kinds at their
/// points' slots, into a span) against the public equations by names (<see cref="ObservationKindRegistry.Evaluate"/>,
/// checked against published values in Geometry/): the same value and derivatives to the bit, and each derivative
/// taken by the same point (or set) and parameter.
/// </summary>
public class EvaluationBySlotsTests
{
    // Invented coordinates (demo data); P3 has a height only.
    private static ParameterState State() => new(
        new Dictionary<string, double>(StringComparer.Ordinal) { ["P1"] = 1000.0, ["P2"] = 1431.25, ["P4"] = 874.5 },
        new Dictionary<string, double>(StringComparer.Ordinal) { ["P1"] = 5000.0, ["P2"] = 5212.75, ["P4"] = 5399.1 },
        new Dictionary<string, double>(StringComparer.Ordinal) { ["P1"] = 101.2, ["P3"] = 99.875 },
        new Dictionary<string, double>(StringComparer.Ordinal) { ["P1/1"] = 0.7 });

    public static TheoryData<Observation> PlaneKinds() =>
    [
        new DistanceObservation("P1", "P2", Length.FromMetres(476.0)),
        new DirectionObservation("P1", "P4", Angle.FromDegrees(301.5), "P1/1"),
        new AzimuthObservation("P2", "P4", Angle.FromDegrees(290.0)),
        new AngleObservation("P1", "P2", "P4", Angle.FromDegrees(267.0)),
    ];

    [Theory]
    [MemberData(nameof(PlaneKinds))]
    public void APlaneKindEvaluatedBySlotsMatchesItsEquationByNames(Observation o)
    {
        var state = State();
        IIndexedCoordinates at = state;
        var byNames = ObservationKindRegistry.Evaluate(o, state);
        Span<int> slots = stackalloc int[ObservationKindRegistry.MostSlots];
        int ns = ObservationKindRegistry.Slots(o, at, slots);
        Assert.True(ns > 0);
        var d = new double[8];
        double value = ObservationKindRegistry.EvaluateInto(o, at, slots[..ns], d, out int count);
        Assert.Equal(BitConverter.DoubleToInt64Bits(byNames.Value), BitConverter.DoubleToInt64Bits(value));
        Assert.Equal(byNames.Partials.Length, count);
        var by = ObservationKindRegistry.PartialsBySlot(o.Kind);
        Assert.Equal(count, by.Length);
        for (int k = 0; k < count; k++)
        {
            var p = byNames.Partials[k];
            Assert.Equal(BitConverter.DoubleToInt64Bits(p.Derivative), BitConverter.DoubleToInt64Bits(d[k]));
            Assert.Equal(p.Parameter, by[k].Parameter);
            int expected = p.Parameter == Parameter.Orientation ? at.SetSlot(p.Owner) : at.PlaneSlot(p.Owner);
            Assert.Equal(expected, slots[by[k].Slot]);
        }
    }

    [Fact]
    public void AKindWithoutSlotsIsEvaluatedByNames()
    {
        var state = State();
        var o = new HeightDifferenceObservation("P1", "P3", Length.FromMetres(-1.3));
        Span<int> slots = stackalloc int[ObservationKindRegistry.MostSlots];
        Assert.Equal(0, ObservationKindRegistry.Slots(o, state, slots));
        var d = new double[8];
        double value = ObservationKindRegistry.EvaluateInto(o, state, [], d, out int count);
        var byNames = ObservationKindRegistry.Evaluate(o, state);
        Assert.Equal(byNames.Value, value);
        Assert.Equal(byNames.Partials.Select(p => p.Derivative), d.Take(count));
    }

    [Fact]
    public void APointWithoutPlaneCoordinatesHasNoPlaneSlot()
    {
        IIndexedCoordinates at = State();
        Assert.Throws<KeyNotFoundException>(() => at.PlaneSlot("P3"));
        Assert.Throws<KeyNotFoundException>(() => at.PlaneSlot("P9"));
        Assert.Throws<KeyNotFoundException>(() => at.SetSlot("P2/1"));
    }
}
