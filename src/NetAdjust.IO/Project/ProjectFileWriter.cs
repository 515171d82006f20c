using System.Globalization;
using System.Text;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// Writes a network as a project file (YAML: units, points) and one CSV file with every observation, in the
/// format <see cref="ProjectReader"/> reads: metres, decimal degrees, standard deviations of angles in arcseconds.
/// Used by <c>netadjust simulate</c>; reading the pair back gives the same network.
/// </summary>
public static class ProjectFileWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Writes the project file and its CSV file (beside it) safely: both or neither.</summary>
    /// <param name="network">The network.</param>
    /// <param name="projectPath">The YAML file to write; the CSV file takes its name with
    /// <c>-observations.csv</c>.</param>
    /// <param name="comment">A comment line for the head of both files (how they were made).</param>
    /// <exception cref="OutputException">When a file cannot be written or would overwrite an input.</exception>
    public static void Write(SurveyNetwork network, string projectPath, string comment)
    {
        string dir = Path.GetDirectoryName(Path.GetFullPath(projectPath))!;
        string csvName = Path.GetFileNameWithoutExtension(projectPath) + "-observations.csv";
        var (yaml, csv) = Format(network, csvName, comment);
        SafeFileWriter.WriteText(Path.Combine(dir, csvName), csv);
        SafeFileWriter.WriteText(projectPath, yaml);
    }

    /// <summary>The texts of the project file and of the CSV file.</summary>
    /// <param name="network">The network.</param>
    /// <param name="csvName">The CSV file's name, as the project file lists it.</param>
    /// <param name="comment">A comment line for the head of both files.</param>
    public static (string Yaml, string Csv) Format(SurveyNetwork network, string csvName, string comment)
    {
        var y = new StringBuilder();
        y.Append("# ").Append(comment).Append('\n');
        y.Append("project: ").Append(Quote(network.Name)).Append('\n');
        y.Append("units:\n  length: m\n  angle: deg\n  angle_sd: arcsec\n");
        y.Append("points:\n");
        foreach (var p in network.Points)
        {
            y.Append("  - {id: ").Append(Quote(p.Id));
            if (p.E is double e) y.Append(", e: ").Append(e.ToString("F4", Inv));
            if (p.N is double n) y.Append(", n: ").Append(n.ToString("F4", Inv));
            if (p.H is double h) y.Append(", h: ").Append(h.ToString("F4", Inv));
            string fix = Text.OptionGrammars.FormatHeldComponents(p.Fixed);
            if (fix.Length > 0) y.Append(", fix: ").Append(fix);
            if (p.SdE is double se) y.Append(", sd_e: ").Append(se.ToString("F5", Inv));
            if (p.SdN is double sn) y.Append(", sd_n: ").Append(sn.ToString("F5", Inv));
            if (p.SdH is double sh) y.Append(", sd_h: ").Append(sh.ToString("F5", Inv));
            y.Append("}\n");
        }
        y.Append("files:\n  - ").Append(csvName).Append('\n');

        var c = new StringBuilder();
        c.Append("# ").Append(comment).Append('\n');
        c.Append("kind,at,from,to,value,sd,length,set\n");
        foreach (var o in network.Observations)
        {
            string sdAngle() => (o.StandardDeviation * Angle.ArcsecondsPerRadian).ToString("F4", Inv);
            string sdLength() => o.StandardDeviation.ToString("F6", Inv);
            string line = o switch
            {
                DirectionObservation d =>
                    $"direction,{d.Station},,{d.Target},{Degrees(d.Reading)},{sdAngle()},,{SetLabel(d)}",
                DistanceObservation d =>
                    $"distance,,{d.From},{d.To},{d.Distance.Metres.ToString("F5", Inv)},{sdLength()},,",
                AngleObservation a =>
                    $"angle,{a.Station},{a.Backsight},{a.Foresight},{Degrees(a.Measured)},{sdAngle()},,",
                AzimuthObservation a => $"azimuth,,{a.From},{a.To},{Degrees(a.Azimuth)},{sdAngle()},,",
                HeightDifferenceObservation h =>
                    $"height_difference,,{h.From},{h.To},{h.Difference.Metres.ToString("F6", Inv)},{sdLength()}," +
                    $"{h.LineLength?.Metres.ToString("F1", Inv)},",
                _ => throw new OutputException($"observation kind {o.Kind} cannot be written to CSV"),
            };
            c.Append(line).Append('\n');
        }
        return (y.ToString(), c.ToString());
    }

    private static string Degrees(Angle a) => a.Degrees.ToString("F9", Inv);

    private static string SetLabel(DirectionObservation d)
    {
        // The reader names a set "<station>/<file>#<set>"; keep the part a CSV row can carry.
        int hash = d.SetId.LastIndexOf('#');
        string label = hash >= 0 ? d.SetId[(hash + 1)..] : d.SetId.StartsWith(d.Station + "/",
            StringComparison.Ordinal) ? d.SetId[(d.Station.Length + 1)..] : d.SetId;
        return label.Replace(',', '_');
    }

    private static string Quote(string s) =>
        s.All(ch => char.IsLetterOrDigit(ch) || ch is '_' or '-' or '.') ? s : "'" + s.Replace("'", "''") + "'";
}
