using FsCheck;
using FsCheck.Fluent;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.IO.Results;
using NetAdjust.Network;

namespace NetAdjust.IO.Tests.Results;

public class EllipseTests
{
    private static AdjustedPoint Pt(double se, double sn, double cov) =>
        new(new Point("P"), 100, 200, null, se, sn, null, cov);

    // Independent check: the semi-axes are the square roots of the eigenvalues of the 2x2 covariance matrix
    // [σE² σEN; σEN σN²] and the major axis is the eigenvector of the larger one (MathNet's symmetric
    // eigen-decomposition, a general-purpose reference library). Azimuth = atan2(vE, vN) reduced to [0, π).
    private static (double A, double B, double Az) ByEigen(double se, double sn, double cov)
    {
        var m = Matrix<double>.Build.DenseOfArray(new[,] { { se * se, cov }, { cov, sn * sn } });
        var evd = m.Evd(Symmetricity.Symmetric);
        int big = evd.EigenValues[0].Real >= evd.EigenValues[1].Real ? 0 : 1;
        var v = evd.EigenVectors.Column(big);
        double az = Math.Atan2(v[0], v[1]);
        if (az < 0) az += Math.PI;
        if (az >= Math.PI) az -= Math.PI;
        return (Math.Sqrt(evd.EigenValues[big].Real), Math.Sqrt(Math.Max(0, evd.EigenValues[1 - big].Real)), az);
    }

    [Theory]
    [InlineData(0.003, 0.003, 0.0)]       // circle
    [InlineData(0.004, 0.002, 0.0)]       // a along east: azimuth 90°
    [InlineData(0.002, 0.004, 0.0)]       // a along north: azimuth 0°
    [InlineData(0.003, 0.003, 0.000006)]  // correlated, equal sd: azimuth 45°
    [InlineData(0.003, 0.003, -0.000006)] // azimuth 135°
    [InlineData(0.0025, 0.0061, 0.0000081)]
    public void MatchesIndependentEigenDecomposition(double se, double sn, double cov)
    {
        var el = ReportFigures.Ellipse(Pt(se, sn, cov))!.Value;
        var (a, b, az) = ByEigen(se, sn, cov);
        Assert.Equal(a, el.SemiMajor, 1e-12);
        Assert.Equal(b, el.SemiMinor, 1e-12);
        if (a - b > 1e-9) Assert.True(AzimuthClose(az, el.Azimuth, 1e-9), $"{az} vs {el.Azimuth}");
    }

    [Theory]
    [InlineData(0.004, 0.002, 0.0, 90.0)]
    [InlineData(0.002, 0.004, 0.0, 0.0)]
    [InlineData(0.003, 0.003, 0.000006, 45.0)]
    [InlineData(0.003, 0.003, -0.000006, 135.0)]
    public void AzimuthIsClockwiseFromNorth(double se, double sn, double cov, double degrees) =>
        // common practice: ellipse azimuth of the semi-major axis, clockwise from grid north, in [0°, 180°) (GLOSSARY).
        Assert.Equal(degrees, ReportFigures.Ellipse(Pt(se, sn, cov))!.Value.Azimuth * 180 / Math.PI, 9);

    [FsCheck.Xunit.Property(MaxTest = 200)]
    public Property AgreesWithEigenForRandomCovariances() =>
        Prop.ForAll(Gen.Choose(1, 10000).Three().ToArbitrary(), t =>
        {
            double se = t.Item1 * 1e-6, sn = t.Item2 * 1e-6;
            double rho = (t.Item3 / 5000.5) - 1.0; // correlation in (−1, 1)
            double cov = rho * se * sn;
            var el = ReportFigures.Ellipse(Pt(se, sn, cov))!.Value;
            var (a, b, az) = ByEigen(se, sn, cov);
            bool axes = Math.Abs(a - el.SemiMajor) < 1e-12 && Math.Abs(b - el.SemiMinor) < 1e-11;
            bool dir = a - b < 1e-7 || AzimuthClose(az, el.Azimuth, 1e-6);
            // Invariants: a² + b² = σE² + σN² (trace) and a·b = √det.
            bool trace = Math.Abs((el.SemiMajor * el.SemiMajor) + (el.SemiMinor * el.SemiMinor) - (se * se) - (sn * sn)) < 1e-15;
            return axes && dir && trace && el.Azimuth >= 0 && el.Azimuth < Math.PI;
        });

    [Fact]
    public void NoEllipseWithoutPlanCoordinates() =>
        Assert.Null(ReportFigures.Ellipse(new AdjustedPoint(new Point("BM"), null, null, 50, null, null, 0.001, null)));

    private static bool AzimuthClose(double x, double y, double tol)
    {
        double d = Math.Abs(x - y) % Math.PI;
        return Math.Min(d, Math.PI - d) < tol;
    }
}
