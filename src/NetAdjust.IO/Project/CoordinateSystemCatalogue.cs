using System.Globalization;
using NetAdjust.Geodesy;

namespace NetAdjust.IO.Project;

/// <summary>
/// The EPSG codes NetAdjust resolves by itself, because their parameters follow from the code
/// (docs/input-format.md, "Grid and ground"): UTM zones on WGS 84 (32601–32660 north, 32701–32760 south), on
/// ETRS89 (GRS 80; 25828–25838, zones 28N–38N) and on NAD83 (GRS 80; 26901–26923, zones 1N–23N), and the British
/// National Grid (27700, OSGB36 on Airy 1830). UTM: latitude of origin 0, central meridian 6° × zone − 183°,
/// scale 0.9996, false easting 500 000 m, false northing 0 (north) or 10 000 000 m (south) (Snyder 1987, USGS
/// Professional Paper 1395, §8 "Universal Transverse Mercator"; the code ranges from the EPSG registry, from memory).
/// Any other system is given as WKT.
/// </summary>
internal static class CoordinateSystemCatalogue
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The legal codes, for messages.</summary>
    public const string Supported =
        "UTM on WGS 84 (EPSG:32601-32660, 32701-32760), ETRS89 (EPSG:25828-25838), NAD83 (EPSG:26901-26923) or " +
        "the British National Grid (EPSG:27700); give any other projected system as WKT";

    /// <summary>The system's name and WKT (version 1) for a code, or null when the code is not one of these.</summary>
    /// <param name="code">The EPSG code.</param>
    public static (string Name, string Wkt)? Find(int code)
    {
        if (code is >= 32601 and <= 32660) return Utm("WGS 84", "WGS_1984", Ellipsoid.Wgs84, code - 32600, true);
        if (code is >= 32701 and <= 32760) return Utm("WGS 84", "WGS_1984", Ellipsoid.Wgs84, code - 32700, false);
        if (code is >= 25828 and <= 25838)
            return Utm("ETRS89", "European_Terrestrial_Reference_System_1989", Ellipsoid.Grs80, code - 25800, true);
        if (code is >= 26901 and <= 26923)
            return Utm("NAD83", "North_American_Datum_1983", Ellipsoid.Grs80, code - 26900, true);
        if (code == 27700)
            // Ordnance Survey, A guide to coordinate systems in Great Britain (from memory): true origin 49°N 2°W,
            // F0 = 0.9996012717, false origin 400 000 m E, −100 000 m N.
            return ("OSGB36 / British National Grid", Projected("OSGB36 / British National Grid", "OSGB 1936",
                "OSGB_1936", Ellipsoid.Airy1830, 49, -2, 0.9996012717, 400000, -100000));
        return null;
    }

    private static (string, string) Utm(string geog, string datum, Ellipsoid ellipsoid, int zone, bool north)
    {
        string name = $"{geog} / UTM zone {zone}{(north ? "N" : "S")}";
        return (name, Projected(name, geog, datum, ellipsoid, 0, 6 * zone - 183, 0.9996, 500000,
            north ? 0 : 10000000));
    }

    private static string Projected(string name, string geog, string datum, Ellipsoid e, double lat0, double lon0,
        double k0, double fe, double fn) =>
        string.Create(Inv,
            $"PROJCS[\"{name}\",GEOGCS[\"{geog}\",DATUM[\"{datum}\",SPHEROID[\"{e.Name}\",{e.SemiMajorAxis:R}," +
            $"{e.InverseFlattening:R}]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]]," +
            $"PROJECTION[\"Transverse_Mercator\"],PARAMETER[\"latitude_of_origin\",{lat0:R}]," +
            $"PARAMETER[\"central_meridian\",{lon0:R}],PARAMETER[\"scale_factor\",{k0:R}]," +
            $"PARAMETER[\"false_easting\",{fe:R}],PARAMETER[\"false_northing\",{fn:R}],UNIT[\"metre\",1]]");
}
