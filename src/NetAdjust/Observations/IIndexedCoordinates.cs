using NetAdjust.Geometry;

namespace NetAdjust.Observations;

/// <summary>
/// Coordinates whose points and direction sets are also reached by integer slots, found by name once
/// (<see cref="PlaneSlot"/>, <see cref="SetSlot"/>, <see cref="SpatialSlotOrNone"/>) and then read without hashing
/// names: the iterations of an adjustment evaluate every equation several times at the same points.
/// </summary>
internal interface IIndexedCoordinates : ICoordinates
{
    /// <summary>The slot of a point with plane coordinates.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such point or it has no plane coordinates.</exception>
    int PlaneSlot(string id);

    /// <summary>The slot of a direction set.</summary>
    /// <exception cref="KeyNotFoundException">When there is no such set.</exception>
    int SetSlot(string setId);

    /// <summary>The plane coordinates of the point in a slot from <see cref="PlaneSlot"/>.</summary>
    PlanePoint Plane(int point);

    /// <summary>The orientation of the set in a slot.</summary>
    double Orientation(int set);

    /// <summary>The slot of a point with plane coordinates and a height, or −1 when there is no such point or it
    /// lacks one of them (its equations are then evaluated by name, with the error that gives).</summary>
    int SpatialSlotOrNone(string id);

    /// <summary>The height of the point in a slot from <see cref="SpatialSlotOrNone"/>.</summary>
    double Height(int point);
}
