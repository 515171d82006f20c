using System.Text;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

public static partial class DemoProjectWriter
{
    /// <summary>The EPSG code of the Tarnholm demo's grid (WGS 84 / UTM zone 33N).</summary>
    private const int TarnholmCode = 32633;

    private const double Arcsecond = 1.0 / Angle.ArcsecondsPerRadian;

    /// <summary>
    /// Draws a demo scenario with what it needs from this assembly: the Tarnholm and Skelmoor scenarios through the
    /// ProjNET projection of their grid (WGS 84 / UTM zone 33N; ETRS89 / UTM zone 32N), the same projection their
    /// project files name and the reduction uses; the others as <see cref="DemoScenarios.Draw"/> does.
    /// </summary>
    /// <param name="scenario">The scenario.</param>
    /// <param name="seed">The random seed.</param>
    public static DemoSurvey Draw(DemoScenario scenario, int seed)
    {
        int code = scenario switch
        {
            DemoScenario.Tarnholm => TarnholmCode,
            DemoScenario.Skelmoor => SkelmoorCode,
            _ => 0,
        };
        if (code == 0) return DemoScenarios.Draw(scenario, seed);
        var (name, wkt) = CoordinateSystemCatalogue.Find(code)!.Value;
        return DemoScenarios.Draw(scenario, seed, ProjNetProjection.FromWkt(wkt, $"EPSG:{code} ({name})"));
    }

    private static string Tarnholm(DemoSurvey s, string how)
    {
        var y = new StringBuilder();
        y.Append("# NetAdjust demo project: Tarnholm quarry extension, control on a UTM grid (invented site).\n" +
            "# Three published control marks (WGS 84 / UTM zone 33N, about 118 km east of the central meridian) " +
            "and five new\n" +
            "# stations on a plateau 440-470 m above the geoid. Distances were measured on the ground: the program " +
            "reduces them\n" +
            "# to the grid (elevation factor x line scale factor, about -290 ppm here), corrects the directions " +
            "for arc-to-chord\n" +
            "# and turns the geodetic azimuth S3-S5 (from a GNSS pair) into a grid azimuth by the convergence " +
            "(about 1.15 deg).\n" +
            "# Run `netadjust adjust data/tarnholm-grid.yaml`; remove the `grid` section to see the global test " +
            "fail.\n" +
            "# Values simulated from a chosen grid truth with realistic noise (directions 1\", distances 1.5 mm, " +
            "azimuth 2\"),\n" +
            $"# drawn by {how};\n" +
            "# ground distances = grid distance / combined factor at the truth.\n" +
            "project: Tarnholm quarry extension (demo)\n" +
            "units: {length: m, angle: dms, angle_sd: arcsec}\n" +
            "default_sd: {direction: 1.0}\n" +
            $"crs: EPSG:{TarnholmCode}\n" +
            "grid:\n" +
            "  distances: ground\n" +
            "  azimuths: geodetic\n" +
            "  geoid_separation: 47.3\n" +
            "points:\n");
        bool first = true;
        foreach (var p in s.Points)
        {
            if (p.IsFixed(Fixity.E)) Point(y, p, 3, 3, "published control");
            else
            {
                Point(y, p, 3, 2, first ? "new station: plane coordinates computed by the program; height levelled"
                    : "");
                first = false;
            }
        }
        y.Append("setups:\n");
        var dms = AnglePattern.Dms;
        foreach (var (at, obs) in s.Setups)
        {
            y.Append("  - at: ").Append(at).Append('\n');
            Setup(y, obs, withSd: true);
            if (obs.OfType<AzimuthObservation>().Any()) y.Append("    azimuths:\n");
            foreach (var a in obs.OfType<AzimuthObservation>())
                y.Append(Inv, $"      - {{to: {a.To}, value: {dms.FormatDirection(a.Azimuth)}, ")
                    .Append(Inv, $"sd: {a.StandardDeviation / Arcsecond:F1}}}\n");
        }
        return y.Append(SchemaComment).ToString();
    }
}
