using System.Globalization;
using System.Text;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// Writes a drawn demonstration survey (<see cref="DemoScenarios"/>) as the project files of data/, in their layout:
/// the same keys, comments and order, so that <c>netadjust simulate --scenario NAME</c> regenerates a demo project.
/// </summary>
public static partial class DemoProjectWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>
    /// The last line of every project file written: the YAML language server's schema comment, so editors check the
    /// file against docs/project.schema.json (a path relative to data/, where the demo projects live). It is the
    /// last line so that the line numbers of the observations, which reports cite, stay as they were.
    /// </summary>
    internal const string SchemaComment = "# yaml-language-server: $schema=../docs/project.schema.json\n";

    /// <summary>The files of a survey: (file name, text), the project file first.</summary>
    /// <param name="survey">The drawn survey.</param>
    /// <param name="baseName">The project file's name without extension; other files are named after it.</param>
    public static IReadOnlyList<(string Name, string Text)> Format(DemoSurvey survey, string baseName)
    {
        string how = string.Create(Inv,
            $"netadjust simulate --scenario {OptionGrammars.DemoScenarios.Format(survey.Scenario)} --seed " +
                $"{survey.Seed}");
        return survey.Scenario switch
        {
            DemoScenario.Brackenmoor => Brackenmoor(survey, baseName, how),
            DemoScenario.Harrowfield => [(baseName + ".yaml", Harrowfield(survey, how))],
            DemoScenario.CorvanFell => [(baseName + ".yaml", CorvanFell(survey, how))],
            DemoScenario.Tarnholm => [(baseName + ".yaml", Tarnholm(survey, how))],
            DemoScenario.Skelmoor => [(baseName + ".yaml", Skelmoor(survey, how))],
            _ => [(baseName + ".yaml", Harrowgate(survey, how))],
        };
    }

    private static List<(string, string)> Brackenmoor(DemoSurvey s, string baseName, string how)
    {
        string csv = baseName + "-levels.csv";
        string Project(bool approximations, string title)
        {
            var y = new StringBuilder();
            y.Append(title).Append('\n').Append(
                "# A closed traverse of seven stations from control BK01, oriented on BK02, and a level loop\n" +
                $"# (levelling/CSV). Values were simulated from a chosen truth with realistic noise: {how}.\n" +
                "project: Brackenmoor WTW control resurvey (demo)\n" +
                "units:\n" +
                "  length: m        # m | ft | usft\n" +
                "  angle: dms       # dms | deg | gon\n" +
                "  angle_sd: arcsec # arcsec | mgon\n" +
                "adjustment:\n" +
                "  alpha: 0.05\n" +
                "  max_iterations: 20\n" +
                "  centering: independent   # independent | correlated (one covariance block per setup)\n" +
                "# Instrument and target specifications: every direction, angle and distance of a setup that " +
                "names an\n" +
                "# instrument is weighted from them (docs/input-format.md, 'Instruments, targets and procedures').\n" +
                "instruments:\n" +
                "  - {id: TS3, direction_sd: 3, zenith_sd: 3, edm: 2 mm + 2 ppm, centering: 1.0 mm, height: 1.5 mm}" +
                "  # ISO 17123-3 sd, arcsec\n" +
                "targets:\n" +
                "  - {id: TRIBRACH, centering: 1.0 mm, height: 1.5 mm}   # prism in a tribrach on a tripod\n" +
                "levels:\n" +
                "  - {id: DL10, sd_per_km: 1.0 mm}   # ISO 17123-2 sd of 1 km double-run levelling " +
                "(used by the CSV level loop)\n" +
                "default_sd:\n  direction: 2.0\n  angle: 2.8\n  distance: 3 mm\n  height_difference: 1 mm\n" +
                "points:\n");
            foreach (var p in s.Points)
            {
                string note = p.Id switch
                {
                    "BK01" => "control, held",
                    "BK02" => "control, held (orientation)",
                    "BMK1" => "benchmark, held",
                    _ when p.H is null && p.E is null => "",
                    _ => approximations ? "approximate" : "no coordinates: computed from the observations",
                };
                var q = approximations || p.E is null || p.IsFixed(Fixity.E) ? p : new Point(p.Id);
                Point(y, q, p.E is null || p.IsFixed(Fixity.E) ? 3 : 1, p.H is not null ? 4 : 3, note);
            }
            y.Append("setups:\n");
            foreach (var (at, obs) in s.Setups)
            {
                y.Append("  - at: ").Append(at).Append('\n');
                y.Append("    instrument: TS3\n    target: TRIBRACH\n    sets: 2\n    faces: both\n");
                Setup(y, obs, withSd: false);
            }
            y.Append("files:\n  - ").Append(csv).Append('\n');
            return y.Append(SchemaComment).ToString();
        }
        var c = new StringBuilder();
        c.Append("# Level loop at Brackenmoor (invented), double-run levelling with level DL10: ")
            .Append("sd = 1.0 mm/sqrt(km) x sqrt(length)\nkind,from,to,value,length,level\n");
        foreach (var h in s.Levelling)
            c.Append(Inv, $"height_difference,{h.From},{h.To},{h.Difference.Metres:F5},")
                .Append(Inv, $"{h.LineLength!.Value.Metres:F0},DL10\n");
        return
        [
            (baseName + ".yaml", Project(true,
                "# NetAdjust demo project: Brackenmoor water treatment works, control resurvey (invented site).")),
            (csv, c.ToString()),
            (baseName + "-auto.yaml", Project(false,
                "# NetAdjust demo project (variant without approximate coordinates for S1-S6, computed by the " +
                "program): Brackenmoor water treatment works (invented site).")),
        ];
    }

    private static string Harrowfield(DemoSurvey s, string how)
    {
        var y = new StringBuilder();
        y.Append("# NetAdjust demo: Harrowfield quarry extension, new control (invented site and data).\n" +
                 $"# Simulated by {how} from a chosen truth with 2\" directions and 3 mm\n" +
                 "# distances, and ONE planted blunder for the blunder hunt: try\n" +
                 "#   dotnet run --project src/NetAdjust.Cli -- adjust data/harrowfield-blunder.yaml --snoop\n" +
                 "project: Harrowfield quarry extension control (blunder-hunt demo)\n" +
                 "units: {length: m, angle: dms, angle_sd: arcsec}\n" +
                 "default_sd: {direction: 2.0, distance: 3 mm}\n" +
                 "statistics:\n  relative_pairs:\n    - [H1, H4]\n" +
                 "points:\n");
        foreach (var p in s.Points) Point(y, p, 3, 3, "");
        y.Append("setups:\n");
        foreach (var (at, obs) in s.Setups)
        {
            y.Append("  - at: ").Append(at).Append('\n');
            Setup(y, obs, withSd: false);
        }
        return y.Append(SchemaComment).ToString();
    }

    private static string Harrowgate(DemoSurvey s, string how)
    {
        var y = new StringBuilder();
        y.Append("# NetAdjust demo project: Harrowgate viaduct, control check before stake-out (invented site).\n" +
                 "# Six new stations braced to four published control marks. One mark (HV03) was disturbed after " +
                 "publication:\n" +
                 "# run `netadjust adjust data/harrowgate-control.yaml --sequence` to see the control test fail and " +
                 "HV03 stand out.\n" +
                 $"# Values simulated from a chosen truth with realistic noise: {how}.\n" +
                 "project: Harrowgate viaduct control check (demo)\n" +
                 "units: {length: m, angle: dms, angle_sd: arcsec}\n" +
                 "default_sd: {direction: 1.0}\n" +
                 "points:\n");
        foreach (var p in s.Points)
            Point(y, p, 3, 3, p.IsFixed(Fixity.E) ? "published control"
                : "new station: approximate coordinates computed by the program");
        y.Append("setups:\n");
        foreach (var (at, obs) in s.Setups)
        {
            y.Append("  - at: ").Append(at).Append('\n');
            Setup(y, obs, withSd: true);
        }
        return y.Append(SchemaComment).ToString();
    }

    private static string CorvanFell(DemoSurvey s, string how)
    {
        var y = new StringBuilder();
        y.Append("# NetAdjust demo project: Corvan Fell wind farm access track, 3D control traverse " +
                 "(invented site).\n" +
                 "# A closed traverse CF1-CF6 observed in two sets in both faces (rounds: horizontal readings, " +
                 "zenith\n" +
                 "# angles, slope distances), tied to two levelled benchmarks (CF1, CF4) and oriented on RM.\n" +
                 "# Values simulated from a chosen truth with curvature and refraction (k = 0.13) and realistic\n" +
                 $"# noise: {how}.\n" +
                 "project: Corvan Fell access track 3D traverse (demo)\n" +
                 "units: {length: m, angle: dms, angle_sd: arcsec}\n" +
                 "adjustment: {refraction: 0.13}\n" +
                 "instruments:\n" +
                 "  - {id: TS2, direction_sd: 2, zenith_sd: 2, edm: 1 mm + 1.5 ppm, centering: 0.8 mm, " +
                 "height: 1 mm}\n" +
                 "targets:\n" +
                 "  - {id: PRISM, centering: 0.8 mm, height: 1 mm}\n" +
                 "points:\n");
        foreach (var p in s.Points)
            Point(y, p, p.IsFixed(Fixity.E) ? 3 : 1, p.IsFixed(Fixity.H) ? 3 : 1, p.Id switch
            {
                "CF1" => "benchmark and control, held",
                "RM" => "reference mark, held in plan",
                "CF4" => "benchmark, height held",
                _ => "approximate",
            });
        y.Append("setups:\n");
        var dms = AnglePattern.Dms;
        foreach (var r in s.Rounds)
        {
            y.Append("  - at: ").Append(r.At).Append('\n');
            y.Append(Inv, $"    instrument: TS2\n    target: PRISM\n    instrument_height: {r.InstrumentHeight:F3}\n");
            y.Append("    rounds:\n");
            for (int set = 0; set < r.Sets.Count; set++)
            {
                y.Append("      - readings:\n");
                foreach (var x in r.Sets[set])
                {
                    y.Append(Inv, $"          - {{to: {x.Target}, ")
                        .Append(Inv, $"hz_left: {dms.FormatDirection(x.HorizontalLeft!.Value)}")
                        .Append(Inv, $", hz_right: {dms.FormatDirection(x.HorizontalRight!.Value)}");
                    if (set == 0 && r.TargetHeights.TryGetValue(x.Target, out double th))
                        y.Append(Inv, $", target_height: {th:F3}");
                    if (x.ZenithLeft is Angle zl && x.ZenithRight is Angle zr)
                        y.Append(Inv, $",\n             zenith_left: {dms.FormatDirection(zl)}")
                            .Append(Inv, $", zenith_right: {dms.FormatDirection(zr)}")
                            .Append(Inv, $", slope_left: {x.SlopeLeft!.Value.Metres:F4}")
                            .Append(Inv, $", slope_right: {x.SlopeRight!.Value.Metres:F4}");
                    y.Append("}\n");
                }
            }
        }
        return y.Append(SchemaComment).ToString();
    }

    private static void Point(StringBuilder y, Point p, int planeDecimals, int heightDecimals, string note)
    {
        y.Append("  - {id: ").Append(p.Id);
        if (p.E is double e) y.Append(", e: ").Append(e.ToString("F" + planeDecimals, Inv));
        if (p.N is double n) y.Append(", n: ").Append(n.ToString("F" + planeDecimals, Inv));
        if (p.H is double h) y.Append(", h: ").Append(h.ToString("F" + heightDecimals, Inv));
        if (p.Fixed != Fixity.None) y.Append(", fix: ").Append(OptionGrammars.FormatHeldComponents(p.Fixed));
        y.Append('}');
        if (note.Length > 0) y.Append("   # ").Append(note);
        y.Append('\n');
    }

    private static void Setup(StringBuilder y, IReadOnlyList<Observation> obs, bool withSd)
    {
        var dms = AnglePattern.Dms;
        if (obs.OfType<DirectionObservation>().Any()) y.Append("    directions:\n");
        foreach (var d in obs.OfType<DirectionObservation>())
            y.Append(Inv, $"      - {{to: {d.Target}, value: {dms.FormatDirection(d.Reading)}}}\n");
        if (obs.OfType<AngleObservation>().Any()) y.Append("    angles:\n");
        foreach (var a in obs.OfType<AngleObservation>())
            y.Append(Inv, $"      - {{from: {a.Backsight}, to: {a.Foresight}, ")
                .Append(Inv, $"value: {dms.FormatDirection(a.Measured)}}}\n");
        if (obs.OfType<DistanceObservation>().Any()) y.Append("    distances:\n");
        foreach (var d in obs.OfType<DistanceObservation>())
        {
            y.Append(Inv, $"      - {{to: {d.To}, value: {d.Distance.Metres:F4}");
            if (withSd) y.Append(Inv, $", sd: {d.StandardDeviation:F4}");
            y.Append("}\n");
        }
    }
}
