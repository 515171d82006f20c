using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

/// <summary>
/// Approximate coordinates judge their constructions in units of σ before any coordinates exist, so a standard
/// deviation still to be derived from specifications (NaN until the adjustment weights at its coordinates) must
/// get a provisional value: before this, the constructions saw NaN and a misfit test such as the resection's
/// 100σ limit could never fail.
/// </summary>
public sealed class ProvisionalDeviationsTests
{
    private static readonly TotalStationSpecification Instrument =
        new("ts", directionSd: Angle.FromArcseconds(5).Radians, zenithSd: 0, edm: null, centeringSd: 0.001,
            heightSd: 0);

    private static SurveyNetwork Network(IReadOnlyDictionary<string, double> sights) => new("provisional",
        [new Point("A") { E = 0, N = 0 }, new Point("B") { E = 100, N = 0 }, new Point("C")],
        [
            new DirectionObservation("A", "B", Angle.FromDegrees(0), "A-1")
            {
                StandardDeviation = double.NaN,
                Weighting = new ObservationWeighting { Instrument = Instrument, ObservedSights = sights },
            },
            new DirectionObservation("A", "C", Angle.FromDegrees(40), "A-1") { StandardDeviation = 2e-5 },
        ]);

    [Fact]
    public void AStandardDeviationStillToBeDerivedGetsTheInstrumentsPointingWithoutUnknownCentering()
    {
        var net = StochasticModel.WithProvisionalDeviations(Network(new Dictionary<string, double>()));
        // One set in both faces: σ = the ISO 17123-3 σ of a direction (common practice); the centering terms
        // σc / d vanish for a sight length not known yet (taken as very long).
        Assert.Equal(Angle.FromArcseconds(5).Radians, net.Observations[0].StandardDeviation, 1e-9);
        Assert.Equal(2e-5, net.Observations[1].StandardDeviation); // a given σ stays as it is
    }

    [Fact]
    public void AnObservedSightLengthBringsItsCenteringTerm()
    {
        var net = StochasticModel.WithProvisionalDeviations(
            Network(new Dictionary<string, double> { ["B"] = 100.0 }));
        // σ² = σ_ISO² + (σc / d)², σc = 1 mm at d = 100 m: 1e-5 rad (law of propagation of variances, common
        // practice).
        double expected = Math.Sqrt(Math.Pow(Angle.FromArcseconds(5).Radians, 2) + Math.Pow(0.001 / 100, 2));
        Assert.Equal(expected, net.Observations[0].StandardDeviation, 1e-12);
    }

    [Fact]
    public void ANetworkWithNothingToDeriveIsReturnedAsItIs()
    {
        var net = new SurveyNetwork("given", [new Point("A") { E = 0, N = 0 }, new Point("B")],
            [new DistanceObservation("A", "B", Length.FromMetres(10)) { StandardDeviation = 0.002 }]);
        Assert.Same(net, StochasticModel.WithProvisionalDeviations(net));
    }
}
