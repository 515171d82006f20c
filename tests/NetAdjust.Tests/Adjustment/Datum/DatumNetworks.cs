using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Datum;

/// <summary>
/// Seeded simulated networks for the datum tests (invented data: they exercise invariants and oracles only).
/// A jittered grid of points 200 m apart; each station has one direction set to its four nearest points and
/// distances to them; optionally height differences along the same lines and an observed azimuth.
/// </summary>
internal static class DatumNetworks
{
    public sealed record Sim(SurveyNetwork Network, IReadOnlyDictionary<string, (double E, double N, double H)> Truth);

    /// <param name="seed">Random seed.</param>
    /// <param name="side">Grid side (side² points).</param>
    /// <param name="control">Which point indices are control, with their fixity.</param>
    /// <param name="approx">Approximate coordinates of the other points: null = none given; otherwise the truth offset by up to this (m).</param>
    /// <param name="levelling">Add height differences.</param>
    /// <param name="azimuth">Add one observed azimuth (removes the rotation defect).</param>
    /// <param name="disturb">A control point whose given coordinates are moved (dE, dN) from the truth.</param>
    /// <param name="noise">Scale of the observation noise (0 for exact observations).</param>
    /// <param name="distances">Include the distances (without them, and without an azimuth, scale is a defect too).</param>
    public static Sim Grid(int seed, int side, IReadOnlyDictionary<int, Fixity> control, double? approx = 0.05, bool levelling = false,
        bool azimuth = false, (int Index, double DE, double DN)? disturb = null, double noise = 1.0, bool distances = true)
    {
        var rng = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var truth = new List<(string Id, double E, double N, double H)>();
        for (int i = 0; i < side; i++)
            for (int j = 0; j < side; j++)
                truth.Add((side <= 10 ? $"Q{i}{j}" : $"Q{i}_{j}", 3000 + (i * 200) + (rng.NextDouble() * 60), 7000 + (j * 200) + (rng.NextDouble() * 60), 50 + (rng.NextDouble() * 20)));
        var points = new List<Point>();
        for (int k = 0; k < truth.Count; k++)
        {
            var t = truth[k];
            if (control.TryGetValue(k, out var fix))
            {
                double de = disturb is { } d && d.Index == k ? d.DE : 0, dn = disturb is { } d2 && d2.Index == k ? d2.DN : 0;
                points.Add(new Point(t.Id) { E = t.E + de, N = t.N + dn, H = (fix & Fixity.H) != 0 ? t.H : null, Fixed = fix });
            }
            else
            {
                // Draw the offsets in every case, so that the observations do not depend on the approximations chosen.
                double ue = (rng.NextDouble() - 0.5) * 2, un = (rng.NextDouble() - 0.5) * 2;
                points.Add(approx is double off ? new Point(t.Id) { E = t.E + (ue * off), N = t.N + (un * off) } : new Point(t.Id));
            }
        }
        var obs = new List<Observation>();
        double sDir = 2 / Angle.ArcsecondsPerRadian;
        foreach (var st in truth)
        {
            var near = truth.Where(t => t.Id != st.Id).OrderBy(t => Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2)).Take(4).ToList();
            double zero = rng.NextDouble() * 2 * Math.PI;
            foreach (var t in near)
            {
                double az = Math.Atan2(t.E - st.E, t.N - st.N);
                obs.Add(new DirectionObservation(st.Id, t.Id, Angle.FromRadians(Angle.Reduce0To2Pi(az - zero + (noise * Gauss() * sDir))), st.Id + "/1") { StandardDeviation = sDir });
                if (string.CompareOrdinal(st.Id, t.Id) < 0)
                {
                    double dist = Math.Sqrt(Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2));
                    double sd = 0.002 + (2e-6 * dist);
                    double dd = dist + (noise * Gauss() * sd);
                    if (distances) obs.Add(new DistanceObservation(st.Id, t.Id, Length.FromMetres(dd)) { StandardDeviation = sd });
                    if (levelling)
                        obs.Add(new HeightDifferenceObservation(st.Id, t.Id, Length.FromMetres(t.H - st.H + (noise * Gauss() * 0.001))) { StandardDeviation = 0.001 });
                }
            }
        }
        if (azimuth)
        {
            var a = truth[0];
            var b = truth[1];
            double sAz = 3 / Angle.ArcsecondsPerRadian;
            obs.Add(new AzimuthObservation(a.Id, b.Id, Angle.FromRadians(Angle.Reduce0To2Pi(Math.Atan2(b.E - a.E, b.N - a.N) + (noise * Gauss() * sAz)))) { StandardDeviation = sAz });
        }
        return new Sim(new SurveyNetwork($"datum test {seed}", points, obs), truth.ToDictionary(t => t.Id, t => (t.E, t.N, t.H)));
    }

    /// <summary>Control: point 0 held in E, N (and H when levelling), point <paramref name="last"/> in E and N.</summary>
    public static Dictionary<int, Fixity> TwoHeld(int last, bool levelling) => new() { [0] = levelling ? Fixity.ENH : Fixity.EN, [last] = Fixity.EN };
}
