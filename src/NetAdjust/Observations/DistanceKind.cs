using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>Horizontal distance d = √(ΔE² + ΔN²) from the instrument (from) to the target (to).</summary>
public sealed class DistanceKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Distance;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Length;

    /// <inheritdoc />
    public string ReportLabel => "distance";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.Scale;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.ElectronicDistance;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } =
        new("distances", ["to", "value", "sd", "target"], ["from", "to", "value", "sd"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at) =>
        PlaneGeometry.Distance(observation.From, at.Plane(observation.From), observation.To, at.Plane(observation.To));

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.From;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.To];
}
