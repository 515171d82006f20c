using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests;

/// <summary>Seeded random test networks (not published data: these exercise invariants and oracles only).</summary>
internal static class TestNetworks
{
    /// <summary>
    /// A random horizontal network: a jittered grid of points, two held, each joined to its neighbours by
    /// distances and one direction set per station, observations perturbed by Gaussian noise of their σ.
    /// Approximate coordinates are the truth offset by up to <paramref name="approxOffset"/> metres.
    /// </summary>
    public static SurveyNetwork Horizontal(int seed, int side = 3, double approxOffset = 0.05, bool levelling = false)
    {
        var rng = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var truth = new List<(string Id, double E, double N, double H)>();
        for (int i = 0; i < side; i++)
            for (int j = 0; j < side; j++)
                truth.Add(($"P{i}{j}", 1000 + (i * 200) + (rng.NextDouble() * 60), 5000 + (j * 200) + (rng.NextDouble() * 60), 100 + (rng.NextDouble() * 20)));
        var points = truth.Select((t, k) => k < 2
            ? new Point(t.Id) { E = t.E, N = t.N, H = k == 0 ? t.H : null, Fixed = k == 0 ? Fixity.ENH : Fixity.EN }
            : new Point(t.Id) { E = t.E + ((rng.NextDouble() - 0.5) * 2 * approxOffset), N = t.N + ((rng.NextDouble() - 0.5) * 2 * approxOffset) }).ToList();
        var obs = new List<Observation>();
        double sDir = 2 / Angle.ArcsecondsPerRadian;
        foreach (var st in truth)
        {
            var near = truth.Where(t => t.Id != st.Id).OrderBy(t => Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2)).Take(4).ToList();
            double zero = rng.NextDouble() * 2 * Math.PI;
            foreach (var t in near)
            {
                double az = Math.Atan2(t.E - st.E, t.N - st.N);
                obs.Add(new DirectionObservation(st.Id, t.Id, Angle.FromRadians(Angle.Reduce0To2Pi(az - zero + (Gauss() * sDir))), st.Id + "/1") { StandardDeviation = sDir });
                if (string.CompareOrdinal(st.Id, t.Id) < 0)
                {
                    double d = Math.Sqrt(Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2));
                    double sd = 0.002 + (2e-6 * d);
                    obs.Add(new DistanceObservation(st.Id, t.Id, Length.FromMetres(d + (Gauss() * sd))) { StandardDeviation = sd });
                    if (levelling)
                        obs.Add(new HeightDifferenceObservation(st.Id, t.Id, Length.FromMetres(t.H - st.H + (Gauss() * 0.001))) { StandardDeviation = 0.001 });
                }
            }
        }
        return new SurveyNetwork($"random {seed}", points, obs);
    }
}
