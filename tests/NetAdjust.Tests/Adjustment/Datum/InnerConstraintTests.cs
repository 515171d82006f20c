using NetAdjust.Simulation;
using FsCheck.Xunit;
using FsCheck;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Adjustment.Datum;

/// <summary>
/// Minimal constraints, inner constraints and the S-transformation, checked against MathNet.Numerics as an
/// independent oracle: the bordered normal matrix [N B; Bᵀ 0]⁻¹, whose upper-left block is the cofactor matrix in
/// the datum Bᵀx = 0, and the Moore-Penrose pseudo-inverse N⁺ (SVD), which is the inner-constraint cofactor matrix
/// when B spans the null space of N (Koch 1999, <i>Parameter Estimation and Hypothesis Testing in Linear Models</i>,
/// §3.4; Baarda 1973, <i>S-transformations and criterion matrices</i>; section and title from memory).
/// </summary>
public class InnerConstraintTests
{
    // The dense solver gives every entry of Qxx, which the oracles below compare in full.
    private static readonly AdjustmentOptions Tight = AdjustmentOptions.Default with
    {
        LengthTolerance = 1e-10, AngleTolerance = 1e-12, MaxIterations = 50, Solver = new NetAdjust.LinearAlgebra.DenseNormalEquationsSolver(),
    };

    private static Matrix<double> Normal(AdjustmentResult r)
    {
        int u = r.Unknowns.Count;
        var a = Matrix<double>.Build.Dense(r.DesignRows.Count, u);
        var p = Matrix<double>.Build.Dense(r.DesignRows.Count, r.DesignRows.Count);
        for (int i = 0; i < r.DesignRows.Count; i++)
        {
            var row = r.DesignRows[i];
            for (int k = 0; k < row.Columns.Length; k++) a[i, row.Columns[k]] = row.Values[k];
            p[i, i] = r.Weights.DiagonalEntry(i);
        }
        return a.Transpose() * p * a;
    }

    /// <summary>Upper-left u×u block of [N B; Bᵀ 0]⁻¹.</summary>
    private static Matrix<double> Bordered(Matrix<double> n, Matrix<double> b)
    {
        int u = n.RowCount, d = b.ColumnCount;
        var m = Matrix<double>.Build.Dense(u + d, u + d);
        m.SetSubMatrix(0, 0, n);
        m.SetSubMatrix(0, u, b);
        m.SetSubMatrix(u, 0, b.Transpose());
        return m.Inverse().SubMatrix(0, u, 0, u);
    }

    private static void AssertCofactorsEqual(Matrix<double> expected, Func<int, int, double> actual, double rel, string what)
    {
        // Entries are compared relative to √(Qii Qjj); held unknowns (Qii = 0) against a floor of 1e−6 of the largest variance (rounding of the oracle is ~1e−16 of it).
        double floor = 1e-6 * expected.Diagonal().AbsoluteMaximum();
        for (int i = 0; i < expected.RowCount; i++)
            for (int j = 0; j < expected.ColumnCount; j++)
            {
                double scale = Math.Sqrt(Math.Max(Math.Abs(expected[i, i]), floor) * Math.Max(Math.Abs(expected[j, j]), floor));
                Assert.True(Math.Abs(expected[i, j] - actual(i, j)) <= rel * scale, $"{what} ({i},{j}): {expected[i, j]} vs {actual(i, j)}");
            }
    }

    /// <summary>
    /// The null space of N from MathNet's SVD (the right singular vectors whose singular values are negligible),
    /// independent of the library's datum code. Its dimension must be the expected datum defect.
    /// </summary>
    private static Matrix<double> SvdNullSpace(Matrix<double> n, int expectedDefect)
    {
        var svd = n.Svd(computeVectors: true);
        var s = svd.S;
        int rank = s.Count(x => x > 1e-10 * s[0]);
        Assert.Equal(n.RowCount - expectedDefect, rank);
        Assert.True(s[rank - 1] > 1e3 * s[rank], $"no clear gap in the singular values: {s[rank - 1]} and {s[rank]}");
        return svd.VT.Transpose().SubMatrix(0, n.RowCount, rank, n.RowCount - rank);
    }

    /// <summary>
    /// Inner constraints over the coordinates of all points (or of a subset): the rows of the null space for those
    /// coordinates, zero for the orientation unknowns and other points (the definition in docs/methods.md, Datum).
    /// </summary>
    private static Matrix<double> InnerConditions(AdjustmentResult r, Matrix<double> nullSpace,
        IReadOnlyCollection<string>? subset = null)
    {
        var b = nullSpace.Clone();
        for (int i = 0; i < r.Unknowns.Count; i++)
        {
            var x = r.Unknowns.Unknowns[i];
            bool outside = subset is not null && !subset.Contains(x.Owner);
            if (x.Parameter == NetAdjust.Geometry.Parameter.Orientation || outside) b.ClearRow(i);
        }
        return b;
    }

    private static SurveyNetwork Net(int seed, bool levelling, bool azimuth = false, Dictionary<int, Fixity>? control = null) =>
        GridNetworks.Grid(seed, 3, control ?? new Dictionary<int, Fixity> { [0] = levelling ? Fixity.ENH : Fixity.EN, [8] = Fixity.E },
            approx: 0.05, levelling: levelling, azimuth: azimuth).Network;

    [Property(MaxTest = 10)]
    public void DatumInvariantQuantitiesAreTheSameInEveryMinimalDatum(PositiveInt seed)
    {
        // Three ways to fix the same datum defect: held coordinates (point 0 in E, N, H and point 8 in E: plain
        // solve, no S-transformation), explicit minimal constraints (position + azimuth, held as conditions) and
        // inner constraints. Residuals, vᵀPv, standard deviations of adjusted observations, redundancy numbers and
        // w-values do not depend on the datum (Koch 1999, §3.4, from memory; common practice in free-network
        // adjustment).
        bool lev = seed.Get % 2 == 0;
        var net = Net(seed.Get, lev);
        var held = Adjuster.Adjust(net, Tight);
        var minimal = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Minimal("Q00", "Q22") });
        var free = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Free() });
        foreach (var other in new[] { minimal, free })
        {
            Assert.Equal(held.Statistics.DegreesOfFreedom, other.Statistics.DegreesOfFreedom);
            Assert.True(Math.Abs(held.Statistics.Vtpv - other.Statistics.Vtpv) <= 1e-9 * held.Statistics.Vtpv, $"vtpv {held.Statistics.Vtpv} vs {other.Statistics.Vtpv}");
            for (int i = 0; i < held.Observations.Count; i++)
            {
                var a = held.Observations[i];
                var b = other.Observations[i];
                Assert.True(Math.Abs(a.Residual - b.Residual) <= 1e-9, $"residual {i}: {a.Residual} vs {b.Residual}");
                Assert.True(Math.Abs(a.SdAdjusted - b.SdAdjusted) <= 1e-9 * a.Input.StandardDeviation, $"sd {i}: {a.SdAdjusted} vs {b.SdAdjusted}");
                // Redundancy numbers rᵢ = (Qvv P)ᵢᵢ and w-values (Baarda 1968) depend on A Qxx Aᵀ only: datum invariant.
                var ta = held.Analysis.Observations[i];
                var tb = other.Analysis.Observations[i];
                Assert.True(Math.Abs(ta.Redundancy - tb.Redundancy) <= 1e-9, $"r {i}: {ta.Redundancy} vs {tb.Redundancy}");
                // w is v/σ: the iterations stop at 1e−10 m, i.e. ~1e−8 σ for these distances, so w agrees to 1e−6 (not 1e−9).
                if (ta.W is double wa) Assert.True(Math.Abs(wa - tb.W!.Value) <= 1e-6, $"w {i}: {wa} vs {tb.W}");
            }
            Assert.Equal(held.Analysis.RedundancySum, other.Analysis.RedundancySum, 9);
        }
    }

    [Theory]
    [InlineData(21, false)]
    [InlineData(22, true)]
    public void InnerConstraintCofactorsEqualTheBorderedNormalMatrixOracle(int seed, bool levelling)
    {
        // The oracle's conditions come from the null space of N by MathNet's SVD (translations and rotation, plus the
        // height translation with levelling), not from the library's own datum directions.
        var r = Adjuster.Adjust(Net(seed, levelling), Tight with { Datum = DatumDefinition.Free() });
        var n = Normal(r);
        var b = InnerConditions(r, SvdNullSpace(n, levelling ? 4 : 3));
        AssertCofactorsEqual(Bordered(n, b), r.Cofactor, 1e-9, "Q inner");
    }

    [Fact]
    public void WithAnObservedAzimuthTheInnerConstraintCofactorIsThePseudoInverse()
    {
        // Null space = translations only, the same rows as B: Q = N⁺ (Koch 1999, §3.4, section from memory).
        // N⁺ by MathNet's SVD.
        var r = Adjuster.Adjust(Net(23, levelling: true, azimuth: true), Tight with { Datum = DatumDefinition.Free() });
        Assert.Equal(3, r.Statistics.DegreesOfFreedom - (r.Statistics.Observations - r.Statistics.Unknowns));
        AssertCofactorsEqual(Normal(r).PseudoInverse(), r.Cofactor, 1e-8, "N+");
    }

    [Fact]
    public void SubsetInnerConstraintsMinimiseTheTraceOverTheSubset()
    {
        var net = Net(24, levelling: false);
        string[] subset = ["Q00", "Q02", "Q20", "Q22"];
        var sub = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Free(subset) });
        var all = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Free() });
        var n = Normal(sub);
        var b = InnerConditions(sub, SvdNullSpace(n, 3), subset); // oracle conditions from MathNet's SVD of N
        var q = STransformation.Cofactor(sub);
        // Bᵀ Q_B = 0: the datum conditions hold for the covariance.
        Assert.True((b.Transpose() * q).FrobeniusNorm() <= 1e-9 * q.FrobeniusNorm());
        AssertCofactorsEqual(Bordered(n, b), sub.Cofactor, 1e-9, "Q subset");
        double Trace(AdjustmentResult r) => r.Unknowns.Unknowns.Select((x, i) => subset.Contains(x.Owner) ? r.Cofactor(i, i) : 0).Sum();
        double min = Trace(sub);
        Assert.True(min < Trace(all), $"{min} vs all-points datum {Trace(all)}");
        var minimal = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Minimal("Q00", "Q22") });
        Assert.True(min < Trace(minimal), $"{min} vs minimal datum {Trace(minimal)}");
    }

    [Theory]
    [InlineData(31, false)]
    [InlineData(32, true)]
    public void STransformOfTheFreeCovarianceEqualsTheCovarianceComputedInThePointAndAzimuthDatum(int seed, bool levelling)
    {
        var net = Net(seed, levelling);
        var free = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Free() });
        var g = STransformation.NullSpace(free);
        var b = STransformation.MinimalConstraints(free, "Q00", "Q22", levelling ? "Q00" : null);
        var moved = STransformation.TransformCofactor(STransformation.Cofactor(free), g, b);
        // Oracle: the bordered normal matrix in the one-point-one-azimuth datum, at the same linearisation.
        var direct = Bordered(Normal(free), b);
        AssertCofactorsEqual(direct, (i, j) => moved[i, j], 1e-9, "S-transformed");

        // And the adjuster's own minimal-constraint solution, against the oracle at its own linearisation.
        var minimal = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Minimal("Q00", "Q22", levelling ? "Q00" : null) });
        var bm = STransformation.MinimalConstraints(minimal, "Q00", "Q22", levelling ? "Q00" : null);
        AssertCofactorsEqual(Bordered(Normal(minimal), bm), minimal.Cofactor, 1e-9, "Q minimal");
        // The held point has no variance in that datum.
        int e0 = minimal.Unknowns.IndexOf("Q00", NetAdjust.Geometry.Parameter.E);
        Assert.True(Math.Abs(minimal.Cofactor(e0, e0)) < 1e-12);
    }

    [Fact]
    public void WeightedControlIsSetAsideInAFreeNetworkAndTheAnalysisStillRuns()
    {
        var net = Net(25, levelling: false, control: new Dictionary<int, Fixity> { [0] = Fixity.EN, [8] = Fixity.None });
        var weighted = new NetAdjust.Network.SurveyNetwork(net.Name,
            net.Points.Select((p, k) => k == 8 ? p with { SdE = 0.01, SdN = 0.01 } : p), net.Observations);
        var free = Adjuster.Adjust(weighted, Tight with { Datum = DatumDefinition.Free() });
        Assert.Equal(free.Observations.Count, free.DesignRows.Count);      // no control rows
        Assert.Empty(free.Analysis.Control);
        Assert.Equal(free.Statistics.DegreesOfFreedom, free.Analysis.RedundancySum, 9);
    }

    [Theory]
    [InlineData(26, true)]
    [InlineData(27, false)]
    public void ADirectionOnlyNetworkHasAScaleDefectThatMinimalAndInnerConstraintsBothFix(int seed, bool azimuth)
    {
        // No distance: scale joins the datum defect (with an azimuth: translation and scale; without: also rotation).
        // Held control for the same defect: point 0 in E and N, point 8 in E (and N when rotation is a defect too).
        var control = new Dictionary<int, Fixity> { [0] = Fixity.EN, [8] = azimuth ? Fixity.E : Fixity.EN };
        var net = GridNetworks.Grid(seed, 3, control, azimuth: azimuth, distances: false).Network;
        var held = Adjuster.Adjust(net, Tight);
        var minimal = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Minimal("Q00", "Q22") });
        var free = Adjuster.Adjust(net, Tight with { Datum = DatumDefinition.Free() });
        int defect = azimuth ? 3 : 4;
        Assert.Equal(free.Statistics.Observations - free.Statistics.Unknowns + defect, free.Statistics.DegreesOfFreedom);
        foreach (var other in new[] { minimal, free })
        {
            Assert.Equal(held.Statistics.DegreesOfFreedom, other.Statistics.DegreesOfFreedom);
            Assert.True(Math.Abs(held.Statistics.Vtpv - other.Statistics.Vtpv) <= 1e-9 * held.Statistics.Vtpv);
        }
        // Minimal constraints hold the distance Q00–Q22 at its value from the given coordinates.
        var p0 = minimal.Points.Single(p => p.Id == "Q00");
        var p1 = minimal.Points.Single(p => p.Id == "Q22");
        var g0 = net["Q00"];
        var g1 = net["Q22"];
        Assert.Equal(Math.Sqrt(Math.Pow(g1.E!.Value - g0.E!.Value, 2) + Math.Pow(g1.N!.Value - g0.N!.Value, 2)),
            Math.Sqrt(Math.Pow(p1.E!.Value - p0.E!.Value, 2) + Math.Pow(p1.N!.Value - p0.N!.Value, 2)), 8);
        var nf = Normal(free);
        var bf = InnerConditions(free, SvdNullSpace(nf, defect));
        AssertCofactorsEqual(Bordered(nf, bf), free.Cofactor, 1e-9, "Q scale-free");
    }
}
