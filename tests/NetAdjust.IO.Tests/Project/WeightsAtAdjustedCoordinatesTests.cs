using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The weights do not depend on the approximate coordinates: sight lengths for centering terms and the centering
/// sensitivities are taken from the adjustment's coordinates (docs/methods.md). The two demo files describe the
/// same survey, one with approximate coordinates of the new points and one without.
/// </summary>
public class WeightsAtAdjustedCoordinatesTests
{
    private static SurveyProject Read(string name) =>
        ProjectReader.Read(Path.Combine(StochasticProjectTests.DataDirectory(), name));

    private static AdjustmentResult Adjust(SurveyProject p, CenteringModel centering) =>
        Adjuster.Adjust(p.Network, p.Options with { Centering = centering });

    [Theory]
    [InlineData(CenteringModel.Independent)]
    [InlineData(CenteringModel.Correlated)]
    public void With_and_without_approximate_coordinates_give_the_same_vtpv(CenteringModel centering)
    {
        // Regression (defect): the reader weighted directions with sight lengths from the given approximate
        // coordinates, so the two files gave vTPv 2.0155 and 2.0154. The least-squares solution must not depend on
        // where the iterations started (common practice), so the agreement is to the convergence tolerance.
        var given = Adjust(Read("brackenmoor.yaml"), centering);
        var auto = Adjust(Read("brackenmoor-auto.yaml"), centering);
        Assert.Equal(1.0, auto.Statistics.Vtpv / given.Statistics.Vtpv, 1e-9);
    }

    [Fact]
    public void Correlated_centering_covers_the_setups_at_points_without_coordinates()
    {
        // Regression (defect): with 'centering: correlated' the observations at points given no coordinates kept
        // diagonal weights (same vTPv as independent weights) while the report said they were correlated.
        var p = Read("brackenmoor-auto.yaml");
        var independent = Adjust(p, CenteringModel.Independent);
        var correlated = Adjust(p, CenteringModel.Correlated);
        var reference = Adjust(Read("brackenmoor.yaml"), CenteringModel.Correlated);
        Assert.NotEqual(independent.Statistics.Vtpv, correlated.Statistics.Vtpv, 6);
        int setups = p.Network.Observations.Where(o => o.SetupId is not null).Select(o => o.SetupId).Distinct().Count();
        Assert.Equal(setups, correlated.Weights.Blocks.Count(b => b.Size > 1));
        Assert.Equal(reference.Weights.Blocks.Count(b => b.Size > 1), correlated.Weights.Blocks.Count(b => b.Size > 1));
    }
}
