using FsCheck;
using FsCheck.Fluent;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class ErrorEllipseTests
{
    [Fact]
    public void AxesAreTheRootsOfTheEigenvaluesOnRandomCovariances()
    {
        // Independent check: MathNet's symmetric eigen decomposition of the 2×2 covariance (Mikhail & Ackermann 1976:
        // the semi-axes are the square roots of the eigenvalues, the major axis along the first eigenvector).
        var gen = from se in Gen.Choose(1, 10000)
                  from sn in Gen.Choose(1, 10000)
                  from rho in Gen.Choose(-999, 999)
                  select (se * 1e-5, sn * 1e-5, rho / 1000.0);
        Prop.ForAll(Arb.From(gen), t =>
        {
            var (se, sn, rho) = t;
            double ce = se * se, cn = sn * sn, cen = rho * se * sn;
            var e = ErrorEllipse.FromCovariance(ce, cn, cen);
            var m = Matrix<double>.Build.DenseOfArray(new[,] { { ce, cen }, { cen, cn } });
            var evd = m.Evd(Symmetricity.Symmetric);
            var ev = evd.EigenValues.Select(z => z.Real).OrderByDescending(x => x).ToArray();
            double scale = ev[0];
            bool axes = Math.Abs((e.A * e.A) - ev[0]) <= 1e-12 * scale &&
                Math.Abs((e.B * e.B) - ev[1]) <= 1e-11 * scale;
            int major = evd.EigenValues[0].Real >= evd.EigenValues[1].Real ? 0 : 1;
            var vec = evd.EigenVectors.Column(major); // (E, N) components
            double dot = Math.Abs((vec[0] * Math.Sin(e.Azimuth)) + (vec[1] * Math.Cos(e.Azimuth)));
            bool direction = ev[0] - ev[1] < 1e-9 * scale || Math.Abs(dot - 1) < 1e-9;
            bool range = e.Azimuth >= 0 && e.Azimuth < Math.PI;
            return axes && direction && range;
        }).QuickCheckThrowOnFailure();
    }

    [Theory]
    [InlineData(4.0, 1.0, 0.0, 90.0)]   // elongated east-west → azimuth 90°
    [InlineData(1.0, 4.0, 0.0, 0.0)]    // elongated north-south → 0°
    [InlineData(2.0, 2.0, 1.0, 45.0)]   // positive correlation of E and N → north-east
    [InlineData(2.0, 2.0, -1.0, 135.0)] // negative → south-east / north-west
    public void AzimuthIsClockwiseFromNorth(double ce, double cn, double cen, double azDeg)
    {
        // Convention of docs/glossary.md: azimuth of the semi-major axis clockwise from north in [0°, 180°)
        // (common practice).
        Assert.Equal(azDeg, ErrorEllipse.FromCovariance(ce, cn, cen).AzimuthDegrees, 9);
    }

    [Fact]
    public void SdAlongADirectionIsTheQuadraticFormOfTheCovariance()
    {
        // σ along the unit vector u = (sin α, cos α) (E, N) is √(uᵀ C u) (propagation of variances; Mikhail &
        // Ackermann 1976), computed here from the covariance itself with MathNet, not from the ellipse's own axes.
        // Along the major axis this is A, across it B.
        double ce = 3e-6, cn = 1e-6, cen = 0.8e-6;
        var c = Matrix<double>.Build.DenseOfArray(new[,] { { ce, cen }, { cen, cn } });
        var e = ErrorEllipse.FromCovariance(ce, cn, cen);
        double Quadratic(double azimuth)
        {
            var u = Vector<double>.Build.DenseOfArray([Math.Sin(azimuth), Math.Cos(azimuth)]);
            return Math.Sqrt(u * c * u);
        }
        for (int deg = 0; deg < 360; deg += 15)
        {
            double az = deg * Math.PI / 180;
            Assert.Equal(Quadratic(az), e.SdAlong(az), 15);
        }
        Assert.Equal(Quadratic(e.Azimuth), e.A, 15);
        Assert.Equal(Quadratic(e.Azimuth + (Math.PI / 2)), e.B, 15);
        Assert.Equal(2.4477 * e.A, e.Scaled(2.4477).A, 15);
    }
}
