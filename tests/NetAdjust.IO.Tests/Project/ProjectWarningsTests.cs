using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The project's warnings (docs/input-format.md, "Warnings") take the points an observation reaches from the
/// network's own check of the observations' points, and look for ids that differ only in case without upper-casing
/// the ids that have no lower case letters; both give what the definitions give, computed here the plain way (a set
/// of the points of every observation; the ids grouped by <see cref="string.ToUpperInvariant"/>).
/// </summary>
public class ProjectWarningsTests
{
    private static Point P(string id) => new(id) { E = 0, N = 0, Source = $"p.yaml:{id.Length}" };

    private static DistanceObservation D(string from, string to, bool excluded = false) =>
        new(from, to, Length.FromMetres(10)) { Sd = Length.FromMetres(0.003), Excluded = excluded };

    /// <summary>The warnings by their definitions, in the order the reader gives them.</summary>
    private static List<string> Plain(SurveyNetwork n)
    {
        var w = new List<string>();
        if (n.Observations.Count == 0) w.Add("the project has no observations: nothing will be adjusted");
        var reached = n.Observations.Where(o => !o.Excluded).SelectMany(o => o.Points).ToHashSet();
        var setAside = n.Observations.Where(o => o.Excluded).SelectMany(o => o.Points).ToHashSet();
        if (n.Observations.Count > 0)
            foreach (var p in n.Points.Where(p => !reached.Contains(p.Id)))
                w.Add($"point {p.Id} ({p.Source}) is reached by no observation" +
                    (setAside.Contains(p.Id) ? " that is not set aside" : "") +
                    ": it is reported as given and takes no part in the adjustment");
        foreach (var g in n.Points.GroupBy(p => p.Id.ToUpperInvariant()).Where(g => g.Count() > 1))
            w.Add($"the point ids {string.Join(", ", g.Select(p => $"{p.Id} ({p.Source})"))} " +
                "differ only in case: they are different points");
        return w;
    }

    public static TheoryData<string[], string[]> Networks => new()
    {
        // points, observations as "from-to" ("!" before: set aside)
        { ["A", "B", "C"], ["A-B", "B-C"] },
        { ["A", "B", "C", "D"], ["A-B", "!B-C"] },
        { ["A", "B", "C", "D"], [] },
        { ["A", "a", "B"], ["A-B"] },
        { ["Ab", "AB", "aB", "X"], ["Ab-X", "!AB-aB"] },
        { ["Pı", "PI", "Q"], ["Pı-Q"] }, // dotless i: its invariant upper case is I
        { ["ä1", "Ä1", "ß", "SS"], ["ä1-ß"] }, // ß has no one-letter upper case: not a twin of SS
        { ["é", "É", "e", "E"], ["é-e"] },
        { ["M1", "M2", "m3"], ["M1-M2"] },
    };

    [Theory]
    [MemberData(nameof(Networks))]
    public void TheWarningsAreThoseOfTheirDefinitions(string[] ids, string[] observations)
    {
        var network = new SurveyNetwork("t", ids.Select(P), observations.Select(s =>
        {
            bool aside = s.StartsWith('!');
            var ends = s.TrimStart('!').Split('-');
            return D(ends[0], ends[1], aside);
        }));
        Assert.Equal(Plain(network), ProjectWarnings.Find(network, []));
    }

    [Fact]
    public void TwinsAreFoundAmongManyIds()
    {
        var ids = Enumerable.Range(0, 500).Select(i => "K" + i.ToString(CultureInfo.InvariantCulture)).ToList();
        ids.Add("k250");
        var network = new SurveyNetwork("t", ids.Select(P), [D("K1", "K2")]);
        var warnings = ProjectWarnings.Find(network, []);
        Assert.Equal(Plain(network), warnings);
        Assert.Contains(warnings, w => w.StartsWith("the point ids K250 (p.yaml:4), k250 (p.yaml:4)",
            StringComparison.Ordinal));
    }
}
