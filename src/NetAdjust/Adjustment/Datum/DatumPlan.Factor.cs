using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>The datum plan, factor: the normal equations factorised for the chosen datum.</summary>
internal sealed partial class DatumPlan
{
    /// <summary>
    /// Factorises the normal equations: directly when the control defines the datum, otherwise the reduced
    /// (minimal-constraint) system wrapped in a <see cref="DatumFactor"/> for the chosen datum.
    /// </summary>
    public INormalFactor Factorize(INormalEquationsSolver solver, IReadOnlyList<SparseRow> rows, WeightMatrix weights)
    {
        int u = Index.Count;
        if (ConditionCount == 0) return FactorizeOrExplain(solver, u, rows, weights, j => j);

        // The held unknowns enter as direct observations e_jᵀx (weight w_j of the order of N_jj): M = N + E W Eᵀ is
        // positive definite, has the pattern of N (diagonal entries only are added) and the same unknowns, so any
        // solver — including one that orders by the unknowns' positions — factorises it. For a consistent right-hand
        // side M⁻¹b is exactly the minimal-constraint solution (x_K = 0), and M⁻¹ = Q_m + H_K W⁻¹ H_Kᵀ with
        // H_K = G (E_KᵀG)⁻¹ (DatumFactor removes that term).
        int d = ConditionCount, m0 = rows.Count;
        var diag = new double[u];
        for (int i = 0; i < m0; i++)
        {
            double p = weights.DiagonalEntry(i);
            var r = rows[i];
            for (int k = 0; k < r.Columns.Length; k++) diag[r.Columns[k]] += p * r.Values[k] * r.Values[k];
        }
        var allRows = new List<SparseRow>(rows);
        var w = new double[d];
        for (int k = 0; k < d; k++)
        {
            int jk = _held[k];
            w[k] = diag[jk] > 0 && double.IsFinite(diag[jk]) ? diag[jk] : 1.0;
            allRows.Add(new SparseRow([jk], [1.0]));
        }
        // a diagonal P kept as one array stays one (the same weights as the blocks below)
        var allWeights = weights.WithDiagonalRows(w) ?? WeightMatrix.FromBlocks(m0 + d,
            weights.Blocks.Concat(Enumerable.Range(0, d).Select(k => new WeightBlock([m0 + k], [w[k]]))));
        var inner = FactorizeOrExplain(solver, u, allRows, allWeights, j => j);
        var (g, b) = Bases();
        var btg = new double[ConditionCount, ConditionCount];
        for (int k = 0; k < ConditionCount; k++)
            for (int l = 0; l < ConditionCount; l++)
                for (int j = 0; j < u; j++) btg[k, l] += b[k][j] * g[l][j];
        var m = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(btg);
        if (m.ConditionNumber() > 1e12)
            throw new DatumDefectException(
                "The datum is not defined: the points chosen for the inner constraints (" +
                    string.Join(", ", Definition.InnerPoints ?? []) +
                ") do not fix the position, orientation and scale of the network. Choose at least two points of the " +
                    "plane network " +
                "and one of the level network, or use all points.", ["inner-constraint points"]);
        // E_KᵀG: the rows of G at the held unknowns (regular by the choice of K).
        var gk = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(d, d, (k, l) => g[l][_held[k]]);
        return new DatumFactor(inner, g, b, m.Inverse().ToArray(), gk.Inverse().ToArray(), w);
    }

    private INormalFactor FactorizeOrExplain(INormalEquationsSolver solver, int size, IReadOnlyList<SparseRow> rows,
        WeightMatrix weights, Func<int, int> toFull)
    {
        try
        {
            return solver.Factorize(size, rows, weights);
        }
        catch (SingularNormalMatrixException e)
        {
            var what = Index.Unknowns[toFull(e.Column)];
            if (what.Parameter == Parameter.Refraction)
                throw new DatumDefectException(
                    $"The observations do not determine the {what.Describe()}: estimating k needs zenith angles " +
                    "of the group observed both ways between the same points (reciprocal), or zenith angles " +
                    "between points whose heights are known from elsewhere (held, or levelled). Observe " +
                    $"reciprocal zenith angles, or assume k for group {what.Owner} instead of estimating it.",
                    [what.Describe()]);
            if (FrameParameters.IsFrame(what.Parameter))
                throw new DatumDefectException(
                    $"The observations do not determine the {what.Describe()}: frame parameters need baselines " +
                    "between points whose coordinates are known from elsewhere (held or weighted control, or " +
                    "terrestrial observations). Hold more control, give the parameters standard deviations, or " +
                    "leave them out (gnss.frame_parameters: none).", [what.Describe()]);
            throw new DatumDefectException(
                $"The datum is not defined: the observations and control do not determine the {what.Describe()}. " +
                "The network holds its datum, but the geometry there is too weak: a point reached by a single " +
                    "distance or direction, " +
                "points on one straight line, or a direction set with a single target. " +
                "Hold or weight more control, or add observations that connect it to the rest of the network.",
                [what.Describe()]);
        }
    }
}
