using System.Text;
using NetAdjust.Network;

namespace NetAdjust.IO.Project;

/// <summary>
/// Data that are legal but suspicious (docs/input-format.md, "Warnings"): a point no observation reaches, two ids
/// that differ only in case, a CSV file listed twice, a project without observations. Each is a sentence for
/// standard error, the report and the JSON <c>warnings</c>.
/// </summary>
internal static class ProjectWarnings
{
    public static List<string> Find(SurveyNetwork network, IEnumerable<string> filesListedTwice)
    {
        var warnings = new List<string>();
        if (network.Observations.Count == 0)
            warnings.Add("the project has no observations: nothing will be adjusted");
        // the points of the observations that count, and of those set aside: marked by the network as it checks
        // each observation's points
        if (network.Observations.Count > 0)
            for (int i = 0; i < network.Points.Count; i++)
            {
                if (network.IsReached(i)) continue;
                var p = network.Points[i];
                warnings.Add($"point {p.Id}{Where(p.Source)} is reached by no observation" +
                    (network.IsReachedBySetAside(i) ? " that is not set aside" : "") +
                    ": it is reported as given and takes no part in the adjustment");
            }
        // ids that differ only in case: two ids of one upper case, one of which is not its own upper case (an id
        // without lower case letters is); the grouping is made only when there are such twins
        var lowered = new HashSet<string>(StringComparer.Ordinal);
        bool twins = false;
        foreach (var p in network.Points)
        {
            if (Ascii.IsValid(p.Id) && !p.Id.AsSpan().ContainsAnyInRange('a', 'z')) continue;
            string u = p.Id.ToUpperInvariant();
            if (u != p.Id) twins |= network.Contains(u) || !lowered.Add(u);
        }
        if (twins)
            foreach (var group in network.Points.GroupBy(p => p.Id.ToUpperInvariant()).Where(g => g.Count() > 1))
                warnings.Add($"the point ids {string.Join(", ", group.Select(p => p.Id + Where(p.Source)))} " +
                    "differ only in case: they are different points");
        foreach (var f in filesListedTwice)
            warnings.Add($"the observation file {f} is listed more than once under 'files': its observations are " +
                $"counted each time");
        return warnings;
    }

    private static string Where(string? source) => source is null ? "" : $" ({source})";
}
