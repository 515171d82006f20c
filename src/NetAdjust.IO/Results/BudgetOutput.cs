using NetAdjust.Stochastic;
using System.Globalization;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes observations' error budgets in the text report (the JSON <c>sd_components</c> name <see cref="Stated"/>).
/// </summary>
internal static class BudgetOutput
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The name of the single component of a standard deviation stated directly (explicit <c>sd</c> or
    /// <c>default_sd</c>).</summary>
    public const string Stated = "stated";

    /// <summary>
    /// Appends the error-budget summary: per observation kind, each contribution's root-mean-square over the
    /// observations weighted from specifications, and its share of the mean variance. Nothing when no observation has a
    /// budget. The list per observation is passed on to <paramref name="output"/> (when given) as it grows.
    /// </summary>
    public static void AppendSummary(StringBuilder sb, AdjustmentResult r, ReportContext c, TextWriter? output = null)
    {
        var withBudget = r.Observations.Where(o => ResultReport.BudgetOf(o) is not null).ToList();
        if (withBudget.Count == 0) return;
        var u = c.Units;
        var units = new ReportUnits(u);
        void Line(string s = "") => sb.Append(s).Append('\n');
        Line(
            $"ERROR BUDGETS (a-priori sd from instrument and target specifications; lengths {u.Length.Symbol}, " +
            $"angles {u.AngleSd.Symbol()})");
        Line($"  Weights: {StochasticModel.Describe(r.Options.Centering)}");
        Line("  Per group: root-mean-square of each contribution, and its share of the group's mean variance.");
        foreach (var kind in ObservationKinds.All)
        {
            var group = withBudget.Where(o => o.Input.Kind == kind).ToList();
            if (group.Count == 0) continue;
            int all = r.Network.Observations.Count(o => o.Kind == kind);
            Line($"  {ObservationLabels.Words(kind)} ({group.Count} of {all} observations)");
            var names = new List<string>();
            foreach (var o in group)
                foreach (var ct in ResultReport.BudgetOf(o)!.Contributions)
                    if (!names.Contains(ct.Name)) names.Add(ct.Name);
            double meanVar = group.Average(o => o.Input.StandardDeviation * o.Input.StandardDeviation);
            string Fmt(double si) => units.ObservationSmall(kind, si);
            foreach (string name in names)
            {
                double v = group.Average(o => Math.Pow(ResultReport.BudgetOf(o)!.ValueOf(name), 2));
                Line(
                    $"    {name,-24} {Fmt(Math.Sqrt(v)),10} " +
                    $"{(meanVar > 0 ? 100 * v / meanVar : 0).ToString("F1", Inv),7} %");
            }
            Line($"    {"total",-24} {Fmt(Math.Sqrt(meanVar)),10} {100.0.ToString("F1", Inv),7} %");
        }
        Line();
        if (!c.ObservationBudgets) return;
        Line(
            $"ERROR BUDGET PER OBSERVATION (# as in OBSERVATIONS; lengths {u.Length.Symbol}, angles " +
            $"{u.AngleSd.Symbol()})");
        foreach (var ao in r.Observations)
        {
            var o = ao.Input;
            if (ResultReport.BudgetOf(ao) is not { } budget) continue;
            string Fmt(double si) => units.ObservationSmall(o.Kind, si);
            // Wrapped to the report's 100 columns: "   12 total 2.18 = name value, name value, ..."
            var line = new StringBuilder($"  {ao.Index + 1,4} total {Fmt(o.StandardDeviation)} =");
            var items = budget.Contributions.Select(x => $"{x.Name} {Fmt(x.Value)}").ToList();
            for (int k = 0; k < items.Count; k++)
            {
                string piece = " " + items[k] + (k < items.Count - 1 ? "," : "");
                if (line.Length + piece.Length > 100)
                {
                    Line(line.ToString()); line.Clear().Append(new string(' ', 7));
                }
                line.Append(piece);
            }
            Line(line.ToString());
            TextChunks.Spill(sb, output);
        }
        Line();
    }
}
