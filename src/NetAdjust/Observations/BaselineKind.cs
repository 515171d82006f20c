using NetAdjust.Geodesy;
using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// One component (ΔX, ΔY or ΔZ) of a GNSS baseline (<see cref="BaselineObservation"/>), modelled through the exact
/// chain grid → geodetic → geocentric (<see cref="BaselineGeometry"/>); its three components share one 3×3 weight
/// block. It uses the plane coordinates and the heights of both ends and fixes orientation and scale (the vector's
/// direction and length), not the position nor the height datum.
/// </summary>
public sealed class BaselineKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.Baseline;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Length;

    /// <inheritdoc />
    public string ReportLabel => "baseline";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Plane | CoordinateAxes.Height;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.Orientation | DatumElements.Scale;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.Given;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } = new("gnss.baselines",
        ["from", "to", "dx", "dy", "dz", "sd", "corr", "cov", "group", "exclude", "sd_factor"],
        ["from", "to", "dx", "dy", "dz", "sd_x", "sd_y", "sd_z", "r_xy", "r_xz", "r_yz", "group"]);

    /// <inheritdoc />
    /// <exception cref="InvalidInputException">When the baseline has no grid system with a projection.</exception>
    public EquationValue Evaluate(Observation observation, ICoordinates at)
    {
        ArgumentNullException.ThrowIfNull(observation);
        ArgumentNullException.ThrowIfNull(at);
        var b = (BaselineObservation)observation;
        if (b.Grid?.Projection is not { } projection)
            throw new InvalidInputException($"{b.Describe()}: a GNSS baseline needs the project's map projection " +
                "(crs and grid) to be modelled on the grid");
        BaselineEnd End(string id) => EndAt(b.Grid, id, at.Plane(id), at.Height(id));
        FrameState? frame = b.Frame is { HasRotations: true } f
            ? new FrameState(f.Id, at.Frame(f.Id, Parameter.FrameRotationX), at.Frame(f.Id, Parameter.FrameRotationY),
                at.Frame(f.Id, Parameter.FrameRotationZ), f.HasScale ? at.Frame(f.Id, Parameter.FrameScale) : 0,
                true, f.HasScale)
            : null;
        return BaselineGeometry.Component(projection, End(b.From), End(b.To), (int)b.Component, frame);
    }

    /// <summary>True when the component can be evaluated by its ends' slots
    /// (<see cref="ObservationKindRegistry.Slots"/>): it is modelled on a projection and has no frame rotations
    /// (which would add unknowns that are not points').</summary>
    internal static bool BySlots(BaselineObservation b) =>
        b.Grid?.Projection is not null && b.Frame is not { HasRotations: true };

    /// <summary><see cref="Evaluate"/> of a component for which <see cref="BySlots"/> holds, at its ends' slots
    /// (start, end), without allocating: the same arithmetic (<see cref="BaselineGeometry.ComponentInto"/>), the
    /// derivatives in the order of <see cref="Evaluate"/>'s partials.</summary>
    internal static double EvaluateInto(BaselineObservation b, IIndexedCoordinates at, ReadOnlySpan<int> slots,
        Span<double> partials, out int count)
    {
        var grid = b.Grid!;
        BaselineEnd End(string id, int slot) => EndAt(grid, id, at.Plane(slot), at.Height(slot));
        return BaselineGeometry.ComponentInto(grid.Projection!, End(b.From, slots[0]), End(b.To, slots[1]),
            (int)b.Component, null, partials, out count);
    }

    /// <summary>An end of a baseline at plane coordinates <paramref name="p"/> and height <paramref name="h"/>, with
    /// its geoid separation (h = H + N) from the grid system.</summary>
    private static BaselineEnd EndAt(GridSystem grid, string id, PlanePoint p, double h) =>
        new(id, p.E, p.N, h, grid.EllipsoidalHeight(id, h)!.Value - h);

    /// <inheritdoc />
    public string? Instrument(Observation observation) => null;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [];
}
