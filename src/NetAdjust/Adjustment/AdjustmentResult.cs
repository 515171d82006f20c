using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// An adjusted point. Standard deviations use the a-priori variance factor (σ0² as given, normally 1);
/// the a-posteriori variance factor is reported beside them in <see cref="AdjustmentStatistics"/>.
/// </summary>
/// <param name="Input">The point as given.</param>
/// <param name="E">Adjusted (or held) easting, m; null when the point takes no part in the plane adjustment and gave
/// none.</param>
/// <param name="N">Adjusted (or held) northing, m.</param>
/// <param name="H">Adjusted (or held) height, m.</param>
/// <param name="SdE">Standard deviation of the easting, m (0 when held; null when not adjusted).</param>
/// <param name="SdN">Standard deviation of the northing, m.</param>
/// <param name="SdH">Standard deviation of the height, m.</param>
/// <param name="CovEN">Covariance of easting and northing, m² (0 when held; null when not adjusted).</param>
public sealed record AdjustedPoint(Point Input, double? E, double? N, double? H, double? SdE, double? SdN, double? SdH,
    double? CovEN)
{
    /// <summary>The point id.</summary>
    public string Id => Input.Id;
}

/// <summary>An observation after adjustment. Values in SI (m or rad).</summary>
/// <param name="Input">The observation as given.</param>
/// <param name="Adjusted">The adjusted value (for angular kinds in [0, 2π)).</param>
/// <param name="Residual">v = adjusted − observed (reduced to (−π, π] for angles).</param>
/// <param name="SdAdjusted">Standard deviation of the adjusted value, √(a Qxx aᵀ) scaled by σ0.</param>
/// <param name="Index">Position in the network's observation list.</param>
public sealed record AdjustedObservation(Observation Input, double Adjusted, double Residual, double SdAdjusted,
    int Index)
{
    /// <summary>
    /// The error budget behind the observation's standard deviation (named contributions whose root-sum-square is
    /// it), at the adjusted coordinates; null when the standard deviation was given directly.
    /// </summary>
    public Stochastic.ErrorBudget? Budget { get; init; }
}

/// <summary>An adjusted orientation unknown of a direction set.</summary>
/// <param name="SetId">The set id.</param>
/// <param name="Station">The station of the set.</param>
/// <param name="Orientation">The adjusted orientation (circle reading of grid north... as azimuth − reading), rad in
/// [0, 2π).</param>
/// <param name="Sd">Its standard deviation, rad.</param>
public sealed record AdjustedOrientation(string SetId, string Station, double Orientation, double Sd);

/// <summary>An estimated refraction coefficient of a group of zenith angles.</summary>
/// <param name="Group">The group's id.</param>
/// <param name="Coefficient">The adjusted k (dimensionless).</param>
/// <param name="Sd">Its standard deviation (a-priori variance factor, as for points).</param>
public sealed record AdjustedRefraction(string Group, double Coefficient, double Sd);

/// <summary>Overall figures of an adjustment.</summary>
/// <param name="Observations">n: observations, including weighted-control components.</param>
/// <param name="Unknowns">u.</param>
/// <param name="DegreesOfFreedom">r = n − u.</param>
/// <param name="Vtpv">vᵀPv.</param>
/// <param name="AprioriVarianceFactor">σ0² used for weights and point standard deviations.</param>
/// <param name="Iterations">Gauss-Newton iterations made.</param>
/// <param name="GlobalTest">The χ² global test.</param>
public sealed record AdjustmentStatistics(int Observations, int Unknowns, int DegreesOfFreedom, double Vtpv,
    double AprioriVarianceFactor, int Iterations, GlobalTest GlobalTest)
{
    /// <summary>A-posteriori variance factor σ̂0² = vᵀPv / r; null when r = 0.</summary>
    public double? VarianceFactor => DegreesOfFreedom > 0 ? Vtpv / DegreesOfFreedom : null;

    /// <summary>A-posteriori standard deviation of unit weight σ̂0 = √(vᵀPv / r); null when r = 0.</summary>
    public double? Sigma0 => VarianceFactor is double f ? Math.Sqrt(f) : null;
}

/// <summary>
/// The complete, immutable result of one adjustment: points, observations, orientations, statistics, and the
/// cofactor matrix Qxx = N⁻¹ of the unknowns (through <see cref="Cofactor"/>) for later statistics.
/// </summary>
public sealed class AdjustmentResult
{
    private readonly INormalFactor? _factor;

    internal AdjustmentResult(SurveyNetwork network, AdjustmentOptions options, UnknownIndex unknowns,
        INormalFactor? factor,
        IReadOnlyList<AdjustedPoint> points, IReadOnlyList<AdjustedObservation> observations,
        IReadOnlyList<AdjustedOrientation> orientations, AdjustmentStatistics statistics, string solverName,
        IReadOnlyList<SparseRow> designRows, WeightMatrix weights)
    {
        Network = network; Options = options; Unknowns = unknowns; _factor = factor;
        Points = ReadOnlyCopies.List(points); Observations = ReadOnlyCopies.List(observations);
        Orientations = ReadOnlyCopies.List(orientations); Statistics = statistics;
        SolverName = solverName; DesignRows = designRows; Weights = weights;
    }

    /// <summary>True when the adjustment has unknowns, so that <see cref="Cofactor"/> and <see cref="Solve"/> can be
    /// used.</summary>
    public bool HasFactor => _factor is not null;

    /// <summary>Solves N x = b with the factor of the normal matrix N at the solution, i.e. x = Qxx b.</summary>
    /// <param name="rhs">b, one entry per unknown.</param>
    /// <returns>x = Qxx b.</returns>
    public double[] Solve(ReadOnlySpan<double> rhs) =>
        _factor is null ? throw new InvalidOperationException("There are no unknowns.") : _factor.Solve(rhs);

    /// <summary>The network adjusted.</summary>
    public SurveyNetwork Network { get; }

    /// <summary>The options used.</summary>
    public AdjustmentOptions Options { get; }

    /// <summary>The numbering of the unknowns.</summary>
    public UnknownIndex Unknowns { get; }

    /// <summary>Adjusted points, in input order.</summary>
    public IReadOnlyList<AdjustedPoint> Points { get; }

    /// <summary>Adjusted observations, in input order.</summary>
    public IReadOnlyList<AdjustedObservation> Observations { get; }

    /// <summary>Adjusted orientation unknowns, in order of first appearance.</summary>
    public IReadOnlyList<AdjustedOrientation> Orientations { get; }

    /// <summary>Estimated refraction coefficients, one per group whose k is an unknown, in order of first
    /// appearance; empty when none is estimated.</summary>
    public IReadOnlyList<AdjustedRefraction> Refractions
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List<AdjustedRefraction>([]);

    /// <summary>Estimated frame parameters between GNSS frames and the local control (docs/methods.md, "GNSS
    /// baselines"), in unknown order; empty when none is estimated.</summary>
    public IReadOnlyList<AdjustedFrameParameter> FrameParameters
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List<AdjustedFrameParameter>([]);

    /// <summary>Overall statistics and the global test.</summary>
    public AdjustmentStatistics Statistics { get; }

    /// <summary>Which linear solver ran.</summary>
    public string SolverName { get; }

    /// <summary>
    /// The design matrix rows at the solution: first one per observation (in input order), then one per
    /// weighted-control component. Values in SI units. Internal: the rows hold arrays that a caller could change.
    /// </summary>
    internal IReadOnlyList<SparseRow> DesignRows { get; }

    /// <summary>The weight matrix P (σ0² Σ⁻¹; diagonal σ0²/σ² for uncorrelated observations) of <see
    /// cref="DesignRows"/>.</summary>
    internal WeightMatrix Weights { get; }

    /// <summary>The cofactor Qxx(i, j) = (N⁻¹)ᵢⱼ of two unknowns (multiply by σ0² for covariance).</summary>
    /// <param name="i">Unknown index.</param>
    /// <param name="j">Unknown index.</param>
    public double Cofactor(int i, int j) =>
        _factor is null ? throw new InvalidOperationException("There are no unknowns.") : _factor.InverseEntry(i, j);
}
