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

    /// <summary>The columns of the other kinds that a baseline row leaves empty, in the order they are checked.
    /// </summary>
    private static readonly string[] NotForBaselines = ["value", "sd", "at", "length", "set", "level", "setups",
        "runs", "instrument", "target", "sets", "faces", "instrument_height", "target_height", "refraction_group"];

    /// <summary>The columns of this part.</summary>
    private static string[] BaselineColumns =>
        ["dx", "dy", "dz", .. SdColumns, .. CorrelationColumns, .. CovarianceColumns, "group"];

    /// <summary>Where the header put the columns a baseline row reads (−1: not in the header), found once per file.
    /// </summary>
    private sealed class BaselinePlaces
    {
        public BaselinePlaces(IReadOnlyDictionary<string, int> columns)
        {
            int C(string name) => columns.GetValueOrDefault(name, -1);
            (Dx, Dy, Dz, Group, Exclude, SdFactor) =
                (C("dx"), C("dy"), C("dz"), C("group"), C("exclude"), C("sd_factor"));
            Sd = [.. SdColumns.Select(C)];
            Correlation = [.. CorrelationColumns.Select(C)];
            Covariance = [.. CovarianceColumns.Select(C)];
            NotUsed = [.. NotForBaselines.Where(columns.ContainsKey).Select(n => (n, columns[n]))];
        }

        public int Dx { get; }
        public int Dy { get; }
        public int Dz { get; }
        public int Group { get; }
        public int Exclude { get; }
        public int SdFactor { get; }
        public int[] Sd { get; }
        public int[] Correlation { get; }
        public int[] Covariance { get; }

        /// <summary>The columns of <see cref="NotForBaselines"/> in the header, in that order.</summary>
        public (string Name, int Column)[] NotUsed { get; }
    }

    private sealed partial class RowReader
    {
        private BaselinePlaces? _baselinePlaces;
        private string? _lastGroup;

        /// <summary>Reads a baseline row (split in <see cref="row"/>) into its three component observations, the
        /// fields read where they lie in the line (no string made for a plain number).</summary>
        private void BaselineRow(string from, string to, string file, int line, List<Observation> rows)
        {
            var c = _baselinePlaces ??= new BaselinePlaces(col!);
            var r = row;
            // the item named in messages, made only for a message
            string Item() => $"baseline {from}→{to}";
            ProjectFileException Bad(string problem) => new(file, line, Item(), problem);
            foreach (var (name, k) in c.NotUsed)
                if (!r.IsEmpty(k)) throw Bad($"the '{name}' field is not used by a baseline");
            double Number(string name, int k, bool required)
            {
                if (r.IsEmpty(k)) return required ? throw Bad($"the '{name}' field is empty") : 0;
                return r.TryNumber(k, out double v) ? v : throw Bad($"{name}: '{r.Field(k)}' is not a number");
            }
            Length Component(string name, int k)
            {
                if (r.IsEmpty(k)) throw Bad($"the '{name}' field is empty");
                // a plain number is read as LengthPattern.Parse reads it; a unit or a problem goes through it
                if (r.TryNumber(k, out double v)) return Length.From(v, LengthUnit.Metre);
                string text = r.Field(k);
                var parsed = LengthPattern.Metres.Parse(text);
                if (!parsed.Success) throw Bad($"{name}: {parsed.Error}");
                return double.IsFinite(parsed.Value.Metres) ? parsed.Value
                    : throw Bad($"{name}: '{text}' is too large to be a length");
            }
            var vector = (Component("dx", c.Dx), Component("dy", c.Dy), Component("dz", c.Dz));
            bool bySd = false, byCov = false;
            for (int i = 0; i < 3; i++) bySd |= !r.IsEmpty(c.Sd[i]) || !r.IsEmpty(c.Correlation[i]);
            foreach (int k in c.Covariance) byCov |= !r.IsEmpty(k);
            if (bySd && byCov)
                throw Bad("give either sd_x, sd_y, sd_z (with r_xy, r_xz, r_yz) or q_xx ... q_zz, not both");
            if (!bySd && !byCov)
                throw Bad("no covariance: fill sd_x, sd_y, sd_z (and r_xy, r_xz, r_yz) or q_xx ... q_zz");
            double[] cov;
            if (byCov)
            {
                Span<double> q = stackalloc double[6];
                for (int i = 0; i < 6; i++) q[i] = Number(CovarianceColumns[i], c.Covariance[i], true);
                cov = [q[0], q[1], q[3], q[1], q[2], q[4], q[3], q[4], q[5]];
            }
            else
            {
                Span<double> sd = stackalloc double[3];
                for (int i = 0; i < 3; i++) sd[i] = Number(SdColumns[i], c.Sd[i], true);
                for (int i = 0; i < 3; i++)
                    if (!(sd[i] > 0)) throw Bad($"{SdColumns[i]}: a standard deviation must be positive");
                Span<double> rho = stackalloc double[3];
                for (int i = 0; i < 3; i++) rho[i] = Number(CorrelationColumns[i], c.Correlation[i], false);
                for (int i = 0; i < 3; i++)
                    if (!(rho[i] > -1 && rho[i] < 1))
                        throw Bad($"{CorrelationColumns[i]}: a correlation must lie between −1 and 1, not " +
                            rho[i].ToString("R", CultureInfo.InvariantCulture));
                cov = BaselineObservation.CovarianceOf((Length.FromMetres(sd[0]), Length.FromMetres(sd[1]),
                    Length.FromMetres(sd[2])), rho[0], rho[1], rho[2]);
            }
            if (BaselineObservation.CovarianceProblem(cov) is string problem) throw Bad(problem);
            // the group of the row before is the same string (the rows of a session follow one another)
            string? group = r.IsEmpty(c.Group) ? null
                : r.FieldEquals(c.Group, _lastGroup) ? _lastGroup : _lastGroup = r.Field(c.Group);
            BaselineObservation[] parts;
            try
            {
                parts = ProjectReader.Baseline($"{file}:{line}", from, to, vector, cov, group, _s.Specs?.BaselineGrid,
                    _s.Specs?.BaselineFrame);
            }
            catch (ArgumentException e) { throw Bad(ProjectReader.GuardProblem(e)); }
            if (r.IsEmpty(c.Exclude) && r.IsEmpty(c.SdFactor))
            {
                rows.AddRange(parts); // no marks: the components as they are
                return;
            }
            foreach (var p in parts)
                rows.Add(ObservationMarks.Apply(p, r.Field(c.Exclude), r.Field(c.SdFactor), file, line, Item()));
        }
    }

    /// <summary>The baseline columns are refused on rows of other kinds.</summary>
    private static void CheckNoBaselineFields(Func<string, string> get, string file, int line, string item)
    {
        foreach (var name in BaselineColumns)
            if (get(name).Length > 0)
                throw new ProjectFileException(file, line, item, $"the '{name}' field is for baselines only");
    }
}
