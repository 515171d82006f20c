using NetAdjust.Geodesy;

namespace NetAdjust.Geometry;

/// <summary>One end of a GNSS baseline on the grid: the point's id, grid coordinates, height above the geoid and
/// geoid separation (metres), so that its ellipsoidal height is h = H + N.</summary>
/// <param name="Id">The point id.</param>
/// <param name="E">Easting.</param>
/// <param name="N">Northing.</param>
/// <param name="H">Height above the geoid.</param>
/// <param name="GeoidSeparation">Geoid separation N.</param>
internal readonly record struct BaselineEnd(string Id, double E, double N, double H, double GeoidSeparation);

/// <summary>The frame parameters' current values: rotations about X, Y, Z (radians) and scale difference μ, with the
/// frame's id and which of them are unknowns (their partial derivatives are given only then).</summary>
/// <param name="Id">The frame's id.</param>
/// <param name="Rx">Rotation about X.</param>
/// <param name="Ry">Rotation about Y.</param>
/// <param name="Rz">Rotation about Z.</param>
/// <param name="Scale">Scale difference μ.</param>
/// <param name="HasRotations">True when the rotations are unknowns.</param>
/// <param name="HasScale">True when μ is an unknown.</param>
internal readonly record struct FrameState(string Id, double Rx, double Ry, double Rz, double Scale,
    bool HasRotations, bool HasScale);

/// <summary>
/// The GNSS baseline's observation equation on grid coordinates (docs/methods.md, "GNSS baselines"): each end goes
/// grid (E, N) → geodetic (φ, λ) by the projection's inverse, h = H + N, then (φ, λ, h) → geocentric (X, Y, Z); the
/// baseline is Δ = X(to) − X(from), with frame parameters (1 + μ)(I + Ω) Δ. The partial derivatives follow the same
/// chain: ∂X/∂(E, N, H) = ∂X/∂(φ, λ, h) · ∂(φ, λ, h)/∂(E, N, H), where a conformal projection of point scale factor k
/// and meridian convergence γ (grid azimuth = geodetic azimuth − γ) maps a grid step (dE, dN) to the ellipsoid step
/// north (dN cos γ − dE sin γ)/k and east (dE cos γ + dN sin γ)/k, so ∂φ/∂E = −sin γ/(k M), ∂φ/∂N = cos γ/(k M),
/// ∂λ/∂E = cos γ/(k ν cos φ), ∂λ/∂N = sin γ/(k ν cos φ), ∂h/∂H = 1 (the geoid separation is held per point).
/// </summary>
internal static class BaselineGeometry
{
    /// <summary>A point's geocentric position and its Jacobian J = ∂(X, Y, Z)/∂(E, N, H) (row-major 3×3; shared
    /// with a cache: do not change it).</summary>
    /// <param name="projection">The projection of the grid.</param>
    /// <param name="end">The point.</param>
    internal static (double X, double Y, double Z, double[] Jacobian) Position(IMapProjection projection,
        BaselineEnd end)
    {
        ArgumentNullException.ThrowIfNull(projection);
        var cache = _cache ??= new PositionCache();
        if (cache.TryGet(projection, end, out var hit)) return hit;
        var ell = projection.Ellipsoid;
        var (lat, lon) = projection.Inverse(end.E, end.N);
        double h = end.H + end.GeoidSeparation;
        var (x, y, z) = Geocentric.ToGeocentric(ell, lat, lon, h);
        double k = ProjectionFactors.PointScaleFactor(projection, end.E, end.N);
        double g = ProjectionFactors.Convergence(projection, end.E, end.N);
        double m = ell.MeridianRadius(lat) * k, nu = ell.PrimeVerticalRadius(lat) * Math.Cos(lat) * k;
        double sg = Math.Sin(g), cg = Math.Cos(g);
        // T = ∂(φ, λ, h)/∂(E, N, H)
        double[] t =
        [
            -sg / m, cg / m, 0,
            cg / nu, sg / nu, 0,
            0, 0, 1,
        ];
        var gj = Geocentric.GeodeticJacobian(ell, lat, lon, h);
        var j = new double[9];
        for (int r = 0; r < 3; r++)
            for (int c = 0; c < 3; c++)
                j[(r * 3) + c] = (gj[r * 3] * t[c]) + (gj[(r * 3) + 1] * t[3 + c]) + (gj[(r * 3) + 2] * t[6 + c]);
        var result = (x, y, z, j);
        cache.Put(projection, end, result);
        return result;
    }

    /// <summary>
    /// One component of the baseline from <paramref name="from"/> to <paramref name="to"/> and its partial
    /// derivatives by E, N, H of both ends (and by the frame parameters that are unknowns).
    /// </summary>
    /// <param name="projection">The projection of the grid.</param>
    /// <param name="from">The start point.</param>
    /// <param name="to">The end point.</param>
    /// <param name="component">0 for ΔX, 1 for ΔY, 2 for ΔZ.</param>
    /// <param name="frame">The frame parameters, or null for none.</param>
    internal static EquationValue Component(IMapProjection projection, BaselineEnd from, BaselineEnd to, int component,
        FrameState? frame = null)
    {
        Span<double> d = stackalloc double[MostPartials];
        double value = ComponentInto(projection, from, to, component, frame, d, out int count);
        var partials = new Partial[count];
        Parameter[] axes = [Parameter.E, Parameter.N, Parameter.H];
        for (int q = 0; q < 3; q++)
        {
            partials[2 * q] = new Partial(from.Id, axes[q], d[2 * q]);
            partials[(2 * q) + 1] = new Partial(to.Id, axes[q], d[(2 * q) + 1]);
        }
        int k = 6;
        if (frame is { HasRotations: true } f)
        {
            partials[k] = new Partial(f.Id, Parameter.FrameRotationX, d[k]);
            partials[k + 1] = new Partial(f.Id, Parameter.FrameRotationY, d[k + 1]);
            partials[k + 2] = new Partial(f.Id, Parameter.FrameRotationZ, d[k + 2]);
            k += 3;
        }
        if (frame is { HasScale: true } s) partials[k] = new Partial(s.Id, Parameter.FrameScale, d[k]);
        return new EquationValue(value, partials);
    }

    /// <summary>The most partial derivatives of a component: six coordinates, three rotations and a scale.</summary>
    internal const int MostPartials = 10;

    /// <summary>
    /// <see cref="Component"/> without allocating: the value, and the derivatives in its order (E of the start and
    /// of the end, then N, then H; then the frame's rotations and scale) written to <paramref name="partials"/>. The
    /// one computation of both.
    /// </summary>
    /// <param name="projection">The projection of the grid.</param>
    /// <param name="from">The start point.</param>
    /// <param name="to">The end point.</param>
    /// <param name="component">0 for ΔX, 1 for ΔY, 2 for ΔZ.</param>
    /// <param name="frame">The frame parameters, or null for none.</param>
    /// <param name="partials">Room for the derivatives (<see cref="MostPartials"/> at most).</param>
    /// <param name="count">The number of derivatives written.</param>
    internal static double ComponentInto(IMapProjection projection, BaselineEnd from, BaselineEnd to, int component,
        FrameState? frame, Span<double> partials, out int count)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(component);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(component, 2);
        var a = Position(projection, from);
        var b = Position(projection, to);
        Span<double> d = [b.X - a.X, b.Y - a.Y, b.Z - a.Z];
        // Row c of M = (1 + μ)(I + Ω), Ω = [[0, −rz, ry], [rz, 0, −rx], [−ry, rx, 0]].
        var f = frame ?? new FrameState("", 0, 0, 0, 0, false, false);
        Span<double> omega = [0, -f.Rz, f.Ry, f.Rz, 0, -f.Rx, -f.Ry, f.Rx, 0];
        Span<double> row = stackalloc double[3];
        for (int c = 0; c < 3; c++)
            row[c] = (1 + f.Scale) * ((component == c ? 1 : 0) + omega[(component * 3) + c]);
        double value = (row[0] * d[0]) + (row[1] * d[1]) + (row[2] * d[2]);
        int k = 0;
        for (int q = 0; q < 3; q++)
        {
            double sa = 0, sb = 0;
            for (int c = 0; c < 3; c++)
            {
                sa += row[c] * a.Jacobian[(c * 3) + q];
                sb += row[c] * b.Jacobian[(c * 3) + q];
            }
            partials[k++] = -sa;
            partials[k++] = sb;
        }
        if (f.HasRotations)
        {
            // ∂(ΩΔ)/∂rx = (0, −Δz, Δy), ∂/∂ry = (Δz, 0, −Δx), ∂/∂rz = (−Δy, Δx, 0)
            Span<double> byRx = [0, -d[2], d[1]], byRy = [d[2], 0, -d[0]], byRz = [-d[1], d[0], 0];
            partials[k++] = (1 + f.Scale) * byRx[component];
            partials[k++] = (1 + f.Scale) * byRy[component];
            partials[k++] = (1 + f.Scale) * byRz[component];
        }
        if (f.HasScale) partials[k++] = value / (1 + f.Scale);
        count = k;
        return value;
    }

    [ThreadStatic] private static PositionCache? _cache;

    /// <summary>The last few positions evaluated on this thread: the three components of a baseline share their ends.
    /// </summary>
    private sealed class PositionCache
    {
        private const int Size = 8;
        private readonly (IMapProjection? P, BaselineEnd End, (double, double, double, double[]) Value)[] _items =
            new (IMapProjection?, BaselineEnd, (double, double, double, double[]))[Size];
        private int _next;

        public bool TryGet(IMapProjection p, BaselineEnd end, out (double X, double Y, double Z, double[] J) value)
        {
            foreach (var item in _items)
                if (ReferenceEquals(item.P, p) && item.End == end) { value = item.Value; return true; }
            value = default;
            return false;
        }

        public void Put(IMapProjection p, BaselineEnd end, (double, double, double, double[]) value)
        {
            _items[_next] = (p, end, value);
            _next = (_next + 1) % Size;
        }
    }
}
