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
        // the points of the observations that count, and of those set aside (one pass, no list per observation)
        var reached = new HashSet<string>(StringComparer.Ordinal);
        var setAside = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in network.Observations)
        {
            var to = o.Excluded ? setAside : reached;
            if (o.At is string at) to.Add(at);
            to.Add(o.From);
            to.Add(o.To);
        }
        if (network.Observations.Count > 0)
            foreach (var p in network.Points.Where(p => !reached.Contains(p.Id)))
                warnings.Add($"point {p.Id}{Where(p.Source)} is reached by no observation" +
                    (setAside.Contains(p.Id) ? " that is not set aside" : "") +
                    ": it is reported as given and takes no part in the adjustment");
        // ids that differ only in case: the grouping is made only when two ids have one upper case
        var upper = new HashSet<string>(StringComparer.Ordinal);
        bool twins = false;
        foreach (var p in network.Points)
            twins |= !upper.Add(p.Id.ToUpperInvariant());
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
