using NetAdjust.Network;
using NetAdjust.Simulation;

namespace NetAdjust.Tests.Statistics;

/// <summary>Simulated networks (invented data exercising invariants only) with one observation set aside, for the
/// statistics tests that must cover an observation without weight.</summary>
internal static class SetAsideNetworks
{
    /// <summary>A seeded plane network of <paramref name="points"/> points with observation
    /// <paramref name="setAside"/> set aside.</summary>
    public static SurveyNetwork Plane(int points, int seed, int setAside)
    {
        var net = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, points, Seed: seed));
        var obs = net.Observations.ToArray();
        obs[setAside] = obs[setAside] with { Excluded = true };
        return new SurveyNetwork(net.Name, net.Points, obs);
    }
}
