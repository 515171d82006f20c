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
        var (a, b) = (at.Plane(o.From), at.Plane(o.To));
        // An estimated k is the group's unknown: its current value, and one more partial derivative,
        // ∂z/∂k = −s/(2(R + H0)).
        string? group = o.RefractionEstimated ? o.RefractionGroup : null;
        double k = group is null ? o.Refraction : at.Refraction(group, o.Refraction);
        var eq = SpatialGeometry.Zenith(new Sighting(o.From, a, at.Height(o.From), o.InstrumentHeight.Metres, o.To, b,
            at.Height(o.To), o.TargetHeight.Metres) { PlaneHeight = o.PlaneHeight.Metres }, k);
        if (group is null) return eq;
        double s = Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));
        return eq with
        {
            Partials =
                [.. eq.Partials, new Partial(group, Parameter.Refraction,
                    SpatialGeometry.ZenithByRefraction(s, o.PlaneHeight.Metres))],
        };
    }

    /// <inheritdoc />
    public string? Instrument(Observation observation) => observation.From;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [observation.To];
}
