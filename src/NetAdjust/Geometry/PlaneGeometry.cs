namespace NetAdjust.Geometry;

/// <summary>
/// The value of an observation equation and its partial derivatives with respect to the coordinates of the
/// points involved (and, for directions, the orientation unknown). Angles in radians, lengths in metres.
/// </summary>
/// <param name="Value">The computed observation value.</param>
/// <param name="Partials">The partial derivatives, each with the parameter it belongs to.</param>
public readonly record struct EquationValue(double Value, Partial[] Partials);

/// <summary>Which parameter a partial derivative belongs to.</summary>
public enum Parameter
{
    /// <summary>Easting of a point.</summary>
    E,

    /// <summary>Northing of a point.</summary>
    N,

    /// <summary>Height of a point.</summary>
    H,

    /// <summary>The orientation unknown of a direction set.</summary>
    Orientation,

    /// <summary>The refraction coefficient k of a group of zenith angles, when it is estimated (dimensionless; the
    /// owner is the group's id).</summary>
    Refraction,

    /// <summary>The small rotation about the earth-centred X axis between a GNSS frame and the local control
    /// (radians; the owner is the frame's id).</summary>
    FrameRotationX,

    /// <summary>The small rotation about the earth-centred Y axis (radians; the owner is the frame's id).</summary>
    FrameRotationY,

    /// <summary>The small rotation about the earth-centred Z axis (radians; the owner is the frame's id).</summary>
    FrameRotationZ,

    /// <summary>The scale difference μ between a GNSS frame and the local control (dimensionless; the owner is the
    /// frame's id).</summary>
    FrameScale,
}

/// <summary>One partial derivative: ∂f/∂(parameter of owner).</summary>
/// <param name="Owner">The point id, or the set id for an orientation.</param>
/// <param name="Parameter">Which parameter.</param>
/// <param name="Derivative">The value of the derivative (SI units).</param>
public readonly record struct Partial(string Owner, Parameter Parameter, double Derivative);

/// <summary>A point's plane coordinates in metres.</summary>
/// <param name="E">Easting.</param>
/// <param name="N">Northing.</param>
public readonly record struct PlanePoint(double E, double N);

/// <summary>
/// Plane observation equations as small pure functions (grid coordinates, azimuth clockwise from north,
/// computed as atan2(ΔE, ΔN)). Each returns the value and the partial derivatives.
/// </summary>
public static class PlaneGeometry
{
    /// <summary>Horizontal distance d = √(ΔE² + ΔN²) and its derivatives.</summary>
    /// <param name="fromId">Id of the from point.</param>
    /// <param name="from">Coordinates of the from point.</param>
    /// <param name="toId">Id of the to point.</param>
    /// <param name="to">Coordinates of the to point.</param>
    public static EquationValue Distance(string fromId, PlanePoint from, string toId, PlanePoint to)
    {
        Span<double> g = stackalloc double[4];
        return TwoPoint(Distance(from, to, g), fromId, toId, g);
    }

    /// <summary>A value of two points with its derivatives by E and N of the from point, then of the to point.
    /// </summary>
    private static EquationValue TwoPoint(double value, string fromId, string toId, ReadOnlySpan<double> g) =>
        new(value,
        [
            new(fromId, Parameter.E, g[0]), new(fromId, Parameter.N, g[1]),
            new(toId, Parameter.E, g[2]), new(toId, Parameter.N, g[3]),
        ]);

    /// <summary>Horizontal distance without allocating: the value, and its derivatives by E and N of the from
    /// point, then of the to point, written to <paramref name="partials"/> (4 entries).</summary>
    internal static double Distance(PlanePoint from, PlanePoint to, Span<double> partials)
    {
        double de = to.E - from.E, dn = to.N - from.N;
        double d = Math.Sqrt((de * de) + (dn * dn));
        double se = de / d, sn = dn / d;
        partials[0] = -se; partials[1] = -sn; partials[2] = se; partials[3] = sn;
        return d;
    }

    /// <summary>Grid azimuth t = atan2(ΔE, ΔN) in [0, 2π) and its derivatives ∂t/∂E_to = ΔN/d², ∂t/∂N_to =
    /// −ΔE/d².</summary>
    /// <param name="fromId">Id of the from point.</param>
    /// <param name="from">Coordinates of the from point.</param>
    /// <param name="toId">Id of the to point.</param>
    /// <param name="to">Coordinates of the to point.</param>
    public static EquationValue Azimuth(string fromId, PlanePoint from, string toId, PlanePoint to)
    {
        Span<double> g = stackalloc double[4];
        return TwoPoint(Azimuth(from, to, g), fromId, toId, g);
    }

    /// <summary>Grid azimuth without allocating: the value, and its derivatives by E and N of the from point, then
    /// of the to point, written to <paramref name="partials"/> (4 entries).</summary>
    internal static double Azimuth(PlanePoint from, PlanePoint to, Span<double> partials)
    {
        double de = to.E - from.E, dn = to.N - from.N;
        double d2 = (de * de) + (dn * dn);
        double t = Math.Atan2(de, dn);
        if (t < 0) t += 2 * Math.PI;
        double ge = dn / d2, gn = -de / d2;
        partials[0] = -ge; partials[1] = -gn; partials[2] = ge; partials[3] = gn;
        return t;
    }

    /// <summary>Horizontal direction r = t(station→target) − ω, with ω the set's orientation unknown.</summary>
    /// <param name="stationId">Id of the station.</param>
    /// <param name="station">Coordinates of the station.</param>
    /// <param name="targetId">Id of the target.</param>
    /// <param name="target">Coordinates of the target.</param>
    /// <param name="setId">Id of the direction set.</param>
    /// <param name="orientation">Current value of the orientation unknown (radians).</param>
    public static EquationValue Direction(string stationId, PlanePoint station, string targetId, PlanePoint target,
        string setId, double orientation)
    {
        Span<double> g = stackalloc double[5];
        double r = Direction(station, target, orientation, g);
        return new EquationValue(r,
        [
            new(stationId, Parameter.E, g[0]), new(stationId, Parameter.N, g[1]),
            new(targetId, Parameter.E, g[2]), new(targetId, Parameter.N, g[3]),
            new(setId, Parameter.Orientation, g[4]),
        ]);
    }

    /// <summary>Horizontal direction without allocating: the value, and its derivatives by E and N of the station,
    /// of the target, and by the orientation, written to <paramref name="partials"/> (5 entries).</summary>
    internal static double Direction(PlanePoint station, PlanePoint target, double orientation,
        Span<double> partials)
    {
        double t = Azimuth(station, target, partials);
        partials[4] = -1.0;
        return t - orientation;
    }

    /// <summary>Horizontal angle α = t(at→foresight) − t(at→backsight), clockwise, in [0, 2π).</summary>
    /// <param name="atId">Id of the station.</param>
    /// <param name="at">Coordinates of the station.</param>
    /// <param name="backId">Id of the backsight.</param>
    /// <param name="back">Coordinates of the backsight.</param>
    /// <param name="foreId">Id of the foresight.</param>
    /// <param name="fore">Coordinates of the foresight.</param>
    public static EquationValue Angle(string atId, PlanePoint at, string backId, PlanePoint back, string foreId,
        PlanePoint fore)
    {
        Span<double> g = stackalloc double[6];
        double a = Angle(at, back, fore, g);
        return new EquationValue(a,
        [
            new(atId, Parameter.E, g[0]), new(atId, Parameter.N, g[1]),
            new(backId, Parameter.E, g[2]), new(backId, Parameter.N, g[3]),
            new(foreId, Parameter.E, g[4]), new(foreId, Parameter.N, g[5]),
        ]);
    }

    /// <summary>Horizontal angle without allocating: the value, and its derivatives by E and N of the station, the
    /// backsight and the foresight, written to <paramref name="partials"/> (6 entries).</summary>
    internal static double Angle(PlanePoint at, PlanePoint back, PlanePoint fore, Span<double> partials)
    {
        Span<double> tf = stackalloc double[4], tb = stackalloc double[4];
        double a = Azimuth(at, fore, tf) - Azimuth(at, back, tb);
        if (a < 0) a += 2 * Math.PI;
        // ∂α = ∂t_f − ∂t_b; the station's derivatives combine both.
        partials[0] = tf[0] - tb[0]; partials[1] = tf[1] - tb[1];
        partials[2] = -tb[2]; partials[3] = -tb[3];
        partials[4] = tf[2]; partials[5] = tf[3];
        return a;
    }

    /// <summary>Height difference Δh = H_to − H_from.</summary>
    /// <param name="fromId">Id of the from point.</param>
    /// <param name="hFrom">Height of the from point (m).</param>
    /// <param name="toId">Id of the to point.</param>
    /// <param name="hTo">Height of the to point (m).</param>
    public static EquationValue HeightDifference(string fromId, double hFrom, string toId, double hTo) =>
        new(hTo - hFrom, [new(fromId, Parameter.H, -1.0), new(toId, Parameter.H, 1.0)]);
}
