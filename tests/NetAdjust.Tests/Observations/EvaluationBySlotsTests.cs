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

    // Invented marks in UTM zone 33 (demo data), with heights; B3 has plane coordinates only.
    private static ParameterState SpatialState() => new(
        new Dictionary<string, double>(StringComparer.Ordinal) { ["B1"] = 512_300.0, ["B2"] = 516_850.4, ["B3"] = 1 },
        new Dictionary<string, double>(StringComparer.Ordinal)
            { ["B1"] = 5_262_100.0, ["B2"] = 5_263_402.2, ["B3"] = 1 },
        new Dictionary<string, double>(StringComparer.Ordinal) { ["B1"] = 412.3, ["B2"] = 455.8 },
        new Dictionary<string, double>(StringComparer.Ordinal));

    public static TheoryData<int, bool> BaselineComponents() =>
        new() { { 0, false }, { 1, false }, { 2, true }, { 0, true } };

    [Theory]
    [MemberData(nameof(BaselineComponents))]
    public void ABaselineComponentEvaluatedBySlotsMatchesItsEquationByNames(int component, bool ownSeparation)
    {
        var state = SpatialState();
        IIndexedCoordinates at = state;
        var grid = Network.BaselineTestNetworks.Grid;
        if (ownSeparation)
            grid = grid with { PointGeoidSeparations = new Dictionary<string, double> { ["B2"] = 44.9 } };
        var (frameWithout, rotated) = (new BaselineFrame("gnss", FrameParameterSet.None),
            new BaselineFrame("gnss", FrameParameterSet.Rotations));
        var o = new BaselineObservation("B1", "B2", Length.FromMetres(-4550.1), Length.FromMetres(1302.2),
            Length.FromMetres(43.5)) { Component = (BaselineComponent)component, Grid = grid, Frame = frameWithout };
        var byNames = ObservationKindRegistry.Evaluate(o, state);
        Span<int> slots = stackalloc int[ObservationKindRegistry.MostSlots];
        int ns = ObservationKindRegistry.Slots(o, at, slots);
        Assert.Equal(2, ns);
        var d = new double[8];
        double value = ObservationKindRegistry.EvaluateInto(o, at, slots[..ns], d, out int count);
        Assert.Equal(BitConverter.DoubleToInt64Bits(byNames.Value), BitConverter.DoubleToInt64Bits(value));
        Assert.Equal(6, count);
        Assert.Equal(byNames.Partials.Length, count);
        var by = ObservationKindRegistry.PartialsBySlot(o.Kind);
        for (int k = 0; k < count; k++)
        {
            var p = byNames.Partials[k];
            Assert.Equal(BitConverter.DoubleToInt64Bits(p.Derivative), BitConverter.DoubleToInt64Bits(d[k]));
            Assert.Equal(p.Parameter, by[k].Parameter);
            Assert.Equal(at.SpatialSlotOrNone(p.Owner), slots[by[k].Slot]);
        }
        // frame rotations (unknowns that are not points'), an end without a height, no projection: by names
        Assert.Equal(0, ObservationKindRegistry.Slots(o with { Frame = rotated }, at, slots));
        Assert.Equal(0, ObservationKindRegistry.Slots(o with { Grid = grid with { Projection = null } }, at, slots));
        Assert.Equal(0, ObservationKindRegistry.Slots(
            new BaselineObservation("B1", "B3", Length.FromMetres(1), Length.FromMetres(1), Length.FromMetres(1))
                { Grid = grid }, at, slots));
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
