using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;

namespace NetAdjust.Stochastic;

/// <summary>
/// The rigorous weight model for instrument centering: the instrument is centred once per setup, so its offset
/// e = (e_E, e_N), with Σe = σ_i² I, is common to every distance, direction and angle observed at that setup.
/// Each observation ℓ_k changes by g_kᵀ e, so the observations of one setup get the covariance
/// Σ = D + Σ_c with (Σ_c)_kl = c_k c_l ĝ_kᵀ ĝ_l, where c_k = σ_i |g_k| is the observation's
/// <c>instrument_centering</c> contribution, ĝ_k = g_k/|g_k| its direction, and D the diagonal of the other,
/// independent contributions (law of propagation of variances, Σ = J Σe Jᵀ). The diagonal of Σ is exactly the
/// square of each observation's standard deviation, so this model differs from the diagonal one only by the
/// covariances. P_block = σ0² Σ⁻¹ for each setup; observations without a budget, a setup or a centering term,
/// and weighted control, keep their diagonal weights.
/// </summary>
/// <remarks>
/// Sensitivities (station S moved by e; Δ = target − S, D = |Δ|): distance g = −Δ/D; direction (azimuth)
/// g = (−ΔN, ΔE)/D²; angle g = g_foresight − g_backsight. They are computed from the network's given or
/// approximate coordinates; only their directions ĝ are used, so metre-level errors in approximate
/// coordinates change the correlations negligibly.
/// </remarks>
public sealed class SetupCenteringWeightModel : IWeightModel
{
    /// <summary>The single instance (the model has no settings).</summary>
    public static SetupCenteringWeightModel Instance { get; } = new();

    /// <inheritdoc />
    public string Description => "instrument centering correlated within each setup";

    /// <inheritdoc />
    public WeightMatrix Build(SurveyNetwork network, IReadOnlyList<double> diagonalWeights, double aprioriVarianceFactor)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(diagonalWeights);
        var blocks = new List<WeightBlock>();
        var inBlock = new bool[diagonalWeights.Count];
        var groups = new Dictionary<string, List<(int Row, double C, double GE, double GN)>>(StringComparer.Ordinal);
        var order = new List<string>();
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var o = network.Observations[i];
            if (o.SetupId is null || o.Budget is null) continue;
            double c = o.Budget.ValueOf(ContributionNames.InstrumentCentering);
            if (!(c > 0)) continue;
            if (Sensitivity(network, o) is not (double ge, double gn)) continue;
            if (!groups.TryGetValue(o.SetupId, out var g)) { g = []; groups[o.SetupId] = g; order.Add(o.SetupId); }
            g.Add((i, c, ge, gn));
        }
        foreach (string setup in order)
        {
            var g = groups[setup];
            int k = g.Count;
            var cov = Matrix<double>.Build.Dense(k, k);
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                    cov[a, b] = a == b
                        ? Sq(network.Observations[g[a].Row].StandardDeviation)
                        : g[a].C * g[b].C * ((g[a].GE * g[b].GE) + (g[a].GN * g[b].GN));
            Matrix<double> weight;
            try
            {
                var chol = cov.Cholesky();
                weight = chol.Solve(Matrix<double>.Build.DenseIdentity(k)) * aprioriVarianceFactor;
            }
            catch (ArgumentException)
            {
                throw new InvalidInputException($"setup {setup}: its observations' covariance matrix is not positive definite " +
                    "(the instrument centering error is their only error): give the instrument's pointing or the EDM a non-zero error");
            }
            var rows = g.Select(x => x.Row).ToArray();
            var m = new double[k * k];
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                    m[(a * k) + b] = 0.5 * (weight[a, b] + weight[b, a]);
            blocks.Add(new WeightBlock(rows, m));
            foreach (int r in rows) inBlock[r] = true;
        }
        for (int i = 0; i < diagonalWeights.Count; i++)
            if (!inBlock[i]) blocks.Add(new WeightBlock([i], [diagonalWeights[i]]));
        blocks.Sort((x, y) => x.Rows[0].CompareTo(y.Rows[0]));
        return WeightMatrix.FromBlocks(diagonalWeights.Count, blocks);
    }

    /// <summary>The unit sensitivity ĝ of an observation to its station's offset, or null when it has none or lacks coordinates.</summary>
    internal static (double E, double N)? Sensitivity(SurveyNetwork network, Observation o)
    {
        (double E, double N)? Xy(string id) => network.Contains(id) && network[id] is { E: double e, N: double n } ? (e, n) : null;
        (double E, double N)? Direction(string s, string t)
        {
            if (Xy(s) is not var (se, sn) || Xy(t) is not var (te, tn)) return null;
            double de = te - se, dn = tn - sn, d2 = (de * de) + (dn * dn);
            return d2 > 0 ? (-dn / d2, de / d2) : null;
        }
        (double E, double N)? raw = o switch
        {
            DistanceObservation d when Xy(d.From) is var (se, sn) && Xy(d.To) is var (te, tn) && Math.Sqrt(Sq(te - se) + Sq(tn - sn)) is var len && len > 0
                => (-(te - se) / len, -(tn - sn) / len),
            DirectionObservation d => Direction(d.Station, d.Target),
            AngleObservation a when Direction(a.Station, a.Foresight) is var (fe, fn) && Direction(a.Station, a.Backsight) is var (be, bn)
                => (fe - be, fn - bn),
            _ => null,
        };
        if (raw is not var (x, y)) return null;
        double norm = Math.Sqrt((x * x) + (y * y));
        return norm > 0 ? (x / norm, y / norm) : null;
    }

    private static double Sq(double x) => x * x;
}
