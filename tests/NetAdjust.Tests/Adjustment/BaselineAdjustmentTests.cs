using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Tests.Network;

namespace NetAdjust.Tests.Adjustment;

/// <summary>A network of GNSS baselines adjusted on the grid (docs/methods.md, "GNSS baselines") against an
/// independent solution.</summary>
public sealed class BaselineAdjustmentTests
{
    [Fact]
    public void ABaselineOnlyNetworkAgreesWithPlainGeocentricLeastSquares()
    {
        var network = BaselineTestNetworks.Network(seed: 19);
        var result = Adjuster.Adjust(network, AdjustmentOptions.Default with { LengthTolerance = 1e-7 });

        // Independent solution: plain least squares on the earth-centred X, Y, Z of GA2..GA4 (the model is linear
        // there: Δ = X(to) − X(from)), GA1 held at its given position, weights Σ⁻¹ per baseline; solved by
        // MathNet's QR on the whitened system L⁻¹ A x = L⁻¹ l with Σ = L Lᵀ (an independent QR solve).
        var truth = BaselineTestNetworks.Truth;
        var fixedXyz = BaselineTestNetworks.Xyz(truth[0].E, truth[0].N, truth[0].H);
        var baselines = network.Observations.Cast<BaselineObservation>().Chunk(3).ToArray();
        int m = baselines.Length * 3, u = 9;
        var a = Matrix<double>.Build.Dense(m, u);
        var l = Vector<double>.Build.Dense(m);
        var w = Matrix<double>.Build.Dense(m, m);
        for (int b = 0; b < baselines.Length; b++)
        {
            var first = baselines[b][0];
            int from = Array.FindIndex(truth, t => t.Id == first.From), to = Array.FindIndex(truth, t => t.Id ==
                first.To);
            double[] obs = [first.Dx.Metres, first.Dy.Metres, first.Dz.Metres];
            double[] fx = [fixedXyz.X, fixedXyz.Y, fixedXyz.Z];
            var cov = Matrix<double>.Build.DenseOfRowMajor(3, 3, first.Covariance!);
            var linv = cov.Cholesky().Factor.Inverse();
            for (int c = 0; c < 3; c++)
            {
                l[(b * 3) + c] = obs[c] + (from == 0 ? fx[c] : 0) - (to == 0 ? fx[c] : 0);
                if (to > 0) a[(b * 3) + c, ((to - 1) * 3) + c] = 1;
                if (from > 0) a[(b * 3) + c, ((from - 1) * 3) + c] = -1;
                for (int d = 0; d < 3; d++) w[(b * 3) + c, (b * 3) + d] = linv[c, d];
            }
        }
        var x = (w * a).QR().Solve(w * l);

        for (int p = 1; p < truth.Length; p++)
        {
            var ap = result.Points.Single(q => q.Id == truth[p].Id);
            // NetAdjust's grid result converted to earth-centred by the same projection and h = H + N
            var xyz = BaselineTestNetworks.Xyz(ap.E!.Value, ap.N!.Value, ap.H!.Value);
            Assert.Equal(x[(p - 1) * 3], xyz.X, 1e-6);
            Assert.Equal(x[((p - 1) * 3) + 1], xyz.Y, 1e-6);
            Assert.Equal(x[((p - 1) * 3) + 2], xyz.Z, 1e-6);
            // and the independent solution converted to the grid: geodetic, then the projection's forward mapping
            var (lat, lon, h) = Geocentric.ToGeodetic(Ellipsoid.Grs80, x[(p - 1) * 3], x[((p - 1) * 3) + 1],
                x[((p - 1) * 3) + 2]);
            var (e, n) = BaselineTestNetworks.Utm33.Forward(lat, lon);
            Assert.Equal(e, ap.E.Value, 1e-6);
            Assert.Equal(n, ap.N.Value, 1e-6);
            Assert.Equal(h - BaselineTestNetworks.GeoidSeparation, ap.H.Value, 1e-6);
        }
        // vᵀPv agrees too (18 observations, 9 unknowns)
        var v = (a * x) - l;
        double vtpv = (w * v).DotProduct(w * v);
        Assert.Equal(9, result.Statistics.DegreesOfFreedom);
        Assert.Equal(vtpv, result.Statistics.Vtpv, 1e-6 * vtpv);
    }

    [Fact]
    public void PointsReachedOnlyByBaselinesGetStartValuesFromThem()
    {
        // GA2..GA4 without coordinates: the baselines place them from GA1 (the chain grid → earth-centred + Δ →
        // grid), and the adjustment reaches the same solution as with start values given (1e-6 m).
        var net = BaselineTestNetworks.Network(seed: 19);
        var bare = new SurveyNetwork(net.Name, net.Points.Select(p => p.IsControl ? p : new Point(p.Id)),
            net.Observations);
        var options = AdjustmentOptions.Default with { LengthTolerance = 1e-7 };
        var a = Adjuster.Adjust(net, options);
        var b = Adjuster.Adjust(bare, options);
        for (int i = 0; i < a.Points.Count; i++)
        {
            Assert.Equal(a.Points[i].E!.Value, b.Points[i].E!.Value, 1e-6);
            Assert.Equal(a.Points[i].N!.Value, b.Points[i].N!.Value, 1e-6);
            Assert.Equal(a.Points[i].H!.Value, b.Points[i].H!.Value, 1e-6);
        }
    }
}
