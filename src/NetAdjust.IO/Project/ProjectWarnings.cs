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
        var reached = network.Observations.Where(o => !o.Excluded).SelectMany(o
            => o.Points).ToHashSet(StringComparer.Ordinal);
        if (network.Observations.Count > 0)
            foreach (var p in network.Points.Where(p => !reached.Contains(p.Id)))
                warnings.Add($"point {p.Id}{Where(p.Source)} is reached by no observation" +
                    (network.Observations.Any(o => o.Points.Contains(p.Id)) ? " that is not set aside" : "") +
                    ": it is reported as given and takes no part in the adjustment");
        foreach (var group in network.Points.GroupBy(p => p.Id.ToUpperInvariant()).Where(g => g.Count() > 1))
            warnings.Add($"the point ids {string.Join(", ", group.Select(p => p.Id + Where(p.Source)))} differ " +
                $"only in case: " +
                "they are different points");
        foreach (var f in filesListedTwice)
            warnings.Add($"the observation file {f} is listed more than once under 'files': its observations are " +
                $"counted each time");
        return warnings;
    }

    private static string Where(string? source) => source is null ? "" : $" ({source})";
}
