using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>A simulated network and the truth it was simulated from (E, N, H of every point, metres).</summary>
/// <param name="Network">The network: observations drawn from the truth with Gaussian noise of their σ.</param>
/// <param name="Truth">The true coordinates of every point, by id.</param>
internal sealed record SimulatedNetwork(
    SurveyNetwork Network, IReadOnlyDictionary<string, (double E, double N, double H)> Truth);

/// <summary>
/// Seeded small networks on a jittered grid, for tests of invariants and oracles (invented data): points 200 m apart,
/// each station with one direction set (σ = 2″) to its four nearest points and distances to them
/// (σ = 2 mm + 2 ppm), optionally height differences along the same lines (σ = 1 mm) and one observed azimuth
/// (σ = 3″). Noise is drawn from <see cref="Random"/> by the Box–Muller transform; same seed, same network.
/// </summary>
internal static class GridNetworks
{
    /// <summary>Where the grid lies and how its points are named.</summary>
    /// <param name="OriginE">Easting of the first grid node, m.</param>
    /// <param name="OriginN">Northing of the first grid node, m.</param>
    /// <param name="IdPrefix">The letter before the grid indices of a point id.</param>
    /// <param name="Name">The network's name; null for one made from the seed.</param>
    internal sealed record Layout(
        double OriginE = 3000, double OriginN = 7000, string IdPrefix = "Q", string? Name = null);

    /// <param name="seed">Random seed.</param>
    /// <param name="side">Grid side (side² points).</param>
    /// <param name="control">Which point indices are control, with their fixity.</param>
    /// <param name="approx">
    /// Approximate coordinates of the other points: null = none given; otherwise the truth offset by up to this (m).
    /// </param>
    /// <param name="levelling">Add height differences.</param>
    /// <param name="azimuth">Add one observed azimuth (removes the rotation defect).</param>
    /// <param name="disturb">A control point whose given coordinates are moved (dE, dN) from the truth.</param>
    /// <param name="noise">Scale of the observation noise (0 for exact observations).</param>
    /// <param name="distances">Include the distances (without them and an azimuth, scale is a defect too).</param>
    /// <param name="layout">Origin, point names and network name; null for the default layout.</param>
    public static SimulatedNetwork Grid(int seed, int side, IReadOnlyDictionary<int, Fixity> control,
        double? approx = 0.05, bool levelling = false, bool azimuth = false,
            (int Index, double DE, double DN)? disturb = null,
        double noise = 1.0, bool distances = true, Layout? layout = null)
    {
        layout ??= new Layout();
        var rng = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var truth = new List<(string Id, double E, double N, double H)>();
        for (int i = 0; i < side; i++)
            for (int j = 0; j < side; j++)
                truth.Add((side <= 10 ? $"{layout.IdPrefix}{i}{j}" : $"{layout.IdPrefix}{i}_{j}",
                    layout.OriginE + (i * 200) + (rng.NextDouble() * 60),
                    layout.OriginN + (j * 200) + (rng.NextDouble() * 60),
                    50 + (rng.NextDouble() * 20)));
        var points = new List<Point>();
        for (int k = 0; k < truth.Count; k++)
        {
            var t = truth[k];
            if (control.TryGetValue(k, out var fix))
            {
                double de = disturb is { } d && d.Index == k ? d.DE : 0;
                double dn = disturb is { } d2 && d2.Index == k ? d2.DN : 0;
                double? h = (fix & Fixity.H) != 0 ? t.H : null;
                points.Add(new Point(t.Id) { E = t.E + de, N = t.N + dn, H = h, Fixed = fix });
            }
            else
            {
                // Draw the offsets in every case, so that the observations do not depend on the approximations chosen.
                double ue = (rng.NextDouble() - 0.5) * 2, un = (rng.NextDouble() - 0.5) * 2;
                points.Add(approx is double off
                    ? new Point(t.Id) { E = t.E + (ue * off), N = t.N + (un * off) } : new Point(t.Id));
            }
        }
        var obs = new List<Observation>();
        double sDir = 2 / Angle.ArcsecondsPerRadian;
        foreach (var st in truth)
        {
            var near = truth.Where(t => t.Id != st.Id)
                .OrderBy(t => Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2)).Take(4).ToList();
            double zero = rng.NextDouble() * 2 * Math.PI;
            foreach (var t in near)
            {
                double az = Math.Atan2(t.E - st.E, t.N - st.N);
                var reading = Angle.FromRadians(Angle.Reduce0To2Pi(az - zero + (noise * Gauss() * sDir)));
                obs.Add(new DirectionObservation(st.Id, t.Id, reading, st.Id + "/1") { StandardDeviation = sDir });
                if (string.CompareOrdinal(st.Id, t.Id) < 0)
                {
                    double dist = Math.Sqrt(Math.Pow(t.E - st.E, 2) + Math.Pow(t.N - st.N, 2));
                    double sd = 0.002 + (2e-6 * dist);
                    double dd = dist + (noise * Gauss() * sd);
                    if (distances)
                        obs.Add(new DistanceObservation(st.Id, t.Id, Length.FromMetres(dd)) { StandardDeviation = sd });
                    if (levelling)
                    {
                        var dh = Length.FromMetres(t.H - st.H + (noise * Gauss() * 0.001));
                        obs.Add(new HeightDifferenceObservation(st.Id, t.Id, dh) { StandardDeviation = 0.001 });
                    }
                }
            }
        }
        if (azimuth)
        {
            var a = truth[0];
            var b = truth[1];
            double sAz = 3 / Angle.ArcsecondsPerRadian;
            double value = Angle.Reduce0To2Pi(Math.Atan2(b.E - a.E, b.N - a.N) + (noise * Gauss() * sAz));
            obs.Add(new AzimuthObservation(a.Id, b.Id, Angle.FromRadians(value)) { StandardDeviation = sAz });
        }
        return new SimulatedNetwork(new SurveyNetwork(layout.Name ?? $"datum test {seed}", points, obs),
            truth.ToDictionary(t => t.Id, t => (t.E, t.N, t.H)));
    }

    /// <summary>Control: point 0 held in E, N (and H when levelling), point <paramref name="last"/> in E, N.</summary>
    public static Dictionary<int, Fixity> TwoHeld(int last, bool levelling) =>
        new() { [0] = levelling ? Fixity.ENH : Fixity.EN, [last] = Fixity.EN };

    /// <summary>
    /// A grid of side² points named P00, P01, ... from (1000, 5000): P00 held in E, N and H, P01 in E and N, the
    /// others given approximate coordinates within <paramref name="approxOffset"/> of the truth.
    /// </summary>
    public static SurveyNetwork Horizontal(int seed, int side = 3, double approxOffset = 0.05, bool levelling = false)
        =>
        Grid(seed, side, new Dictionary<int, Fixity> { [0] = Fixity.ENH, [1] = Fixity.EN }, approxOffset, levelling,
            layout: new Layout(1000, 5000, "P", $"random {seed}")).Network;
}
