using NetAdjust.Network;

namespace NetAdjust.Stochastic;

/// <summary>
/// The 3×3 weight blocks of GNSS baselines (docs/methods.md, "GNSS baselines"): for the three components of one
/// baseline (<see cref="BaselineObservation.BaselineId"/>), Σ = D R D with R the correlations of the baseline's
/// covariance (group scale applied) and D the components' current standard deviations, so that a procedure that
/// re-weights a component (variance components, robust estimation) keeps the correlations; weight block σ0² Σ⁻¹.
/// They join the setup blocks of correlated centering in one block-diagonal weight matrix (a baseline has no setup,
/// so the two never share a row).
/// </summary>
internal static class BaselineBlocks
{
    /// <summary>The blocks of a network's baselines, in order of their first component.</summary>
    /// <param name="network">The network.</param>
    /// <param name="sd">Each observation's current standard deviation (SI), in network order.</param>
    /// <param name="aprioriVarianceFactor">σ0².</param>
    /// <exception cref="InvalidInputException">When the components of one baseline disagree or their covariance
    /// is not positive definite.</exception>
    public static IReadOnlyList<CorrelatedBlock> Build(SurveyNetwork network, IReadOnlyList<double> sd,
        double aprioriVarianceFactor)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(sd);
        var groups = Groups(network);
        var blocks = new List<CorrelatedBlock>(groups.Count);
        foreach (var rows in groups)
        {
            var first = (BaselineObservation)network.Observations[rows[0]];
            var cov = first.Covariance!;
            int k = rows.Count;
            var sigma = new double[k, k];
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                {
                    int ca = (int)((BaselineObservation)network.Observations[rows[a]]).Component;
                    int cb = (int)((BaselineObservation)network.Observations[rows[b]]).Component;
                    double r = cov[(ca * 3) + cb] / Math.Sqrt(cov[(ca * 3) + ca] * cov[(cb * 3) + cb]);
                    sigma[a, b] = r * sd[rows[a]] * sd[rows[b]];
                }
            var w = InverseSpd(sigma) ?? throw new InvalidInputException(
                $"{first.Describe()}: the covariance of the baseline is not positive definite");
            var m = new double[k * k];
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++) m[(a * k) + b] = 0.5 * (w[a, b] + w[b, a]) * aprioriVarianceFactor;
            blocks.Add(new CorrelatedBlock([.. rows], m));
        }
        return blocks;
    }

    /// <summary>The rows of each baseline with a covariance, grouped by <see cref="BaselineObservation.BaselineId"/>
    /// (ascending rows; groups in order of their first row). Components without an id or covariance stand alone and
    /// are not listed.</summary>
    /// <param name="network">The network.</param>
    /// <exception cref="InvalidInputException">When two components of one id name different points, repeat a
    /// component or differ in their covariance.</exception>
    public static IReadOnlyList<IReadOnlyList<int>> Groups(SurveyNetwork network)
    {
        ArgumentNullException.ThrowIfNull(network);
        var byId = new Dictionary<string, List<int>>(StringComparer.Ordinal);
        var order = new List<List<int>>();
        for (int i = 0; i < network.Observations.Count; i++)
        {
            if (network.Observations[i] is not BaselineObservation { BaselineId: string id, Covariance: not null } b)
                continue;
            if (!byId.TryGetValue(id, out var rows)) { rows = []; byId[id] = rows; order.Add(rows); }
            else
            {
                var first = (BaselineObservation)network.Observations[rows[0]];
                bool sameCovariance = first.Covariance!.SequenceEqual(b.Covariance);
                if (first.From != b.From || first.To != b.To || !sameCovariance || rows.Any(r =>
                        ((BaselineObservation)network.Observations[r]).Component == b.Component))
                    throw new InvalidInputException($"{b.Describe()}: baseline {id} has components that do not " +
                        "belong together (different points, a repeated component or different covariances)");
            }
            rows.Add(i);
        }
        return order;
    }

    /// <summary>Σ⁻¹ by Cholesky, or null when Σ is not positive definite.</summary>
    private static double[,]? InverseSpd(double[,] s)
    {
        int n = s.GetLength(0);
        var l = new double[n, n];
        for (int j = 0; j < n; j++)
        {
            double d = s[j, j];
            for (int k = 0; k < j; k++) d -= l[j, k] * l[j, k];
            if (!(d > 0)) return null;
            l[j, j] = Math.Sqrt(d);
            for (int i = j + 1; i < n; i++)
            {
                double v = s[i, j];
                for (int k = 0; k < j; k++) v -= l[i, k] * l[j, k];
                l[i, j] = v / l[j, j];
            }
        }
        var inv = new double[n, n];
        for (int c = 0; c < n; c++)
        {
            var y = new double[n];
            for (int i = 0; i < n; i++) // L y = e_c
            {
                double v = i == c ? 1 : 0;
                for (int k = 0; k < i; k++) v -= l[i, k] * y[k];
                y[i] = v / l[i, i];
            }
            for (int i = n - 1; i >= 0; i--) // Lᵀ x = y
            {
                double v = y[i];
                for (int k = i + 1; k < n; k++) v -= l[k, i] * inv[k, c];
                inv[i, c] = v / l[i, i];
            }
        }
        return inv;
    }
}
