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

    /// <summary>One observation group of the budget summary: each contribution's root-mean-square (SI) over the
    /// group's observations weighted from specifications and its share (%) of the mean variance; the total sd.
    /// </summary>
    internal sealed record Group(ObservationKind Kind, int Count, int All,
        IReadOnlyList<(string Name, double Rms, double Share)> Parts, double Total);

    /// <summary>The budget summary per observation kind, in the order of the kinds; empty when no observation has a
    /// budget.</summary>
    internal static IReadOnlyList<Group> Summary(AdjustmentResult r)
    {
        var withBudget = r.Observations.Where(o => ResultReport.BudgetOf(o) is not null).ToList();
        var groups = new List<Group>();
        foreach (var kind in ObservationKinds.All)
        {
            var group = withBudget.Where(o => o.Input.Kind == kind).ToList();
            if (group.Count == 0) continue;
            var names = new List<string>();
            foreach (var o in group)
                foreach (var ct in ResultReport.BudgetOf(o)!.Contributions)
                    if (!names.Contains(ct.Name)) names.Add(ct.Name);
            double meanVar = group.Average(o => o.Input.StandardDeviation * o.Input.StandardDeviation);
            var parts = names.Select(name =>
            {
                double v = group.Average(o => Math.Pow(ResultReport.BudgetOf(o)!.ValueOf(name), 2));
                return (name, Math.Sqrt(v), meanVar > 0 ? 100 * v / meanVar : 0);
            }).ToList();
            groups.Add(new Group(kind, group.Count, r.Network.Observations.Count(o => o.Kind == kind), parts,
                Math.Sqrt(meanVar)));
        }
        return groups;
    }

    /// <summary>
    /// Appends the budget summary to the HTML report as a table (group, contribution, root-mean-square with its
    /// unit in the header, share), under the heading of the <c>budgets</c> section. Nothing when no observation has
    /// a budget.
    /// </summary>
    internal static void AppendHtml(StringBuilder sb, AdjustmentResult r, ReportContext c)
    {
        var groups = Summary(r);
        if (groups.Count == 0) return;
        var units = new ReportUnits(c.Units);
        static string E(string s) => System.Net.WebUtility.HtmlEncode(s);
        sb.Append("<section id=\"budgets\">\n<h2>Error budgets</h2>\n<p>")
          .Append(E($"A-priori standard deviations from instrument and target specifications; weights: " +
              $"{StochasticModel.Describe(r.Options.Centering)}. Per group: the root-mean-square of each " +
              "contribution and its share of the group's mean variance."))
          .Append("</p>\n<table>\n<thead><tr><th>Group</th><th class=\"num\">Observations</th><th>Contribution</th>")
          .Append("<th class=\"num\">")
          .Append(E($"Root-mean-square ({c.Units.Length.Symbol} or {c.Units.AngleSd.Symbol()})"))
          .Append("</th><th class=\"num\">Share (%)</th></tr></thead>\n<tbody>\n");
        foreach (var g in groups)
        {
            string group = E(ObservationLabels.Words(g.Kind)), count = $"{g.Count} of {g.All}";
            foreach (var (name, rms, share) in g.Parts.Append(("total", g.Total, 100.0)))
                sb.Append(name == "total" ? "<tr class=\"total\">" : "<tr>").Append("<td>").Append(group)
                  .Append("</td><td class=\"num\">").Append(count).Append("</td><td>").Append(E(name))
                  .Append("</td><td class=\"num\">").Append(units.ObservationSmall(g.Kind, rms))
                  .Append("</td><td class=\"num\">").Append(share.ToString("F1", Inv)).Append("</td></tr>\n");
        }
        sb.Append("</tbody>\n</table>\n");
        if (c.ObservationBudgets)
        {
            sb.Append("<table class=\"per-observation\">\n<thead><tr><th class=\"num\">#</th><th>Kind</th>")
              .Append("<th class=\"num\">sd</th><th>Contributions</th></tr></thead>\n<tbody>\n");
            foreach (var ao in r.Observations)
            {
                if (ResultReport.BudgetOf(ao) is not { } budget) continue;
                var o = ao.Input;
                sb.Append("<tr><td class=\"num\">").Append(ao.Index + 1).Append("</td><td>")
                  .Append(E(ObservationLabels.Words(o.Kind))).Append("</td><td class=\"num\">")
                  .Append(units.ObservationSmall(o.Kind, o.StandardDeviation)).Append("</td><td>")
                  .Append(E(string.Join(", ", budget.Contributions.Select(x =>
                      $"{x.Name} {units.ObservationSmall(o.Kind, x.Value)}"))))
                  .Append("</td></tr>\n");
            }
            sb.Append("</tbody>\n</table>\n");
        }
        sb.Append("</section>\n");
    }

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
        foreach (var g in Summary(r))
        {
            Line($"  {ObservationLabels.Words(g.Kind)} ({g.Count} of {g.All} observations)");
            string Fmt(double si) => units.ObservationSmall(g.Kind, si);
            foreach (var (name, rms, share) in g.Parts)
                Line($"    {name,-24} {Fmt(rms),10} {share.ToString("F1", Inv),7} %");
            Line($"    {"total",-24} {Fmt(g.Total),10} {100.0.ToString("F1", Inv),7} %");
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
