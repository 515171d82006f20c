using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>Horizontal angle α = t(at→foresight) − t(at→backsight), clockwise, in [0, 2π).</summary>
public sealed class AngleKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Angle;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Angle;

    /// <inheritdoc />
    public string ReportLabel => "angle";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.None;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.CircleReadingDifference;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } =
        new("angles", ["from", "to", "value", "sd", "target"], ["at", "from", "to", "value", "sd"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at) =>
        PlaneGeometry.Angle(observation.At!, at.Plane(observation.At!), observation.From, at.Plane(observation.From),
            observation.To, at.Plane(observation.To));

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.At;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.From, observation.To];
}
