using NetAdjust.Units;

namespace NetAdjust.Geodesy;

/// <summary>A position in an earth-centred, earth-fixed Cartesian frame: Z along the ellipsoid's minor axis, X in
/// the plane of the zero meridian, Y completing a right-handed frame. Immutable.</summary>
/// <param name="X">X coordinate.</param>
/// <param name="Y">Y coordinate.</param>
/// <param name="Z">Z coordinate.</param>
public readonly record struct GeocentricPosition(Length X, Length Y, Length Z);
