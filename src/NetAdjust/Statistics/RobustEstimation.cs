using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.Statistics;

/// <summary>The weight function of an iteratively re-weighted adjustment.</summary>
public enum RobustMethod
{
    /// <summary>Huber (1964): weight factor min(1, c/|u|); default c = 1.5.</summary>
    Huber,

    /// <summary>Danish method (Krarup &amp; Kubik): weight factor 1 for |u| ≤ c, exp(1 − (u/c)²) above; default c = 2.</summary>
    Danish,
}

/// <summary>The outcome of a robust (iteratively re-weighted) adjustment.</summary>
/// <param name="Method">The weight function.</param>
/// <param name="Tuning">Its constant c.</param>
/// <param name="Iterations">Re-weighting iterations made.</param>
/// <param name="Converged">True when the weight factors settled (largest change below 0.001).</param>
/// <param name="WeightFactors">The final weight factor of each observation (1 = full weight), in network order.</param>
/// <param name="Standardised">The final robust standardised residual |u| = |v| / (σ √r) with the given σ, in network order (NaN when not tested).</param>
/// <param name="Suspected">Observations whose robust standardised residual exceeds the w-test critical value, largest first.</param>
/// <param name="Final">The last re-weighted adjustment (standard deviations inflated by 1/√factor).</param>
public sealed record RobustEstimate(RobustMethod Method, double Tuning, int Iterations, bool Converged, IReadOnlyList<double> WeightFactors,
    IReadOnlyList<double> Standardised, IReadOnlyList<int> Suspected, AdjustmentResult Final);

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
    public static RobustEstimate Run(SurveyNetwork network, RobustMethod method, AdjustmentOptions? options = null, double? tuning = null, int maxIterations = 30)
    {
        options ??= AdjustmentOptions.Default;
        double c = tuning ?? (method == RobustMethod.Huber ? 1.5 : 2.0);
        if (!(c > 0) || !double.IsFinite(c)) throw new InvalidInputException("the robust tuning constant must be positive");
        if (maxIterations < 1) throw new InvalidInputException("the robust estimation needs at least one iteration");
        var quick = options with { Analysis = options.Analysis with { ExternalReliability = ExternalReliabilityMode.Never, RelativeForObservedPairs = false, RelativePairs = [] } };
        int n = network.Observations.Count;
        var f = Enumerable.Repeat(1.0, n).ToArray();
        var u = new double[n];
        AdjustmentResult result;
        int it = 0;
        bool converged = false;
        while (true)
        {
            var obs = network.Observations.Select((o, i) => f[i] == 1.0 ? o : Reweighting.WithSd(o, o.StandardDeviation / Math.Sqrt(f[i]))).ToArray();
            result = Adjuster.Adjust(new SurveyNetwork(network.Name, network.Points, obs), quick);
            if (converged || it >= maxIterations) break;
            it++;
            var a = result.Analysis;
            double change = 0;
            for (int i = 0; i < n; i++)
            {
                var t = a.Observations[i];
                if (t.Flag is ObservationFlag.Excluded or ObservationFlag.Uncontrolled) { u[i] = double.NaN; continue; }
                // standardised against the given σ: u = v / (σ √r), with r of the current weighting
                u[i] = Math.Abs(result.Observations[i].Residual) / (network.Observations[i].StandardDeviation * Math.Sqrt(Math.Max(t.Redundancy, 1e-3)));
                double g = Weight(method, c, u[i]);
                change = Math.Max(change, Math.Abs(g - f[i]));
                f[i] = g;
            }
            converged = change < 1e-3;
        }
        double crit = result.Analysis.WCritical;
        var suspected = Enumerable.Range(0, n).Where(i => u[i] > crit).OrderByDescending(i => u[i]).ThenBy(i => i).ToArray();
        return new RobustEstimate(method, c, it, converged, f, u, suspected, result);
    }

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
