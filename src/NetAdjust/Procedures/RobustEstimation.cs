using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Procedures;

/// <summary>The weight function of an iteratively re-weighted adjustment.</summary>
public enum RobustMethod
{
    /// <summary>Huber (1964): weight factor min(1, c/|u|); default c = 1.5.</summary>
    Huber,

    /// <summary>Danish method (Krarup &amp; Kubik): weight factor 1 for |u| ≤ c, exp(1 − (u/c)²) above; default c =
    /// 2.</summary>
    Danish,
}

/// <summary>The outcome of a robust (iteratively re-weighted) adjustment. Made by the robust estimation only (the
/// constructor is internal).</summary>
public sealed record RobustEstimate
{
    /// <summary>Made by the robust estimation.</summary>
    internal RobustEstimate(RobustMethod Method, double Tuning, int Iterations, bool Converged,
        IReadOnlyList<double> WeightFactors, IReadOnlyList<double> Standardised, IReadOnlyList<int> Suspected,
        AdjustmentResult Final)
    {
        this.Method = Method; this.Tuning = Tuning; this.Iterations = Iterations; this.Converged = Converged;
        this.WeightFactors = WeightFactors; this.Standardised = Standardised; this.Suspected = Suspected;
        this.Final = Final;
    }

    /// <summary>The weight function.</summary>
    public RobustMethod Method { get; internal init; }

    /// <summary>Its constant c.</summary>
    public double Tuning { get; internal init; }

    /// <summary>Re-weighting iterations made.</summary>
    public int Iterations { get; internal init; }

    /// <summary>True when the weight factors settled (largest change below 0.001).</summary>
    public bool Converged { get; internal init; }

    /// <summary>The last re-weighted adjustment (standard deviations inflated by 1/√factor).</summary>
    public AdjustmentResult Final { get; internal init; }

    /// <summary>The final weight factor of each observation, in network order.</summary>
    public IReadOnlyList<double> WeightFactors
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>The final robust standardised residual of each observation, in network order.</summary>
    public IReadOnlyList<double> Standardised
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Observations whose robust standardised residual exceeds the critical value, largest first.</summary>
    public IReadOnlyList<int> Suspected
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }
}

/// <summary>
/// Robust estimation by iteratively re-weighted least squares: each observation's weight is multiplied by a factor
/// that falls as its standardised residual grows, and the network is re-adjusted until the factors settle. It
/// locates several blunders at once where one-at-a-time data snooping can be misled. It is a locating tool: the
/// surveyor then excludes or re-measures and runs the ordinary adjustment.
/// </summary>
public static class RobustEstimation
{
    /// <summary>Runs the re-weighting.</summary>
    /// <param name="network">The network; excluded observations stay excluded.</param>
    /// <param name="method">The weight function.</param>
    /// <param name="options">Adjustment options; null for defaults.</param>
    /// <param name="tuning">The constant c (positive); null for the method's default.</param>
    /// <param name="maxIterations">Largest number of re-weightings, ≥ 1 (default 30).</param>
    /// <exception cref="InvalidInputException">When a setting is invalid.</exception>
    /// <exception cref="AdjustmentFailedException">When an adjustment fails.</exception>
    public static RobustEstimate Run(SurveyNetwork network, RobustMethod method, AdjustmentOptions? options = null,
        double? tuning = null, int maxIterations = 30)
    {
        // one solver for every round: the sparse engine analyses the pattern once
        options = SolverChoice.Reusable(options ?? AdjustmentOptions.Default);
        double c = tuning ?? (method == RobustMethod.Huber ? 1.5 : 2.0);
        if (!(c > 0) || !double.IsFinite(c))
            throw new InvalidInputException("the robust tuning constant must be positive");
        if (maxIterations < 1) throw new InvalidInputException("the robust estimation needs at least one iteration");
        var quick = options with { Analysis = options.Analysis with { ExternalReliability =
            ExternalReliabilityMode.Never, RelativeForObservedPairs = false, RelativePairs = [] } };
        network = Reweighting.WithStandardDeviations(network, quick);
        int n = network.Observations.Count;
        var f = Enumerable.Repeat(1.0, n).ToArray();
        var u = new double[n];
        var drive = new double[n];
        AdjustmentResult result;
        int it = 0;
        bool converged = false;
        while (true)
        {
            var obs = network.Observations.Select((o, i) => f[i] == 1.0 ? o : Reweighting.WithSd(o,
                o.StandardDeviation / Math.Sqrt(f[i]))).ToArray();
            result = Adjuster.Adjust(new SurveyNetwork(network.Name, network.Points, obs), quick);
            // u of this adjustment, so that the reported u, suspects and final result belong together
            var a = result.Analysis;
            for (int i = 0; i < n; i++)
            {
                var t = a.Observations[i];
                double r = Math.Max(t.Redundancy, 1e-3), v = result.Observations[i].Residual, sd =
                    network.Observations[i].StandardDeviation;
                bool untested = t.Flag is ObservationFlag.Excluded or ObservationFlag.Uncontrolled;
                // The weight function is driven by |v| / (σ √r) with the given σ and r of the current weighting: it
                // keeps
                // a blunder down-weighted once found (u, which ignores the observation's own weight, lets the weights
                // of
                // a direction set swing from round to round). Suspects are decided by u, the w the observation would
                // get
                // at full weight against the others; when the others as re-weighted leave it uncontrolled (its
                // redundancy at full weight below the uncontrolled threshold, e.g. one of two directions of a set that
                // are both down-weighted) u cannot test it and the driving value stands in.
                drive[i] = untested ? double.NaN : Math.Abs(v) / (sd * Math.Sqrt(r));
                double rFull = 1 / (1 + (((1 / r) - 1) / f[i]));
                u[i] =
                    untested ? double.NaN : rFull < options.Analysis.UncontrolledRedundancy ? drive[i] : Standardised(v,
                    sd, r, f[i]);
            }
            if (converged || it >= maxIterations) break;
            it++;
            double change = 0;
            for (int i = 0; i < n; i++)
            {
                if (double.IsNaN(drive[i])) continue;
                double g = Weight(method, c, drive[i]);
                change = Math.Max(change, Math.Abs(g - f[i]));
                f[i] = g;
            }
            converged = change < 1e-3;
        }
        double crit = result.Analysis.WCritical;
        var suspected = Enumerable.Range(0, n).Where(i => u[i] > crit).OrderByDescending(i => u[i]).ThenBy(i =>
            i).ToArray();
        return new RobustEstimate(method, c, it, converged, f, u, suspected, result);
    }

    /// <summary>
    /// The robust standardised residual |u| of an observation: the w-test statistic it would get at full weight, with
    /// the
    /// other observations weighted as they are now. With the current weight factor f and redundancy number r
    /// (r = 1/(1 + f pᵢ hᵢ), hᵢ = aᵢ Q′ aᵢᵀ with Q′ the cofactor matrix of the others), the misclosure of the
    /// observation against the others is eᵢ = vᵢ / r, with variance σᵢ² + σ0² hᵢ = σᵢ² (1 + (1/r − 1)/f); so
    /// |u| = |vᵢ| / (r σᵢ √(1 + (1/r − 1)/f)). For f = 1 this is Baarda's |w| = |vᵢ|/(σᵢ √r); for a down-weighted
    /// observation it does not grow as its own weight falls (the plain |vᵢ|/(σᵢ √r) tends to |eᵢ|/σᵢ, which is
    /// 1/√r₀ times too large and makes good observations beside a blunder look like blunders).
    /// Exact for diagonal weights; with correlated weight blocks an approximation.
    /// </summary>
    /// <param name="residual">vᵢ in the current (re-weighted) adjustment (m or rad).</param>
    /// <param name="givenSd">σᵢ as given (m or rad), &gt; 0.</param>
    /// <param name="redundancy">rᵢ in the current adjustment, in (0, 1].</param>
    /// <param name="factor">The current weight factor f in (0, 1].</param>
    /// <returns>|u| ≥ 0.</returns>
    internal static double Standardised(double residual, double givenSd, double redundancy, double factor) =>
        Math.Abs(residual) / (redundancy * givenSd * Math.Sqrt(1 + (((1 / redundancy) - 1) / factor)));

    /// <summary>The weight factor of an observation with standardised residual u.</summary>
    /// <param name="method">The weight function.</param>
    /// <param name="c">The tuning constant.</param>
    /// <param name="u">|u| ≥ 0.</param>
    /// <returns>A factor in (0, 1], floored at 1e−8 so that every weight stays positive.</returns>
    public static double Weight(RobustMethod method, double c, double u)
    {
        u = Math.Abs(u);
        if (u <= c) return 1.0;
        double g = method == RobustMethod.Huber ? c / u : Math.Exp(1 - ((u / c) * (u / c)));
        return Math.Max(g, 1e-8);
    }
}
