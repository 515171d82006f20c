using System.Globalization;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// The reference height H0 of the plane coordinates (<c>adjustment.plane_height</c>, docs/input-format.md): the
/// height at which plane distances are true horizontal distances, which the spatial model of slope distances and
/// zenith angles needs (docs/methods.md, "Spatial model").
/// </summary>
public static partial class ProjectReader
{
    /// <summary>The largest reference height accepted, metres either side of the height datum.</summary>
    private const double PlaneHeightLimit = 10_000;

    /// <summary>
    /// H0 in metres and how it was chosen: <c>adjustment.plane_height</c> when given; with a projection, the
    /// ellipsoid (H0 = −geoid separation, the mean of the points' separations when they are given per point);
    /// otherwise the mean of the given heights of the points (0 when no point has a height).
    /// </summary>
    private static (double Metres, PlaneHeightBasis Basis) ReadPlaneHeight(Context ctx, YamlMappingNode root,
        ProjectUnits units, IReadOnlyList<Point> points, GridSystem? grid)
    {
        if (ctx.Child(root, "adjustment") is YamlMappingNode adj && ctx.Child(adj, "plane_height") is YamlNode n)
        {
            const string item = "adjustment.plane_height";
            double h = Length.From(ctx.Number(n, item), units.Length).Metres;
            if (!(Math.Abs(h) <= PlaneHeightLimit))
                throw ctx.Error(n, item,
                    $"the reference height {h.ToString("0.###", CultureInfo.InvariantCulture)} m " +
                    "of the plane coordinates is outside −10 000 … 10 000 m");
            return (h, PlaneHeightBasis.Stated);
        }
        if (grid?.Projection is not null)
        {
            double sep = grid.PointGeoidSeparations.Count > 0
                ? grid.PointGeoidSeparations.Values.Average() : grid.GeoidSeparation;
            return (-sep, PlaneHeightBasis.Ellipsoid);
        }
        var given = points.Where(p => p.H is not null).ToList();
        return given.Count == 0 ? (0.0, PlaneHeightBasis.MeanHeight)
            : (given.Average(p => p.H!.Value), PlaneHeightBasis.MeanHeight);
    }

    /// <summary>The observations with the spatial model's kinds given the reference height H0.</summary>
    private static void ApplyPlaneHeight(List<Observation> observations, double metres)
    {
        var h = Length.FromMetres(metres);
        for (int i = 0; i < observations.Count; i++)
            observations[i] = observations[i] switch
            {
                SlopeDistanceObservation s => s with { PlaneHeight = h },
                ZenithObservation z => z with { PlaneHeight = h },
                var o => o,
            };
    }
}

/// <summary>How a project's reference height H0 of the plane coordinates was chosen.</summary>
public enum PlaneHeightBasis
{
    /// <summary>The mean of the given heights of the points (a project without a projection, the default).</summary>
    MeanHeight,

    /// <summary>Stated by <c>adjustment.plane_height</c>.</summary>
    Stated,

    /// <summary>The ellipsoid (H0 = −geoid separation): grid coordinates of a projection.</summary>
    Ellipsoid,
}
