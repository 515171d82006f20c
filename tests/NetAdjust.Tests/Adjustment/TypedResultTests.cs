using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Simulation;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// The typed members of the results show the SI values the library computes, typed by what they are: an observation's
/// adjusted value, residual, standard deviation and minimal detectable bias are angles for angular kinds and lengths
/// otherwise; coordinates, ellipse axes and shifts are lengths; azimuths and orientations are angles.
/// </summary>
public sealed class TypedResultTests
{
    private static SurveyNetwork Network(DemoScenario scenario)
    {
        var s = DemoScenarios.Draw(scenario, DemoScenarios.DefaultSeed(scenario));
        return new SurveyNetwork(scenario.ToString(), s.Points,
            s.Setups.SelectMany(x => x.Observations).Concat(s.Levelling));
    }

    [Fact]
    public void ObservationValuesAreAnglesForAngularKindsAndLengthsOtherwise()
    {
        var result = Adjuster.Adjust(Network(DemoScenario.Brackenmoor));
        var analysis = result.Analysis;
        Assert.Contains(result.Observations, o => o.Input.Kind.IsAngular());
        Assert.Contains(result.Observations, o => !o.Input.Kind.IsAngular());
        foreach (var o in result.Observations)
        {
            bool angular = o.Input.Kind.IsAngular();
            foreach (var q in new[] { o.AdjustedValue, o.ResidualValue, o.SdAdjustedValue, o.Input.ObservedValue })
            {
                Assert.Equal(angular, q.IsAngle);
                Assert.Equal(angular, q.AsAngle.HasValue);
                Assert.Equal(!angular, q.AsLength.HasValue);
            }
            Assert.Equal(o.Residual, SiOf(o.ResidualValue));
            Assert.Equal(o.Adjusted, SiOf(o.AdjustedValue));
            Assert.Equal(o.SdAdjusted, SiOf(o.SdAdjustedValue));
            Assert.Equal(o.Input.Value, SiOf(o.Input.ObservedValue));
            var test = analysis.Observations[o.Index];
            Assert.Equal(test.Mdb, test.MinimalDetectableBias is Quantity m ? SiOf(m) : null);
            if (test.MinimalDetectableBias is Quantity mdb) Assert.Equal(angular, mdb.IsAngle);
        }
    }

    [Fact]
    public void ADirectionResidualReadsInArcseconds()
    {
        // 1 rad = 648000/π arcseconds (definition of the radian; common practice).
        var result = Adjuster.Adjust(Network(DemoScenario.Brackenmoor));
        var d = result.Observations.First(o => o.Input.Kind == ObservationKind.Direction);
        Assert.Equal(d.Residual * 648000 / Math.PI, d.ResidualValue.AsAngle!.Value.Arcseconds, 9);
        Assert.EndsWith("\"", d.ResidualValue.ToString(), StringComparison.Ordinal);
        var s = result.Observations.First(o => o.Input.Kind == ObservationKind.Distance);
        Assert.Equal(s.Residual * 1000, s.ResidualValue.AsLength!.Value.In(LengthUnit.Millimetre), 9);
        Assert.EndsWith(" m", s.ResidualValue.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void PointsEllipsesAndOrientationsAreLengthsAndAngles()
    {
        var result = Adjuster.Adjust(Network(DemoScenario.Brackenmoor));
        foreach (var p in result.Points)
        {
            Assert.Equal(p.E, p.Easting?.Metres);
            Assert.Equal(p.N, p.Northing?.Metres);
            Assert.Equal(p.H, p.Height?.Metres);
            Assert.Equal(p.SdE, p.SdEasting?.Metres);
            Assert.Equal(p.SdN, p.SdNorthing?.Metres);
            Assert.Equal(p.SdH, p.SdHeight?.Metres);
        }
        Assert.NotEmpty(result.Orientations);
        foreach (var o in result.Orientations)
        {
            Assert.Equal(o.Orientation, o.OrientationAngle.Radians);
            Assert.Equal(o.Sd, o.SdAngle.Radians);
        }
        var precision = result.Analysis.Points.First(p => p.Ellipse is not null);
        var e = precision.Ellipse!.Value;
        Assert.Equal(e.A, e.SemiMajorAxis.Metres);
        Assert.Equal(e.B, e.SemiMinorAxis.Metres);
        Assert.Equal(e.AzimuthDegrees, e.MajorAxisAzimuth.Degrees, 12);
        // Along the major axis the standard deviation is the semi-major axis (Mikhail & Ackermann 1976).
        Assert.Equal(e.A, e.SdAlong(e.MajorAxisAzimuth).Metres, 12);
    }

    [Fact]
    public void ErrorEllipseOfACovarianceHasTypedAxes()
    {
        // σE² = 4, σN² = 1, σEN = 0 (mm²): a = 2 mm along east (azimuth 90°), b = 1 mm (Mikhail & Ackermann 1976,
        // eigenvalues of a diagonal covariance).
        var e = ErrorEllipse.FromCovariance(4e-6, 1e-6, 0);
        Assert.Equal(2.0, e.SemiMajorAxis.In(LengthUnit.Millimetre), 12);
        Assert.Equal(1.0, e.SemiMinorAxis.In(LengthUnit.Millimetre), 12);
        Assert.Equal(90.0, e.MajorAxisAzimuth.Degrees, 12);
    }

    [Fact]
    public void SequenceShiftsAndDiscrepanciesAreLengths()
    {
        var seq = AdjustmentSequence.Run(Network(DemoScenario.Harrowgate));
        Assert.NotEmpty(seq.Shifts);
        foreach (var s in seq.Shifts)
        {
            Assert.Equal(s.DE, s.EastingShift?.Metres);
            Assert.Equal(s.DN, s.NorthingShift?.Metres);
            Assert.Equal(s.DH, s.HeightShift?.Metres);
            // √(ΔE² + ΔN²) (common practice).
            if (s.DE is double de && s.DN is double dn)
                Assert.Equal(Math.Sqrt((de * de) + (dn * dn)), s.HorizontalShift!.Value.Metres, 12);
        }
        foreach (var d in seq.Discrepancies)
        {
            Assert.Equal(d.DE, d.EastingDiscrepancy?.Metres);
            Assert.Equal(d.SdE, d.SdEasting?.Metres);
            Assert.Equal(d.DH, d.HeightDiscrepancy?.Metres);
        }
    }

    private static double SiOf(Quantity q) => q.IsAngle ? q.AsAngle!.Value.Radians : q.AsLength!.Value.Metres;
}
