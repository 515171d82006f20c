using NetAdjust.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>Which earth-centred component of a GNSS baseline an observation is.</summary>
public enum BaselineComponent
{
    /// <summary>ΔX: along the axis through the equator and the zero meridian.</summary>
    X,

    /// <summary>ΔY: along the axis through the equator and 90° east.</summary>
    Y,

    /// <summary>ΔZ: along the rotation axis, towards the north pole.</summary>
    Z,
}

/// <summary>
/// One component of a GNSS baseline: the earth-centred vector (ΔX, ΔY, ΔZ) = position(to) − position(from) in
/// metres, as processing software gives it, with its full 3×3 covariance. A baseline enters the network as three
/// observations, one per <see cref="Component"/>, that share <see cref="BaselineId"/>, the vector and the covariance;
/// the stochastic model joins them in one 3×3 weight block (docs/methods.md, "GNSS baselines"). The unknowns stay the
/// grid coordinates E, N and the height H: the equation goes grid → geodetic (the projection's inverse, h = H + N
/// with the geoid separation N of <see cref="Grid"/>) → geocentric. Build the three with
/// <see cref="Components"/>.
/// </summary>
/// <param name="From">The point the vector starts at.</param>
/// <param name="To">The point the vector ends at.</param>
/// <param name="Dx">ΔX = X(to) − X(from).</param>
/// <param name="Dy">ΔY = Y(to) − Y(from).</param>
/// <param name="Dz">ΔZ = Z(to) − Z(from).</param>
public sealed record BaselineObservation(string From, string To, Length Dx, Length Dy, Length Dz) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Baseline;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));

    /// <summary>ΔX = X(to) − X(from).</summary>
    public Length Dx { get; init => field = Guards.FiniteLength(value, nameof(Dx), "a baseline component"); } =
        Guards.FiniteLength(Dx, nameof(Dx), "a baseline component");

    /// <summary>ΔY = Y(to) − Y(from).</summary>
    public Length Dy { get; init => field = Guards.FiniteLength(value, nameof(Dy), "a baseline component"); } =
        Guards.FiniteLength(Dy, nameof(Dy), "a baseline component");

    /// <summary>ΔZ = Z(to) − Z(from).</summary>
    public Length Dz { get; init => field = Guards.FiniteLength(value, nameof(Dz), "a baseline component"); } =
        Guards.FiniteLength(Dz, nameof(Dz), "a baseline component");

    /// <summary>The component this observation is (ΔX by default).</summary>
    public BaselineComponent Component { get; init; }

    /// <inheritdoc />
    public override double Value => Component switch
    {
        BaselineComponent.X => Dx.Metres,
        BaselineComponent.Y => Dy.Metres,
        _ => Dz.Metres,
    };

    /// <summary>The id that joins the three components of one baseline (unique in the network); null for a
    /// component that stands alone (weighted by its own standard deviation, uncorrelated).</summary>
    public string? BaselineId { get; init; }

    /// <summary>
    /// The covariance of (ΔX, ΔY, ΔZ) as adjusted, m², 3×3 row-major (the group scale factor applied), symmetric
    /// positive definite; null for none. The weight block takes its correlations and each component's current
    /// standard deviation, so a procedure that re-weights a component keeps the correlations.
    /// </summary>
    /// <exception cref="ArgumentException">On init, when the matrix has not 9 finite entries, is not symmetric or
    /// not positive definite.</exception>
    public IReadOnlyList<double>? Covariance
    {
        get;
        init => field = value is null ? null : CheckedCovariance(value, nameof(Covariance));
    }

    /// <summary>The grid system the baseline is modelled through: its projection (required to evaluate the
    /// equation) and the geoid separations that make ellipsoidal heights h = H + N.</summary>
    public GridSystem? Grid { get; init; }

    /// <summary>The group of baselines (e.g. a session or a receiver pair) that shares a scale factor of the
    /// covariance and a variance component; null for none.</summary>
    public string? Group { get; init; }

    /// <summary>The variance factor the covariance was scaled by for the group (positive, 1 by default; for
    /// reports: <see cref="Covariance"/> already includes it).</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when not positive and finite.</exception>
    public double GroupScale
    {
        get;
        init => field = value > 0 && double.IsFinite(value) ? value
            : throw new ArgumentOutOfRangeException(nameof(GroupScale), value, "a scale factor must be positive.");
    } = 1.0;

    /// <summary>The frame parameters (rotations, scale) between the GNSS frame and the local control that the
    /// baseline's equation includes; null for none (the default).</summary>
    public BaselineFrame? Frame { get; init; }

    /// <summary>The vector (ΔX, ΔY, ΔZ) in metres.</summary>
    public (double X, double Y, double Z) Vector => (Dx.Metres, Dy.Metres, Dz.Metres);

    /// <summary>
    /// The three component observations of one baseline: ΔX, ΔY, ΔZ with their standard deviations √Σᵢᵢ, joined by
    /// <paramref name="baselineId"/> and <paramref name="covariance"/>.
    /// </summary>
    /// <param name="baselineId">The id that joins them (unique in the network).</param>
    /// <param name="from">The start point.</param>
    /// <param name="to">The end point.</param>
    /// <param name="vector">(ΔX, ΔY, ΔZ).</param>
    /// <param name="covariance">3×3 row-major covariance in m² (group scale applied).</param>
    /// <param name="grid">The grid system with its projection.</param>
    /// <exception cref="ArgumentException">When an argument is invalid (see the properties).</exception>
    public static IReadOnlyList<BaselineObservation> Components(string baselineId, string from, string to,
        (Length X, Length Y, Length Z) vector, IReadOnlyList<double> covariance, GridSystem grid)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(baselineId);
        ArgumentNullException.ThrowIfNull(grid);
        return Made(baselineId, from, to, vector, CheckedCovariance(covariance, nameof(covariance)), grid, null, null);
    }

    /// <summary>The three components as <see cref="Components"/> makes them, with a grid system that may be missing
    /// yet (a reader sets it once the project's grid is read), a source and a group: each made once, the covariance
    /// checked once and shared by the three.</summary>
    internal static BaselineObservation[] Made(string baselineId, string from, string to,
        (Length X, Length Y, Length Z) vector, IReadOnlyList<double> covariance, GridSystem? grid, string? source,
        string? group)
    {
        var x = new BaselineObservation(from, to, vector.X, vector.Y, vector.Z)
        {
            // the covariance checked before its first entry is read
            BaselineId = baselineId, Covariance = covariance, Grid = grid, Source = source, Group = group,
            Component = BaselineComponent.X, StandardDeviation = Math.Sqrt(covariance[0]),
        };
        var cov = x.Covariance!;
        return
        [
            x,
            x with { Component = BaselineComponent.Y, StandardDeviation = Math.Sqrt(cov[4]) },
            x with { Component = BaselineComponent.Z, StandardDeviation = Math.Sqrt(cov[8]) },
        ];
    }

    /// <summary>The covariance of (ΔX, ΔY, ΔZ) from standard deviations and correlations.</summary>
    /// <param name="sd">σ of ΔX, ΔY, ΔZ (positive).</param>
    /// <param name="rxy">Correlation of ΔX and ΔY, in (−1, 1).</param>
    /// <param name="rxz">Correlation of ΔX and ΔZ, in (−1, 1).</param>
    /// <param name="ryz">Correlation of ΔY and ΔZ, in (−1, 1).</param>
    /// <returns>3×3 row-major, m².</returns>
    public static double[] CovarianceOf((Length X, Length Y, Length Z) sd, double rxy, double rxz, double ryz)
    {
        double sx = sd.X.Metres, sy = sd.Y.Metres, sz = sd.Z.Metres;
        return
        [
            sx * sx, rxy * sx * sy, rxz * sx * sz,
            rxy * sx * sy, sy * sy, ryz * sy * sz,
            rxz * sx * sz, ryz * sy * sz, sz * sz,
        ];
    }

    /// <summary>Why a 3×3 covariance cannot be used (not finite, not symmetric, not positive definite), or null.
    /// </summary>
    /// <param name="covariance">3×3 row-major.</param>
    public static string? CovarianceProblem(IReadOnlyList<double> covariance)
    {
        ArgumentNullException.ThrowIfNull(covariance);
        if (covariance.Count != 9) return "a baseline covariance has 9 entries (3×3)";
        if (covariance.Any(v => !double.IsFinite(v))) return "the covariance has an entry that is not a finite number";
        for (int i = 0; i < 3; i++)
            for (int j = 0; j < i; j++)
            {
                double a = covariance[(i * 3) + j], b = covariance[(j * 3) + i];
                if (Math.Abs(a - b) > 1e-12 * Math.Max(Math.Abs(a), Math.Abs(b)))
                    return "the covariance is not symmetric";
            }
        // Sylvester's criterion: the leading minors are positive.
        double c00 = covariance[0], c01 = covariance[1], c02 = covariance[2], c11 = covariance[4],
            c12 = covariance[5], c22 = covariance[8];
        double m2 = (c00 * c11) - (c01 * c01);
        double m3 = (c00 * ((c11 * c22) - (c12 * c12))) - (c01 * ((c01 * c22) - (c12 * c02)))
            + (c02 * ((c01 * c12) - (c11 * c02)));
        double scale = c00 * c11 * c22;
        return c00 > 0 && m2 > 1e-12 * c00 * c11 && m3 > 1e-12 * scale ? null
            : "the covariance is not positive definite (a variance is not positive, or the correlations contradict " +
              "each other)";
    }

    private static IReadOnlyList<double> CheckedCovariance(IReadOnlyList<double> covariance, string name)
    {
        ArgumentNullException.ThrowIfNull(covariance, name);
        return CovarianceProblem(covariance) is string problem ? throw new ArgumentException(problem, name)
            : ReadOnlyCopies.List(covariance);
    }
}
