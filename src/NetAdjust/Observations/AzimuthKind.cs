using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// Grid azimuth t = atan2(ΔE, ΔN), clockwise from grid north. Given as data (e.g. from a bearing of record), it is
/// not weighted from a total station, so it has no instrument for centering.
/// </summary>
public sealed class AzimuthKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Azimuth;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Angle;

    /// <inheritdoc />
    public string ReportLabel => "azimuth";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.Orientation;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.Given;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } = new("azimuths", ["to", "value", "sd"], ["from", "to", "value", "sd"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at) =>
        PlaneGeometry.Azimuth(observation.From, at.Plane(observation.From), observation.To, at.Plane(observation.To));

    /// <inheritdoc />
    public string? Instrument(Observation observation) => null;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [];
}
