using NetAdjust.Geometry;
using NetAdjust.Units;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// The orientation of a set of directions (the circle reading of grid north) from sightings of located points:
/// the circular mean of azimuth − reading. Shared by the approximate coordinates and the datum's start values.
/// </summary>
internal static class SetOrientation
{
    /// <summary>
    /// Circular mean of orientation values (azimuth − reading): the first value plus the mean of the others'
    /// differences from it, each reduced to (−π, π], so that values on both sides of 0 do not average to π.
    /// </summary>
    /// <param name="azimuthMinusReading">One value per sighting, radians.</param>
    /// <returns>The mean in radians (not reduced to a range), or null when there is no value.</returns>
    public static double? Mean(IEnumerable<double> azimuthMinusReading)
    {
        double first = double.NaN, sum = 0;
        int count = 0;
        foreach (double w in azimuthMinusReading)
        {
            if (count == 0) first = w;
            sum += Angle.ReduceSigned(w - first);
            count++;
        }
        return count > 0 ? first + (sum / count) : null;
    }

    /// <summary>The azimuth from (<paramref name="e0"/>, <paramref name="n0"/>) to (<paramref name="e1"/>,
    /// <paramref name="n1"/>) in [0, 2π), computed as the observation equation of a direction computes it.</summary>
    public static double Azimuth(double e0, double n0, double e1, double n1)
    {
        double t = Math.Atan2(e1 - e0, n1 - n0);
        if (t < 0) t += 2 * Math.PI;
        return t;
    }

    /// <summary>The orientation of a set at <paramref name="station"/> from readings to located targets.</summary>
    /// <param name="station">Coordinates of the station.</param>
    /// <param name="sightings">Each located target's coordinates and the set's reading to it, radians.</param>
    /// <returns>The mean orientation in radians, or null when no target is given.</returns>
    public static double? Mean(PlanePoint station, IEnumerable<(PlanePoint Target, double Reading)> sightings) =>
        Mean(sightings.Select(s => Constructions.Azimuth(station, s.Target) - s.Reading));
}
