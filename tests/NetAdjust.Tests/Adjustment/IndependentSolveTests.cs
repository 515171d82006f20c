using NetAdjust.Simulation;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// The normal-equation solution is checked against an independent solve of the same weighted linear system by
/// Householder QR (MathNet.Numerics), which never forms AᵀPA.
/// </summary>
public class IndependentSolveTests
{
    [Theory]
    [InlineData(1, false)]
    [InlineData(2, true)]
    [InlineData(3, true)]
    public void NormalEquationsAgreeWithQrOnTheSameLinearisedSystem(int seed, bool levelling)
    {
        var result = Adjuster.Adjust(GridNetworks.Horizontal(seed, 3, levelling: levelling));
        int n = result.DesignRows.Count, u = result.Unknowns.Count;
        // √P A x ≈ √P l, with a random right-hand side l (diagonal P).
        var rng = new Random(seed);
        var a = Matrix<double>.Build.Dense(n, u);
        var l = Vector<double>.Build.Dense(n);       // √P l
        var lRaw = new double[n];                     // l, in the observations' units
        for (int i = 0; i < n; i++)
        {
            double sw = Math.Sqrt(result.Weights.DiagonalEntry(i));
            var row = result.DesignRows[i];
            for (int k = 0; k < row.Columns.Length; k++) a[i, row.Columns[k]] = sw * row.Values[k];
            lRaw[i] = (rng.NextDouble() - 0.5) * 3 / sw; // misclosures of a few σ
            l[i] = sw * lRaw[i];
        }
        var xQr = a.QR().Solve(l);

        var factor = new DenseNormalEquationsSolver().Factorize(u, result.DesignRows, result.Weights);
        var rhs = new double[u];
        for (int i = 0; i < n; i++)
        {
            double pl = result.Weights.DiagonalEntry(i) * lRaw[i]; // (P l)ᵢ
            var row = result.DesignRows[i];
            for (int k = 0; k < row.Columns.Length; k++) rhs[row.Columns[k]] += row.Values[k] * pl;
        }
        var xNe = factor.Solve(rhs);
        double scale = xQr.AbsoluteMaximum();
        for (int j = 0; j < u; j++)
            Assert.True(Math.Abs(xNe[j] - xQr[j]) <= 1e-9 * scale, $"unknown {j}: {xNe[j]} vs {xQr[j]}");

        // Qxx = (R⁻¹)(R⁻¹)ᵀ from the QR factor, against the normal-equation inverse, entry by entry.
        var rInv = a.QR().R.SubMatrix(0, u, 0, u).Inverse();
        var q = rInv * rInv.Transpose();
        for (int i = 0; i < u; i++)
            for (int j = 0; j < u; j++)
                Assert.True(Math.Abs(factor.InverseEntry(i, j) - q[i, j]) <= 1e-9 * Math.Sqrt(q[i, i] * q[j, j]),
                    $"Qxx({i},{j})");
    }

    [Fact]
    public void AdjustedResidualsAreOrthogonalToTheColumnsOfPA()
    {
        // At the least-squares solution Aᵀ P v = 0 (normal equations); checked with the result's own A, P, v.
        var r = Adjuster.Adjust(GridNetworks.Horizontal(7, 3, levelling: true));
        var v = r.Observations.Select(o => o.Residual).ToArray();
        var pv = r.Weights.Multiply(v);
        var atpv = new double[r.Unknowns.Count];
        for (int i = 0; i < v.Length; i++)
            for (int k = 0; k < r.DesignRows[i].Columns.Length; k++)
                atpv[r.DesignRows[i].Columns[k]] += r.DesignRows[i].Values[k] * pv[i];
        double scale = r.DesignRows.Take(v.Length)
            .Select((row, i) => row.Values.ToArray().DefaultIfEmpty(0).Max(Math.Abs) * Math.Abs(pv[i])).Max();
        Assert.All(atpv, x => Assert.True(Math.Abs(x) < 1e-8 * scale, $"AᵀPv component {x}"));
    }

    [Fact]
    public void ResultDoesNotDependOnHowFarOffTheApproximateCoordinatesWere()
    {
        var near = Adjuster.Adjust(GridNetworks.Horizontal(11, 3, approxOffset: 0.01));
        var far = Adjuster.Adjust(GridNetworks.Horizontal(11, 3, approxOffset: 2.0));
        for (int i = 0; i < near.Points.Count; i++)
        {
            Assert.Equal(near.Points[i].E!.Value, far.Points[i].E!.Value, 7);
            Assert.Equal(near.Points[i].N!.Value, far.Points[i].N!.Value, 7);
        }
        Assert.Equal(near.Statistics.Vtpv, far.Statistics.Vtpv, 6);
    }
}
