using System.Text;
using NetAdjust.Network;
using NetAdjust.Simulation;

namespace NetAdjust.IO.Project;

public static partial class DemoProjectWriter
{
    /// <summary>The EPSG code of the Skelmoor demo's grid (ETRS89 / UTM zone 32N).</summary>
    private const int SkelmoorCode = 25832;

    private static string Skelmoor(DemoSurvey s, string how)
    {
        var y = new StringBuilder();
        y.Append("# NetAdjust demo project: Skelmoor business park, GNSS control with a traverse and a level line " +
            "(invented site).\n" +
            "# Four GNSS control marks SK01-SK04 (ETRS89 / UTM zone 32N, 2-3 km apart) observed in two sessions of " +
            "three receivers;\n" +
            "# SK01 is held. A total-station traverse SK01-T1-T2-T3-SK03 oriented on SK02 at both ends, distances " +
            "on the ground,\n" +
            "# and a level line along it from SK01. The baselines are adjusted with the terrestrial observations on " +
            "the grid: heights\n" +
            "# above the geoid with the separation below (h = H + N). `netadjust check` shows the baseline loops " +
            "first.\n" +
            "# Values simulated from a chosen grid truth with realistic noise (baselines 3 mm + 0.5 ppm horizontal, " +
            "twice that\n" +
            "# vertical, correlated; directions 1\", distances 2 mm, levelling 1 mm/sqrt(km)),\n" +
            $"# drawn by {how}.\n" +
            "project: Skelmoor business park GNSS control (demo)\n" +
            "units: {length: m, angle: dms, angle_sd: arcsec}\n" +
            "default_sd: {direction: 1.0}\n" +
            $"crs: EPSG:{SkelmoorCode}\n" +
            "grid:\n" +
            "  distances: ground\n" +
            string.Create(Inv, $"  geoid_separation: {SkelmoorGnss.GeoidSeparation:F2}\n") +
            "points:\n");
        bool firstMark = true, firstStation = true;
        foreach (var p in s.Points)
        {
            string note = "";
            if (p.IsFixed(Fixity.E)) note = "published control, held";
            else if (p.Id.StartsWith("SK", StringComparison.Ordinal) && firstMark)
            {
                note = "GNSS mark: approximate coordinates from a navigation fix";
                firstMark = false;
            }
            else if (!p.Id.StartsWith("SK", StringComparison.Ordinal) && firstStation)
            {
                note = "traverse station: approximate coordinates from the sketch";
                firstStation = false;
            }
            Point(y, p, p.IsFixed(Fixity.E) ? 3 : 1, p.IsFixed(Fixity.H) ? 3 : 1, note);
        }
        y.Append("gnss:\n  frame: \"ETRS89\"\n  groups:\n");
        foreach (string session in s.Baselines.Select(b => b.Session).Distinct())
            y.Append("    - {id: ").Append(session).Append(", scale: 1.0}\n");
        y.Append("  baselines:\n");
        foreach (var b in s.Baselines)
        {
            var (sx, sy, sz) = b.Sd;
            var (rxy, rxz, ryz) = b.Correlations;
            y.Append(Inv, $"    - {{from: {b.From}, to: {b.To}, dx: {b.Dx:F4}, dy: {b.Dy:F4}, dz: {b.Dz:F4}, ")
                .Append(Inv, $"sd: [{sx:F5}, {sy:F5}, {sz:F5}], corr: [{rxy:F3}, {rxz:F3}, {ryz:F3}], ")
                .Append(Inv, $"group: {b.Session}}}\n");
        }
        y.Append("setups:\n");
        foreach (var (at, obs) in s.Setups)
        {
            y.Append("  - at: ").Append(at).Append('\n');
            Setup(y, obs, withSd: true);
        }
        y.Append("levelling:\n");
        foreach (var l in s.Levelling)
            y.Append(Inv, $"  - {{from: {l.From}, to: {l.To}, dh: {l.Difference.Metres:F4}, ")
                .Append(Inv, $"length: {l.LineLength!.Value.Metres:F0}, sd: {l.StandardDeviation:F5}}}\n");
        return y.Append(SchemaComment).ToString();
    }
}
