using NetAdjust.Geometry;
using NetAdjust.Tests.Network;

namespace NetAdjust.Tests.Geometry;

/// <summary>The GNSS baseline's equation grid → geodetic → geocentric and its analytic partial derivatives
/// (docs/methods.md, "GNSS baselines").</summary>
public sealed class BaselineGeometryTests
{
    private static readonly BaselineEnd From = new("GA1", 512_300.0, 5_262_100.0, 412.3, 45.2);
    private static readonly BaselineEnd To = new("GA2", 516_850.4, 5_263_402.2, 455.8, 47.9);

    public static TheoryData<int> Components => [0, 1, 2];

    [Theory]
    [MemberData(nameof(Components))]
    public void PartialDerivativesAgreeWithCentralDifferences(int component)
    {
        // Central differences of the full chain (projection inverse, h = H + N, geodetic → earth-centred) with a step
        // of 1 m: the truncation error h²/6 · f‴ is below 1e-13 for a function whose curvature is that of the earth,
        // so the analytic derivatives (via the point scale factor and the convergence) must agree to 1e-8
        // (common practice for checking a Jacobian).
        var p = BaselineTestNetworks.Utm33;
        var eq = BaselineGeometry.Component(p, From, To, component);
        const double step = 1.0;
        foreach (var (end, isTo) in new[] { (From, false), (To, true) })
            foreach (var par in new[] { Parameter.E, Parameter.N, Parameter.H })
            {
                BaselineEnd Moved(BaselineEnd e, double d) => par switch
                {
                    Parameter.E => e with { E = e.E + d },
                    Parameter.N => e with { N = e.N + d },
                    _ => e with { H = e.H + d },
                };
                double Value(double d) => isTo
                    ? BaselineGeometry.Component(p, From, Moved(To, d), component).Value
                    : BaselineGeometry.Component(p, Moved(From, d), To, component).Value;
                double numeric = (Value(step) - Value(-step)) / (2 * step);
                double analytic = eq.Partials.Single(q => q.Owner == end.Id && q.Parameter == par).Derivative;
                Assert.True(Math.Abs(numeric - analytic) < 1e-8,
                    $"∂Δ{component}/∂{par}({end.Id}): analytic {analytic:R}, central difference {numeric:R}");
            }
    }

    [Theory]
    [MemberData(nameof(Components))]
    public void FramePartialDerivativesAgreeWithCentralDifferences(int component)
    {
        // The frame model (1 + μ)(I + Ω) Δ: derivatives by rx, ry, rz and μ against central differences with steps of
        // 1e-6 (the model is linear in each, so the difference is exact to rounding; common practice).
        var p = BaselineTestNetworks.Utm33;
        var f = new FrameState("F", 2e-6, -3e-6, 1.5e-6, 4e-6, true, true);
        var eq = BaselineGeometry.Component(p, From, To, component, f);
        (Parameter Par, Func<double, FrameState> Move)[] cases =
        [
            (Parameter.FrameRotationX, d => f with { Rx = f.Rx + d }),
            (Parameter.FrameRotationY, d => f with { Ry = f.Ry + d }),
            (Parameter.FrameRotationZ, d => f with { Rz = f.Rz + d }),
            (Parameter.FrameScale, d => f with { Scale = f.Scale + d }),
        ];
        foreach (var (par, move) in cases)
        {
            const double h = 1e-6;
            double numeric = (BaselineGeometry.Component(p, From, To, component, move(h)).Value -
                BaselineGeometry.Component(p, From, To, component, move(-h)).Value) / (2 * h);
            double analytic = eq.Partials.Single(q => q.Parameter == par).Derivative;
            Assert.True(Math.Abs(numeric - analytic) < 1e-4 + (1e-9 * Math.Abs(analytic)),
                $"∂Δ{component}/∂{par}: analytic {analytic:R}, central difference {numeric:R}");
        }
    }

    [Fact]
    public void TheVectorIsTheDifferenceOfTheEarthCentredPositions()
    {
        // Δ = X(to) − X(from) with X from the projection's inverse and h = H + N (the chain of docs/methods.md);
        // a frame with zero parameters changes nothing.
        var p = BaselineTestNetworks.Utm33;
        var a = NetAdjust.Geodesy.Geocentric.ToGeocentric(p.Ellipsoid, p.Inverse(From.E, From.N).Latitude,
            p.Inverse(From.E, From.N).Longitude, From.H + From.GeoidSeparation);
        var b = NetAdjust.Geodesy.Geocentric.ToGeocentric(p.Ellipsoid, p.Inverse(To.E, To.N).Latitude,
            p.Inverse(To.E, To.N).Longitude, To.H + To.GeoidSeparation);
        double[] expected = [b.X - a.X, b.Y - a.Y, b.Z - a.Z];
        for (int c = 0; c < 3; c++)
        {
            Assert.Equal(expected[c], BaselineGeometry.Component(p, From, To, c).Value, 1e-9);
            Assert.Equal(expected[c], BaselineGeometry.Component(p, From, To, c,
                new FrameState("F", 0, 0, 0, 0, true, true)).Value, 1e-9);
        }
    }
}
