using System.Runtime.InteropServices;
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
        // k ≤ 3: a baseline has three components, none repeated (Groups); Σ and its inverse in k×k row-major spans
        Span<double> sigma = stackalloc double[9], w = stackalloc double[9], l = stackalloc double[9];
        Span<int> components = stackalloc int[3];
        foreach (var rows in groups)
        {
            var first = (BaselineObservation)network.Observations[rows[0]];
            var cov = first.Covariance!;
            int k = rows.Count;
            for (int a = 0; a < k; a++)
                components[a] = (int)((BaselineObservation)network.Observations[rows[a]]).Component;
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                {
                    int ca = components[a], cb = components[b];
                    double r = cov[(ca * 3) + cb] / Math.Sqrt(cov[(ca * 3) + ca] * cov[(cb * 3) + cb]);
                    sigma[(a * k) + b] = r * sd[rows[a]] * sd[rows[b]];
                }
            if (!InverseSpd(sigma[..(k * k)], k, l[..(k * k)], w[..(k * k)]))
                throw new InvalidInputException($"{first.Describe()}: the covariance of the baseline is not positive " +
                    "definite");
            var m = new double[k * k];
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                    m[(a * k) + b] = 0.5 * (w[(a * k) + b] + w[(b * k) + a]) * aprioriVarianceFactor;
            blocks.Add(new CorrelatedBlock(ImmutableCollectionsMarshal.AsImmutableArray(rows.ToArray()),
                ImmutableCollectionsMarshal.AsImmutableArray(m)));
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
        // the components of one baseline mostly follow one another: the id met just before needs no look-up
        (string? Id, List<int>? Rows) last = default;
        for (int i = 0; i < network.Observations.Count; i++)
        {
            if (network.Observations[i] is not BaselineObservation { BaselineId: string id, Covariance: not null } b)
                continue;
            var rows = ReferenceEquals(id, last.Id) ? last.Rows : null;
            if (rows is null && !byId.TryGetValue(id, out rows)) { rows = []; byId[id] = rows; order.Add(rows); }
            else
            {
                var first = (BaselineObservation)network.Observations[rows[0]];
                // components made together share one covariance list
                bool sameCovariance = ReferenceEquals(first.Covariance, b.Covariance) ||
                    first.Covariance!.SequenceEqual(b.Covariance);
                if (first.From != b.From || first.To != b.To || !sameCovariance || rows.Any(r =>
                        ((BaselineObservation)network.Observations[r]).Component == b.Component))
                    throw new InvalidInputException($"{b.Describe()}: baseline {id} has components that do not " +
                        "belong together (different points, a repeated component or different covariances)");
            }
            rows.Add(i);
            last = (id, rows);
        }
        return order;
    }

    /// <summary>Σ⁻¹ (n×n, row-major) by Cholesky into <paramref name="inverse"/>, with <paramref name="l"/> for
    /// the factor; false when Σ is not positive definite.</summary>
    private static bool InverseSpd(ReadOnlySpan<double> s, int n, Span<double> l, Span<double> inverse)
    {
        l.Clear();
        for (int j = 0; j < n; j++)
        {
            double d = s[(j * n) + j];
            for (int k = 0; k < j; k++) d -= l[(j * n) + k] * l[(j * n) + k];
            if (!(d > 0)) return false;
            l[(j * n) + j] = Math.Sqrt(d);
            for (int i = j + 1; i < n; i++)
            {
                double v = s[(i * n) + j];
                for (int k = 0; k < j; k++) v -= l[(i * n) + k] * l[(j * n) + k];
                l[(i * n) + j] = v / l[(j * n) + j];
            }
        }
        inverse.Clear();
        Span<double> y = stackalloc double[n];
        for (int c = 0; c < n; c++)
        {
            for (int i = 0; i < n; i++) // L y = e_c
            {
                double v = i == c ? 1 : 0;
                for (int k = 0; k < i; k++) v -= l[(i * n) + k] * y[k];
                y[i] = v / l[(i * n) + i];
            }
            for (int i = n - 1; i >= 0; i--) // Lᵀ x = y
            {
                double v = y[i];
                for (int k = i + 1; k < n; k++) v -= l[(k * n) + i] * inverse[(k * n) + c];
                inverse[(i * n) + c] = v / l[(i * n) + i];
            }
        }
        return true;
    }
}
