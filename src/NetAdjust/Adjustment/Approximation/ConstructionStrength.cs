namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// How strongly a construction places a point, strongest first. Within a round of the breadth-first location
/// every point is tried at one strength before any point is tried at the next, and a round ends at the first
/// strength that locates something (docs/methods.md, approximate coordinates).
/// </summary>
internal enum ConstructionStrength
{
    /// <summary>
    /// Polar point or intersection using only stations that the point's own direction sets see back (so that its
    /// sets can be oriented on the station that located it). A point without direction sets uses all stations.
    /// </summary>
    SeenBack,

    /// <summary>Polar point (ray and distance from one station) or intersection of rays from two stations.</summary>
    PolarOrIntersection,

    /// <summary>Resection from angles or directions at the point to three or more located points.</summary>
    Resection,

    /// <summary>
    /// Ray–circle or circle–circle intersection whose solution is unique (one solution ahead of the ray) or told
    /// apart from the other by the other observations to located points.
    /// </summary>
    DecidedIntersection,

    /// <summary>A two-solution case that nothing decides: taken only when nothing else makes progress.</summary>
    UndecidedIntersection,
}
