using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.Tests.Simulation;

/// <summary>Simulation from a plan draws its noise from the simulations' one seeded source.</summary>
public class PlannedSurveysTests
{
    private static SurveyNetwork Truth() => new("plan",
        [new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 100, N = 0 },
         new Point("C") { E = 0, N = 100 }],
        [new DistanceObservation("A", "B", Length.FromMetres(100)) { StandardDeviation = 0.001 },
         new DistanceObservation("A", "C", Length.FromMetres(100)) { StandardDeviation = 0.001 },
         new DistanceObservation("B", "C", Length.FromMetres(Math.Sqrt(20000))) { StandardDeviation = 0.001 }]);

    private static Observation WithValue(Observation o, double v) =>
        ((DistanceObservation)o) with { Distance = Length.FromMetres(v) };

    [Fact]
    public void TheNoiseIsTheSameSequenceAsTheScenarioDraws()
    {
        // The same seeded source as `simulate --scenario` (one generator): its Gaussian numbers in order, scaled
        // by each observation's standard deviation.
        double[] sd = [0.002, 0.003, 0.004];
        var truth = Truth();
        var drawn = PlannedSurveys.Draw(truth, sd, 42, WithValue);
        var noise = new SeededNoise(42);
        for (int i = 0; i < sd.Length; i++)
        {
            Assert.Equal(truth.Observations[i].Value + noise.Gauss(sd[i]), drawn.Observations[i].Value, 12);
            Assert.Equal(sd[i], drawn.Observations[i].StandardDeviation);
        }
    }

    [Fact]
    public void TheSameSeedGivesTheSameDraw()
    {
        double[] sd = [0.002, 0.003, 0.004];
        var a = PlannedSurveys.Draw(Truth(), sd, 9, WithValue).Observations.Select(o => o.Value);
        var b = PlannedSurveys.Draw(Truth(), sd, 9, WithValue).Observations.Select(o => o.Value);
        var c = PlannedSurveys.Draw(Truth(), sd, 10, WithValue).Observations.Select(o => o.Value);
        Assert.Equal(a, b);
        Assert.NotEqual(a, c);
    }

    [Fact]
    public void TheTarnholmScenarioNeedsItsProjection() =>
        Assert.Throws<ArgumentException>(() => DemoScenarios.Draw(DemoScenario.Tarnholm, 1));
}
