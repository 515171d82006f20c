using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Network;

namespace NetAdjust.Statistics;

/// <summary>
/// The test of one GNSS baseline as a vector, and its residuals in the local frame (docs/methods.md, "Tests of
/// baselines"). Lengths in metres.
/// </summary>
/// <param name="BaselineId">The baseline's id.</param>
/// <param name="From">The start point.</param>
/// <param name="To">The end point.</param>
/// <param name="Rows">The indices of its component observations in the result (ΔX, ΔY, ΔZ order as given).</param>
/// <param name="Residual">v = adjusted − observed of (ΔX, ΔY, ΔZ).</param>
/// <param name="LocalResidual">The residual vector in the local frame at the baseline's mid point: north, east, up
/// (R · v).</param>
/// <param name="Statistic">T = ŵᵀ (Cᵀ P Qvv P C)⁻¹ ŵ / σ0² with ŵ = Cᵀ P v, C selecting its weighted rows; null when
/// the baseline is set aside or not controlled.</param>
/// <param name="Dimension">The number of weighted components tested (3, fewer when some are set aside).</param>
/// <param name="CriticalValue">χ²(1 − α; <see cref="Dimension"/>), with α the w-test's significance level; null when
/// not tested.</param>
/// <param name="Passed">True when T ≤ the critical value; null when not tested.</param>
/// <param name="LocalW">The w-test of a bias along local north, east and up: w = cᵀ P v / (σ0 √(cᵀ P Qvv P c)) with
/// c the unit direction in (ΔX, ΔY, ΔZ); null when not tested.</param>
/// <param name="LocalMdb">The minimal detectable bias along local north, east and up, δ0 σ0 / √(cᵀ P Qvv P c)
/// (metres); null when not tested.</param>
public sealed record BaselineTest(string BaselineId, string From, string To, IReadOnlyList<int> Rows,
    (double X, double Y, double Z) Residual, (double North, double East, double Up) LocalResidual, double? Statistic,
    int Dimension, double? CriticalValue, bool? Passed, (double North, double East, double Up)? LocalW,
    (double North, double East, double Up)? LocalMdb)
{
    /// <summary>The indices of its component observations in the result.</summary>
    public IReadOnlyList<int> Rows { get; init => field = ReadOnlyCopies.List(value); } = ReadOnlyCopies.List(Rows);
}

/// <summary>
/// The three-dimensional test of each GNSS baseline of a result (Teunissen, <i>Testing Theory</i>, Delft 2000; Baarda
/// 1968): with C selecting the baseline's rows, ŵ = Cᵀ P v and T = ŵᵀ (Cᵀ P Qvv P C)⁻¹ ŵ / σ0² is χ²(3) under the
/// null hypothesis (σ0² known); the one-dimensional case is the square of the w-test. The components' w, redundancy
/// numbers, MDB and external reliability are the rows of <see cref="NetworkAnalysis.Observations"/>, computed with the
/// full weight blocks. Residuals in the local frame use the rotation R at the mid point of the adjusted ends
/// (rows east, north, up; reported as north, east, up).
/// </summary>
public static class BaselineAnalysis
{
    /// <summary>Tests every baseline (components joined by <see cref="BaselineObservation.BaselineId"/> and a
    /// covariance) of the result.</summary>
    /// <param name="result">The adjustment result.</param>
    /// <param name="analysis">Its analysis (for the significance level); null for <c>result.Analysis</c> defaults.
    /// </param>
    /// <returns>One test per baseline, in input order; empty when there are none.</returns>
    public static IReadOnlyList<BaselineTest> Analyse(AdjustmentResult result, NetworkAnalysis? analysis = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        double alpha = (analysis?.Options ?? AnalysisOptions.Default).WTestAlpha;
        double s0sq = result.Statistics.AprioriVarianceFactor;
        var groups = Stochastic.BaselineBlocks.Groups(result.Network);
        double delta0 = analysis?.Delta0 ?? CriticalValues.NonCentrality(alpha, AnalysisOptions.Default.TypeIIError);
        // Each baseline is tested alone, into its own slot; on a large network the second half on another core (the
        // same numbers whatever the schedule).
        var tests = new BaselineTest[groups.Count];
        void Range(int from, int to)
        {
            for (int g = from; g < to; g++) tests[g] = Test(result, groups[g], alpha, s0sq, delta0);
        }
        int half = SideBySide.Half(groups.Count, SideBySideBaselines);
        SideBySide.Run(() => Range(0, half), half < groups.Count ? () => Range(half, groups.Count) : null);
        return tests;
    }

    /// <summary>Baselines from which the tests run on two cores.</summary>
    private const int SideBySideBaselines = 2048;

    /// <summary>The test of the baseline whose component observations are <paramref name="rows"/>.</summary>
    private static BaselineTest Test(AdjustmentResult result, IReadOnlyList<int> rows, double alpha, double s0sq,
        double delta0)
    {
        var first = (BaselineObservation)result.Network.Observations[rows[0]];
        var v = new double[3];
        foreach (int r in rows)
            v[(int)((BaselineObservation)result.Network.Observations[r]).Component] =
                result.Observations[r].Residual;
        var rotation = Rotation(result, first);
        double Row(int i) => rotation is null ? double.NaN
            : (rotation[i * 3] * v[0]) + (rotation[(i * 3) + 1] * v[1]) + (rotation[(i * 3) + 2] * v[2]);
        var block = Block(result, rows);
        double? t = null, crit = null;
        (double, double, double)? localW = null, localMdb = null;
        int dim = block?.Kept.Length ?? 0;
        if (block is { } bk && Statistic(bk) is double tv)
        {
            t = tv / s0sq;
            crit = ChiSquared.InvCDF(dim, 1 - alpha);
            if (rotation is not null)
            {
                var n = Directional(bk, rotation[3..6], s0sq, delta0);
                var e = Directional(bk, rotation[0..3], s0sq, delta0);
                var u = Directional(bk, rotation[6..9], s0sq, delta0);
                if (n is not null && e is not null && u is not null)
                {
                    localW = (n.Value.W, e.Value.W, u.Value.W);
                    localMdb = (n.Value.Mdb, e.Value.Mdb, u.Value.Mdb);
                }
            }
        }
        return new BaselineTest(first.BaselineId!, first.From, first.To, rows, (v[0], v[1], v[2]),
            (Row(1), Row(0), Row(2)), t, dim, crit, t is double tt ? tt <= crit!.Value : null, localW, localMdb);
    }

    /// <summary>The weighted rows of a baseline's block: P, Qvv = P⁻¹ − A Qxx Aᵀ on them, v, and the component
    /// (0, 1, 2) of each; null when no row carries weight or the result has no unknowns.</summary>
    private sealed record BlockMatrices(int[] Kept, int[] Components, Matrix<double> P, Matrix<double> Qvv,
        Vector<double> V);

    private static BlockMatrices? Block(AdjustmentResult result, IReadOnlyList<int> rows)
    {
        var (blk, _) = result.Weights.BlockOf(rows[0]);
        var kept = Enumerable.Range(0, blk.Size).Where(a => Enumerable.Range(0, blk.Size).Any(b => blk[a, b] != 0))
            .ToArray();
        int k = kept.Length;
        if (k == 0 || !result.HasFactor) return null;
        var p = Matrix<double>.Build.Dense(k, k, (a, b) => blk[kept[a], kept[b]]);
        var qvv = p.Inverse();
        var design = result.DesignRows;
        for (int a = 0; a < k; a++)
            for (int b = 0; b < k; b++)
            {
                var ra = design[blk.Rows[kept[a]]];
                var rb = design[blk.Rows[kept[b]]];
                double s = 0;
                for (int x = 0; x < ra.Columns.Length; x++)
                    for (int y = 0; y < rb.Columns.Length; y++)
                        s += ra.Values[x] * rb.Values[y] * result.Cofactor(ra.Columns[x], rb.Columns[y]);
                qvv[a, b] -= s; // Qvv = P⁻¹ − A Qxx Aᵀ on the block
            }
        var v = Vector<double>.Build.Dense(k, a => result.Observations[blk.Rows[kept[a]]].Residual);
        var comps = kept.Select(a => (int)((BaselineObservation)result.Network.Observations[blk.Rows[a]]).Component)
            .ToArray();
        return new BlockMatrices(kept, comps, p, qvv, v);
    }

    /// <summary>σ0² T = ŵᵀ (P Qvv P)⁻¹ ŵ with ŵ = P v, on the range of P Qvv P (a direction without redundancy
    /// carries no test); null when nothing is controlled.</summary>
    private static double? Statistic(BlockMatrices b)
    {
        var w = b.P * b.V;
        var m = b.P * b.Qvv * b.P;
        var evd = m.Evd(Symmetricity.Symmetric);
        double largest = evd.EigenValues.Max(z => z.Real);
        if (!(largest > 0)) return null;
        double t = 0;
        for (int i = 0; i < b.Kept.Length; i++)
        {
            double lambda = evd.EigenValues[i].Real;
            if (lambda <= 1e-10 * largest) continue;
            double proj = evd.EigenVectors.Column(i) * w;
            t += proj * proj / lambda;
        }
        return t;
    }

    /// <summary>The w-test and MDB of a bias along the unit direction d (in ΔX, ΔY, ΔZ).</summary>
    private static (double W, double Mdb)? Directional(BlockMatrices b, double[] d, double s0sq, double delta0)
    {
        var c = Vector<double>.Build.Dense(b.Kept.Length, a => d[b.Components[a]]);
        var pc = b.P * c;
        double q = pc * (b.Qvv * pc); // cᵀ P Qvv P c
        if (!(q > 1e-12 * (pc * pc) * b.Qvv.Diagonal().AbsoluteMaximum())) return null;
        double s0 = Math.Sqrt(s0sq);
        return (pc * b.V / (s0 * Math.Sqrt(q)), delta0 * s0 / Math.Sqrt(q));
    }

    /// <summary>R (rows east, north, up in the earth-centred frame) at the mid point of the baseline's adjusted ends;
    /// null when they have no plane coordinates or the baseline no projection.</summary>
    private static double[]? Rotation(AdjustmentResult result, BaselineObservation b)
    {
        if (b.Grid?.Projection is not { } projection) return null;
        // the result's points are the network's, in its order: found by the network's index, not by a search
        var pa = result.Points[result.Network.IndexOf(b.From)];
        var pb = result.Points[result.Network.IndexOf(b.To)];
        if (pa.E is null || pa.N is null || pb.E is null || pb.N is null) return null;
        double ha = b.Grid.EllipsoidalHeight(b.From, pa.H) ?? 0, hb = b.Grid.EllipsoidalHeight(b.To, pb.H) ?? 0;
        var (lat1, lon1) = projection.Inverse(pa.E.Value, pa.N.Value);
        var (lat2, lon2) = projection.Inverse(pb.E.Value, pb.N.Value);
        var e = projection.Ellipsoid;
        var x1 = Geocentric.ToGeocentric(e, lat1, lon1, ha);
        var x2 = Geocentric.ToGeocentric(e, lat2, lon2, hb);
        var (lat, lon, _) = Geocentric.ToGeodetic(e, (x1.X + x2.X) / 2, (x1.Y + x2.Y) / 2, (x1.Z + x2.Z) / 2);
        return Geocentric.LocalRotation(lat, lon);
    }
}
