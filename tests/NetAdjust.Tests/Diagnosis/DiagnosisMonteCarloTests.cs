using NetAdjust.Diagnosis;

namespace NetAdjust.Tests.Diagnosis;

/// <summary>
/// Each blunder kind planted in drawn Ravelstone networks (DiagnosisNetworks) and diagnosed; the rates measured with
/// these seeds (100 runs per kind, seeds 1001–1100) are in the comments, the rates required a little below them and
/// never below 70% for kinds the data can identify (docs/diagnosis.md, "What the data can and cannot tell apart").
/// Sizes: the free kinds two MDBs, the heights ±0.1, 0.2 or 0.5 m, the prism ±17.5, 30 or 34.4 mm; the discrete
/// kinds at their own amounts. More runs: NETADJUST_DIAGNOSIS_RUNS=300.
/// </summary>
[Trait("Category", "MonteCarlo")]
public class DiagnosisMonteCarloTests
{
    private static readonly int Runs = int.Parse(
        Environment.GetEnvironmentVariable("NETADJUST_DIAGNOSIS_RUNS") ?? "100",
        System.Globalization.CultureInfo.InvariantCulture);

    private static readonly System.Collections.Concurrent.ConcurrentDictionary<BlunderKind,
        Lazy<List<DiagnosisMonteCarlo.Outcome>>> Simulated = new();

    /// <summary>The runs of one kind, simulated once for all the tests of this class.</summary>
    private static List<DiagnosisMonteCarlo.Outcome> Simulate(BlunderKind kind) =>
        Simulated.GetOrAdd(kind, k => new(() => Enumerable.Range(1001, Runs).Select(s => DiagnosisMonteCarlo.Run(k, s))
            .OfType<DiagnosisMonteCarlo.Outcome>().ToList())).Value;

    private static double Rate(IReadOnlyCollection<DiagnosisMonteCarlo.Outcome> runs,
        Func<DiagnosisMonteCarlo.Outcome, bool> which) => runs.Count(which) / (double)runs.Count;

    [Theory]
    // kind, measured rate of "true kind first" (common practice: a rate a little below the measured one)
    [InlineData(BlunderKind.TargetHeight, 0.90)]      // measured 100/100
    [InlineData(BlunderKind.InstrumentHeight, 0.88)]  // measured 97/100
    [InlineData(BlunderKind.PrismConstant, 0.85)]     // measured 95/100 (the rest: a transposition also fits)
    [InlineData(BlunderKind.FeetForMetres, 0.90)]     // measured 95/95 adjusted
    [InlineData(BlunderKind.Transposition, 0.90)]     // measured 97/99
    [InlineData(BlunderKind.WrongPoint, 0.90)]        // measured 99/100
    [InlineData(BlunderKind.SetBacksight, 0.90)]      // measured 100/100 (angles turned from one backsight)
    [InlineData(BlunderKind.FaceMixUp, 0.90)]         // measured 36/36 of the runs whose adjustment converged
    public void TheTrueKindRanksFirst(BlunderKind kind, double required)
    {
        var runs = Simulate(kind);
        // a face mix-up of a direction often stops the adjustment itself from converging (no result to diagnose);
        // the others nearly always adjust
        Assert.True(runs.Count >= (kind == BlunderKind.FaceMixUp ? 0.3 : 0.9) * Runs, $"{runs.Count} adjusted");
        double first = Rate(runs, o => o.FirstIsTrue);
        Assert.True(first >= required, $"{kind}: true kind first in {first:P0} of {runs.Count}");
        // when another kind ranks first, the two are flagged indistinguishable or the truth was not found
        Assert.True(Rate(runs, o => o.FirstOrFlagged || !o.Found || o.Top!.Kind == BlunderKind.UnexplainedBias)
            >= 0.97, kind.ToString());
    }

    [Theory]
    // kind, measured share of runs with |∇̂ − ∇| ≤ σ∇̂ (≈ 68% expected for a normal estimate)
    [InlineData(BlunderKind.UnexplainedBias)]   // measured 74/100
    [InlineData(BlunderKind.TargetHeight)]      // measured 74/100
    [InlineData(BlunderKind.InstrumentHeight)]  // measured 65/97
    [InlineData(BlunderKind.SetBacksight)]      // measured 70/100
    public void TheEstimatedSizeIsWithinItsStandardDeviationOfTheTruthAboutTwoThirdsOfTheTime(BlunderKind kind)
    {
        // P(|z| ≤ 1) = 0.683 for a normal estimate; with about 100 runs the binomial standard deviation is 0.047, so
        // the band 0.683 ± 3 × 0.047 = [0.54, 0.82] (the heights' vectors are linearised: c = −∂f/∂h).
        var runs = Simulate(kind).Where(o => o.TrueHypothesis?.Size is not null).ToList();
        Assert.True(runs.Count >= 0.9 * Runs);
        double within = Rate(runs, o =>
            Math.Abs(o.TrueHypothesis!.Size!.Value - o.Planted.Size!.Value) <= o.TrueHypothesis.SizeSd!.Value);
        double sd = Math.Sqrt(0.683 * 0.317 / runs.Count);
        Assert.InRange(within, 0.683 - (3 * sd), 0.683 + (3 * sd));
    }

    [Fact]
    public void AnUnexplainedBiasFitsAfterItsCorrectionAndIsNamedOnlyWhenACandidateMatches()
    {
        // A free bias of two MDBs: not identifiable against the discrete candidates that happen to match its size
        // (prism constants and transposed digits are dense near 10–30 mm), nor, on a zenith angle, against a target
        // height (docs/diagnosis.md). Measured: the unexplained bias fits after its correction in 93/100 (the rest:
        // a false alarm elsewhere, about n·α = 7% of the runs), ranks first or is flagged indistinguishable from the
        // first in 58/100, and every other first-ranked kind uses a discrete candidate or a free size parallel to
        // it (or does not fit).
        var runs = Simulate(BlunderKind.UnexplainedBias);
        double fits = Rate(runs, o => o.TrueHypothesis?.FitsAfter == true);
        double firstOrFlagged = Rate(runs, o => o.FirstOrFlagged);
        Assert.True(fits >= 0.85 && firstOrFlagged >= 0.5, $"fits {fits:P0}, first or flagged {firstOrFlagged:P0}");
        Assert.All(runs.Where(o => !o.FirstOrFlagged && o.Found), o => Assert.True(o.Top!.Candidate is not null
            || o.Suspect!.Indistinguishable.Any(p => p.First == o.Top.Kind || p.Second == o.Top.Kind)
            || !o.Top.FitsAfter));
    }
}
