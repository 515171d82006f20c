using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>
/// The S-transformation (Baarda 1973, <i>S-transformations and criterion matrices</i>, Netherlands Geodetic
/// Commission, Publications on Geodesy, New Series 5(1)): moves a solution and its cofactor matrix from one
/// datum to another without re-adjusting. With G (u×d) spanning the null space of the design matrix (A G = 0)
/// and the target datum given by d conditions Bᵀx = 0 (BᵀG regular), S = I − G (BᵀG)⁻¹ Bᵀ, x_B = S x and
/// Q_B = S Q Sᵀ, from any datum with the same null space (Koch 1999, §3.4; Caspary 1987, §2.5).
/// Dense: intended for analysis of small and medium networks (u up to a few thousand).
/// </summary>
public static class STransformation
{
    /// <summary>S = I − G (BᵀG)⁻¹ Bᵀ.</summary>
    /// <param name="nullSpace">G, u×d, the datum directions (translations, rotation, scale, height).</param>
    /// <param name="conditions">B, u×d, the conditions Bᵀx = 0 that define the target datum.</param>
    /// <exception cref="ArgumentException">When the shapes differ or BᵀG is singular (B does not fix the datum).</exception>
    public static Matrix<double> Operator(Matrix<double> nullSpace, Matrix<double> conditions)
    {
        if (nullSpace.RowCount != conditions.RowCount || nullSpace.ColumnCount != conditions.ColumnCount)
            throw new ArgumentException("G and B must have the same shape (unknowns × datum defect).");
        var btg = conditions.TransposeThisAndMultiply(nullSpace);
        if (btg.ConditionNumber() > 1e12) throw new ArgumentException("BᵀG is singular: the conditions do not fix the datum.");
        return Matrix<double>.Build.DenseIdentity(nullSpace.RowCount) - (nullSpace * btg.Inverse() * conditions.Transpose());
    }

    /// <summary>Q_B = S Q Sᵀ: a cofactor matrix moved to the datum Bᵀx = 0.</summary>
    /// <param name="cofactor">Q in any datum with null space G (u×u).</param>
    /// <param name="nullSpace">G (u×d).</param>
    /// <param name="conditions">B (u×d).</param>
    public static Matrix<double> TransformCofactor(Matrix<double> cofactor, Matrix<double> nullSpace, Matrix<double> conditions)
    {
        var s = Operator(nullSpace, conditions);
        return s * cofactor * s.Transpose();
    }

    /// <summary>
    /// The full cofactor matrix Qxx of a result (u×u; dense, for analysis of small networks). Needs a solver whose
    /// factor gives every entry of N⁻¹ (the dense solver does); a sparse factor may give only the entries on the
    /// pattern of N.
    /// </summary>
    /// <param name="result">The result.</param>
    public static Matrix<double> Cofactor(AdjustmentResult result)
    {
        int u = result.Unknowns.Count;
        return Matrix<double>.Build.Dense(u, u, (i, j) => result.Cofactor(i, j));
    }

    /// <summary>
    /// The datum directions G of a result's unknowns at its adjusted coordinates: easting and northing
    /// translation, rotation (when no azimuth is observed; orientation unknowns turn with the network), scale
    /// (when no distance is observed) and height translation (when there are heights). Rotation and scale are
    /// about the centroid, per unit of the root-mean-square distance from it.
    /// </summary>
    /// <param name="result">A result of any datum (usually minimal or inner constraints, where all points are unknowns).</param>
    public static Matrix<double> NullSpace(AdjustmentResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        var idx = result.Unknowns;
        var plane = result.Points.Where(p => idx.IndexOf(p.Id, Parameter.E) >= 0 || idx.IndexOf(p.Id, Parameter.N) >= 0)
            .Select(p => p.Id).ToList();
        bool height = idx.Unknowns.Any(x => x.Parameter == Parameter.H);
        var defects = DatumConditions.Defects(ObservationKindRegistry.FixedBy(result.Network.Observations), plane.Count > 0, height);
        var g = DatumConditions.NullSpace(idx.Unknowns, defects, At(result), plane);
        return Matrix<double>.Build.Dense(idx.Count, defects.Count, (i, k) => g[k][i]);
    }

    private static Func<string, PlanePoint> At(AdjustmentResult result)
    {
        var byId = result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        return id => new PlanePoint(byId[id].E!.Value, byId[id].N!.Value);
    }

    /// <summary>
    /// The conditions B = E G of the inner-constraint (minimum-trace) datum over a set of points: the rows of G for
    /// the coordinates of those points, zero elsewhere (orientation unknowns included).
    /// </summary>
    /// <param name="result">The result whose unknowns are used.</param>
    /// <param name="nullSpace">G from <see cref="NullSpace"/>.</param>
    /// <param name="points">The points; null for all.</param>
    public static Matrix<double> InnerConstraints(AdjustmentResult result, Matrix<double> nullSpace, IEnumerable<string>? points = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(nullSpace);
        var set = points is null ? null : new HashSet<string>(points, StringComparer.Ordinal);
        var g = Enumerable.Range(0, nullSpace.ColumnCount).Select(k => nullSpace.Column(k).ToArray()).ToArray();
        var b = DatumConditions.Inner(g, result.Unknowns.Unknowns, set);
        return Matrix<double>.Build.Dense(nullSpace.RowCount, nullSpace.ColumnCount, (i, k) => b[k][i]);
    }

    /// <summary>
    /// The conditions B of explicit minimal constraints: the easting and northing of <paramref name="holdPoint"/>,
    /// the azimuth (when the null space has a rotation) and distance (when it has a scale) from it to
    /// <paramref name="azimuthTo"/>, and the height of <paramref name="holdHeight"/>, linearised at the result's coordinates.
    /// The columns follow the order of <see cref="NullSpace"/>.
    /// </summary>
    /// <param name="result">The result whose unknowns and coordinates are used.</param>
    /// <param name="holdPoint">The point held in position.</param>
    /// <param name="azimuthTo">The second point (needed when there is a rotation or scale defect).</param>
    /// <param name="holdHeight">The point held in height (needed when there are heights).</param>
    public static Matrix<double> MinimalConstraints(AdjustmentResult result, string holdPoint, string? azimuthTo, string? holdHeight)
    {
        ArgumentNullException.ThrowIfNull(result);
        var idx = result.Unknowns;
        bool height = idx.Unknowns.Any(x => x.Parameter == Parameter.H);
        var defects = DatumConditions.Defects(ObservationKindRegistry.FixedBy(result.Network.Observations), plane: true, height);
        var at = At(result);
        var b = Matrix<double>.Build.Dense(idx.Count, defects.Count);
        for (int k = 0; k < defects.Count; k++)
            foreach (var (owner, par, value) in DatumConditions.MinimalGradient(defects[k], holdPoint, azimuthTo, holdHeight, at))
                b[idx.IndexOf(owner, par), k] += value;
        return b;
    }
}
