using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// Slope distance: the chord from the instrument (mark height + instrument height) to the target (mark height +
/// target height) over a spherical earth (<see cref="SpatialGeometry.SlopeDistance"/>).
/// </summary>
public sealed class SlopeDistanceKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.SlopeDistance;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Length;

    /// <inheritdoc />
    public string ReportLabel => "slope";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane | CoordinateAxes.Height;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.Scale;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.ElectronicDistance;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } =
        new("slope_distances", ["to", "value", "sd", "target", "target_height"], ["from", "to", "value", "sd"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at)
    {
        var o = (SlopeDistanceObservation)observation;
        return SpatialGeometry.SlopeDistance(new Sighting(o.From, at.Plane(o.From), at.Height(o.From),
            o.InstrumentHeight.Metres, o.To, at.Plane(o.To), at.Height(o.To), o.TargetHeight.Metres)
        {
            PlaneHeight = o.PlaneHeight.Metres,
        });
    }

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.From;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.To];
}
