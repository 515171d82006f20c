using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Procedures;

/// <summary>One round of a blunder hunt: one adjustment, its worst test, and what was done. Made by the blunder hunt
/// only (the constructor is internal).</summary>
public sealed record SnoopingRound
{
    /// <summary>Made by the blunder hunt.</summary>
    internal SnoopingRound(int Round, int DegreesOfFreedom, double? VarianceFactor, bool? GlobalTestPassed,
        int? WorstIndex, double? WorstStatistic, double Critical, bool SetAside)
    {
        this.Round = Round; this.DegreesOfFreedom = DegreesOfFreedom; this.VarianceFactor = VarianceFactor;
        this.GlobalTestPassed = GlobalTestPassed; this.WorstIndex = WorstIndex; this.WorstStatistic = WorstStatistic;
        this.Critical = Critical; this.SetAside = SetAside;
    }

    /// <summary>1, 2, …</summary>
    public int Round { get; internal init; }

    /// <summary>r of this round's adjustment.</summary>
    public int DegreesOfFreedom { get; internal init; }

    /// <summary>σ̂0² of this round; null when r = 0.</summary>
    public double? VarianceFactor { get; internal init; }

    /// <summary>The global test of this round; null when not possible.</summary>
    public bool? GlobalTestPassed { get; internal init; }

    /// <summary>The observation with the largest test statistic (index in the network), or null when none can be
    /// tested.</summary>
    public int? WorstIndex { get; internal init; }

    /// <summary>Its w (variance factor known) or tau (estimated).</summary>
    public double? WorstStatistic { get; internal init; }

    /// <summary>The critical value it was compared with.</summary>
    public double Critical { get; internal init; }

    /// <summary>True when the worst observation failed and was set aside for the next round.</summary>
    public bool SetAside { get; internal init; }
}

/// <summary>The outcome of iterative data snooping. Made by the blunder hunt only (the constructor is
/// internal).</summary>
public sealed record BlunderHunt
{
    /// <summary>Made by the blunder hunt.</summary>
    internal BlunderHunt(IReadOnlyList<SnoopingRound> Rounds, IReadOnlyList<int> SetAside, string StopReason,
        AdjustmentResult Final)
    {
        this.Rounds = Rounds; this.SetAside = SetAside; this.StopReason = StopReason; this.Final = Final;
    }

    /// <summary>Why the hunt stopped, in words.</summary>
    public string StopReason { get; internal init; }

    /// <summary>The last adjustment (with the set-aside observations excluded, still reported with their
    /// misclosures).</summary>
    public AdjustmentResult Final { get; internal init; }

    /// <summary>The log, one entry per adjustment.</summary>
    public IReadOnlyList<SnoopingRound> Rounds
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Indices of the observations set aside, in the order found.</summary>
    public IReadOnlyList<int> SetAside
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }
}

/// <summary>
/// Iterative data snooping (Baarda 1968): adjust, test every observation, set aside the one with the largest
/// statistic above the critical value, adjust again, until none fails or a limit is reached. The w-test decides
/// when the variance factor is known, Pope's tau test when it is estimated (<see
/// cref="AnalysisOptions.VarianceFactor"/>).
/// Only one observation is set aside per round, because one blunder spreads into the residuals of its neighbours.
/// </summary>
public static class DataSnooping
{
    /// <summary>Runs the hunt.</summary>
    /// <param name="network">The network; observations already marked excluded stay excluded.</param>
    /// <param name="options">Adjustment options (their <see cref="AdjustmentOptions.Analysis"/> sets the tests); null
    /// for defaults.</param>
    /// <param name="maxRounds">Largest number of observations to set aside, ≥ 1 (default 10).</param>
    /// <returns>The log and the final adjustment.</returns>
    /// <exception cref="InvalidInputException">When the options or the round limit are invalid.</exception>
    /// <exception cref="AdjustmentFailedException">When the first adjustment fails.</exception>
    public static BlunderHunt Run(SurveyNetwork network, AdjustmentOptions? options = null, int maxRounds = 10)
    {
        // one solver for every round: the sparse engine analyses the pattern once
        options = SolverChoice.Reusable(options ?? AdjustmentOptions.Default);
        if (maxRounds < 1) throw new InvalidInputException("the blunder hunt needs a round limit of at least 1");
        var quick = options with { Analysis = options.Analysis with { ExternalReliability =
            ExternalReliabilityMode.Never, RelativeForObservedPairs = false, RelativePairs = [] } };
        var rounds = new List<SnoopingRound>();
        var setAside = new List<int>();
        var current = network;
        var result = Adjuster.Adjust(current, quick);
        string reason;
        while (true)
        {
            var a = result.Analysis;
            bool byTau = a.Basis == VarianceFactorBasis.Estimated;
            double crit = byTau ? a.TauCritical ?? double.NaN : a.WCritical;
            int? worst = null; double worstStat = 0;
            foreach (var t in a.Observations)
            {
                if (t.Flag is ObservationFlag.Excluded or ObservationFlag.Uncontrolled) continue;
                double? s = byTau ? t.Tau : t.W;
                if (s is double x && (worst is null || Math.Abs(x) > Math.Abs(worstStat)))
                {
                    worst = t.Index; worstStat = x;
                }
            }
            var st = result.Statistics;
            bool fails = worst is not null && Math.Abs(worstStat) > crit;
            bool canGo = fails && setAside.Count < maxRounds && st.DegreesOfFreedom > 1;
            rounds.Add(new SnoopingRound(rounds.Count + 1, st.DegreesOfFreedom, st.VarianceFactor, st.GlobalTest.Passed,
                worst, worst is null ? null : worstStat, crit, canGo));
            if (!fails)
            {
                reason = worst is null ? "no observation can be tested"
                    : double.IsNaN(crit) ? "the tau test needs at least 2 degrees of freedom"
                    : "no observation fails the test";
                break;
            }
            if (setAside.Count >= maxRounds)
            {
                reason = $"the round limit ({maxRounds}) was reached with an observation still failing"; break;
            }
            if (st.DegreesOfFreedom <= 1)
            {
                reason = "setting aside another observation would leave no redundancy"; break;
            }

            var obs = current.Observations.ToArray();
            obs[worst!.Value] = obs[worst.Value] with { Excluded = true };
            var next = new SurveyNetwork(current.Name, current.Points, obs);
            AdjustmentResult nextResult;
            try { nextResult = Adjuster.Adjust(next, quick); }
            catch (AdjustmentFailedException e)
            {
                rounds[^1] = rounds[^1] with { SetAside = false };
                reason = $"setting aside {obs[worst.Value].Describe()} makes the adjustment fail ({e.Message})";
                break;
            }
            setAside.Add(worst.Value);
            current = next;
            result = nextResult;
        }
        var final = Adjuster.Adjust(current, options); // full statistics with the caller's options
        return new BlunderHunt(rounds, setAside, reason, final);
    }
}
