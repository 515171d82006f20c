using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// Zenith angle (0 at the zenith) from the instrument to the target over a spherical earth, through a line of sight
/// refracted with the observation's coefficient k (<see cref="SpatialGeometry.Zenith"/>).
/// </summary>
public sealed class ZenithKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Zenith;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Angle;

    /// <inheritdoc />
    public string ReportLabel => "zenith";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane | CoordinateAxes.Height;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.None;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.ZenithReading;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } =
        new("zeniths", ["to", "value", "sd", "target", "target_height"], ["from", "to", "value", "sd"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at)
    {
        var o = (ZenithObservation)observation;
        return SpatialGeometry.Zenith(new Sighting(o.From, at.Plane(o.From), at.Height(o.From),
            o.InstrumentHeight.Metres, o.To, at.Plane(o.To), at.Height(o.To), o.TargetHeight.Metres), o.Refraction);
    }

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.From;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.To];
}
