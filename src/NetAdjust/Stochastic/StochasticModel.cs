using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Stochastic;

/// <summary>
/// The stochastic model of a network at given coordinates: every observation's standard deviation and error
/// budget, and, for correlated centering, one weight block per instrument setup. Built from the network (its
/// observations with their directly given standard deviations or their <see cref="ObservationWeighting"/>) and the
/// coordinates (sight lengths, centering sensitivities); immutable.
/// </summary>
/// <remarks>
/// Correlated centering: the instrument is centred once per setup, so its offset e = (e_E, e_N), Σe = σ_i² I, is
/// common to every observation of that setup. Observation k changes by g_kᵀ e, g_k the partial derivatives of its
/// equation at the instrument point (<see cref="IObservationKind.Instrument"/>), so the setup's observations get
/// the covariance Σ = D + Σ_c with (Σ_c)_kl = c_k c_l ĝ_kᵀ ĝ_l, where c_k = σ_i |g_k| is the observation's
/// <c>instrument_centering</c> contribution, ĝ_k = g_k/|g_k|, and D the diagonal of the other, independent
/// contributions (law of propagation of variances, Σ = J Σe Jᵀ). The diagonal of Σ is each observation's σ², so
/// this differs from the independent model only by the covariances. Weight block = σ0² Σ⁻¹.
/// </remarks>
public sealed class StochasticModel
{
    private readonly double[] _sd;
    private readonly CorrelatedBlock[] _blocks;

    private StochasticModel(double[] sd, ErrorBudget?[] budgets, CorrelatedBlock[] blocks, bool derived)
    {
        _sd = sd; _blocks = blocks; HasDerivedWeights = derived;
        StandardDeviations = sd.AsReadOnly(); Budgets = budgets.AsReadOnly(); Blocks = blocks.AsReadOnly();
        DependsOnCoordinates = Array.Exists(budgets, b => b is not null);
    }

    /// <summary>False when no observation has specifications to weigh it by (every σ given, no budget): then the
    /// model is the same at any coordinates (the baseline blocks take only the given σ and covariances) and need not
    /// be built again after the coordinates change.</summary>
    internal bool DependsOnCoordinates { get; }

    /// <summary>Each observation's a-priori standard deviation (SI), in network order.</summary>
    public IReadOnlyList<double> StandardDeviations { get; }

    /// <summary>Each observation's error budget as used (scaled by its re-weighting), or null when σ was given
    /// directly.</summary>
    public IReadOnlyList<ErrorBudget?> Budgets { get; }

    /// <summary>The weight blocks σ0² Σ⁻¹ of the setups with correlated centering (none for independent
    /// centering), then one 3×3 block per GNSS baseline (<see cref="BaselineBlocks"/>).</summary>
    public IReadOnlyList<CorrelatedBlock> Blocks { get; }

    /// <summary>True when some standard deviation was derived from specifications at the coordinates.</summary>
    public bool HasDerivedWeights { get; }

    /// <summary>A short description of the centering model for reports.</summary>
    /// <param name="centering">The centering model.</param>
    public static string Describe(CenteringModel centering) =>
        centering == CenteringModel.Correlated
            ? "instrument centering correlated within each setup" : "independent observations (diagonal weights)";

    /// <summary>Builds the model.</summary>
    /// <param name="network">The network.</param>
    /// <param name="at">Coordinates of every point the observations reach (and set orientations).</param>
    /// <param name="centering">How instrument centering enters the weights.</param>
    /// <param name="aprioriVarianceFactor">σ0² (positive).</param>
    /// <exception cref="InvalidInputException">When an observation cannot be weighted, or a setup's covariance is
    /// not positive definite.</exception>
    public static StochasticModel Build(SurveyNetwork network, ICoordinates at, CenteringModel centering,
        double aprioriVarianceFactor)
    {
        ArgumentNullException.ThrowIfNull(network);
        ArgumentNullException.ThrowIfNull(at);
        int m = network.Observations.Count;
        var sd = new double[m];
        var budgets = new ErrorBudget?[m];
        bool derived = false;
        for (int i = 0; i < m; i++)
        {
            var o = network.Observations[i];
            if (ObservationBudgets.Of(o, at) is not ErrorBudget b) { sd[i] = o.StandardDeviation; continue; }
            if (double.IsNaN(o.StandardDeviation))
            {
                derived = true;
                // The re-weighting factor scales the budget with σ (σ = total × factor).
                sd[i] = o.SdFactor == 1.0 ? b.Total : b.Total * o.SdFactor;
                budgets[i] = o.SdFactor == 1.0 ? b : b.Scaled(o.SdFactor);
                if (StandardDeviationLimits.Problem(sd[i], ObservationKindRegistry.Of(o).Unit == UnitClass.Angle)
                    is string problem)
                {
                    string what = o.Source is null ? o.Describe() :
                        $"{o.Source}: {o.Describe()[..^(o.Source.Length + 3)]}";
                    throw new InvalidInputException($"{what}: {problem}, derived from the specifications");
                }
            }
            else
            {
                sd[i] = o.StandardDeviation;
                budgets[i] = o.StandardDeviation == b.Total ? b : b.Scaled(o.StandardDeviation / b.Total);
            }
        }
        var blocks = centering == CenteringModel.Correlated
            ? SetupBlocks(network, at, sd, budgets, aprioriVarianceFactor) : [];
        blocks = [.. blocks, .. BaselineBlocks.Build(network, sd, aprioriVarianceFactor)];
        return new StochasticModel(sd, budgets, blocks, derived);
    }

    /// <summary>
    /// The largest relative change of a standard deviation or a block weight between this model and another of the
    /// same network (0 when they are the same).
    /// </summary>
    /// <param name="other">The other model.</param>
    public double LargestChange(StochasticModel other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (other._sd.Length != _sd.Length || other._blocks.Length != _blocks.Length) return double.PositiveInfinity;
        double worst = 0;
        for (int i = 0; i < _sd.Length; i++)
            worst = Math.Max(worst, Math.Abs(other._sd[i] - _sd[i]) / _sd[i]);
        for (int k = 0; k < _blocks.Length; k++)
        {
            var a = _blocks[k].Weights;
            var b = other._blocks[k].Weights;
            if (a.Count != b.Count) return double.PositiveInfinity;
            double scale = a.Max(Math.Abs);
            for (int j = 0; j < a.Count; j++) worst = Math.Max(worst, Math.Abs(a[j] - b[j]) / scale);
        }
        return worst;
    }

    /// <summary>
    /// The network with provisional standard deviations, for judging constructions of approximate coordinates in
    /// units of σ before any coordinates exist: a given σ as it is; one still to be derived (NaN) from its budget
    /// with the sight lengths observed in its setup and, where none is, without centering terms
    /// (<see cref="ObservationBudgets.Provisional"/>). The same network when no σ is to be derived. The adjustment
    /// itself is weighted at its own coordinates (<see cref="Build"/>).
    /// </summary>
    /// <param name="network">The network.</param>
    public static SurveyNetwork WithProvisionalDeviations(SurveyNetwork network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (!network.Observations.Any(o => double.IsNaN(o.StandardDeviation))) return network;
        var obs = network.Observations.Select(o =>
            double.IsNaN(o.StandardDeviation) && ObservationBudgets.Provisional(o) is ErrorBudget b
                ? o with { StandardDeviation = b.Total * o.SdFactor } : o);
        return new SurveyNetwork(network.Name, network.Points, obs);
    }

    /// <summary>
    /// The network with every derived standard deviation filled in (the observations keep their weighting), so that
    /// a result's network states the σ it was adjusted with; the same network when nothing was derived.
    /// </summary>
    /// <param name="network">The network the model was built from.</param>
    public SurveyNetwork Apply(SurveyNetwork network)
    {
        ArgumentNullException.ThrowIfNull(network);
        if (!HasDerivedWeights) return network;
        var obs = network.Observations.Select((o, i) =>
            double.IsNaN(o.StandardDeviation) ? o with { StandardDeviation = _sd[i] } : o);
        return new SurveyNetwork(network.Name, network.Points, obs);
    }

    private static CorrelatedBlock[] SetupBlocks(SurveyNetwork network, ICoordinates at, double[] sd,
        ErrorBudget?[] budgets, double aprioriVarianceFactor)
    {
        var groups = new Dictionary<string, List<(int Row, double C, double GE, double GN)>>(StringComparer.Ordinal);
        var order = new List<string>();
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var o = network.Observations[i];
            if (o.SetupId is null || budgets[i] is not ErrorBudget b) continue;
            double c = b.ValueOf(ContributionNames.InstrumentCentering);
            if (!(c > 0)) continue;
            if (Sensitivity(o, at) is not (double ge, double gn)) continue;
            if (!groups.TryGetValue(o.SetupId, out var g)) { g = []; groups[o.SetupId] = g; order.Add(o.SetupId); }
            g.Add((i, c, ge, gn));
        }
        var blocks = new List<CorrelatedBlock>();
        foreach (string setup in order)
        {
            var g = groups[setup];
            int k = g.Count;
            var cov = Matrix<double>.Build.Dense(k, k);
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                    cov[a, b] = a == b
                        ? sd[g[a].Row] * sd[g[a].Row]
                        : g[a].C * g[b].C * ((g[a].GE * g[b].GE) + (g[a].GN * g[b].GN));
            Matrix<double> weight;
            try
            {
                var chol = cov.Cholesky();
                weight = chol.Solve(Matrix<double>.Build.DenseIdentity(k)) * aprioriVarianceFactor;
            }
            catch (ArgumentException)
            {
                throw new InvalidInputException($"setup {setup}: its observations' covariance matrix is not positive " +
                    "definite (the instrument centering error is their only error): give the instrument's pointing " +
                    "or the EDM a non-zero error");
            }
            var m = new double[k * k];
            for (int a = 0; a < k; a++)
                for (int b = 0; b < k; b++)
                    m[(a * k) + b] = 0.5 * (weight[a, b] + weight[b, a]);
            blocks.Add(new CorrelatedBlock(g.Select(x => x.Row).ToArray(), m));
        }
        return blocks.ToArray();
    }

    /// <summary>
    /// The unit sensitivity ĝ of an observation to its instrument's offset: the partial derivatives of its equation
    /// at the instrument point, normalised; null when its kind has no instrument or the derivatives vanish.
    /// </summary>
    /// <param name="observation">The observation.</param>
    /// <param name="at">The coordinates.</param>
    public static (double E, double N)? Sensitivity(Observation observation, ICoordinates at)
    {
        ArgumentNullException.ThrowIfNull(observation);
        var kind = ObservationKindRegistry.Of(observation);
        if (kind.Instrument(observation) is not string station) return null;
        double x = 0, y = 0;
        foreach (var p in kind.Evaluate(observation, at).Partials)
        {
            if (p.Owner != station) continue;
            if (p.Parameter == Geometry.Parameter.E) x += p.Derivative;
            else if (p.Parameter == Geometry.Parameter.N) y += p.Derivative;
        }
        double norm = Math.Sqrt((x * x) + (y * y));
        return norm > 0 && double.IsFinite(norm) ? (x / norm, y / norm) : null;
    }
}

/// <summary>The weights σ0² Σ⁻¹ of the correlated observations of one setup.</summary>
/// <param name="Rows">The observations' indices in the network, ascending.</param>
/// <param name="Weights">The k×k weight matrix, row-major, symmetric.</param>
public sealed record CorrelatedBlock(IReadOnlyList<int> Rows, IReadOnlyList<double> Weights)
{
    /// <summary>The observations' indices in the network, ascending.</summary>
    public IReadOnlyList<int> Rows { get; init => field = ReadOnlyCopies.List(value); } = ReadOnlyCopies.List(Rows);

    /// <summary>The k×k weight matrix, row-major, symmetric.</summary>
    public IReadOnlyList<double> Weights
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List(Weights);
}
