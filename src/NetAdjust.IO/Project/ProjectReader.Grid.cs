using System.Globalization;
using NetAdjust.Geodesy;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The coordinate reference system (<c>crs</c>) and the grid declaration (<c>grid</c>) of a project
/// (docs/input-format.md, "Grid and ground").</summary>
public static partial class ProjectReader
{
    private static readonly string[] GridKeys =
        ["distances", "azimuths", "scale", "geoid_separation", "geoid_separations", "mean_height", "mean_height_sd"];

    /// <summary>Reads <c>crs</c> (an EPSG code NetAdjust resolves, or WKT) and the <c>grid</c> section; checks that
    /// they agree with each other and with the points (the heights the observations need are checked once they are
    /// read, <see cref="CheckGridHeights"/>). The grid system is null when the project has no <c>grid</c> section
    /// (the <c>crs</c> then only labels the outputs, as before).</summary>
    private static (string? Crs, GridSystem? Grid) ReadGrid(Context ctx, YamlMappingNode root, LengthPattern lengths,
        IReadOnlyList<Point> points)
    {
        var (crs, projection, crsNode) = ReadCrs(ctx, root);
        if (ctx.Child(root, "grid") is not YamlNode node) return (crs, null);
        var m = ctx.Mapping(node, "grid");
        ctx.CheckKeys(m, GridKeys, "grid");
        if (ctx.Child(m, "distances") is not YamlNode dn)
            throw ctx.Error(m, "grid.distances", "say whether the distances are 'ground' or 'grid' distances " +
                "(never guessed)");
        var system = new GridSystem
        {
            Projection = projection,
            Distances = ctx.Choice(dn, "grid.distances", OptionGrammars.DistanceBases),
        };
        double Len(YamlNode v, string item) => ctx.ParseLength(v, lengths, ctx.Scalar(v, item), item).Metres;
        if (ctx.Child(m, "azimuths") is YamlNode az)
        {
            system = system with { Azimuths = ctx.Choice(az, "grid.azimuths", OptionGrammars.AzimuthBases) };
            if (system.Azimuths == AzimuthBasis.Geodetic && projection is null)
                throw ctx.Error(az, "grid.azimuths", "geodetic azimuths need a projection (crs) for the meridian " +
                    "convergence");
        }
        if (ctx.Child(m, "scale") is YamlNode sc)
        {
            if (crsNode is not null)
                throw ctx.Error(sc, "grid.scale", "a project scale factor and a projection (crs, line " +
                    $"{Line(crsNode)}) contradict each other: give one of them");
            double s = ctx.Number(sc, "grid.scale");
            if (!(s > 0.99 && s < 1.01))
                throw ctx.Error(sc, "grid.scale", $"'{s.ToString(CultureInfo.InvariantCulture)}' is not a scale " +
                    "factor near 1 (grid length = ground length × scale, between 0.99 and 1.01)");
            system = system with { ProjectScale = s };
        }
        foreach (string key in new[] { "geoid_separation", "geoid_separations", "mean_height", "mean_height_sd" })
            if (projection is null && ctx.Child(m, key) is YamlNode v)
                throw ctx.Error(v, "grid." + key, "applies only with a projection (crs)");
        if (ctx.Child(m, "geoid_separation") is YamlNode gs)
            system = system with { GeoidSeparation = Len(gs, "grid.geoid_separation") };
        if (ctx.Child(m, "geoid_separations") is YamlNode gss)
        {
            var map = new Dictionary<string, double>(StringComparer.Ordinal);
            foreach (var (k, v) in ctx.Mapping(gss, "grid.geoid_separations (point id: separation)").Children)
            {
                string id = ctx.Scalar(k, "grid.geoid_separations");
                if (!points.Any(p => p.Id == id))
                    throw ctx.Error(k, "grid.geoid_separations", $"point '{id}' is not in the list of points");
                map[id] = Len(v, $"grid.geoid_separations {id}");
            }
            system = system with { PointGeoidSeparations = map };
        }
        if (ctx.Child(m, "mean_height") is YamlNode mh)
            system = system with { MeanHeight = Len(mh, "grid.mean_height") };
        if (ctx.Child(m, "mean_height_sd") is YamlNode mhs)
        {
            if (system.MeanHeight is null)
                throw ctx.Error(mhs, "grid.mean_height_sd", "is given without grid.mean_height");
            double sd = Len(mhs, "grid.mean_height_sd");
            if (!(sd >= 0)) throw ctx.Error(mhs, "grid.mean_height_sd", "must not be negative");
            system = system with { MeanHeightSd = sd };
        }
        return (crs, system);
    }

    /// <summary>With a projection and ground distances, every end of a horizontal distance needs a height (the
    /// project has no mean height).</summary>
    private static void CheckGridHeights(Context ctx, YamlMappingNode root, GridSystem? grid,
        IReadOnlyList<Point> points, IReadOnlyList<Observation> observations)
    {
        if (grid is not { Projection: not null, Distances: DistanceBasis.Ground, MeanHeight: null }) return;
        var needed = observations.OfType<DistanceObservation>().SelectMany(d => new[] { d.From, d.To })
            .ToHashSet(StringComparer.Ordinal);
        foreach (var p in points)
        {
            if (p.H is not null || !needed.Contains(p.Id)) continue;
            // the point's line is in its source (file:line), whether the list was read from its lines or not
            int colon = p.Source?.LastIndexOf(':') ?? -1;
            int line = colon > 0 && int.TryParse(p.Source.AsSpan(colon + 1), System.Globalization.NumberStyles.None,
                System.Globalization.CultureInfo.InvariantCulture, out int l) ? l : Line(root);
            throw new ProjectFileException(ctx.File, line, "point " + p.Id, "has no height, but the project's " +
                "distances are ground distances on a projection: give the point a height (h) or the project a " +
                "grid.mean_height");
        }
    }

    /// <summary>Reads the optional <c>crs</c> key: <c>EPSG:</c> and a code NetAdjust resolves (e.g.
    /// <c>EPSG:32633</c>), or WKT of a projected system (<c>PROJCS[...]</c>).</summary>
    private static (string? Label, IMapProjection? Projection, YamlNode? Node) ReadCrs(Context ctx,
        YamlMappingNode root)
    {
        if (ctx.Child(root, "crs") is not YamlNode node) return (null, null, null);
        string s = ctx.Scalar(node, "crs").Trim();
        if (s.StartsWith("PROJCS[", StringComparison.OrdinalIgnoreCase))
        {
            try { return (null, ProjNetProjection.FromWkt(s, "WKT " + WktName(s)), node); }
            catch (ArgumentException e) { throw ctx.Error(node, "crs", e.Message); }
        }
        if (s.StartsWith("PROJCRS[", StringComparison.OrdinalIgnoreCase) ||
            s.StartsWith("GEOGCS[", StringComparison.OrdinalIgnoreCase))
            throw ctx.Error(node, "crs", "give a projected system as WKT version 1 (PROJCS[...])");
        const string prefix = "EPSG:";
        string code = s.StartsWith(prefix, StringComparison.OrdinalIgnoreCase) ? s[prefix.Length..] : "";
        if (code.Length is < 4 or > 6 || !code.All(char.IsAsciiDigit))
            throw ctx.Error(node, "crs",
                $"'{s}' is not a coordinate reference system: write EPSG: and its code, e.g. EPSG:32633, or WKT");
        var found = CoordinateSystemCatalogue.Find(int.Parse(code, CultureInfo.InvariantCulture));
        if (found is not var (name, wkt))
            throw ctx.Error(node, "crs", $"EPSG:{code} is not a code NetAdjust can resolve: use " +
                CoordinateSystemCatalogue.Supported);
        return (prefix + code, ProjNetProjection.FromWkt(wkt, $"{prefix}{code} ({name})"), node);
    }

    private static string WktName(string wkt)
    {
        int a = wkt.IndexOf('"'), b = a < 0 ? -1 : wkt.IndexOf('"', a + 1);
        return b > a ? wkt[(a + 1)..b] : "projected system";
    }
}
