using NetAdjust.Geometry;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>A measured distance from a located point: the circle on which the unknown point lies.</summary>
/// <param name="Origin">The located point (centre).</param>
/// <param name="At">Its coordinates.</param>
/// <param name="Distance">The horizontal distance (radius), metres.</param>
/// <param name="Sd">Standard deviation of the distance, metres.</param>
internal readonly record struct Circle(string Origin, PlanePoint At, double Distance, double Sd);
