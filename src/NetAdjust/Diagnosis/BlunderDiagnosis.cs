using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.Diagnosis;

/// <summary>
/// Blunder diagnosis (docs/diagnosis.md): for each suspect observation of an adjustment, tests a catalogue of field
/// blunders, each a model of how the booked observations would be biased, against the null model, estimates its
/// size or picks its best discrete candidate, checks whether the network fits after the correction, and ranks the
/// hypotheses. The statistics are Baarda's w (1968) along the alternative vector for one bias amount and the
/// generalised likelihood ratio statistic T_q for q amounts (Teunissen 2000); the input is never changed.
/// </summary>
public static partial class BlunderDiagnosis
{
    /// <summary>Diagnoses the suspects of an adjustment: the observations whose w-test fails at
    /// <see cref="DiagnosisOptions.Alpha"/> (largest |w| first), or, when none fails but the global test does, the
    /// <see cref="DiagnosisOptions.WorstWhenGlobalFails"/> observations with the largest |w|.</summary>
    /// <param name="result">The adjustment.</param>
    /// <param name="options">The options; null for <see cref="DiagnosisOptions.Default"/>.</param>
    /// <returns>The diagnosis; no suspects when the network fits.</returns>
    /// <exception cref="InvalidInputException">When an option is out of range.</exception>
    public static Diagnosis Diagnose(AdjustmentResult result, DiagnosisOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        options ??= DiagnosisOptions.Default;
        options.Validate();
        var t = new BiasTesting(result);
        double crit = CriticalValues.WTest(options.Alpha);
        var candidates = new List<(int Index, double W)>();
        for (int i = 0; i < t.ObservationCount; i++)
            if (!result.Observations[i].Input.Excluded && t.Testable(i)) candidates.Add((i, t.W(i)));
        var ordered = candidates.OrderByDescending(c => Math.Abs(c.W)).ThenBy(c => c.Index).ToList();
        var suspects = ordered.Where(c => Math.Abs(c.W) > crit).ToList();
        if (suspects.Count == 0 && result.Statistics.GlobalTest.Passed == false)
            suspects = ordered.Take(options.WorstWhenGlobalFails).ToList();
        var list = new List<SuspectDiagnosis>();
        // one solver for every re-adjustment; no external reliability (as the blunder hunt)
        var quick = SolverChoice.Reusable(result.Options with
        {
            Analysis = result.Options.Analysis with
            {
                ExternalReliability = ExternalReliabilityMode.Never, RelativeForObservedPairs = false,
                RelativePairs = [],
            },
        });
        foreach (var (index, w) in suspects.Take(options.MaxSuspects))
            list.Add(DiagnoseOne(t, index, w, options, crit, quick));
        return new Diagnosis(list, options);
    }

    /// <summary>How many of the best named hypotheses of a suspect are confirmed by re-adjusting the corrected
    /// network.</summary>
    private const int Confirmed = 2;

    private sealed record Tested(BlunderHypothesis Hypothesis, Alternative Vector, Trial Trial, double Nabla,
        Candidate? Candidate);

    private static SuspectDiagnosis DiagnoseOne(BiasTesting t, int suspect, double w, DiagnosisOptions options,
        double crit, AdjustmentOptions quick)
    {
        var leaveOuts = new Dictionary<string, LeaveOut?>(StringComparer.Ordinal);
        LeaveOut? Leave(IReadOnlyList<int> group)
        {
            string key = string.Join(",", group.Order());
            if (!leaveOuts.TryGetValue(key, out var lo)) leaveOuts[key] = lo = LeaveOut.Of(t, group, quick);
            return lo;
        }
        var tested = new List<Tested>();
        var alone = Leave([suspect]);
        foreach (var trial in Catalogue(t.Result, alone?.Result ?? t.Result, suspect, options))
            if (Test(t, trial, crit, Leave(trial.C.Keys.ToList())) is Tested x) tested.Add(x);
        var ranked = Rank(tested);
        var confirm = ranked.Where(x => x.Hypothesis.Kind != BlunderKind.UnexplainedBias).Take(Confirmed).ToList();
        foreach (var x in confirm)
        {
            int at = ranked.IndexOf(x);
            ranked[at] = x with { Hypothesis = Confirm(t, x, crit, quick) };
        }
        if (confirm.Count > 0) ranked = Rank(ranked);

        // pairs that cannot be told apart: both fit and their vectors are nearly parallel in the P Qvv P metric;
        // the unexplained bias takes part only against a named kind of free size (a discrete candidate is evidence
        // beyond the direction of its vector)
        var pairs = new List<(BlunderKind, BlunderKind)>();
        var fitting = ranked.Where(x => x.Hypothesis.FitsAfter && x.Vector.Q == 1).ToList();
        for (int a = 0; a < fitting.Count; a++)
            for (int b = a + 1; b < fitting.Count; b++)
            {
                var (ha, hb) = (fitting[a].Hypothesis, fitting[b].Hypothesis);
                if (ha.Kind == hb.Kind) continue;
                var named = ha.Kind == BlunderKind.UnexplainedBias ? hb : hb.Kind == BlunderKind.UnexplainedBias ? ha
                    : null;
                if (named is not null && named.Candidate is not null) continue;
                double cos = BiasTesting.Inner(fitting[a].Vector, fitting[b].Vector)
                    / Math.Sqrt(fitting[a].Vector.M[0, 0] * fitting[b].Vector.M[0, 0]);
                if (Math.Abs(cos) > options.ParallelCosine) pairs.Add((ha.Kind, hb.Kind));
            }
        var top = ranked[0].Hypothesis;
        BlunderHypothesis Other((BlunderKind, BlunderKind) p) =>
            ranked.First(x => x.Hypothesis.Kind == (p.Item1 == top.Kind ? p.Item2 : p.Item1)).Hypothesis;
        bool explained = top.Kind != BlunderKind.UnexplainedBias && top.FitsAfter && top.Significant
            && !pairs.Any(p => (p.Item1 == top.Kind || p.Item2 == top.Kind)
                && (Other(p).Kind == BlunderKind.UnexplainedBias || Other(p).Edit != top.Edit));
        return new SuspectDiagnosis(suspect, w, ranked.Select(x => x.Hypothesis).ToList(), pairs, explained);
    }

    /// <summary>Best first: fits after the correction; then a named kind before the unexplained bias (a named kind
    /// that fits explains the data with a cause, the unexplained bias is the fallback); then the p-value of the
    /// global test after the correction; then |statistic|; then the catalogue's order.</summary>
    private static List<Tested> Rank(IEnumerable<Tested> tested) => tested
        .OrderByDescending(x => x.Hypothesis.FitsAfter)
        .ThenByDescending(x => x.Hypothesis.Kind != BlunderKind.UnexplainedBias)
        .ThenByDescending(x => x.Hypothesis.FitAfter)
        .ThenByDescending(x => Math.Abs(x.Hypothesis.Statistic))
        .ThenBy(x => x.Hypothesis.Kind)
        .ToList();

    /// <summary>Re-adjusts the network with the hypothesis' correction applied: the exact largest |w| and global
    /// test after it.</summary>
    private static BlunderHypothesis Confirm(BiasTesting t, Tested x, double crit, AdjustmentOptions quick)
    {
        var net = t.Result.Network;
        var obs = net.Observations.ToArray();
        x.Trial.Apply(obs, x.Nabla, x.Candidate);
        int dof = t.DegreesOfFreedom - (x.Candidate is null ? 1 : 0);
        try
        {
            var res = Adjuster.Adjust(new Network.SurveyNetwork(net.Name, net.Points, obs), quick);
            var bt = new BiasTesting(res);
            double max = bt.MaxAbsW();
            double omega = res.Statistics.Vtpv;
            return x.Hypothesis with
            {
                MaxAbsWAfter = max, FitsAfter = max <= crit && t.GlobalPasses(omega, dof),
                FitAfter = t.PValue(omega, dof),
            };
        }
        catch (NetAdjustException)
        {
            return x.Hypothesis with { MaxAbsWAfter = double.PositiveInfinity, FitsAfter = false, FitAfter = 0 };
        }
    }

    /// <summary>Tests one trial: its free size (when it has one) and each discrete candidate; keeps the better
    /// fit after the correction. The fit is judged from the adjustment with the trial's observations set aside
    /// (<see cref="LeaveOut"/>), which a large blunder does not distort; when that adjustment fails, from the
    /// linear update of the null adjustment.</summary>
    private static Tested? Test(BiasTesting t, Trial trial, double crit, LeaveOut? lo)
    {
        var alt = t.Prepare([trial.C]);
        if (alt.Untestable) return null;
        double m = alt.M[0, 0];
        double wc = alt.What[0] / (t.Sigma0 * Math.Sqrt(m));     // w along c, signed as the analysis' w
        double size = -alt.What[0] / m;                          // ∇̂ = −(cᵀPQvvPc)⁻¹cᵀPv
        double sd = t.Sigma0 / Math.Sqrt(m);
        if (lo is not null && lo.Estimate(trial.C) is var (s2, sd2)) (size, sd) = (s2, sd2);
        int r = t.DegreesOfFreedom;
        // the size is a wrong height (a length) for the height kinds, else a bias of the observations' own values
        bool angular = trial.Applies is not (Correction.TargetHeight or Correction.InstrumentHeight)
            && trial.Observations.Count > 0
            && Network.ObservationKinds.ValueIsAngle(t.Result.Observations[trial.Observations[0]].Input.Kind);

        (double MaxW, double P, bool Fits) Fit(double nabla, int dof)
        {
            var (omega, maxW) = lo is not null ? lo.After(trial.C, nabla) : t.After(alt, [nabla]);
            return (maxW, t.PValue(omega, dof), maxW <= crit && t.GlobalPasses(omega, dof));
        }

        Candidate? best = null;
        (double MaxW, double P, bool Fits) bestFit = default;
        foreach (var c in trial.Candidates)
        {
            var f = Fit(c.Nabla, r);
            if (best is null || f.P > bestFit.P || (f.P == bestFit.P && f.MaxW < bestFit.MaxW))
            {
                best = c; bestFit = f;
            }
        }
        if (trial.Free)
        {
            // a candidate that fits is kept (it names the amount); otherwise the better of the two fits
            var free = Fit(size, r - 1);
            if (best is null || (!bestFit.Fits && (free.Fits || free.P > bestFit.P)))
            {
                return new Tested(new BlunderHypothesis(trial.Kind, trial.FreeDescription(size, sd), trial.Observations,
                    1, wc, crit, size, sd, null, free.MaxW, free.Fits, trial.FreeEdit(size))
                    { FitAfter = free.P, SizeIsAngle = angular },
                    alt, trial, size, null);
            }
            return new Tested(new BlunderHypothesis(trial.Kind, best.Description, trial.Observations, 1, wc, crit,
                size, sd, best.Label, bestFit.MaxW, bestFit.Fits, best.Edit)
                { FitAfter = bestFit.P, SizeIsAngle = angular }, alt, trial, best.Nabla, best);
        }
        if (best is null) return null;
        return new Tested(new BlunderHypothesis(trial.Kind, best.Description, trial.Observations, 1, wc, crit,
            null, null, best.Label, bestFit.MaxW, bestFit.Fits, best.Edit)
            { FitAfter = bestFit.P, SizeIsAngle = angular }, alt, trial,
            best.Nabla, best);
    }

    /// <summary>The χ² critical value of a group test of q amounts at α.</summary>
    internal static double GroupCritical(int q, double alpha) => ChiSquared.InvCDF(q, 1 - alpha);

    /// <summary>The generalised likelihood ratio statistic T_q = ŵᵀ(CᵀP Qvv P C)⁻¹ŵ / σ0² of a q-column alternative,
    /// with ∇̂ = −(CᵀP Qvv P C)⁻¹ CᵀPv and its covariance σ0²(CᵀP Qvv P C)⁻¹ (Teunissen 2000).</summary>
    internal static (double T, double[] Size, double[,] Covariance) GroupTest(BiasTesting t,
        IReadOnlyList<IReadOnlyDictionary<int, double>> columns)
    {
        var alt = t.Prepare(columns);
        int q = alt.Q;
        var mm = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(q, q, (i, j) => alt.M[i, j]);
        var inv = mm.Inverse();
        var what = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(alt.What);
        double tq = what * (inv * what) / t.Sigma0Squared;
        var size = (-(inv * what)).ToArray();
        var cov = new double[q, q];
        for (int i = 0; i < q; i++) for (int j = 0; j < q; j++) cov[i, j] = t.Sigma0Squared * inv[i, j];
        return (tq, size, cov);
    }
}
