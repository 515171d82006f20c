using NetAdjust.Geometry;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>A line of sight from a located point with a known azimuth.</summary>
/// <param name="Origin">The located point the ray starts at.</param>
/// <param name="At">Its coordinates.</param>
/// <param name="Azimuth">Grid azimuth of the ray, radians, clockwise from north.</param>
/// <param name="Sd">Standard deviation of the azimuth, radians.</param>
internal readonly record struct Ray(string Origin, PlanePoint At, double Azimuth, double Sd);
