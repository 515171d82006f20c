using NetAdjust.Geometry;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>A measured clockwise angle at the unknown point from located point X to located point Y.</summary>
/// <param name="X">The first located point (backsight).</param>
/// <param name="AtX">Its coordinates.</param>
/// <param name="Y">The second located point (foresight).</param>
/// <param name="AtY">Its coordinates.</param>
/// <param name="Angle">The clockwise angle X → Y, radians.</param>
/// <param name="Sd">Standard deviation of the angle, radians.</param>
internal readonly record struct AngleAtPoint(
    string X, PlanePoint AtX, string Y, PlanePoint AtY, double Angle, double Sd);
