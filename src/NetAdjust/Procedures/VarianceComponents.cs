using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Procedures;

/// <summary>The estimated variance component(s) of one observation group. Made by the variance component estimation
/// only (the constructor is internal).</summary>
public sealed record VarianceComponent
{
    /// <summary>Made by the variance component estimation.</summary>
    internal VarianceComponent(ObservationKind Kind, int Count, double Redundancy, double VarianceFactor,
        double SdScale, double? ScaledSd, double? ConstantPart, double? PpmPart, string? Note)
    {
        this.Kind = Kind; this.Count = Count; this.Redundancy = Redundancy; this.VarianceFactor = VarianceFactor;
        this.SdScale = SdScale; this.ScaledSd = ScaledSd; this.ConstantPart = ConstantPart; this.PpmPart = PpmPart;
        this.Note = Note;
    }

    /// <summary>The observation kind of the group.</summary>
    public ObservationKind Kind { get; internal init; }

    /// <summary>Observations in the group (not excluded).</summary>
    public int Count { get; internal init; }

    /// <summary>The group's share of the redundancy, Σ rᵢ over the group, in the final adjustment.</summary>
    public double Redundancy { get; internal init; }

    /// <summary>The group's variance factor against the standard deviations given: Σ vᵢ²/σᵢ² / Σ rᵢ (1 means the given
    /// σ fit).</summary>
    public double VarianceFactor { get; internal init; }

    /// <summary>√ of <see cref="VarianceFactor"/>: multiply the given standard deviations by this.</summary>
    public double SdScale { get; internal init; }

    /// <summary>When every observation of the group had the same σ: that σ times <see cref="SdScale"/> (m or rad); else
    /// null.</summary>
    internal double? ScaledSd { get; init; }

    /// <summary>Distances with a fitted spec: the constant part a (m); else null.</summary>
    internal double? ConstantPart { get; init; }

    /// <summary>Distances with a fitted spec: the proportional part b (ppm); else null.</summary>
    public double? PpmPart { get; internal init; }

    /// <summary>Why a spec was not fitted or why the estimate is weak; null when none.</summary>
    public string? Note { get; internal init; }

    /// <summary>When every observation of the group had the same σ: that σ times <see cref="SdScale"/>; else
    /// null.</summary>
    public Quantity? ScaledSdValue =>
        ScaledSd is double q ? Quantity.FromSi(q, ObservationKinds.ValueIsAngle(Kind)) : null;

    /// <summary>Distances with a fitted spec: the constant part a; else null.</summary>
    public Length? ConstantPartLength => Lengths.Of(ConstantPart);

    /// <summary>For GNSS baselines, the group of baselines this component belongs to (empty text for baselines in no
    /// group); null for other kinds. Baselines get one component per group, estimated from their full 3×3 blocks
    /// (σ̂² = Σ vᵀ Σ⁻¹ v / Σ rᵢ over the group's baselines).</summary>
    public string? Group { get; internal init; }
}

/// <summary>The outcome of a variance component estimation. Made by the variance component estimation only (the
/// constructor is internal).</summary>
public sealed record VarianceComponentEstimate
{
    /// <summary>Made by the variance component estimation.</summary>
    internal VarianceComponentEstimate(IReadOnlyList<VarianceComponent> Groups, int Iterations, bool Converged,
        AdjustmentResult Final)
    {
        this.Groups = Groups; this.Iterations = Iterations; this.Converged = Converged; this.Final = Final;
    }

    /// <summary>Iterations made.</summary>
    public int Iterations { get; internal init; }

    /// <summary>True when no observation's standard deviation changed by more than 0.005% in the last
    /// iteration.</summary>
    public bool Converged { get; internal init; }

    /// <summary>The adjustment with the re-estimated standard deviations.</summary>
    public AdjustmentResult Final { get; internal init; }

    /// <summary>One entry per observation kind present, in kind order.</summary>
    public IReadOnlyList<VarianceComponent> Groups
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }
}

/// <summary>
/// Variance component estimation per observation group by Förstner's iterative estimator (Förstner 1979; Koch 1999
/// §3.6): with Σ = Σₖ θₖ Tₖ, each iteration sets θₖ ← θₖ · Σᵢ (vᵢ²/σᵢ²) sᵢₖ / Σᵢ rᵢ sᵢₖ, where sᵢₖ = θₖ tᵢₖ / σᵢ² is
/// the share of component k in the variance of observation i, then re-adjusts. For one component per group this is
/// σ̂ₖ² = vₖᵀPₖvₖ / rₖ. Weighted control is not re-estimated. Distances may get two components, a constant and a
/// distance-proportional one, giving a fitted "a + b ppm"; that fit is only attempted when the distances are many
/// and of widely different lengths, because otherwise the two parts cannot be told apart.
/// </summary>
public static class VarianceComponents
{
    /// <summary>Fewest distances for the a + b ppm fit.</summary>
    public const int MinimumDistancesForSpecFit = 8;

    /// <summary>Smallest ratio of longest to shortest distance for the a + b ppm fit.</summary>
    public const double MinimumLengthRatioForSpecFit = 3.0;

    /// <summary>
    /// Below this group redundancy the estimate is called weak and its 95% interval is given: with r = 10 the interval
    /// of the standard-deviation scale already spans a factor of 2.5 (χ²(0.975; 10)/χ²(0.025; 10) = 6.3).
    /// </summary>
    public const double WeakGroupRedundancy = 10.0;

    /// <summary>Estimates the variance components.</summary>
    /// <param name="network">The network.</param>
    /// <param name="options">Adjustment options; null for defaults.</param>
    /// <param name="fitDistanceSpec">Try the two-component a + b ppm model for distances.</param>
    /// <param name="maxIterations">Largest number of iterations, ≥ 1 (default 300: the fixed-point iteration converges
    /// linearly, slowly when two components are hard to tell apart, as a and b ppm often are).</param>
    /// <exception cref="InvalidInputException">When a setting is invalid.</exception>
    /// <exception cref="AdjustmentFailedException">When an adjustment fails.</exception>
    public static VarianceComponentEstimate Estimate(SurveyNetwork network, AdjustmentOptions? options = null,
        bool fitDistanceSpec = true, int maxIterations = 300)
    {
        // one solver for every round: the sparse engine analyses the pattern once
        options = SolverChoice.Reusable(options ?? AdjustmentOptions.Default);
        if (maxIterations < 1)
            throw new InvalidInputException("the variance component estimation needs at least one iteration");
        var quick = options with { Analysis = options.Analysis with { ExternalReliability =
            ExternalReliabilityMode.Never, RelativeForObservedPairs = false, RelativePairs = [] } };
        network = Reweighting.WithStandardDeviations(network, quick);
        var obs = network.Observations;
        int n = obs.Count;
        var given = obs.Select(o => o.StandardDeviation * o.StandardDeviation).ToArray();

        // Components: (kind, t_i per observation (0 when not in it), θ)
        var comps = new List<(ObservationKind Kind, double[] T, double Theta, ComponentPart Name, string? Group)>();
        var notes = new Dictionary<ObservationKind, string>();
        var fitted = new HashSet<ObservationKind>();
        foreach (var kind in ObservationKinds.All)
        {
            var members = Enumerable.Range(0, n).Where(i => obs[i].Kind == kind && !obs[i].Excluded).ToArray();
            if (members.Length == 0) continue;
            if (kind == ObservationKind.Distance && fitDistanceSpec)
            {
                var d = members.Select(i => obs[i].Value).ToArray();
                double ratio = d.Max() / d.Min();
                if (members.Length >= MinimumDistancesForSpecFit && ratio >= MinimumLengthRatioForSpecFit)
                {
                    var sd = members.Select(i => Math.Sqrt(given[i])).OrderBy(x => x).ToArray();
                    double med = sd[sd.Length / 2], medD = d.OrderBy(x => x).ElementAt(d.Length / 2);
                    var tA = new double[n]; var tB = new double[n];
                    foreach (int i in members) { tA[i] = 1; tB[i] = obs[i].Value * obs[i].Value; }
                    comps.Add((kind, tA, med * med / 2, ComponentPart.Constant, null));
                    comps.Add((kind, tB, med * med / 2 / (medD * medD), ComponentPart.Proportional, null));
                    fitted.Add(kind);
                    continue;
                }
                notes[kind] =
                    $"no a + b ppm fit: it needs at least {MinimumDistancesForSpecFit} distances whose longest is at " +
                    $"least {MinimumLengthRatioForSpecFit:0}× the shortest; the given standard deviations were " +
                    $"scaled instead";
            }
            foreach (var (group, part) in Groups(obs, kind, members))
            {
                var t = new double[n];
                foreach (int i in part) t[i] = given[i];
                comps.Add((kind, t, 1.0, ComponentPart.Scale, group));
            }
        }

        double[] Variances()
        {
            var s = (double[])given.Clone();
            var touched = new bool[n];
            foreach (var c in comps)
                for (int i = 0; i < n; i++)
                    if (c.T[i] != 0) { if (!touched[i]) { s[i] = 0; touched[i] = true; } s[i] += c.Theta * c.T[i]; }
            return s;
        }

        AdjustmentResult result;
        int it = 0;
        bool converged = false;
        while (true)
        {
            var s2 = Variances();
            var net = new SurveyNetwork(network.Name, network.Points, obs.Select((o, i) => Reweighting.WithSd(o,
                Math.Sqrt(s2[i]))));
            result = Adjuster.Adjust(net, quick);
            if (converged || it >= maxIterations) break;
            it++;
            var a = result.Analysis;
            double change = 0;
            for (int k = 0; k < comps.Count; k++)
            {
                var c = comps[k];
                double num = 0, den = 0;
                for (int i = 0; i < n; i++)
                {
                    if (c.T[i] == 0 || a.Observations[i].Flag == ObservationFlag.Excluded) continue;
                    double share = c.Theta * c.T[i] / s2[i];
                    double v = result.Observations[i].Residual;
                    num += c.Group is null ? v * v / s2[i] * share : 0;
                    den += a.Observations[i].Redundancy * share;
                }
                if (c.Group is not null) num = BlockQuadratic(result, c.T); // vᵀ Σ⁻¹ v over the group's blocks
                if (!(den > 1e-6)) continue; // no redundancy in this component: keep it
                double ratio = num / den;
                if (!(ratio > 0)) ratio = 1e-6; // a perfect fit: let the component shrink, never vanish
                comps[k] = c with { Theta = c.Theta * ratio };
            }
            // Settled when no observation's standard deviation moves by more than 0.005% (a component that tends to
            // zero changes θ slowly but no longer changes any weight).
            var s2New = Variances();
            for (int i = 0; i < n; i++) change = Math.Max(change, Math.Abs(Math.Sqrt(s2New[i] / s2[i]) - 1));
            converged = change < 5e-5;
        }

        var fin = result.Analysis;
        var groups = new List<VarianceComponent>();
        foreach (var kind in ObservationKinds.All)
        foreach (var (group, members) in Groups(obs, kind, Enumerable.Range(0, n)
            .Where(i => obs[i].Kind == kind && !obs[i].Excluded).ToArray()))
        {
            if (members.Length == 0) continue;
            double r = members.Sum(i => fin.Observations[i].Redundancy);
            double sumSq = group is null ? members.Sum(i => result.Observations[i].Residual *
                result.Observations[i].Residual / given[i])
                : comps.First(c => c.Group == group).Theta * BlockQuadratic(result, members.Select(i => i).ToArray());
            double vf = r > 1e-6 ? sumSq / r : double.NaN;
            double? same = members.All(i => given[i] == given[members[0]]) ? Math.Sqrt(given[members[0]]) : null;
            double? aPart = null, bPart = null;
            string? note = notes.GetValueOrDefault(kind);
            if (fitted.Contains(kind))
            {
                var ca = comps.First(c => c.Kind == kind && c.Name == ComponentPart.Constant);
                var cb = comps.First(c => c.Kind == kind && c.Name == ComponentPart.Proportional);
                aPart = Math.Sqrt(ca.Theta);
                bPart = Math.Sqrt(cb.Theta) * 1e6;
            }
            if (r < WeakGroupRedundancy) note = (note is null ? "" : note + "; ") + (r > 1e-6
                ? $"the group's redundancy is only " +
                    $"{r.ToString("0.00", System.Globalization.CultureInfo.InvariantCulture)}: the estimate is weak" +
                    WeakInterval(vf, r)
                : "the group has no redundancy: its variance factor cannot be estimated");
            groups.Add(new VarianceComponent(kind, members.Length, r, vf, Math.Sqrt(vf), same * Math.Sqrt(vf), aPart,
                bPart, note) { Group = group });
        }
        return new VarianceComponentEstimate(groups, it, converged, result);
    }

    /// <summary>The members of a kind split into its estimated groups: GNSS baselines by their group (empty text for
    /// none), every other kind as one group (null).</summary>
    private static IEnumerable<(string? Group, int[] Members)> Groups(IReadOnlyList<Observation> obs,
        ObservationKind kind, int[] members)
    {
        if (kind != ObservationKind.Baseline)
        {
            yield return (null, members);
            yield break;
        }
        foreach (var g in members.GroupBy(i => ((BaselineObservation)obs[i]).Group ?? "", StringComparer.Ordinal))
            yield return (g.Key, g.ToArray());
    }

    /// <summary>Σ vᵀ Σ⁻¹ v over the weight blocks that hold the rows marked (non-zero entries of
    /// <paramref name="marked"/>, or the rows listed), Σ⁻¹ = P / σ0² of the result.</summary>
    private static double BlockQuadratic(AdjustmentResult result, double[] marked) =>
        BlockQuadratic(result, Enumerable.Range(0, marked.Length).Where(i => marked[i] != 0).ToArray());

    private static double BlockQuadratic(AdjustmentResult result, int[] rows)
    {
        var seen = new HashSet<LinearAlgebra.WeightBlock>(ReferenceEqualityComparer.Instance);
        double s = 0;
        foreach (int row in rows)
        {
            var (blk, _) = result.Weights.BlockOf(row);
            if (!seen.Add(blk)) continue;
            for (int a = 0; a < blk.Size; a++)
                for (int b = 0; b < blk.Size; b++)
                    s += result.Observations[blk.Rows[a]].Residual * blk[a, b]
                        * result.Observations[blk.Rows[b]].Residual;
        }
        return s / result.Statistics.AprioriVarianceFactor;
    }

    /// <summary>
    /// The 95% interval of a group's variance factor from its estimate f̂ and redundancy r, taking r f̂ / f as χ²(r)
    /// (approximately so for r not whole): [r f̂ / χ²(0.975; r), r f̂ / χ²(0.025; r)] (Koch 1999, §3.6 and the χ² test
    /// of a variance, *from memory* for the section).
    /// </summary>
    private static string WeakInterval(double vf, double r)
    {
        if (!(vf > 0) || !double.IsFinite(vf)) return "";
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        double lo = r * vf / MathNet.Numerics.Distributions.ChiSquared.InvCDF(r, 0.975);
        double hi = r * vf / MathNet.Numerics.Distributions.ChiSquared.InvCDF(r, 0.025);
        string Text(double x) => x >= 1000 ? x.ToString("F0", inv) : x.ToString("G3", inv);
        return $" (95% interval of its variance factor roughly {Text(lo)} to {Text(hi)})";
    }
}

/// <summary>The part of a group's variance that one estimated component scales.</summary>
internal enum ComponentPart
{
    /// <summary>The constant part a² of a distance's variance a² + (b·d)².</summary>
    Constant,

    /// <summary>The distance-proportional part (b·d)².</summary>
    Proportional,

    /// <summary>The group's given variances as a whole.</summary>
    Scale,
}
