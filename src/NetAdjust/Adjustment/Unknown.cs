using NetAdjust.Geometry;

namespace NetAdjust.Adjustment;

/// <summary>One unknown parameter of the adjustment: a coordinate component of a point, or a set's
/// orientation.</summary>
/// <param name="Owner">The point id, or the direction set id for an orientation.</param>
/// <param name="Parameter">Which parameter.</param>
public readonly record struct Unknown(string Owner, Parameter Parameter)
{
    /// <summary>Describes the unknown in words, e.g. "easting of T4" or "orientation of set T1/1".</summary>
    public string Describe() => Parameter switch
    {
        Parameter.E => $"easting of {Owner}",
        Parameter.N => $"northing of {Owner}",
        Parameter.H => $"height of {Owner}",
        Parameter.Refraction => $"refraction coefficient of group {Owner}",
        Parameter.FrameRotationX => $"rotation about X of frame {Owner}",
        Parameter.FrameRotationY => $"rotation about Y of frame {Owner}",
        Parameter.FrameRotationZ => $"rotation about Z of frame {Owner}",
        Parameter.FrameScale => $"scale difference of frame {Owner}",
        _ => $"orientation of direction set {Owner}",
    };
}

/// <summary>
/// Numbers the unknowns: for each point in input order its free easting, northing (when it takes part in a
/// horizontal observation) and height (when it takes part in a height difference), then one orientation per
/// direction set in order of first appearance, then one refraction coefficient per group of zenith angles whose k
/// is estimated, in order of first appearance.
/// </summary>
public sealed class UnknownIndex
{
    private readonly Dictionary<Unknown, int> _map = new();
    private readonly List<Unknown> _list = new();

    /// <summary>Creates an empty numbering (the adjuster fills it).</summary>
    internal UnknownIndex() => Unknowns = _list.AsReadOnly();

    /// <summary>The unknowns in index order (a read-only view).</summary>
    public IReadOnlyList<Unknown> Unknowns { get; }

    /// <summary>The number of unknowns.</summary>
    public int Count => _list.Count;

    /// <summary>The index of an unknown, or −1 when that parameter is held fixed or not in the adjustment.</summary>
    /// <param name="owner">Point id or set id.</param>
    /// <param name="parameter">The parameter.</param>
    public int IndexOf(string owner, Parameter parameter) =>
        _map.TryGetValue(new Unknown(owner, parameter), out int i) ? i : -1;

    internal void Add(Unknown u)
    {
        // one look-up: the slot of a new unknown is filled, that of one already numbered left as it is
        ref int slot = ref System.Runtime.InteropServices.CollectionsMarshal.GetValueRefOrAddDefault(_map, u,
            out bool exists);
        if (exists) return;
        slot = _list.Count;
        _list.Add(u);
    }

    /// <summary>Makes room for <paramref name="count"/> unknowns in all (no rehashing while a large network's are
    /// added).</summary>
    internal void EnsureCapacity(int count)
    {
        _map.EnsureCapacity(count);
        _list.EnsureCapacity(count);
    }
}
