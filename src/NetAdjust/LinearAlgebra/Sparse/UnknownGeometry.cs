namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Where the unknowns sit on the ground, for geometric nested dissection: each unknown belongs to one group
/// (the unknowns of one point, together with the orientations of the direction sets observed at it), and each
/// group has a plane position (m). Immutable. Groups without a position (NaN) make the geometric ordering
/// unavailable; the solver then orders by approximate minimum degree.
/// </summary>
public sealed class UnknownGeometry
{
    private readonly int[] _group;
    private readonly double[] _x, _y;

    /// <summary>Creates the description.</summary>
    /// <param name="groupOfUnknown">For each unknown, its group in [0, group count).</param>
    /// <param name="groupX">Easting (m) of each group; NaN when not known.</param>
    /// <param name="groupY">Northing (m) of each group; NaN when not known.</param>
    /// <exception cref="ArgumentException">When a group index is out of range or the position arrays differ in length.</exception>
    public UnknownGeometry(IReadOnlyList<int> groupOfUnknown, IReadOnlyList<double> groupX, IReadOnlyList<double> groupY)
    {
        if (groupX.Count != groupY.Count) throw new ArgumentException("the group position arrays differ in length");
        _group = groupOfUnknown.ToArray();
        _x = groupX.ToArray();
        _y = groupY.ToArray();
        foreach (int g in _group)
            if ((uint)g >= (uint)_x.Length) throw new ArgumentException($"group {g} is outside 0..{_x.Length - 1}");
        HasAllPositions = _x.All(double.IsFinite) && _y.All(double.IsFinite);
    }

    /// <summary>The number of unknowns described.</summary>
    public int UnknownCount => _group.Length;

    /// <summary>The number of groups.</summary>
    public int GroupCount => _x.Length;

    /// <summary>True when every group has a finite position.</summary>
    public bool HasAllPositions { get; }

    /// <summary>The group of an unknown.</summary>
    /// <param name="unknown">The unknown index.</param>
    public int GroupOf(int unknown) => _group[unknown];

    /// <summary>The position (m) of a group.</summary>
    /// <param name="group">The group index.</param>
    public (double X, double Y) PositionOf(int group) => (_x[group], _y[group]);
}

/// <summary>
/// A normal-equations solver that can use the geometry of the unknowns to order them (an optional refinement
/// of <see cref="INormalEquationsSolver"/>; callers without geometry use the plain interface).
/// </summary>
public interface IGeometryAwareSolver : INormalEquationsSolver
{
    /// <summary>Forms N = AᵀPA and factorises it, ordering with the help of the unknowns' positions.</summary>
    /// <param name="unknownCount">The number of unknowns.</param>
    /// <param name="rows">The rows of A.</param>
    /// <param name="weights">The weight matrix P.</param>
    /// <param name="geometry">Positions and grouping of the unknowns; null when not known.</param>
    /// <returns>The factor.</returns>
    /// <exception cref="SingularNormalMatrixException">When N is numerically singular.</exception>
    INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights, UnknownGeometry? geometry);
}
