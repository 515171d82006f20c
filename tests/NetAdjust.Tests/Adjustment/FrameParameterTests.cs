using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Tests.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>Frame parameters between the GNSS frame and the local control as unknowns (docs/methods.md, "GNSS
/// baselines").</summary>
public sealed class FrameParameterTests
{
    /// <summary>The test network with all four marks held (the local control) and baselines simulated in a frame
    /// turned by (rx, ry, rz) and scaled by μ: Δ_gnss = (1 + μ)(I + Ω) Δ_local.</summary>
    private static SurveyNetwork Turned(double rx, double ry, double rz, double mu, BaselineFrame frame, int seed,
        double noise = 0.3)
    {
        var net = BaselineTestNetworks.Network(seed, noiseScale: noise);
        var points = BaselineTestNetworks.Truth.Select(t => new Point(t.Id)
            { E = t.E, N = t.N, H = t.H, Fixed = Fixity.E | Fixity.N | Fixity.H });
        var m = Matrix<double>.Build.DenseOfRowMajor(3, 3, [1, -rz, ry, rz, 1, -rx, -ry, rx, 1]) * (1 + mu);
        var obs = net.Observations.Cast<BaselineObservation>().Select(b =>
        {
            var d = m * Vector<double>.Build.Dense([b.Dx.Metres, b.Dy.Metres, b.Dz.Metres]);
            return b with
            {
                Dx = Length.FromMetres(d[0]), Dy = Length.FromMetres(d[1]), Dz = Length.FromMetres(d[2]), Frame = frame,
            };
        });
        return new SurveyNetwork("turned", points, obs);
    }

    [Fact]
    public void FreeRotationsAndScaleAreRecovered()
    {
        // Simulated: rotations of 1″, −2″, 0.5″ and a scale of +3 ppm (an older realisation of the control, invented);
        // noise 0.3 × the stated covariance. The estimates must lie within 4 of their standard deviations (common
        // practice for a simulation check), and those are small against the simulated values.
        double sec = Math.PI / 648000;
        var frame = new BaselineFrame("gnss", FrameParameterSet.RotationsAndScale);
        var result = Adjuster.Adjust(Turned(1 * sec, -2 * sec, 0.5 * sec, 3e-6, frame, seed: 5));
        var f = result.FrameParameters;
        Assert.Equal([Parameter.FrameRotationX, Parameter.FrameRotationY, Parameter.FrameRotationZ,
            Parameter.FrameScale], f.Select(x => x.Parameter));
        double[] truth = [1 * sec, -2 * sec, 0.5 * sec, 3e-6];
        for (int i = 0; i < 4; i++)
        {
            Assert.True(Math.Abs(f[i].Value - truth[i]) < 4 * f[i].Sd, $"{f[i].Parameter}: {f[i].Value} ± {f[i].Sd}");
            Assert.True(f[i].Sd < Math.Abs(truth[i]) / 3, $"{f[i].Parameter} sd {f[i].Sd}");
        }
        Assert.Equal(18 - 4, result.Statistics.DegreesOfFreedom);
    }

    [Fact]
    public void WithoutFrameParametersTheTurnedBaselinesDoNotFit()
    {
        // The same data (noise as stated) adjusted without frame parameters: vᵀPv is far above χ²(0.975; r) (the
        // rotation of 2″ is 5 cm on the 5 km baselines, many σ), with them it is not. It would fail if the
        // parameters did nothing.
        double sec = Math.PI / 648000;
        var none = new BaselineFrame("gnss", FrameParameterSet.None);
        var with = new BaselineFrame("gnss", FrameParameterSet.Rotations);
        var without = Adjuster.Adjust(Turned(1 * sec, -2 * sec, 0.5 * sec, 0, none, 5, 1)).Statistics;
        var fit = Adjuster.Adjust(Turned(1 * sec, -2 * sec, 0.5 * sec, 0, with, 5, 1)).Statistics;
        // one-sided: vᵀPv above χ²(0.975; r) is a misfit (docs/references.md §2)
        Assert.True(without.Vtpv > without.GlobalTest.Upper!.Value, $"vtpv {without.Vtpv}");
        Assert.True(fit.Vtpv < fit.GlobalTest.Upper!.Value, $"vtpv {fit.Vtpv} dof {fit.DegreesOfFreedom}");
    }

    [Fact]
    public void AnAPrioriStandardDeviationHoldsAParameterTowardsZero()
    {
        // A rotation sd of 0.001″ about zero (a direct observation of the parameter) keeps the estimates near zero
        // even though the data say 1″ (their own sd is about 0.04″): each estimate is within 0.01″ of zero, and its
        // sd below the a-priori one.
        double sec = Math.PI / 648000;
        var held = new BaselineFrame("gnss", FrameParameterSet.Rotations) { RotationSd = Angle.FromArcseconds(0.001) };
        var result = Adjuster.Adjust(Turned(1 * sec, -1 * sec, 1 * sec, 0, held, 9));
        Assert.All(result.FrameParameters, f => Assert.True(Math.Abs(f.Value) < 0.01 * sec && f.Sd < 0.001 * sec,
            $"{f.Value / sec}″ ± {f.Sd / sec}″"));
        Assert.Empty(result.Analysis.Control); // the frame's rows are no control points
        Assert.Equal(18 - 3 + 3, result.Statistics.DegreesOfFreedom);
    }
}
