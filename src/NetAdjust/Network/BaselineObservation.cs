using System.Collections.Immutable;
using System.Diagnostics;
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
public sealed record BaselineObservation : Observation
{
    /// <summary>A component of the baseline (ΔX unless <see cref="Component"/> says otherwise).</summary>
    /// <param name="From">The point the vector starts at.</param>
    /// <param name="To">The point the vector ends at.</param>
    /// <param name="Dx">ΔX = X(to) − X(from).</param>
    /// <param name="Dy">ΔY = Y(to) − Y(from).</param>
    /// <param name="Dz">ΔZ = Z(to) − Z(from).</param>
    /// <exception cref="ArgumentException">When an id is empty or a component not finite.</exception>
    public BaselineObservation(string From, string To, Length Dx, Length Dy, Length Dz)
        : this(Guards.Id(From, nameof(From)), Guards.Id(To, nameof(To)), WholeOf(Dx, Dy, Dz))
    {
    }

    /// <summary>A component of checked ids and whole.</summary>
    private BaselineObservation(string from, string to, Whole whole)
    {
        this.From = from;
        this.To = to;
        _whole = whole;
    }

    /// <summary>The start and end points and the vector.</summary>
    /// <param name="From">The point the vector starts at.</param>
    /// <param name="To">The point the vector ends at.</param>
    /// <param name="Dx">ΔX.</param>
    /// <param name="Dy">ΔY.</param>
    /// <param name="Dz">ΔZ.</param>
    public void Deconstruct(out string From, out string To, out Length Dx, out Length Dy, out Length Dz) =>
        (From, To, Dx, Dy, Dz) = (this.From, this.To, this.Dx, this.Dy, this.Dz);

    /// <summary>
    /// What the three components of a baseline have in common, held once for the three (a baseline row of a large
    /// file makes one of these and three small component records instead of three records of all of it). A record:
    /// an observation's equality and hash code are as with these members as fields of its own; setting one member
    /// of a component makes that component a whole of its own, as a field of its own would.
    /// </summary>
    private sealed record Whole(Length Dx, Length Dy, Length Dz)
    {
        public string? Id { get; init; }
        public IReadOnlyList<double>? Covariance { get; init; }
        public GridSystem? Grid { get; init; }
        public string? Group { get; init; }
        public double GroupScale { get; init; } = 1.0;
        public BaselineFrame? Frame { get; init; }
    }

    private readonly Whole _whole;

    private static Length Checked(Length value, string parameter) =>
        Guards.FiniteLength(value, parameter, "a baseline component");

    /// <summary>A whole of the vector alone, its components checked.</summary>
    private static Whole WholeOf(Length dx, Length dy, Length dz) =>
        new(Checked(dx, nameof(Dx)), Checked(dy, nameof(Dy)), Checked(dz, nameof(Dz)));

    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Baseline;

    /// <inheritdoc />
    public override string From { get; }

    /// <inheritdoc />
    public override string To { get; }

    /// <summary>ΔX = X(to) − X(from).</summary>
    public Length Dx { get => _whole.Dx; init => _whole = _whole with { Dx = Checked(value, nameof(Dx)) }; }

    /// <summary>ΔY = Y(to) − Y(from).</summary>
    public Length Dy { get => _whole.Dy; init => _whole = _whole with { Dy = Checked(value, nameof(Dy)) }; }

    /// <summary>ΔZ = Z(to) − Z(from).</summary>
    public Length Dz { get => _whole.Dz; init => _whole = _whole with { Dz = Checked(value, nameof(Dz)) }; }

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
    public string? BaselineId { get => _whole.Id; init => _whole = _whole with { Id = value }; }

    /// <summary>
    /// The covariance of (ΔX, ΔY, ΔZ) as adjusted, m², 3×3 row-major (the group scale factor applied), symmetric
    /// positive definite; null for none. The weight block takes its correlations and each component's current
    /// standard deviation, so a procedure that re-weights a component keeps the correlations.
    /// </summary>
    /// <exception cref="ArgumentException">On init, when the matrix has not 9 finite entries, is not symmetric or
    /// not positive definite.</exception>
    public IReadOnlyList<double>? Covariance
    {
        get => _whole.Covariance;
        init => _whole = _whole with
        {
            Covariance = value is null ? null : CheckedCovariance(value, nameof(Covariance)),
        };
    }

    /// <summary>The grid system the baseline is modelled through: its projection (required to evaluate the
    /// equation) and the geoid separations that make ellipsoidal heights h = H + N.</summary>
    public GridSystem? Grid { get => _whole.Grid; init => _whole = _whole with { Grid = value }; }

    /// <summary>The group of baselines (e.g. a session or a receiver pair) that shares a scale factor of the
    /// covariance and a variance component; null for none.</summary>
    public string? Group { get => _whole.Group; init => _whole = _whole with { Group = value }; }

    /// <summary>The variance factor the covariance was scaled by for the group (positive, 1 by default; for
    /// reports: <see cref="Covariance"/> already includes it).</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when not positive and finite.</exception>
    public double GroupScale
    {
        get => _whole.GroupScale;
        init => _whole = _whole with
        {
            GroupScale = value > 0 && double.IsFinite(value) ? value
                : throw new ArgumentOutOfRangeException(nameof(GroupScale), value, "a scale factor must be positive."),
        };
    }

    /// <summary>The frame parameters (rotations, scale) between the GNSS frame and the local control that the
    /// baseline's equation includes; null for none (the default).</summary>
    public BaselineFrame? Frame { get => _whole.Frame; init => _whole = _whole with { Frame = value }; }

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
        return Made(baselineId, from, to, vector, CheckedCovariance(covariance, nameof(covariance)), grid, null, null,
            null);
    }

    /// <summary>The three components as <see cref="Components"/> makes them, with a grid system and frame that may
    /// be missing (a reader refuses a baseline without a projection once all are read), a source and a group: the
    /// three share one whole (vector, id, covariance, grid, group, frame), made once. The covariance must be
    /// checked already (<see cref="CovarianceProblem"/> null): it is kept as it is.</summary>
    internal static BaselineObservation[] Made(string baselineId, string from, string to,
        (Length X, Length Y, Length Z) vector, ImmutableArray<double> covariance, GridSystem? grid,
        BaselineFrame? frame, string? source, string? group)
    {
        Debug.Assert(CovarianceProblem(covariance) is null, "the covariance is checked by the caller");
        from = Guards.Id(from, nameof(From));
        to = Guards.Id(to, nameof(To));
        var whole = new Whole(Checked(vector.X, nameof(Dx)), Checked(vector.Y, nameof(Dy)),
            Checked(vector.Z, nameof(Dz)))
        {
            Id = baselineId, Covariance = covariance, Grid = grid, Group = group, Frame = frame,
        };
        var x = new BaselineObservation(from, to, whole)
        {
            Source = source, Component = BaselineComponent.X, StandardDeviation = Math.Sqrt(covariance[0]),
        };
        return
        [
            x,
            x with { Component = BaselineComponent.Y, StandardDeviation = Math.Sqrt(covariance[4]) },
            x with { Component = BaselineComponent.Z, StandardDeviation = Math.Sqrt(covariance[8]) },
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

    private static ImmutableArray<double> CheckedCovariance(IReadOnlyList<double> covariance, string name)
    {
        ArgumentNullException.ThrowIfNull(covariance, name);
        return CovarianceProblem(covariance) is string problem ? throw new ArgumentException(problem, name)
            : covariance is ImmutableArray<double> a ? a : [.. covariance];
    }
}
