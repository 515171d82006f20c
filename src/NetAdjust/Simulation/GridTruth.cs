using NetAdjust.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// What the field measures between two points of a truth on a map projection, shared by the demos drawn on a grid
/// (Tarnholm, Skelmoor): the inverse of the grid reduction (<see cref="Procedures.GridReduction"/>), through the same
/// <see cref="ProjectionFactors"/>.
/// </summary>
internal static class GridTruth
{
    /// <summary>The grid bearing of the chord minus the arc-to-chord correction: the projected geodesic's bearing at
    /// the station, i.e. what a direction measured there gives once oriented on grid north.</summary>
    /// <param name="p">The projection.</param>
    /// <param name="a">The station (E, N, orthometric H).</param>
    /// <param name="b">The target.</param>
    public static double Geodesic(IMapProjection p, (double E, double N, double H) a, (double E, double N, double H) b)
        => Math.Atan2(b.E - a.E, b.N - a.N) - ProjectionFactors.ArcToChord(p, a.E, a.N, b.E, b.N);

    /// <summary>The horizontal ground distance: grid distance / (elevation factor × line scale factor), the factors
    /// taken at the truth and the mean ellipsoidal height of the line (orthometric plus the geoid separation).
    /// </summary>
    /// <param name="p">The projection.</param>
    /// <param name="a">One end (E, N, orthometric H).</param>
    /// <param name="b">The other end.</param>
    /// <param name="geoidSeparation">The geoid separation N of the site, metres.</param>
    public static double Ground(IMapProjection p, (double E, double N, double H) a, (double E, double N, double H) b,
        double geoidSeparation)
    {
        double grid = Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));
        double k = ProjectionFactors.LineScaleFactor(p, a.E, a.N, b.E, b.N);
        var (lat, _) = p.Inverse((a.E + b.E) / 2, (a.N + b.N) / 2);
        double h = ((a.H + b.H) / 2) + geoidSeparation;
        double ef = ProjectionFactors.ElevationFactor(p.Ellipsoid, lat, Math.Atan2(b.E - a.E, b.N - a.N), h);
        return grid / (ef * k);
    }

    /// <summary>A circle reading in [0, 2π).</summary>
    /// <param name="radians">Any angle, radians.</param>
    public static Angle Circle(double radians) => Angle.FromRadians(Angle.Reduce0To2Pi(radians));
}
