using NetAdjust.Geometry;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment;

/// <summary>
/// Current values of all parameters during the iterations: coordinates of every point (held or free) and
/// orientation of every direction set.
/// </summary>
/// <remarks>Coordinates and orientations are held in arrays, one slot per point or set, found by name once; the
/// iterations reach them by those slots (<see cref="IIndexedCoordinates"/>) without hashing names.</remarks>
public sealed class ParameterState : ICoordinates, IIndexedCoordinates
{
    // Points: one slot per id that has any of E, N, H; a component the state does not hold is marked absent.
    private readonly Dictionary<string, int> _pointSlot = new(StringComparer.Ordinal);
    private readonly double[] _e, _n, _h;
    private readonly bool[] _hasE, _hasN, _hasH;
    private readonly Dictionary<string, int> _setSlot = new(StringComparer.Ordinal);
    private readonly double[] _orientation;
    private readonly Dictionary<string, double> _refraction;
    private readonly Dictionary<string, double> _rx = new(StringComparer.Ordinal), _ry = new(StringComparer.Ordinal),
        _rz = new(StringComparer.Ordinal), _scale = new(StringComparer.Ordinal);

    internal ParameterState(Dictionary<string, double> e, Dictionary<string, double> n, Dictionary<string, double> h,
        Dictionary<string, double> orientation, Dictionary<string, double>? refraction = null)
    {
        foreach (var map in new[] { e, n, h })
            foreach (var id in map.Keys) _pointSlot.TryAdd(id, _pointSlot.Count);
        int points = _pointSlot.Count;
        (_e, _hasE) = Column(e, points);
        (_n, _hasN) = Column(n, points);
        (_h, _hasH) = Column(h, points);
        _orientation = new double[orientation.Count];
        foreach (var (id, value) in orientation)
        {
            _orientation[_setSlot.Count] = value;
            _setSlot.Add(id, _setSlot.Count);
        }
        _refraction = refraction ?? new Dictionary<string, double>(StringComparer.Ordinal);
    }

    private (double[] Values, bool[] Has) Column(Dictionary<string, double> map, int points)
    {
        var values = new double[points];
        var has = new bool[points];
        foreach (var (id, value) in map)
        {
            int slot = _pointSlot[id];
            values[slot] = value;
            has[slot] = true;
        }
        return (values, has);
    }

    /// <summary>The current value of a frame parameter of a GNSS frame whose parameters are unknowns (radians for
    /// rotations, dimensionless for the scale difference); 0 for others.</summary>
    /// <param name="frame">The frame's id.</param>
    /// <param name="parameter">One of the frame parameters.</param>
    public double Frame(string frame, Parameter parameter) =>
        FrameMap(parameter) is { } map && map.TryGetValue(frame, out double v) ? v : 0.0;

    /// <summary>Starts the parameters of a frame at zero.</summary>
    internal void AddFrame(string frame, bool scale)
    {
        _rx[frame] = 0; _ry[frame] = 0; _rz[frame] = 0;
        if (scale) _scale[frame] = 0;
    }

    /// <summary>The plane coordinates of a point (m).</summary>
    /// <param name="id">The point id.</param>
    /// <exception cref="KeyNotFoundException">When the point has no plane coordinates.</exception>
    public PlanePoint Plane(string id)
    {
        int slot = PointSlot(id);
        return _hasE[slot] && _hasN[slot] ? new(_e[slot], _n[slot]) : throw Missing(id);
    }

    /// <summary>The height of a point (m).</summary>
    /// <param name="id">The point id.</param>
    /// <exception cref="KeyNotFoundException">When the point has no height.</exception>
    public double Height(string id)
    {
        int slot = PointSlot(id);
        return _hasH[slot] ? _h[slot] : throw Missing(id);
    }

    /// <summary>The orientation of a direction set (rad).</summary>
    /// <param name="setId">The set id.</param>
    /// <exception cref="KeyNotFoundException">When the state holds no such set.</exception>
    public double Orientation(string setId) =>
        _setSlot.TryGetValue(setId, out int slot) ? _orientation[slot] : throw Missing(setId);

    /// <summary>The current refraction coefficient of a group whose k is estimated, else
    /// <paramref name="assumed"/>.</summary>
    /// <param name="group">The group's id.</param>
    /// <param name="assumed">The group's assumed k.</param>
    public double Refraction(string group, double assumed) =>
        _refraction.TryGetValue(group, out double k) ? k : assumed;

    /// <summary>The value of one parameter.</summary>
    /// <param name="u">The unknown.</param>
    /// <exception cref="KeyNotFoundException">When the state does not hold that parameter.</exception>
    public double Get(Unknown u) => TryGet(u.Owner, u.Parameter, out double v) ? v : throw Missing(u.Owner);

    internal void Add(Unknown u, double delta)
    {
        switch (u.Parameter)
        {
            case Parameter.E or Parameter.N or Parameter.H:
                int slot = PointSlot(u.Owner);
                var (values, has) = Component(u.Parameter);
                if (!has[slot]) throw Missing(u.Owner);
                values[slot] += delta;
                break;
            case Parameter.Orientation:
                _orientation[_setSlot.TryGetValue(u.Owner, out int set) ? set : throw Missing(u.Owner)] += delta;
                break;
            default:
                var map = FrameMap(u.Parameter) ?? _refraction;
                map[u.Owner] += delta;
                break;
        }
    }

    internal bool TryGet(string owner, Parameter p, out double v)
    {
        switch (p)
        {
            case Parameter.E or Parameter.N or Parameter.H:
                var (values, has) = Component(p);
                if (_pointSlot.TryGetValue(owner, out int slot) && has[slot]) { v = values[slot]; return true; }
                v = 0;
                return false;
            case Parameter.Orientation:
                if (_setSlot.TryGetValue(owner, out int set)) { v = _orientation[set]; return true; }
                v = 0;
                return false;
            default:
                return (FrameMap(p) ?? _refraction).TryGetValue(owner, out v);
        }
    }

    int IIndexedCoordinates.PlaneSlot(string id)
    {
        int slot = PointSlot(id);
        return _hasE[slot] && _hasN[slot] ? slot : throw Missing(id);
    }

    /// <summary>The number of point slots.</summary>
    internal int PointSlots => _e.Length;

    /// <summary>The number of set slots.</summary>
    internal int SetSlots => _orientation.Length;

    /// <summary>The slot of a point, or −1 when the state holds none of its coordinates.</summary>
    internal int PointSlotOrNone(string id) => _pointSlot.TryGetValue(id, out int slot) ? slot : -1;

    /// <summary>The slot of a direction set, or −1 when the state holds no such set.</summary>
    internal int SetSlotOrNone(string setId) => _setSlot.TryGetValue(setId, out int slot) ? slot : -1;

    int IIndexedCoordinates.SetSlot(string setId) =>
        _setSlot.TryGetValue(setId, out int slot) ? slot : throw Missing(setId);

    PlanePoint IIndexedCoordinates.Plane(int point) => new(_e[point], _n[point]);

    double IIndexedCoordinates.Orientation(int set) => _orientation[set];

    int IIndexedCoordinates.SpatialSlotOrNone(string id) =>
        _pointSlot.TryGetValue(id, out int slot) && _hasE[slot] && _hasN[slot] && _hasH[slot] ? slot : -1;

    double IIndexedCoordinates.Height(int point) => _h[point];

    private int PointSlot(string id) => _pointSlot.TryGetValue(id, out int slot) ? slot : throw Missing(id);

    private (double[] Values, bool[] Has) Component(Parameter p) => p switch
    {
        Parameter.E => (_e, _hasE),
        Parameter.N => (_n, _hasN),
        _ => (_h, _hasH),
    };

    private Dictionary<string, double>? FrameMap(Parameter p) => p switch
    {
        Parameter.FrameRotationX => _rx,
        Parameter.FrameRotationY => _ry,
        Parameter.FrameRotationZ => _rz,
        Parameter.FrameScale => _scale,
        _ => null,
    };

    private static KeyNotFoundException Missing(string id) =>
        new($"The parameters hold no value for {id}.");
}
