using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Standards;
using NetAdjust.Stochastic;
using NetAdjust.Tests.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Procedures;

public class NetworkDesignTests
{
    private const double Arcsec = Math.PI / (180 * 3600);

    private static readonly (string Id, double E, double N)[] Design =
    [
        ("D1", 5000, 5000), ("D2", 5400, 5050), ("Q1", 5120, 5330), ("Q2", 5380, 5390), ("Q3", 5250, 5600),
    ];

    /// <summary>An invented plan: D1, D2 held; one set of directions at each point to every other and the
    /// distances between neighbours; values left at zero (the plan gives none).</summary>
    private static SurveyNetwork Plan(double directionSd = 3 * Arcsec, ObservationWeighting? weighting = null)
    {
        var pts = Design.Select(d => d.Id.StartsWith('D')
            ? new Point(d.Id) { E = d.E, N = d.N, Fixed = Fixity.EN } : new Point(d.Id) { E = d.E, N = d.N })
            .ToList();
        var obs = new List<Observation>();
        foreach (var a in Design)
            foreach (var b in Design.Where(b => b.Id != a.Id))
            {
                obs.Add(new DirectionObservation(a.Id, b.Id, Angle.FromRadians(0), a.Id + "/1")
                    { StandardDeviation = weighting is null ? directionSd : double.NaN, Weighting = weighting });
                if (string.CompareOrdinal(a.Id, b.Id) < 0)
                    obs.Add(new DistanceObservation(a.Id, b.Id, Length.FromMetres(1)) { StandardDeviation = 0.003 });
            }
        return new SurveyNetwork("plan", pts, obs);
    }

    [Fact]
    public void PlanAndAdjustmentOfSimulatedObservationsGiveTheSameCovariance()
    {
        // The covariance of a least-squares adjustment depends on the geometry and the weights only (Gauss-Markov
        // model, common practice): a plan analysed at the coordinates an adjustment of simulated observations ends
        // at gives that adjustment's covariance, to 1e-9 relative.
        var plan = Plan();
        var drawn = NetworkDesign.Simulate(plan, seed: 7);
        var adjusted = Adjuster.Adjust(drawn);
        var moved = new SurveyNetwork("plan", plan.Points.Select(p =>
        {
            var a = adjusted.Points.First(x => x.Id == p.Id);
            return p with { E = a.E, N = a.N };
        }), plan.Observations);
        var design = NetworkDesign.Analyse(moved);
        Assert.Equal(adjusted.Unknowns.Count, design.Unknowns.Count);
        double largest = 0;
        for (int i = 0; i < design.Unknowns.Count; i++) largest = Math.Max(largest, adjusted.Cofactor(i, i));
        for (int i = 0; i < design.Unknowns.Count; i++)
            for (int j = 0; j <= i; j++)
                Assert.True(Math.Abs(design.Cofactor(i, j) - adjusted.Cofactor(i, j)) <= 1e-9 * largest,
                    $"Qxx[{i},{j}]: plan {design.Cofactor(i, j)}, adjustment {adjusted.Cofactor(i, j)}");
        // the plan has no residuals: its observations take their values at the design coordinates
        Assert.All(design.Observations, o => Assert.True(Math.Abs(o.Residual) < 1e-9));
    }

    [Fact]
    public void DoublingTheSetsHalvesTheAngularVariance()
    {
        // Error of redundant measurement: the mean of n sets has σ/√n, so doubling the sets halves the variance of a
        // direction (ISO 17123-3 σ per set in both faces; centering set to zero so only pointing and reading count;
        // docs/references.md §9).
        var ts = new TotalStationSpecification("ts", 2 * Arcsec, 2 * Arcsec, null, 0, 0);
        var target = new TargetSpecification("prism", 0, 0);
        var w = new ObservationWeighting { Instrument = ts, Target = target, Procedure = new ObservingProcedure(1,
            Faces.Both) };
        var plan = Plan(weighting: w);
        double Var(SurveyNetwork n, int i) =>
            Math.Pow(StochasticModel.Build(n, new GivenCoordinates(n), CenteringModel.Independent, 1)
                .StandardDeviations[i], 2);
        int first = 0; // a direction
        foreach (int sets in new[] { 1, 2, 4 })
        {
            var one = NetworkDesign.WithSets(plan, sets);
            var two = NetworkDesign.WithSets(plan, 2 * sets);
            Assert.Equal(0.5, Var(two, first) / Var(one, first), 12);
        }
        // a stated σ is taken as that of one set: σ/√n
        var stated = Plan(directionSd: 4 * Arcsec);
        Assert.Equal(2 * Arcsec, NetworkDesign.WithSets(stated, 4).Observations[0].StandardDeviation, 15);
    }

    [Fact]
    public void RecommendedSetsAreMonotoneInTheRequiredPrecision()
    {
        // A stricter allowance never needs fewer sets; the worst ratio never grows with more sets and its steps
        // shrink (diminishing returns of σ/√n; common practice).
        var plan = Plan(directionSd: 8 * Arcsec);
        int? previous = 0;
        var found = new List<int?>();
        foreach (double mm in new[] { 12.0, 9, 7, 6, 5.5 })
        {
            var standard = new AccuracyStandard("site", StandardKind.RelativePrecision, "test")
                { Constant = mm / 1000 };
            var r = ProcedureAdvisor.Recommend(plan, null, standard, 12);
            var trials = Assert.Single(r.Instruments).Trials;
            for (int k = 1; k < trials.Count; k++)
                Assert.True(trials[k].WorstRatio <= trials[k - 1].WorstRatio + 1e-12);
            for (int k = 2; k < trials.Count; k++)
                Assert.True(trials[k - 1].WorstRatio - trials[k].WorstRatio <=
                    trials[k - 2].WorstRatio - trials[k - 1].WorstRatio + 1e-12);
            int? sets = Assert.Single(r.Instruments).SmallestSets;
            if (previous is int p && sets is int s) Assert.True(s >= p, $"{mm} mm needs {s} sets, a looser one {p}");
            if (previous is null) Assert.Null(sets); // once out of reach, a stricter one is too
            previous = sets;
            found.Add(sets);
        }
        // the allowances span the range: the loosest is met with one set, a stricter one needs more
        Assert.Equal(1, found[0]);
        Assert.Contains(found, s => s is > 1);
    }

    [Fact]
    public void LeastPreciseInstrumentThatMeetsTheStandardIsRecommended()
    {
        var w = new ObservationWeighting { Instrument = new TotalStationSpecification("x", 1 * Arcsec, 1 * Arcsec,
            null, 0, 0), Target = new TargetSpecification("p", 0, 0) };
        var plan = Plan(weighting: w);
        TotalStationSpecification[] candidates =
        [
            new("one", 1 * Arcsec, 1 * Arcsec, null, 0, 0), new("five", 5 * Arcsec, 5 * Arcsec, null, 0, 0),
            new("twenty", 20 * Arcsec, 20 * Arcsec, null, 0, 0),
        ];
        var standard = new AccuracyStandard("site", StandardKind.RelativePrecision, "test") { Constant = 0.012 };
        var r = ProcedureAdvisor.Recommend(plan, null, standard, 4, candidates);
        Assert.Equal(["twenty", "five", "one"], r.Instruments.Select(i => i.Instrument));
        var meets = r.Instruments.Where(i => i.SmallestSets.HasValue).ToList();
        Assert.NotEmpty(meets);
        Assert.Equal(meets[0], r.Recommended);
        // a more precise instrument never needs more sets
        for (int k = 1; k < r.Instruments.Count; k++)
            if (r.Instruments[k - 1].SmallestSets is int a && r.Instruments[k].SmallestSets is int b)
                Assert.True(b <= a);
    }

    [Fact]
    public void PlanPointWithoutCoordinatesIsInvalidInput()
    {
        var plan = Plan();
        var pts = plan.Points.Select(p => p.Id == "Q3" ? new Point("Q3") { Source = "plan.yaml:9" } : p);
        var bad = new SurveyNetwork("plan", pts, plan.Observations);
        var e = Assert.Throws<InvalidInputException>(() => NetworkDesign.AtDesign(bad));
        Assert.Contains("plan.yaml:9", e.Message);
        Assert.Contains("Q3", e.Message);
    }
}
