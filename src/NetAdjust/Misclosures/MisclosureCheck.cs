using MathNet.Numerics.Distributions;
using NetAdjust.Network;
using NetAdjust.Stochastic;

namespace NetAdjust.Misclosures;

/// <summary>
/// The checks before the adjustment, from the observations as measured: the misclosure of every level loop, line
/// between benchmarks and section levelled twice, and the angular and linear misclosures of every traverse found in
/// the network. A failing closure names the observations it contains, which localises a blunder before the
/// adjustment runs. Pure computation; nothing is adjusted (docs/methods.md, "Misclosures before the adjustment").
/// </summary>
public static class MisclosureCheck
{
    /// <summary>Finds and checks the closures of a network.</summary>
    /// <param name="network">The network; observations set aside are left out.</param>
    /// <param name="options">The options; null for <see cref="MisclosureOptions.Default"/>.</param>
    /// <returns>The closures found (empty lists when there are none).</returns>
    /// <exception cref="ArgumentOutOfRangeException">When an option is out of range.</exception>
    public static MisclosureReport Run(SurveyNetwork network, MisclosureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(network);
        var o = options ?? MisclosureOptions.Default;
        o.Validate();
        // σ as given, or from the specifications with the sight lengths observed in the setup (no coordinates yet)
        var sd = network.Observations.Select(ProvisionalSd).ToArray();
        double z = Normal.InvCDF(0, 1, 1 - ((1 - o.Confidence) / 2));
        double chi2 = ChiSquared.InvCDF(2, o.Confidence);
        var levels = LevelClosures.Find(network, sd, o, z);
        var traverses = TraverseClosures.Find(network, sd, o, z, chi2);
        return new MisclosureReport(o, levels, traverses)
            { BaselineLoops = NetAdjust.Misclosures.BaselineLoops.Check(network, o.Confidence) };
    }

    /// <summary>
    /// The σ an observation is checked with: as given, or from its specifications with the sight lengths observed
    /// in its setup (as <see cref="StochasticModel.WithProvisionalDeviations"/>); NaN when the specifications give
    /// none (e.g. a sight of zero length), so that its closures are reported without a test instead of failing.
    /// </summary>
    private static double ProvisionalSd(Observation o)
    {
        if (!double.IsNaN(o.StandardDeviation)) return o.StandardDeviation;
        try
        {
            return ObservationBudgets.Provisional(o) is ErrorBudget b ? b.Total * o.SdFactor : double.NaN;
        }
        catch (ArgumentException)
        {
            return double.NaN;
        }
    }
}
