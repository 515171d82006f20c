using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Reduction;
using NetAdjust.Units;

namespace NetAdjust.Tests.Reduction;

public class RoundsReducerTests
{
    private static readonly double Sec = 1 / Angle.ArcsecondsPerRadian;

    private static readonly string[] Names = ["R1", "R2", "R3", "R4"];

    // Own construction: true directions, zenith angles and slope distances of four targets.
    private static readonly double[] TrueDirections = [0.3, 1.4, 2.9, 5.2];

    private static readonly double[] TrueZeniths = [1.52, 1.61, 1.3, 1.75];

    private static readonly double[] TrueSlopes = [150.25, 212.5, 98.75, 330.0];

    private static RoundsOptions Options(double directionSdArcsec = 5, double zenithSdArcsec = 5) =>
        new(directionSdArcsec * Sec, zenithSdArcsec * Sec);

    /// <summary>A set as an instrument with collimation error c and index error i books it, the circle set to
    /// <paramref name="circle"/> at north; the optional errors are pointing errors of the target (in both faces).
    /// </summary>
    private static FaceReadings[] Set(double circle, double c, double i, double[]? errors = null) =>
        [.. Enumerable.Range(0, 4).Select(k =>
        {
            double hz = TrueDirections[k] - circle + (errors?[k] ?? 0), z = TrueZeniths[k];
            // Face left reads c/sin z more than the line of sight's true direction, face right c/sin z less and 180°
            // round; face left reads z + i, face right 360° − z + i (common practice).
            return new FaceReadings(Names[k])
            {
                HorizontalLeft = Angle.FromRadians(hz + (c / Math.Sin(z))),
                HorizontalRight = Angle.FromRadians(hz + Math.PI - (c / Math.Sin(z))),
                ZenithLeft = Angle.FromRadians(z + i),
                ZenithRight = Angle.FromRadians((2 * Math.PI) - z + i),
                SlopeLeft = Length.FromMetres(TrueSlopes[k]),
                SlopeRight = Length.FromMetres(TrueSlopes[k]),
            };
        })];

    [Fact]
    public void AConstructedSetGivesBackItsCollimationAndIndexErrorExactly()
    {
        // Two sets begun at different circle positions, with c = 12.5″, i = −8″ and then c = −4″, i = 21″.
        var r = RoundsReducer.Reduce([Set(0.1, 12.5 * Sec, -8 * Sec), Set(2.2, -4 * Sec, 21 * Sec)], Options());
        Assert.Equal(Faces.Both, r.Faces);
        Assert.Equal(12.5, r.Sets[0].Collimation / Sec, 9);
        Assert.Equal(-8.0, r.Sets[0].IndexError / Sec, 9);
        Assert.Equal(-4.0, r.Sets[1].Collimation / Sec, 9);
        Assert.Equal(21.0, r.Sets[1].IndexError / Sec, 9);
        Assert.Equal("R1", r.ReferenceTarget);
        for (int k = 0; k < 4; k++)
        {
            // The mean of both faces removes both errors: the directions reduced to R1, the true zenith angles.
            Assert.Equal(TrueDirections[k] - TrueDirections[0], r.Targets[k].Direction, 12);
            Assert.Equal(TrueZeniths[k], r.Targets[k].Zenith, 12);
            Assert.Equal(TrueSlopes[k], r.Targets[k].SlopeDistance, 9);
        }
        Assert.Equal(new ObservingProcedure(2, Faces.Both), r.Procedure);
        // Error-free sets have no spread.
        Assert.Equal(0, r.Directions!.Empirical, 6);
        Assert.True(r.Passes);
    }

    [Fact]
    public void OneFaceSetsTakeTheReadingsThemselvesAndNoInstrumentErrors()
    {
        var right = Set(0.4, 0, 0).Select(x => x with { HorizontalLeft = null, ZenithLeft = null, SlopeLeft = null });
        var r = RoundsReducer.Reduce([[.. right]], Options());
        Assert.Equal(Faces.One, r.Faces);
        Assert.True(double.IsNaN(r.Sets[0].Collimation));
        Assert.True(double.IsNaN(r.Sets[0].IndexError));
        // Face right alone: R − 180° and 360° − z_R (common practice).
        Assert.Equal(TrueDirections[2] - TrueDirections[0], r.Targets[2].Direction, 12);
        Assert.Equal(TrueZeniths[2], r.Targets[2].Zenith, 12);
        Assert.Null(r.Directions);
    }

    [Fact]
    public void TheSpreadOfTheDirectionsIsTheResidualOfAnIndependentLeastSquaresFitOfTheSets()
    {
        // Four sets with pointing errors (own numbers, arcsec). The reduction's double-centred residuals must give the
        // sum of squares of a least-squares fit of m(s,k) = t(k) − ω(s) (t of R1 held at 0), solved independently by
        // MathNet's Householder QR; ν = (n − 1)(t − 1) = 9 (ISO 17123-3, full test procedure, from memory).
        double[][] e = [[2.1, -3.0, 4.4, 0.5], [-1.2, 2.6, -0.8, 3.9], [0.7, -4.1, 1.5, -2.2], [3.3, 0.4, -2.7, 1.0]];
        var sets = Enumerable.Range(0, 4).Select(s =>
            (IReadOnlyList<FaceReadings>)Set(0.7 * s, 6 * Sec, 3 * Sec, [.. e[s].Select(x => x * Sec)])).ToList();
        var r = RoundsReducer.Reduce(sets, Options());

        var a = Matrix<double>.Build.Dense(16, 7);
        var l = Vector<double>.Build.Dense(16);
        for (int s = 0; s < 4; s++)
            for (int k = 0; k < 4; k++)
            {
                int row = (s * 4) + k;
                if (k > 0) a[row, k - 1] = 1;   // t(k), k = 2..4
                a[row, 3 + s] = -1;             // ω(s)
                l[row] = e[s][k];
            }
        var x = a.QR().Solve(l);
        double ss = (a * x - l).L2Norm();
        Assert.Equal(9, r.Directions!.DegreesOfFreedom);
        Assert.Equal(Math.Sqrt(ss * ss / 9), r.Directions.Empirical / Sec, 9);
        // The mean reduced direction of R3 is the fitted t(3) − t(1).
        Assert.Equal(TrueDirections[2] - TrueDirections[0] + (x[1] * Sec), r.Targets[2].Direction, 12);
    }

    [Fact]
    public void TheSpreadTestBoundIsTheIsoChiSquareBound()
    {
        // ISO 17123-3 accepts s ≤ σ·√(χ²(0.95; ν)/ν) (ISO 17123-3:2001, from memory). χ²(0.95; 30) = 43.7730 and
        // χ²(0.95; 20) = 31.4104 (NIST/SEMATECH e-Handbook of Statistical Methods, table of critical values of χ²;
        // docs/references.md §2, computed).
        // Directions: 11 sets of 4 targets, ν = (n − 1)(t − 1) = 30; each target ν = n − 1 = 10.
        var eleven = Enumerable.Range(0, 11).Select(s => (IReadOnlyList<FaceReadings>)Set(0.5 * s, 0, 0)).ToList();
        var r = RoundsReducer.Reduce(eleven, Options(5, 3));
        Assert.Equal(30, r.Directions!.DegreesOfFreedom);
        Assert.Equal(5.0 * Math.Sqrt(43.7730 / 30), r.Directions.Bound / Sec, 4);
        Assert.Equal(10, r.Targets[1].DirectionTest!.DegreesOfFreedom);
        // Zenith angles have no orientation to remove: 6 sets of 4 targets give ν = t(n − 1) = 20.
        var six = Enumerable.Range(0, 6).Select(s => (IReadOnlyList<FaceReadings>)Set(0.5 * s, 0, 0)).ToList();
        r = RoundsReducer.Reduce(six, Options(5, 3));
        Assert.Equal(20, r.Zeniths!.DegreesOfFreedom);
        Assert.Equal(3.0 * Math.Sqrt(31.4104 / 20), r.Zeniths.Bound / Sec, 4);
    }

    [Fact]
    public void ASpreadBeyondTheInstrumentsFigureFailsItsTest()
    {
        // One target moves by 20″ in one set of three: for a 1″ instrument that fails, for a 20″ one it does not.
        var sets = new List<IReadOnlyList<FaceReadings>>
        {
            Set(0, 0, 0), Set(1, 0, 0, [0, 0, 40 * Sec, 0]), Set(2, 0, 0),
        };
        var tight = RoundsReducer.Reduce(sets, Options(1));
        Assert.False(tight.Directions!.Passes);
        Assert.False(tight.Targets[2].DirectionTest!.Passes);
        Assert.False(tight.Passes);
        Assert.True(RoundsReducer.Reduce(sets, Options(20)).Passes);
    }

    [Fact]
    public void ThePerTargetStatisticIsChiSquareWithNMinusOneDegreesOfFreedom()
    {
        // Monte Carlo (seeded): with errors of σ per direction in one set, the per-target statistic
        // (n − 1)s²/σ² follows χ²(n − 1), so it exceeds χ²(0.95; n − 1) in about 5% of the cases (MathNet's χ²).
        var rng = new Random(20261202);
        int n = 3, runs = 2000, failed = 0;
        double sigma = 2 * Sec;
        for (int run = 0; run < runs; run++)
        {
            var sets = Enumerable.Range(0, n).Select(s => (IReadOnlyList<FaceReadings>)Set(s, 0, 0,
                [.. Enumerable.Range(0, 4).Select(_ => sigma * Normal.Sample(rng, 0, 1))])).ToList();
            var r = RoundsReducer.Reduce(sets, new RoundsOptions(sigma, 0));
            if (!r.Targets[3].DirectionTest!.Passes) failed++;
        }
        // 5% of 2000 = 100 ± 3σ of a binomial (≈ 29).
        Assert.InRange(failed, 100 - 30, 100 + 30);
    }

    [Fact]
    public void FacesThatDisagreeBeyondTheToleranceAreRefusedNamingSetAndReading()
    {
        var bad = Set(0.3, 0, 0);
        bad[2] = bad[2] with
        {
            HorizontalRight = Angle.FromRadians(bad[2].HorizontalRight!.Value.Radians + (70 * Sec)),
        };
        var e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([Set(0, 0, 0), bad], Options()));
        Assert.Equal(1, e.Set);
        Assert.Equal(2, e.Reading);
        Assert.Contains("70.0″", e.Message);
        // A tolerance of 80″ lets the same readings through.
        RoundsReducer.Reduce([Set(0, 0, 0), bad], Options() with { FaceTolerance = 80 * Sec });
    }

    [Fact]
    public void ZenithFacesThatDisagreeBeyondTheToleranceAreRefused()
    {
        var bad = Set(0.3, 0, 0);
        bad[1] = bad[1] with { ZenithRight = Angle.FromRadians(bad[1].ZenithRight!.Value.Radians - (61 * Sec)) };
        var e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([bad], Options()));
        Assert.Equal((0, 1), (e.Set, e.Reading));
        Assert.Contains("zenith", e.Message);
    }

    [Theory]
    [InlineData(true, 181.0)]
    [InlineData(true, 0.0)]
    [InlineData(false, 179.0)]
    [InlineData(false, 360.0)]
    public void ARawZenithAngleOutsideItsFacesRangeIsRefused(bool left, double degrees)
    {
        var bad = Set(0.3, 0, 0);
        var z = Angle.FromDegrees(degrees);
        bad[3] = left ? bad[3] with { ZenithLeft = z } : bad[3] with { ZenithRight = z };
        var e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([bad], Options()));
        Assert.Equal((0, 3), (e.Set, e.Reading));
        Assert.Contains(left ? "between 0 and 180°" : "between 180 and 360°", e.Message);
    }

    [Fact]
    public void SetsThatSightOtherTargetsOrMixFacesAreRefused()
    {
        var missing = Set(0.3, 0, 0)[..3];
        var e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([Set(0, 0, 0), missing], Options()));
        Assert.Equal((1, -1), (e.Set, e.Reading));
        Assert.Contains("R4", e.Message);
        var oneFace = Set(0.3, 0, 0).Select(x => x with { HorizontalRight = null, ZenithRight = null }).ToArray();
        e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([Set(0, 0, 0), oneFace], Options()));
        Assert.Equal((1, -1), (e.Set, e.Reading));
        var mixed = Set(0.3, 0, 0);
        mixed[1] = mixed[1] with { ZenithRight = null };
        e = Assert.Throws<RoundsReadingException>(() => RoundsReducer.Reduce([mixed], Options()));
        Assert.Equal((0, 1), (e.Set, e.Reading));
    }
}
