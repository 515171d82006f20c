using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Tests.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

/// <summary>
/// The 3×3 weight blocks of GNSS baselines: W = σ0² Σ⁻¹ with Σ = D R D (R the correlations of the stated
/// covariance, D the components' current σ), checked against MathNet's general matrix inverse (an independent LU
/// solve); the grouping of components by baseline id whatever their order; the refusal of components that do not
/// belong together; and a model of given σ alone being the same at any coordinates.
/// </summary>
public class BaselineBlocksTests
{
    private static readonly (Length X, Length Y, Length Z) Vector =
        (Length.FromMetres(4550.412), Length.FromMetres(1302.187), Length.FromMetres(43.512));

    private static IReadOnlyList<BaselineObservation> Parts(string id, string from, string to, int k) =>
        BaselineObservation.Components(id, from, to, Vector, BaselineTestNetworks.Covariance(k),
            BaselineTestNetworks.Grid);

    private static SurveyNetwork Net(IEnumerable<Observation> observations) =>
        new("blocks", BaselineTestNetworks.Truth.Select(t => new Point(t.Id) { E = t.E, N = t.N, H = t.H }),
            observations);

    /// <summary>W from Σ = D R D inverted by MathNet (LU), Σ's correlations from the stated covariance.</summary>
    private static Matrix<double> Expected(IReadOnlyList<double> cov, double[] sd, int[] components, double s0sq)
    {
        int k = sd.Length;
        var sigma = Matrix<double>.Build.Dense(k, k, (a, b) =>
        {
            int ca = components[a], cb = components[b];
            double r = cov[(ca * 3) + cb] / Math.Sqrt(cov[(ca * 3) + ca] * cov[(cb * 3) + cb]);
            return r * sd[a] * sd[b];
        });
        return sigma.Inverse() * s0sq;
    }

    private static void AssertBlock(Matrix<double> expected, CorrelatedBlock block)
    {
        int k = expected.RowCount;
        Assert.Equal(k * k, block.Weights.Count);
        for (int a = 0; a < k; a++)
            for (int b = 0; b < k; b++)
                Assert.Equal(expected[a, b], block.Weights[(a * k) + b], 1e-10 * Math.Abs(expected[a, a]));
    }

    [Fact]
    public void ABlockIsTheInverseOfTheCovarianceWithTheComponentsCurrentDeviations()
    {
        var parts = Parts("B1", "GA1", "GA2", 2);
        var net = Net(parts);
        // σ as stated for ΔX, re-weighted by 1.5 for ΔY and by 0.8 for ΔZ: the correlations stay those stated
        var cov = parts[0].Covariance!;
        double[] sd = [Math.Sqrt(cov[0]), 1.5 * Math.Sqrt(cov[4]), 0.8 * Math.Sqrt(cov[8])];
        var blocks = BaselineBlocks.Build(net, sd, 2.5);
        var block = Assert.Single(blocks);
        Assert.Equal([0, 1, 2], block.Rows);
        AssertBlock(Expected(cov, sd, [0, 1, 2], 2.5), block);
        // the stated σ give the stated covariance back: W = Σ⁻¹ (σ0² = 1)
        double[] stated = [Math.Sqrt(cov[0]), Math.Sqrt(cov[4]), Math.Sqrt(cov[8])];
        var weights = BaselineBlocks.Build(net, stated, 1)[0].Weights;
        var w = Matrix<double>.Build.Dense(3, 3, (a, b) => weights[(a * 3) + b]);
        var back = w.Inverse();
        for (int a = 0; a < 3; a++)
            for (int b = 0; b < 3; b++) Assert.Equal(cov[(a * 3) + b], back[a, b], 1e-9 * cov[(a * 3) + a]);
    }

    [Fact]
    public void ComponentsInAnyOrderAreGroupedByTheirBaseline()
    {
        var one = Parts("B1", "GA1", "GA2", 0);
        var two = Parts("B2", "GA2", "GA3", 3);
        var distance = new DistanceObservation("GA1", "GA3", Length.FromMetres(5000)) { Sd = Length.FromMetres(0.01) };
        // interleaved, out of component order, with another kind between them
        Observation[] order = [two[2], one[0], distance, two[0], one[2], one[1], two[1]];
        var net = Net(order);
        double[] sd = [.. order.Select(o => o.Sd!.Value.Si * 1.1)];
        var blocks = BaselineBlocks.Build(net, sd, 1);
        Assert.Equal(2, blocks.Count);
        Assert.Equal([0, 3, 6], blocks[0].Rows); // B2 first: its first row comes first
        Assert.Equal([1, 4, 5], blocks[1].Rows);
        AssertBlock(Expected(two[0].Covariance!, [sd[0], sd[3], sd[6]], [2, 0, 1], 1), blocks[0]);
        AssertBlock(Expected(one[0].Covariance!, [sd[1], sd[4], sd[5]], [0, 2, 1], 1), blocks[1]);
        // the same baseline in the usual order (its components one after another) gives the same weights, permuted
        var sorted = BaselineBlocks.Build(Net(one), [sd[1], sd[5], sd[4]], 1)[0];
        int[] at = [0, 2, 1]; // row of blocks[1] → row of sorted
        for (int a = 0; a < 3; a++)
            for (int b = 0; b < 3; b++)
                Assert.Equal(sorted.Weights[(at[a] * 3) + at[b]], blocks[1].Weights[(a * 3) + b],
                    1e-12 * Math.Abs(sorted.Weights[0]));
    }

    [Fact]
    public void ABaselineOfTwoComponentsGetsATwoByTwoBlock()
    {
        var parts = Parts("B1", "GA1", "GA4", 1);
        var net = Net([parts[0], parts[2]]);
        var cov = parts[0].Covariance!;
        double[] sd = [Math.Sqrt(cov[0]), Math.Sqrt(cov[8])];
        var block = Assert.Single(BaselineBlocks.Build(net, sd, 1));
        AssertBlock(Expected(cov, sd, [0, 2], 1), block);
    }

    public static TheoryData<string> Mismatches =>
        ["repeated next", "repeated apart", "repeated after another baseline", "points", "covariance"];

    [Theory]
    [MemberData(nameof(Mismatches))]
    public void ComponentsOfOneIdThatDoNotBelongTogetherAreRefused(string mismatch)
    {
        var parts = Parts("B1", "GA1", "GA2", 0);
        var distance = new DistanceObservation("GA1", "GA3", Length.FromMetres(5000)) { Sd = Length.FromMetres(0.01) };
        Observation[] obs = mismatch switch
        {
            // the same component twice, one right after the other or apart
            "repeated next" => [parts[0], parts[1], parts[1]],
            "repeated apart" => [parts[0], parts[1], distance, parts[0]],
            "repeated after another baseline" => [parts[0], parts[1], Parts("B2", "GA2", "GA3", 1)[0], parts[1]],
            // the same id and covariance on a baseline to another point
            "points" => [parts[0], parts[1], Parts("B1", "GA1", "GA3", 0)[2]],
            // the same id and points with another covariance
            _ => [parts[0], parts[1], Parts("B1", "GA1", "GA2", 4)[2]],
        };
        var e = Assert.Throws<InvalidInputException>(() => BaselineBlocks.Groups(Net(obs)));
        Assert.Contains("baseline B1 has components that do not belong together", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AModelOfGivenDeviationsAloneIsTheSameAtOtherCoordinates()
    {
        var net = BaselineTestNetworks.Network(seed: 3);
        var moved = new SurveyNetwork(net.Name,
            net.Points.Select(p => p with { E = p.E + 25.0, N = p.N - 40.0, H = p.H + 3.0 }), net.Observations);
        var here = StochasticModel.Build(net, new GivenCoordinates(net), CenteringModel.Independent, 1.0);
        var there = StochasticModel.Build(net, new GivenCoordinates(moved), CenteringModel.Independent, 1.0);
        Assert.False(here.DependsOnCoordinates);
        Assert.Equal(here.StandardDeviations, there.StandardDeviations);
        Assert.Equal(here.Blocks.Count, there.Blocks.Count);
        for (int k = 0; k < here.Blocks.Count; k++)
        {
            Assert.Equal(here.Blocks[k].Rows, there.Blocks[k].Rows);
            Assert.Equal(here.Blocks[k].Weights, there.Blocks[k].Weights);
        }
        Assert.Equal(0, here.LargestChange(there));
    }

    [Fact]
    public void AModelWithSpecificationsDependsOnTheCoordinates()
    {
        // a direction weighted by a total station with a centering error: the centering term of its σ is the
        // centering over the sight length, taken from the coordinates (common practice)
        var ts = new TotalStationSpecification("T", Angle.FromArcseconds(1).Radians, 0, new EdmSpecification(0.002, 2),
            0.002, 0);
        Observation[] obs = [new DirectionObservation("GA1", "GA2", Angle.FromDegrees(74.2), "GA1#1")
            { Weighting = new ObservationWeighting { Instrument = ts } }];
        var net = Net(obs);
        var far = new SurveyNetwork(net.Name, net.Points.Select(p => p.Id == "GA2" ? p with { E = p.E + 20_000 } : p),
            obs);
        var here = StochasticModel.Build(net, new GivenCoordinates(net), CenteringModel.Independent, 1.0);
        var there = StochasticModel.Build(net, new GivenCoordinates(far), CenteringModel.Independent, 1.0);
        Assert.True(here.DependsOnCoordinates);
        // the longer sight has the smaller centering term
        Assert.True(there.StandardDeviations[0] < here.StandardDeviations[0] - 5e-9);
    }
}
