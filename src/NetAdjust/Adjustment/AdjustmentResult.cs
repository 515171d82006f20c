using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Adjustment;

/// <summary>
/// An adjusted point. Standard deviations use the a-priori variance factor (σ0² as given, normally 1);
/// the a-posteriori variance factor is reported beside them in <see cref="AdjustmentStatistics"/>. Made by the
/// adjustment only (the constructor is internal); coordinates and standard deviations are typed
/// (<see cref="Easting"/>, <see cref="SdEasting"/>, ...).
/// </summary>
public sealed record AdjustedPoint
{
    /// <summary>Made by the adjustment: coordinates and standard deviations in metres, covariance in m².</summary>
    internal AdjustedPoint(Point Input, double? E, double? N, double? H, double? SdE, double? SdN, double? SdH,
        double? CovEN)
    {
        this.Input = Input; this.E = E; this.N = N; this.H = H;
        this.SdE = SdE; this.SdN = SdN; this.SdH = SdH; this.CovEN = CovEN;
    }

    /// <summary>The point as given.</summary>
    public Point Input { get; internal init; }

    /// <summary>The point id.</summary>
    public string Id => Input.Id;

    /// <summary>Adjusted (or held) easting, m; null when the point takes no part in the plane adjustment and gave
    /// none.</summary>
    internal double? E { get; init; }

    /// <summary>Adjusted (or held) northing, m.</summary>
    internal double? N { get; init; }

    /// <summary>Adjusted (or held) height, m.</summary>
    internal double? H { get; init; }

    /// <summary>Standard deviation of the easting, m (0 when held; null when not adjusted).</summary>
    internal double? SdE { get; init; }

    /// <summary>Standard deviation of the northing, m.</summary>
    internal double? SdN { get; init; }

    /// <summary>Standard deviation of the height, m.</summary>
    internal double? SdH { get; init; }

    /// <summary>Covariance of easting and northing, m² (0 when held; null when not adjusted).</summary>
    public double? CovEN { get; internal init; }

    /// <summary>Adjusted (or held) easting; null when the point takes no part in the plane adjustment and gave
    /// none.</summary>
    public Length? Easting => Lengths.Of(E);

    /// <summary>Adjusted (or held) northing; null likewise.</summary>
    public Length? Northing => Lengths.Of(N);

    /// <summary>Adjusted (or held) height; null when the point has no height.</summary>
    public Length? Height => Lengths.Of(H);

    /// <summary>Standard deviation of the easting (zero when held; null when not adjusted).</summary>
    public Length? SdEasting => Lengths.Of(SdE);

    /// <summary>Standard deviation of the northing (zero when held; null when not adjusted).</summary>
    public Length? SdNorthing => Lengths.Of(SdN);

    /// <summary>Standard deviation of the height (zero when held; null when not adjusted).</summary>
    public Length? SdHeight => Lengths.Of(SdH);
}

/// <summary>
/// An observation after adjustment. Made by the adjustment only (the constructor is internal). The adjusted value,
/// residual and standard deviation are <see cref="Quantity"/> values: lengths for distances and height
/// differences, angles for directions, angles, azimuths and zenith angles.
/// </summary>
public sealed record AdjustedObservation
{
    /// <summary>Made by the adjustment: values in SI units (m or rad).</summary>
    internal AdjustedObservation(Observation Input, double Adjusted, double Residual, double SdAdjusted, int Index)
    {
        this.Input = Input; this.Adjusted = Adjusted; this.Residual = Residual; this.SdAdjusted = SdAdjusted;
        this.Index = Index;
    }

    /// <summary>The observation as given.</summary>
    public Observation Input { get; internal init; }

    /// <summary>The adjusted value, m or rad (for angular kinds in [0, 2π)).</summary>
    internal double Adjusted { get; init; }

    /// <summary>v = adjusted − observed, m or rad (reduced to (−π, π] for angles).</summary>
    internal double Residual { get; init; }

    /// <summary>Standard deviation of the adjusted value, √(a Qxx aᵀ) scaled by σ0, m or rad.</summary>
    internal double SdAdjusted { get; init; }

    /// <summary>Position in the network's observation list.</summary>
    public int Index { get; internal init; }

    /// <summary>The adjusted value (for angular kinds in [0°, 360°)).</summary>
    public Quantity AdjustedValue => Quantity.FromSi(Adjusted, IsAngle);

    /// <summary>The residual v = adjusted − observed (for angles reduced to (−180°, 180°]).</summary>
    public Quantity ResidualValue => Quantity.FromSi(Residual, IsAngle);

    /// <summary>The standard deviation of the adjusted value, √(a Qxx aᵀ) scaled by σ0.</summary>
    public Quantity SdAdjustedValue => Quantity.FromSi(SdAdjusted, IsAngle);

    private bool IsAngle => ObservationKinds.ValueIsAngle(Input.Kind);

    /// <summary>
    /// The error budget behind the observation's standard deviation (named contributions whose root-sum-square is
    /// it), at the adjusted coordinates; null when the standard deviation was given directly.
    /// </summary>
    public Stochastic.ErrorBudget? Budget { get; internal init; }
}

/// <summary>An adjusted orientation unknown of a direction set. Made by the adjustment only.</summary>
public sealed record AdjustedOrientation
{
    /// <summary>Made by the adjustment: orientation and standard deviation in radians.</summary>
    internal AdjustedOrientation(string SetId, string Station, double Orientation, double Sd)
    {
        this.SetId = SetId; this.Station = Station; this.Orientation = Orientation; this.Sd = Sd;
    }

    /// <summary>The set id.</summary>
    public string SetId { get; internal init; }

    /// <summary>The station of the set.</summary>
    public string Station { get; internal init; }

    /// <summary>The adjusted orientation (azimuth − circle reading), rad in [0, 2π).</summary>
    internal double Orientation { get; init; }

    /// <summary>Its standard deviation, rad.</summary>
    internal double Sd { get; init; }

    /// <summary>The adjusted orientation of the set: azimuth − circle reading, in [0°, 360°).</summary>
    public Angle OrientationAngle => Angle.FromRadians(Orientation);

    /// <summary>The standard deviation of <see cref="OrientationAngle"/>.</summary>
    public Angle SdAngle => Angle.FromRadians(Sd);
}

/// <summary>An estimated refraction coefficient of a group of zenith angles. Made by the adjustment only.</summary>
public sealed record AdjustedRefraction
{
    /// <summary>Made by the adjustment.</summary>
    internal AdjustedRefraction(string Group, double Coefficient, double Sd)
    {
        this.Group = Group; this.Coefficient = Coefficient; this.Sd = Sd;
    }

    /// <summary>The group's id.</summary>
    public string Group { get; internal init; }

    /// <summary>The adjusted k (dimensionless).</summary>
    public double Coefficient { get; internal init; }

    /// <summary>Its standard deviation (dimensionless; a-priori variance factor, as for points).</summary>
    public double Sd { get; internal init; }
}

/// <summary>Overall figures of an adjustment. Made by the adjustment only.</summary>
public sealed record AdjustmentStatistics
{
    /// <summary>Made by the adjustment.</summary>
    internal AdjustmentStatistics(int Observations, int Unknowns, int DegreesOfFreedom, double Vtpv,
        double AprioriVarianceFactor, int Iterations, GlobalTest GlobalTest)
    {
        this.Observations = Observations; this.Unknowns = Unknowns; this.DegreesOfFreedom = DegreesOfFreedom;
        this.Vtpv = Vtpv; this.AprioriVarianceFactor = AprioriVarianceFactor; this.Iterations = Iterations;
        this.GlobalTest = GlobalTest;
    }

    /// <summary>n: observations, including weighted-control components.</summary>
    public int Observations { get; internal init; }

    /// <summary>u: unknowns.</summary>
    public int Unknowns { get; internal init; }

    /// <summary>r = n − u.</summary>
    public int DegreesOfFreedom { get; internal init; }

    /// <summary>vᵀPv.</summary>
    public double Vtpv { get; internal init; }

    /// <summary>σ0² used for weights and point standard deviations.</summary>
    public double AprioriVarianceFactor { get; internal init; }

    /// <summary>Gauss-Newton iterations made.</summary>
    public int Iterations { get; internal init; }

    /// <summary>The χ² global test.</summary>
    public GlobalTest GlobalTest { get; internal init; }

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

    /// <summary>a Qxx aᵀ of each observation's design row, as the adjuster computed it for the observation's standard
    /// deviation (NaN for a set-aside observation; null without unknowns): the statistics reuse it.</summary>
    internal double[]? RowCofactors { get; init; }

    /// <summary>True when the adjustment has unknowns, so that <see cref="Cofactor"/> and <see cref="Solve"/> can be
    /// used.</summary>
    public bool HasFactor => _factor is not null;

    /// <summary>Solves N x = b with the factor of the normal matrix N at the solution, i.e. x = Qxx b.</summary>
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
            public double Cofactor(int i, int j) =>
        _factor is null ? throw new InvalidOperationException("There are no unknowns.") : _factor.InverseEntry(i, j);
}
