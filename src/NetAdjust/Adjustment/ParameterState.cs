using NetAdjust.Geometry;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment;

/// <summary>
/// Current values of all parameters during the iterations: coordinates of every point (held or free) and
/// orientation of every direction set.
/// </summary>
public sealed class ParameterState : ICoordinates
{
    private readonly Dictionary<string, double> _e, _n, _h, _orientation, _refraction;
    private readonly Dictionary<string, double> _rx = new(StringComparer.Ordinal), _ry = new(StringComparer.Ordinal),
        _rz = new(StringComparer.Ordinal), _scale = new(StringComparer.Ordinal);

    internal ParameterState(Dictionary<string, double> e, Dictionary<string, double> n, Dictionary<string, double> h,
        Dictionary<string, double> orientation, Dictionary<string, double>? refraction = null)
    {
        _e = e; _n = n; _h = h; _orientation = orientation;
        _refraction = refraction ?? new Dictionary<string, double>(StringComparer.Ordinal);
    }

    /// <summary>The current value of a frame parameter of a GNSS frame whose parameters are unknowns (radians for
    /// rotations, dimensionless for the scale difference); 0 for others.</summary>
    /// <param name="frame">The frame's id.</param>
    /// <param name="parameter">One of the frame parameters.</param>
    public double Frame(string frame, Parameter parameter) =>
        Map(parameter).TryGetValue(frame, out double v) ? v : 0.0;

    /// <summary>Starts the parameters of a frame at zero.</summary>
    internal void AddFrame(string frame, bool scale)
    {
        _rx[frame] = 0; _ry[frame] = 0; _rz[frame] = 0;
        if (scale) _scale[frame] = 0;
    }

    /// <summary>The plane coordinates of a point (m).</summary>
    /// <param name="id">The point id.</param>
    public PlanePoint Plane(string id) => new(_e[id], _n[id]);

    /// <summary>The height of a point (m).</summary>
    /// <param name="id">The point id.</param>
    public double Height(string id) => _h[id];

    /// <summary>The orientation of a direction set (rad).</summary>
    /// <param name="setId">The set id.</param>
    public double Orientation(string setId) => _orientation[setId];

    /// <summary>The current refraction coefficient of a group whose k is estimated, else
    /// <paramref name="assumed"/>.</summary>
    /// <param name="group">The group's id.</param>
    /// <param name="assumed">The group's assumed k.</param>
    public double Refraction(string group, double assumed) =>
        _refraction.TryGetValue(group, out double k) ? k : assumed;

    /// <summary>The value of one parameter.</summary>
    /// <param name="u">The unknown.</param>
    public double Get(Unknown u) => Map(u.Parameter)[u.Owner];

    internal void Add(Unknown u, double delta) => Map(u.Parameter)[u.Owner] += delta;

    internal bool TryGet(string owner, Parameter p, out double v) => Map(p).TryGetValue(owner, out v);

    private Dictionary<string, double> Map(Parameter p) => p switch
    {
        Parameter.E => _e,
        Parameter.N => _n,
        Parameter.H => _h,
        Parameter.Refraction => _refraction,
        Parameter.FrameRotationX => _rx,
        Parameter.FrameRotationY => _ry,
        Parameter.FrameRotationZ => _rz,
        Parameter.FrameScale => _scale,
        _ => _orientation,
    };
}
