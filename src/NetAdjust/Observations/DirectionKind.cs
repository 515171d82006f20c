using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>Horizontal direction r = t(station→target) − ω, with ω the orientation unknown of its set.</summary>
public sealed class DirectionKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Direction;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Angle;

    /// <inheritdoc />
    public string ReportLabel => "direction";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.None;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.CircleReading;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } =
        new("directions", ["to", "value", "sd", "target"], ["at", "to", "value", "sd", "set"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at)
    {
        var d = (DirectionObservation)observation;
        return PlaneGeometry.Direction(d.Station, at.Plane(d.Station), d.Target, at.Plane(d.Target), d.SetId,
            at.Orientation(d.SetId));
    }

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.At;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.To];
}
