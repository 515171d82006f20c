using System.Globalization;

namespace NetAdjust.Geodesy;

/// <summary>What the project's horizontal distances are: measured on the ground, or already on the grid.</summary>
public enum DistanceBasis
{
    /// <summary>Reduced to the grid already (used as they are).</summary>
    Grid,

    /// <summary>Horizontal distances at the height of the marks: reduced by the combined factor.</summary>
    Ground,
}

/// <summary>What the project's azimuths are: grid bearings, or geodetic (astronomic) azimuths.</summary>
public enum AzimuthBasis
{
    /// <summary>Grid bearings of the chord (used as they are).</summary>
    Grid,

    /// <summary>Geodetic or astronomic azimuths from true north: the convergence and arc-to-chord correction are
    /// applied.</summary>
    Geodetic,
}

/// <summary>
/// The coordinate system of a project's plane coordinates and how its observations relate to it (docs/input-format.md,
/// "Grid and ground"): a map projection, a stated project scale factor (a low-distortion local grid), or plain local
/// coordinates; whether distances are ground or grid; whether azimuths are geodetic or grid; the geoid separation
/// and the heights that give each line its ellipsoidal height. Immutable.
/// </summary>
public sealed record GridSystem
{
    /// <summary>The map projection of the plane coordinates, or null for a local system.</summary>
    public IMapProjection? Projection { get; init; }

    /// <summary>A local system's scale: grid length = ground length × this factor (positive); null for none.
    /// Not used with a projection.</summary>
    public double? ProjectScale { get; init; }

    /// <summary>Whether horizontal distances are ground or grid distances.</summary>
    public DistanceBasis Distances { get; init; } = DistanceBasis.Grid;

    /// <summary>Whether azimuths are grid bearings or geodetic azimuths.</summary>
    public AzimuthBasis Azimuths { get; init; } = AzimuthBasis.Grid;

    /// <summary>The geoid separation N in metres (ellipsoidal height = height + N) for points without their own.
    /// </summary>
    public double GeoidSeparation { get; init; }

    /// <summary>Geoid separations of single points in metres, by point id.</summary>
    public IReadOnlyDictionary<string, double> PointGeoidSeparations { get; init; } =
        new Dictionary<string, double>(StringComparer.Ordinal);

    /// <summary>The mean height of the project in metres (above the geoid), used for points without a height;
    /// null for none.</summary>
    public double? MeanHeight { get; init; }

    /// <summary>The standard deviation of <see cref="MeanHeight"/> in metres; null when not stated.</summary>
    public double? MeanHeightSd { get; init; }

    /// <summary>The plain local system of a project that declares nothing: no reduction.</summary>
    public static GridSystem Local { get; } = new();

    /// <summary>True when the system changes observations (a projection, or a project scale with ground distances).
    /// </summary>
    public bool Reduces => Projection is not null || (ProjectScale is not null && Distances == DistanceBasis.Ground);

    /// <summary>The ellipsoidal height of a point in metres from its height (or the mean height) and its geoid
    /// separation; null when the point has no height and the project no mean height.</summary>
    /// <param name="id">The point id.</param>
    /// <param name="height">The point's height above the geoid in metres, or null.</param>
    public double? EllipsoidalHeight(string id, double? height)
    {
        double? h = height ?? MeanHeight;
        if (h is null) return null;
        return h.Value + (PointGeoidSeparations.TryGetValue(id, out double n) ? n : GeoidSeparation);
    }

    /// <summary>One line naming the system for report headers, e.g.
    /// <c>EPSG:32633 (WGS 84 / UTM zone 33N), ground distances reduced to the grid</c>.</summary>
    public string Describe()
    {
        string distances = Distances == DistanceBasis.Ground ? "ground distances" : "grid distances";
        if (Projection is not null)
            return Projection.Name + (Distances == DistanceBasis.Ground
                ? ", ground distances reduced to the grid" : ", distances given on the grid");
        if (ProjectScale is double s)
            return "project ground system: local coordinates, grid = ground × " +
                s.ToString("0.000000###", CultureInfo.InvariantCulture) +
                (Distances == DistanceBasis.Ground ? ", ground distances scaled" : ", distances given on the grid");
        return "local plane coordinates, " + distances + " used as measured";
    }
}
