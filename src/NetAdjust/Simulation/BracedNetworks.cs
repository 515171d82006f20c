using MathNet.Numerics.Distributions;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// Small braced networks simulated from a chosen truth, for the statistical tests (invented data): two held control
/// points, free points, direction sets and distances between all (or randomly chosen) pairs; and level networks.
/// Noise is N(0, σ²) per observation from a seeded generator (MathNet's normal sampler).
/// </summary>
internal static class BracedNetworks
{
    public const double DirectionSd = 3.0 / 206264.80624709636; // 3″
    public const double DistanceSd = 0.003;                     // 3 mm
    public const double HeightSd = 0.002;                       // 2 mm

    public sealed record Truth(Dictionary<string, (double E, double N)> Plane, Dictionary<string, double> Height);

    /// <summary>A small horizontal network: control A, B; free points P1..Pk placed by the generator.</summary>
    public static (SurveyNetwork Network, Truth Truth) Horizontal(int seed, int freePoints, double noise = 1.0,
        bool allPairs = true, double pairProbability = 1.0, int? noiseSeed = null, double? distanceNoise = null,
        Func<double, double>? distanceTrueSd = null)
    {
        var rnd = new Random(seed);
        var noiseRnd = noiseSeed is int ns ? new Random(ns) : rnd;
        var plane = new Dictionary<string, (double E, double N)>(StringComparer.Ordinal)
        {
            ["A"] = (1000.0, 2000.0),
            ["B"] = (1900.0, 2250.0),
        };
        for (int k = 1; k <= freePoints; k++)
        {
            (double E, double N) p;
            do p = (800 + (rnd.NextDouble() * 1300), 1700 + (rnd.NextDouble() * 1000));
            while (plane.Values.Any(q => Math.Sqrt(Math.Pow(q.E - p.E, 2) + Math.Pow(q.N - p.N, 2)) < 150));
            plane[$"P{k}"] = p;
        }
        var ids = plane.Keys.ToList();
        var points = new List<Point>
        {
            new("A") { E = plane["A"].E, N = plane["A"].N, Fixed = Fixity.EN },
            new("B") { E = plane["B"].E, N = plane["B"].N, Fixed = Fixity.EN },
        };
        foreach (var id in ids.Skip(2))
            points.Add(new Point(id) { E = plane[id].E + 0.05, N = plane[id].N - 0.04 });

        var obs = new List<Observation>();
        double Gauss() => Normal.Sample(noiseRnd, 0, 1);
        foreach (var at in ids)
        {
            double orientation = rnd.NextDouble() * 2 * Math.PI;
            foreach (var to in ids)
            {
                if (to == at) continue;
                bool controlPair = at is "A" or "B" || to is "A" or "B";
                if (!controlPair && !allPairs && rnd.NextDouble() > pairProbability) continue;
                double az = Math.Atan2(plane[to].E - plane[at].E, plane[to].N - plane[at].N);
                double reading = Angle.Reduce0To2Pi(az - orientation + (noise * DirectionSd * Gauss()));
                obs.Add(new DirectionObservation(at, to, Angle.FromRadians(reading), at + "/1")
                    { StandardDeviation = DirectionSd });
                if (string.CompareOrdinal(at, to) < 0 && !(at == "A" && to == "B"))
                {
                    double d = Math.Sqrt(
                        Math.Pow(plane[to].E - plane[at].E, 2) + Math.Pow(plane[to].N - plane[at].N, 2));
                    double trueSd = distanceTrueSd?.Invoke(d) ?? ((distanceNoise ?? noise) * DistanceSd);
                    obs.Add(new DistanceObservation(at, to, Length.FromMetres(d + (trueSd * Gauss())))
                        { StandardDeviation = DistanceSd });
                }
            }
        }
        return (new SurveyNetwork("simulated", points, obs), new Truth(plane, new Dictionary<string, double>()));
    }

    /// <summary>A level network: benchmark BM0 held, BM1..BMk free, a chain plus random cross sections.</summary>
    public static (SurveyNetwork Network, Truth Truth) Levelling(
        int seed, int benchmarks, int extraSections, double noise = 1.0)
    {
        var rnd = new Random(seed);
        var h = new Dictionary<string, double>(StringComparer.Ordinal);
        for (int k = 0; k <= benchmarks; k++) h[$"BM{k}"] = 50 + (rnd.NextDouble() * 20);
        var points = h.Keys
            .Select(id => id == "BM0" ? new Point(id) { H = h[id], Fixed = Fixity.H } : new Point(id)).ToList();
        var obs = new List<Observation>();
        void Section(string a, string b)
        {
            double sd = HeightSd * (0.5 + rnd.NextDouble());
            var dh = Length.FromMetres(h[b] - h[a] + (noise * sd * Normal.Sample(rnd, 0, 1)));
            obs.Add(new HeightDifferenceObservation(a, b, dh) { StandardDeviation = sd });
        }
        for (int k = 1; k <= benchmarks; k++) Section($"BM{k - 1}", $"BM{k}");
        for (int x = 0; x < extraSections; x++)
        {
            int a = rnd.Next(benchmarks + 1), b = rnd.Next(benchmarks + 1);
            if (a != b) Section($"BM{a}", $"BM{b}");
        }
        return (new SurveyNetwork("levels", points, obs), new Truth(new(), h));
    }

    /// <summary>The network with observation i changed by a bias (m or rad).</summary>
    public static SurveyNetwork WithBias(SurveyNetwork net, int i, double bias)
    {
        var obs = net.Observations.ToArray();
        obs[i] = obs[i] switch
        {
            DistanceObservation d => d with { Distance = Length.FromMetres(d.Distance.Metres + bias) },
            DirectionObservation d => d with { Reading = Angle.FromRadians(d.Reading.Radians + bias) },
            HeightDifferenceObservation d => d with { Difference = Length.FromMetres(d.Difference.Metres + bias) },
            AngleObservation d => d with { Measured = Angle.FromRadians(d.Measured.Radians + bias) },
            AzimuthObservation d => d with { Azimuth = Angle.FromRadians(d.Azimuth.Radians + bias) },
            _ => throw new InvalidOperationException(),
        };
        return new SurveyNetwork(net.Name, net.Points, obs);
    }
}
