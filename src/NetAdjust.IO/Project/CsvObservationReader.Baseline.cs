using System.Globalization;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// CSV rows of GNSS baselines (kind <c>baseline</c>; docs/input-format.md, "GNSS baselines"): <c>from</c>, <c>to</c>,
/// <c>dx</c>, <c>dy</c>, <c>dz</c> in metres, the covariance as <c>sd_x</c>, <c>sd_y</c>, <c>sd_z</c> (metres) with
/// <c>r_xy</c>, <c>r_xz</c>, <c>r_yz</c> (empty: 0), or as the lower triangle <c>q_xx</c>, <c>q_yx</c>, <c>q_yy</c>,
/// <c>q_zx</c>, <c>q_zy</c>, <c>q_zz</c> (m²); optional <c>group</c>, <c>exclude</c>, <c>sd_factor</c>. One row
/// gives the baseline's three component observations.
/// </summary>
internal static partial class CsvObservationReader
{
    private static readonly string[] SdColumns = ["sd_x", "sd_y", "sd_z"];
    private static readonly string[] CorrelationColumns = ["r_xy", "r_xz", "r_yz"];
    private static readonly string[] CovarianceColumns = ["q_xx", "q_yx", "q_yy", "q_zx", "q_zy", "q_zz"];

    /// <summary>The columns of this part.</summary>
    private static string[] BaselineColumns =>
        ["dx", "dy", "dz", .. SdColumns, .. CorrelationColumns, .. CovarianceColumns, "group"];

    private static IEnumerable<Observation> BaselineRow(string from, string to, Func<string, string> get, string file,
        int line, string item)
    {
        ProjectFileException Bad(string problem) => new(file, line, item, problem);
        foreach (var name in new[] { "value", "sd", "at", "length", "set", "level", "setups", "runs", "instrument",
                     "target", "sets", "faces", "instrument_height", "target_height", "refraction_group" })
            if (get(name).Length > 0) throw Bad($"the '{name}' field is not used by a baseline");
        double Number(string name, bool required, double empty = 0)
        {
            string t = get(name);
            if (t.Length == 0) return required ? throw Bad($"the '{name}' field is empty") : empty;
            return double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) &&
                double.IsFinite(v) ? v : throw Bad($"{name}: '{t}' is not a number");
        }
        Length Component(string name)
        {
            var r = LengthPattern.Metres.Parse(get(name).Length == 0 ? throw Bad($"the '{name}' field is empty")
                : get(name));
            return r.Success ? r.Value : throw Bad($"{name}: {r.Error}");
        }
        var vector = (Component("dx"), Component("dy"), Component("dz"));
        bool bySd = SdColumns.Concat(CorrelationColumns).Any(c => get(c).Length > 0);
        bool byCov = CovarianceColumns.Any(c => get(c).Length > 0);
        if (bySd && byCov) throw Bad("give either sd_x, sd_y, sd_z (with r_xy, r_xz, r_yz) or q_xx ... q_zz, not both");
        if (!bySd && !byCov) throw Bad("no covariance: fill sd_x, sd_y, sd_z (and r_xy, r_xz, r_yz) or q_xx ... q_zz");
        double[] cov;
        if (byCov)
        {
            var q = CovarianceColumns.Select(c => Number(c, true)).ToArray();
            cov = [q[0], q[1], q[3], q[1], q[2], q[4], q[3], q[4], q[5]];
        }
        else
        {
            var sd = SdColumns.Select(c => Number(c, true)).ToArray();
            for (int i = 0; i < 3; i++)
                if (!(sd[i] > 0)) throw Bad($"{SdColumns[i]}: a standard deviation must be positive");
            var r = CorrelationColumns.Select(c => Number(c, false)).ToArray();
            for (int i = 0; i < 3; i++)
                if (!(r[i] > -1 && r[i] < 1))
                    throw Bad($"{CorrelationColumns[i]}: a correlation must lie between −1 and 1, not " +
                        r[i].ToString("R", CultureInfo.InvariantCulture));
            cov = BaselineObservation.CovarianceOf((Length.FromMetres(sd[0]), Length.FromMetres(sd[1]),
                Length.FromMetres(sd[2])), r[0], r[1], r[2]);
        }
        if (BaselineObservation.CovarianceProblem(cov) is string problem) throw Bad(problem);
        string? group = get("group").Length > 0 ? get("group") : null;
        string source = $"{file}:{line}";
        var list = new List<Observation>(3);
        foreach (var c in ProjectReader.Baseline(source, from, to, vector, cov, group))
            list.Add(ObservationMarks.Apply(ProjectReader.GuardedRow(file, line, item, () => c), get("exclude"),
                get("sd_factor"), file, line, item));
        return list;
    }

    /// <summary>The baseline columns are refused on rows of other kinds.</summary>
    private static void CheckNoBaselineFields(Func<string, string> get, string file, int line, string item)
    {
        foreach (var name in BaselineColumns)
            if (get(name).Length > 0)
                throw new ProjectFileException(file, line, item, $"the '{name}' field is for baselines only");
    }
}
