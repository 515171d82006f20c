using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Simulation;

/// <summary>
/// Seeded generator of realistic synthetic networks for benchmarks, tests and demonstrations: points on a jittered
/// square grid (spacing <see cref="SyntheticNetworkSpec.Spacing"/>), each joined to its nearest neighbours;
/// observations simulated from the chosen truth with Gaussian noise of their stated standard deviation;
/// approximate coordinates offset from the truth. Same seed, same network, on every machine.
/// </summary>
/// <remarks>
/// Plane networks: per point one direction set to its <see cref="SyntheticNetworkSpec.Neighbours"/> nearest points
/// (σ = 1″), and a distance to each of them measured once per pair (σ = 2 mm + 2 ppm); three unknowns per point
/// (E, N, orientation), about 9 observations per point with 6 neighbours. Level networks: a height difference per
/// neighbour pair (σ = 1 mm/√km). Every <see cref="SyntheticNetworkSpec.ControlEvery"/>-th point (at least two) is
/// held.
/// </remarks>
public static class SyntheticNetworks
{
    /// <summary>Makes a network.</summary>
    /// <param name="spec">What to make.</param>
    /// <exception cref="ArgumentException">When the specification is out of range.</exception>
    public static SurveyNetwork Create(SyntheticNetworkSpec spec)
    {
        if (spec.Points < 3) throw new ArgumentException("a synthetic network needs at least 3 points");
        if (spec.Neighbours < 2 || spec.Neighbours >= spec.Points)
            throw new ArgumentException("neighbours must be at least 2 and fewer than the points");
        if (!(spec.Spacing > 0)) throw new ArgumentException("the spacing must be positive");
        if (spec.ControlEvery < 1) throw new ArgumentException("the control interval must be at least 1");

        var rng = new Random(spec.Seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        int n = spec.Points;
        int side = (int)Math.Ceiling(Math.Sqrt(n));
        var e = new double[n];
        var nn = new double[n];
        var h = new double[n];
        for (int i = 0; i < n; i++)
        {
            e[i] = 100_000 + ((i % side) * spec.Spacing) + ((rng.NextDouble() - 0.5) * 0.6 * spec.Spacing);
            nn[i] = 500_000 + ((i / side) * spec.Spacing) + ((rng.NextDouble() - 0.5) * 0.6 * spec.Spacing);
            h[i] = 50 + (20 * Math.Sin(e[i] / 3000.0)) + (15 * Math.Cos(nn[i] / 2500.0)) + rng.NextDouble();
        }
        string Id(int i) => "Q" + (i + 1).ToString("D6", System.Globalization.CultureInfo.InvariantCulture);
        var control = new bool[n];
        int controls = 0;
        for (int i = 0; i < n; i += spec.ControlEvery) { control[i] = true; controls++; }
        if (controls < 2) control[n - 1] = true;

        var points = new Point[n];
        for (int i = 0; i < n; i++)
        {
            if (spec.Kind == SyntheticNetworkKind.Plane)
                points[i] = control[i]
                    ? new Point(Id(i)) { E = Math.Round(e[i], 4), N = Math.Round(nn[i], 4), Fixed = Fixity.EN }
                    : new Point(Id(i)) { E = Math.Round(e[i] + (Gauss() * spec.ApproximateOffset), 3),
                        N = Math.Round(nn[i] + (Gauss() * spec.ApproximateOffset), 3) };
            else
                points[i] = control[i]
                    ? new Point(Id(i)) { E = Math.Round(e[i], 1), N = Math.Round(nn[i], 1), H = Math.Round(h[i], 4),
                        Fixed = Fixity.H }
                    : new Point(Id(i)) { E = Math.Round(e[i], 1), N = Math.Round(nn[i], 1) };
        }

        var neighbours = NearestNeighbours(e, nn, spec.Neighbours, spec.Spacing);
        var obs = new List<Observation>(n * (spec.Neighbours + (spec.Neighbours / 2) + 1));
        double sDir = 1.0 / Angle.ArcsecondsPerRadian;
        for (int i = 0; i < n; i++)
        {
            if (spec.Kind == SyntheticNetworkKind.Plane)
            {
                double zero = rng.NextDouble() * 2 * Math.PI;
                foreach (int j in neighbours[i])
                {
                    double az = Math.Atan2(e[j] - e[i], nn[j] - nn[i]);
                    double reading = Angle.Reduce0To2Pi(az - zero + (Gauss() * sDir));
                    obs.Add(new DirectionObservation(Id(i), Id(j), Angle.FromRadians(Math.Round(reading, 9)),
                        Id(i) + "/1") { StandardDeviation = sDir });
                }
            }
            foreach (int j in neighbours[i])
            {
                // each pair once: from the lower index, or when i is not among j's neighbours
                if (j < i && neighbours[j].Contains(i)) continue;
                double d = Math.Sqrt(((e[j] - e[i]) * (e[j] - e[i])) + ((nn[j] - nn[i]) * (nn[j] - nn[i])));
                if (spec.Kind == SyntheticNetworkKind.Plane)
                {
                    double sd = 0.002 + (2e-6 * d);
                    obs.Add(new DistanceObservation(Id(i), Id(j),
                        Length.FromMetres(Math.Round(d + (Gauss() * sd), 5))) { StandardDeviation = sd });
                }
                else
                {
                    double sd = 0.001 * Math.Sqrt(d / 1000.0);
                    obs.Add(new HeightDifferenceObservation(Id(i), Id(j),
                        Length.FromMetres(Math.Round(h[j] - h[i] + (Gauss() * sd), 6)),
                        Length.FromMetres(Math.Round(d, 1))) { StandardDeviation = sd });
                }
            }
        }
        return new SurveyNetwork(spec.Name ??
            $"synthetic {spec.Kind.ToString().ToLowerInvariant()} network of {n} points (seed {spec.Seed})", points,
            obs);
    }

    /// <summary>The k nearest other points of each point, by a bucket grid (O(n k) expected).</summary>
    private static int[][] NearestNeighbours(double[] x, double[] y, int k, double spacing)
    {
        int n = x.Length;
        double minX = x.Min(), minY = y.Min();
        int cols = (int)((x.Max() - minX) / spacing) + 1, rows = (int)((y.Max() - minY) / spacing) + 1;
        var bucketStart = new int[(cols * rows) + 1];
        int Cell(int i) => ((int)((y[i] - minY) / spacing) * cols) + (int)((x[i] - minX) / spacing);
        for (int i = 0; i < n; i++) bucketStart[Cell(i) + 1]++;
        for (int c = 0; c < cols * rows; c++) bucketStart[c + 1] += bucketStart[c];
        var bucket = new int[n];
        var put = (int[])bucketStart.Clone();
        for (int i = 0; i < n; i++) bucket[put[Cell(i)]++] = i;

        var result = new int[n][];
        var cand = new List<(double D, int J)>();
        for (int i = 0; i < n; i++)
        {
            int cx = (int)((x[i] - minX) / spacing), cy = (int)((y[i] - minY) / spacing);
            for (int r = 1; ; r++)
            {
                cand.Clear();
                for (int gy = Math.Max(0, cy - r); gy <= Math.Min(rows - 1, cy + r); gy++)
                    for (int gx = Math.Max(0, cx - r); gx <= Math.Min(cols - 1, cx + r); gx++)
                        for (int t = bucketStart[(gy * cols) + gx]; t < bucketStart[(gy * cols) + gx + 1]; t++)
                        {
                            int j = bucket[t];
                            if (j != i)
                                cand.Add((((x[j] - x[i]) * (x[j] - x[i])) + ((y[j] - y[i]) * (y[j] - y[i])), j));
                        }
                // Enough candidates, and the k-th lies within the searched square's inscribed radius: exact.
                cand.Sort();
                bool all = cx - r <= 0 && cy - r <= 0 && cx + r >= cols - 1 && cy + r >= rows - 1;
                if (cand.Count >= k && (all || cand[k - 1].D <= Math.Pow(r * spacing, 2))) break;
            }
            result[i] = cand.Take(k).Select(c => c.J).ToArray();
        }
        return result;
    }
}
