using NetAdjust.Geodesy;
using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Tests.Network;

namespace NetAdjust.Tests.Misclosures;

/// <summary>The checks before the adjustment find the loops of a network's GNSS baselines
/// (docs/methods.md, "Misclosures before the adjustment").</summary>
public class BaselineLoopNetworkTests
{
    [Fact]
    public void NetworkBaselinesAreCheckedAsLoopsOfTheirComponents()
    {
        var net = BaselineTestNetworks.Network(7);
        var loops = MisclosureCheck.Run(net).BaselineLoops;
        // six baselines among four marks: cycle rank 6 − 4 + 1 = 3 (common practice)
        Assert.Equal(3, loops.Count);
        foreach (var loop in loops)
        {
            Assert.Equal(3 * loop.Baselines.Count, loop.Observations.Count);
            double wx = 0, wy = 0, wz = 0;
            for (int k = 0; k < loop.Baselines.Count; k++)
            {
                var parts = loop.Observations.Skip(3 * k).Take(3)
                    .Select(i => (BaselineObservation)net.Observations[i]).ToList();
                Assert.Equal([BaselineComponent.X, BaselineComponent.Y, BaselineComponent.Z],
                    parts.Select(p => p.Component));
                Assert.Single(parts.Select(p => p.BaselineId).Distinct());
                // the loop runs from Points[k] to Points[k + 1]: the vector's sign follows (definition of a loop
                // misclosure, common practice)
                double s = parts[0].From == loop.Points[k] && parts[0].To == loop.Points[k + 1] ? 1 : -1;
                Assert.Equal(loop.Points[k + (s > 0 ? 0 : 1)], parts[0].From);
                wx += s * parts[0].Value;
                wy += s * parts[1].Value;
                wz += s * parts[2].Value;
            }
            Assert.Equal(wx, loop.Dx, 9);
            Assert.Equal(wy, loop.Dy, 9);
            Assert.Equal(wz, loop.Dz, 9);
            Assert.True(double.IsFinite(loop.Up)); // positions from the approximate coordinates and the projection
        }
    }

    [Fact]
    public void FiveCentimetreUpBlunderFailsTheLoopsThatHoldItInUp()
    {
        // 5 cm along the local up of GA1 on the baseline GA1→GA2 (issue #19's blunder case)
        var t = BaselineTestNetworks.Truth[0];
        var (lat, lon) = BaselineTestNetworks.Utm33.Inverse(t.E, t.N);
        double[] r = Geocentric.LocalRotation(lat, lon);
        var net = BaselineTestNetworks.Network(7, bias: (0, 0.05 * r[6], 0.05 * r[7], 0.05 * r[8]));
        var loops = MisclosureCheck.Run(net).BaselineLoops;
        var holding = loops.Where(l => l.Baselines.Contains(0)).ToList();
        Assert.NotEmpty(holding);
        Assert.All(holding, l =>
        {
            Assert.False(l.Passed);
            // the misclosure lies in up: 5 cm (± the noise of a few mm), far more than east or north
            Assert.InRange(Math.Abs(l.Up), 0.035, 0.065);
            Assert.True(Math.Abs(l.Up) > 3 * Math.Max(Math.Abs(l.East), Math.Abs(l.North)));
        });
    }

    [Fact]
    public void BaselineWithAComponentSetAsideIsLeftOut()
    {
        var net = BaselineTestNetworks.Network(7);
        var obs = net.Observations.ToList();
        int k = obs.FindIndex(o => o is BaselineObservation { Component: BaselineComponent.Y });
        obs[k] = obs[k] with { Excluded = true };
        var loops = MisclosureCheck.Run(new SurveyNetwork(net.Name, net.Points, obs)).BaselineLoops;
        Assert.Equal(5 - 4 + 1, loops.Count);
        Assert.All(loops, l => Assert.DoesNotContain(k, l.Observations));
    }
}
