using System.Collections;
using System.Reflection;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Simulation;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// Results are immutable: no public setter, and no collection reachable through the public properties of a result
/// (adjustment, analysis, sequence, blunder hunt, robust estimate, variance components, stochastic model, with the
/// network and inputs they hold) that a caller could change, by casting it back to an array or a list or otherwise.
/// Found by
/// walking the public properties, so a new result member is checked without being listed here.
/// </summary>
public sealed class ImmutableResultTests
{
    private static SurveyNetwork Network(DemoScenario scenario)
    {
        var s = DemoScenarios.Draw(scenario, DemoScenarios.DefaultSeed(scenario));
        return new SurveyNetwork(scenario.ToString(), s.Points,
            s.Setups.SelectMany(x => x.Observations).Concat(s.Levelling));
    }

    [Fact]
    public void NoCollectionReachableFromAResultCanBeChanged()
    {
        var net = Network(DemoScenario.Harrowgate);
        var result = Adjuster.Adjust(net);
        object[] results =
        [
            result,
            ResultAnalysis.Analyse(result),
            AdjustmentSequence.Run(net),
            DataSnooping.Run(Network(DemoScenario.Harrowfield)),
            RobustEstimation.Run(net, RobustMethod.Huber),
            VarianceComponents.Estimate(Network(DemoScenario.Brackenmoor)),
            StochasticModel.Build(result.Network, new Adjusted(result), CenteringModel.Correlated, 1.0),
        ];
        var changeable = new List<string>();
        var seen = new HashSet<object>(ReferenceEqualityComparer.Instance);
        foreach (var r in results) Walk(r, r.GetType().Name, changeable, seen, 0);
        Assert.True(seen.Count > 100, $"the walk reached only {seen.Count} objects");
        Assert.True(changeable.Count == 0, string.Join(Environment.NewLine, changeable));
    }

    [Fact]
    public void AListGivenToAnInputIsCopiedNotKept()
    {
        var points = new List<Point> { new("A") { E = 0, N = 0, Fixed = Fixity.EN }, new("B") { E = 100, N = 0 } };
        var observations = new List<Observation>
        {
            new DistanceObservation("A", "B", Length.FromMetres(100)) { Sd = Length.FromMillimetres(2) },
        };
        var net = new SurveyNetwork("copy", points, observations);
        points.Clear();
        observations.Clear();
        Assert.Equal(2, net.Points.Count);
        Assert.Single(net.Observations);
        var sights = new Dictionary<string, double> { ["B"] = 100 };
        var w = new ObservationWeighting { ObservedSights = sights };
        sights["C"] = 5;
        Assert.Single(w.ObservedSights);
    }

    [Fact]
    public void NoResultTypeHasAPublicSetter()
    {
        var setters = typeof(AdjustmentResult).Assembly.GetExportedTypes()
            .Where(t => t.Namespace is "NetAdjust.Adjustment" or "NetAdjust.Statistics" or "NetAdjust.Procedures")
            .SelectMany(t => t.GetProperties(BindingFlags.Public | BindingFlags.Instance))
            .Where(p => p.SetMethod is { IsPublic: true } s && !s.ReturnParameter.GetRequiredCustomModifiers()
                .Contains(typeof(System.Runtime.CompilerServices.IsExternalInit)))
            .Select(p => $"{p.DeclaringType!.Name}.{p.Name}")
            .ToList();
        Assert.Empty(setters);
    }

    /// <summary>The adjusted coordinates and orientations of a result.</summary>
    private sealed class Adjusted(AdjustmentResult r) : ICoordinates
    {
        public PlanePoint Plane(string id)
        {
            var p = r.Points.Single(q => q.Id == id);
            return new PlanePoint(p.E ?? 0, p.N ?? 0);
        }

        public double Height(string id) => r.Points.Single(q => q.Id == id).H ?? 0;

        public double Orientation(string setId) => r.Orientations.Single(o => o.SetId == setId).Orientation;
    }

    /// <summary>Records every changeable collection under <paramref name="o"/>; follows NetAdjust's own
    /// types.</summary>
    private static void Walk(object? o, string path, List<string> changeable, HashSet<object> seen, int depth)
    {
        if (o is null || o is string || o.GetType().IsPrimitive || o.GetType().IsEnum || depth > 12) return;
        if (!o.GetType().IsValueType && !seen.Add(o)) return;
        if (o is Array) changeable.Add($"{path}: an array");
        else if (o is IList { IsReadOnly: false }) changeable.Add($"{path}: a changeable list ({o.GetType().Name})");
        else if (o is IDictionary { IsReadOnly: false })
            changeable.Add($"{path}: a changeable dictionary ({o.GetType().Name})");
        if (o is IEnumerable items && o is IList or IDictionary or ICollection)
        {
            int k = 0;
            foreach (var item in items)
            {
                if (k++ >= 3) break; // a few elements of each collection are enough to reach every member type
                object? element = item is DictionaryEntry e ? e.Value : item;
                Walk(element, $"{path}[{k - 1}]", changeable, seen, depth + 1);
            }
            return;
        }
        if (o.GetType().Namespace?.StartsWith("NetAdjust", StringComparison.Ordinal) != true) return;
        foreach (var p in o.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (p.GetIndexParameters().Length > 0 || p.Name == "EqualityContract") continue;
            object? value;
            try { value = p.GetValue(o); }
            catch (TargetInvocationException) { continue; }
            Walk(value, $"{path}.{p.Name}", changeable, seen, depth + 1);
        }
    }
}
