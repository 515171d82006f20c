using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Geodesy;
using NetAdjust.Misclosures;

namespace NetAdjust.Tests.Misclosures;

/// <summary>Loops of GNSS baselines before the adjustment (docs/methods.md, "Misclosures before the adjustment").
/// </summary>
public class BaselineLoopsTests
{
    private const double Deg = Math.PI / 180;
    private static readonly Ellipsoid Grs80 = Ellipsoid.Grs80;

    // Invented marks about 3 to 5 km apart near 47°N 8°E, heights in metres above the ellipsoid.
    private static readonly Dictionary<string, (double Lat, double Lon, double H)> Marks = new()
    {
        ["A"] = (47.00 * Deg, 8.00 * Deg, 450),
        ["B"] = (47.03 * Deg, 8.02 * Deg, 520),
        ["C"] = (47.01 * Deg, 8.06 * Deg, 610),
        ["D"] = (46.98 * Deg, 8.04 * Deg, 480),
    };

    private static (double Lat, double Lon)? Position(string id) =>
        Marks.TryGetValue(id, out var p) ? (p.Lat, p.Lon) : null;

    private static (double X, double Y, double Z) Xyz(string id) =>
        Geocentric.ToGeocentric(Grs80, Marks[id].Lat, Marks[id].Lon, Marks[id].H);

    /// <summary>3 mm + 0.5 ppm horizontal and twice that vertical (common practice for static baselines), turned
    /// into an earth-centred covariance at the start point, with no correlation in the local frame.</summary>
    private static double[] Covariance(string from, double length)
    {
        double sh = 0.003 + 0.5e-6 * length, sv = 2 * sh;
        double[] r = Geocentric.LocalRotation(Marks[from].Lat, Marks[from].Lon);
        var rm = Matrix<double>.Build.Dense(3, 3, (i, j) => r[3 * i + j]);
        var local = Matrix<double>.Build.DenseOfDiagonalArray([sh * sh, sh * sh, sv * sv]);
        var c = rm.Transpose() * local * rm;
        return [.. c.ToRowMajorArray()];
    }

    /// <summary>An exact baseline from the marks' positions, plus an error given in the earth-centred frame.</summary>
    private static BaselineVector Baseline(string from, string to, string? group, double ex = 0, double ey = 0,
        double ez = 0)
    {
        var (x1, y1, z1) = Xyz(from);
        var (x2, y2, z2) = Xyz(to);
        double dx = x2 - x1, dy = y2 - y1, dz = z2 - z1;
        double length = Math.Sqrt(dx * dx + dy * dy + dz * dz);
        return new BaselineVector(from, to, dx + ex, dy + ey, dz + ez, Covariance(from, length), group,
            $"{from}-{to} {group}");
    }

    private static List<BaselineLoop> Find(IReadOnlyList<BaselineVector> v, double confidence = 0.95) =>
        BaselineLoops.Find(v, Grs80, Position, confidence);

    [Fact]
    public void TriangleMisclosureIsTheSumOfTheVectorsInPpmAndInEastNorthUp()
    {
        // A known misclosure put on B→C, given in east, north, up at the loop's mean position: 10, −6, 24 mm.
        var (xa, ya, za) = Xyz("A");
        var (xb, yb, zb) = Xyz("B");
        var (xc, yc, zc) = Xyz("C");
        // mean position: the mean of the three marks projected to the ellipsoid (h = 0), as documented
        var a0 = Geocentric.ToGeocentric(Grs80, Marks["A"].Lat, Marks["A"].Lon, 0);
        var b0 = Geocentric.ToGeocentric(Grs80, Marks["B"].Lat, Marks["B"].Lon, 0);
        var c0 = Geocentric.ToGeocentric(Grs80, Marks["C"].Lat, Marks["C"].Lon, 0);
        double mx = (a0.X + b0.X + c0.X) / 3, my = (a0.Y + b0.Y + c0.Y) / 3, mz = (a0.Z + b0.Z + c0.Z) / 3;
        // geodetic latitude of the mean point (Bowring's single step is far better than needed here, from memory)
        double p = Math.Sqrt(mx * mx + my * my), lon = Math.Atan2(my, mx);
        double lat = Math.Atan2(mz, p * (1 - Grs80.EccentricitySquared));
        // east, north, up unit vectors written out (common practice), misclosure w = R^T [e, n, u]
        double[] east = [-Math.Sin(lon), Math.Cos(lon), 0];
        double[] north = [-Math.Sin(lat) * Math.Cos(lon), -Math.Sin(lat) * Math.Sin(lon), Math.Cos(lat)];
        double[] up = [Math.Cos(lat) * Math.Cos(lon), Math.Cos(lat) * Math.Sin(lon), Math.Sin(lat)];
        double e = 0.010, n = -0.006, u = 0.024;
        double[] w = [.. Enumerable.Range(0, 3).Select(k => e * east[k] + n * north[k] + u * up[k])];
        var loop = Assert.Single(Find(
            [Baseline("A", "B", "S1"), Baseline("B", "C", "S2", w[0], w[1], w[2]), Baseline("C", "A", "S1")]));

        Assert.Equal(["A", "B", "C", "A"], loop.Points);
        Assert.Equal(w[0], loop.Dx, 9);
        Assert.Equal(w[1], loop.Dy, 9);
        Assert.Equal(w[2], loop.Dz, 9);
        // the latitude of the mean point above is good to about 1e-9 rad, far below 1e-6 m on 26 mm
        Assert.Equal(e, loop.East, 7);
        Assert.Equal(n, loop.North, 7);
        Assert.Equal(u, loop.Up, 7);
        // the loop length is the sum of the measured baselines' lengths (B→C with its error)
        double length = Dist(xa, ya, za, xb, yb, zb) + Dist(xb, yb, zb, xc + w[0], yc + w[1], zc + w[2]) +
            Dist(xc, yc, zc, xa, ya, za);
        Assert.Equal(length, loop.Length, 3);
        // ppm of loop length: |w| / L × 10⁶ = 26.68 mm / L (common practice)
        Assert.Equal(Math.Sqrt(e * e + n * n + u * u) / length * 1e6, loop.Ppm, 6);
        Assert.False(loop.Trivial);
        Assert.Equal(["S1", "S2"], loop.Groups);
    }

    [Fact]
    public void MisclosureIsTestedWithChiSquareOnThreeDegreesOfFreedom()
    {
        var loop = Assert.Single(Find(
            [Baseline("A", "B", "S1"), Baseline("B", "C", "S2", 0.004, -0.003, 0.005), Baseline("C", "A", "S1")]));
        // the summed covariance, and wᵀC⁻¹w by MathNet's LU solve (an independent solve)
        var c = Matrix<double>.Build.Dense(3, 3);
        foreach (var (f, t) in new[] { ("A", "B"), ("B", "C"), ("C", "A") })
        {
            var v = Baseline(f, t, null);
            c += Matrix<double>.Build.Dense(3, 3, (i, j) => v.Covariance[3 * i + j]);
        }
        var w = Vector<double>.Build.Dense([0.004, -0.003, 0.005]);
        Assert.Equal(w * c.Solve(w), loop.Statistic, 9);
        // χ²(0.95; 3) from MathNet's chi-square quantile (7.8147, computed)
        Assert.Equal(ChiSquared.InvCDF(3, 0.95), loop.Critical, 12);
        Assert.Equal(7.8147, loop.Critical, 4);
        Assert.Equal(1.959964, loop.ComponentCritical, 6); // two-sided normal quantile (docs/references.md §3)
        Assert.Equal(loop.Statistic <= loop.Critical, loop.Passed);
        // each component's sd is that of the rotated covariance: σ_u² = uᵀ C u
        double[] r = Geocentric.LocalRotation(47.0133 * Deg, 8.0267 * Deg);
        var upRow = Vector<double>.Build.Dense([r[6], r[7], r[8]]);
        Assert.Equal(Math.Sqrt(upRow * c * upRow), loop.SdUp, 5);
    }

    [Fact]
    public void FiveCentimetreBlunderInUpFailsAndShowsInUp()
    {
        // a 5 cm error along the local up of B, on B→C of a 3-5 km triangle with sd of a few mm (common practice)
        double[] r = Geocentric.LocalRotation(Marks["B"].Lat, Marks["B"].Lon);
        var loops = Find([Baseline("A", "B", "S1"), Baseline("B", "C", "S2", 0.05 * r[6], 0.05 * r[7], 0.05 * r[8]),
            Baseline("C", "A", "S1")]);
        var loop = Assert.Single(loops);
        Assert.False(loop.Passed);
        Assert.Equal(0.05, loop.Up, 4);
        Assert.True(Math.Abs(loop.East) < 1e-3 && Math.Abs(loop.North) < 1e-3);
        Assert.True(Math.Abs(loop.Up) / (loop.ComponentCritical * loop.SdUp) > 1);
        // the exact loop passes, its statistic 0 (a zero misclosure, common practice)
        var clean = Assert.Single(Find([Baseline("A", "B", "S1"), Baseline("B", "C", "S2"), Baseline("C", "A", "S1")]));
        Assert.True(clean.Passed);
        Assert.Equal(0, clean.Statistic, 12);
    }

    [Fact]
    public void LoopOfOneSessionIsMarkedTrivial()
    {
        var loop = Assert.Single(Find([Baseline("A", "B", "S1"), Baseline("B", "C", "S1"), Baseline("A", "C", "S1"),
            Baseline("C", "D", "S2")]));
        Assert.True(loop.Trivial);
        Assert.Equal(["S1"], loop.Groups);
        // a loop without groups is not called trivial: nothing says it is one session
        Assert.False(Assert.Single(Find([Baseline("A", "B", null), Baseline("B", "C", null),
            Baseline("A", "C", null)])).Trivial);
    }

    [Fact]
    public void LoopsMixingSessionsArePreferredAndIndependent()
    {
        // Two sessions each measure every baseline of the triangle ABC: cycle rank m − n + c = 6 − 3 + 1 = 4
        // (graph theory, common practice). A basis without trivial loops exists (three repeats and one triangle
        // across sessions), so no loop of the basis is trivial.
        var v = new List<BaselineVector>
        {
            Baseline("A", "B", "S1"), Baseline("B", "C", "S1"), Baseline("C", "A", "S1"),
            Baseline("A", "B", "S2"), Baseline("C", "B", "S2"), Baseline("A", "C", "S2"),
        };
        var loops = Find(v);
        Assert.Equal(4, loops.Count);
        Assert.All(loops, l => Assert.False(l.Trivial));
        Assert.Equal(3, loops.Count(l => l.Baselines.Count == 2));
        Assert.Equal(1, loops.Count(l => l.Baselines.Count == 3));
        // independent: as vectors over GF(2) of baselines, the four loops have full rank (checked by elimination
        // written here, not the library's)
        Assert.Equal(4, Gf2Rank(loops.Select(l => l.Baselines).ToList(), v.Count));
    }

    [Fact]
    public void RepeatedBaselineClosesAsALoopOfTwo()
    {
        // A→B in S1 and B→A in S2, the second 7 mm off in X: the loop runs A→B→A, both forward, and closes on the
        // sum of the two vectors, +7 mm in X (common practice)
        var ab = Baseline("A", "B", "S1");
        var ba = Baseline("B", "A", "S2", 0.007);
        var loop = Assert.Single(Find([ab, ba]));
        Assert.Equal(["A", "B", "A"], loop.Points);
        Assert.Equal([false, false], loop.Reversed);
        Assert.Equal(0.007, loop.Dx, 9);
        Assert.Equal(0, loop.Dy, 9);
    }

    [Theory]
    [InlineData(60, true)]
    [InlineData(120, true)]
    [InlineData(60, false)]
    [InlineData(120, false)]
    public void BaselinesMeasuredAgainAndAgainGiveIndependentLoopsAndEachSearchStopsEarly(int rounds, bool sessions)
    {
        // Six baselines (A–B, A–C, B–C, B–D, A–D, B–A), observed again and again (monitoring), in two sessions of
        // three or with no session: cycle rank m − n + c = 6·rounds − 4 + 1 (graph theory, common practice), and the
        // loops of a basis are independent (the GF(2) rank written here). The searches for a way back stop at their
        // target, and the repeats of a baseline of a session share one: a few baselines read per baseline. (Read to
        // the end of every point's list and searched again for every repeat, they were 57,600 for 60 rounds and
        // 230,400 for 120, with sessions or without: quadratic.)
        string? s1 = sessions ? "S1" : null, s2 = sessions ? "S2" : null;
        var v = new List<BaselineVector>();
        for (int r = 0; r < rounds; r++)
        {
            v.AddRange([Baseline("A", "B", s1), Baseline("A", "C", s1), Baseline("B", "C", s1)]);
            v.AddRange([Baseline("B", "D", s2), Baseline("A", "D", s2), Baseline("B", "A", s2)]);
        }
        BaselineLoops.BaselinesRead = 0;
        var loops = Find(v);
        Assert.Equal(v.Count - 4 + 1, loops.Count);
        Assert.Equal(loops.Count, Gf2Rank(loops.Select(l => l.Baselines).ToList(), v.Count));
        Assert.All(loops, l => Assert.Equal(0, l.Misclosure, 9)); // exact vectors close exactly
        Assert.InRange(BaselineLoops.BaselinesRead, 1, 10 * v.Count);
    }

    [Fact]
    public void LoopWithoutKnownPositionsHasNoEastNorthUpButIsStillTested()
    {
        var v = new List<BaselineVector>
            { Baseline("A", "B", "S1"), Baseline("B", "C", "S2", 0.01), Baseline("C", "A", "S1") };
        var loop = Assert.Single(BaselineLoops.Find(v, Grs80, _ => null, 0.95));
        Assert.True(double.IsNaN(loop.East) && double.IsNaN(loop.SdUp));
        Assert.True(loop.Testable);
        Assert.Equal(0.01, loop.Misclosure, 9);
    }

    [Fact]
    public void BlunderShowsOnlyInTheLoopsThatHoldIt()
    {
        // A braced quadrilateral over two sessions; a 6 cm error on D→A: every failing loop holds D–A
        var v = new List<BaselineVector>
        {
            Baseline("A", "B", "S1"), Baseline("B", "C", "S1"), Baseline("A", "C", "S1"),
            Baseline("C", "D", "S2"), Baseline("B", "D", "S2"), Baseline("D", "A", "S2", 0.03, -0.04, 0.03),
        };
        var loops = Find(v);
        Assert.Equal(6 - 4 + 1, loops.Count);
        Assert.Contains(loops, l => !l.Passed);
        Assert.All(loops.Where(l => !l.Passed), l => Assert.Contains(5, l.Baselines));
        Assert.All(loops.Where(l => !l.Baselines.Contains(5)), l => Assert.True(l.Passed));
    }

    [Fact]
    public void NetworkWithoutLoopsHasNone()
    {
        Assert.Empty(Find([Baseline("A", "B", "S1"), Baseline("B", "C", "S2"), Baseline("C", "D", "S1")]));
        Assert.Empty(Find([]));
    }

    /// <summary>A lattice of points 1 km apart (rows × columns), joined to their east and north neighbours, each
    /// part's vectors in the plane (positions are not needed for the count).</summary>
    private static List<BaselineVector> Lattice(string prefix, int rows, int columns, string? group = null)
    {
        double[] cov = [1e-5, 0, 0, 0, 1e-5, 0, 0, 0, 1e-5];
        var v = new List<BaselineVector>();
        string Id(int r, int c) => $"{prefix}{r}-{c}";
        for (int r = 0; r < rows; r++)
            for (int c = 0; c < columns; c++)
            {
                if (c + 1 < columns) v.Add(new BaselineVector(Id(r, c), Id(r, c + 1), 1000, 0, 0, cov, group, null));
                if (r + 1 < rows) v.Add(new BaselineVector(Id(r, c), Id(r + 1, c), 0, 1000, 0, cov, group, null));
            }
        return v;
    }

    [Fact]
    public void LoopsOfALatticeAreItsSquares()
    {
        // The shortest cycle basis of a plane lattice is its faces (graph theory, common practice): 5 × 5 points,
        // 40 baselines, 16 loops of four.
        var loops = BaselineLoops.Find(Lattice("P", 5, 5), Grs80, _ => null, 0.95);
        Assert.Equal(40 - 25 + 1, loops.Count);
        Assert.All(loops, l => Assert.Equal(4, l.Baselines.Count));
    }

    [Fact]
    public void LargeNetworkInSeveralPartsGetsALoopForEachUnitOfCycleRank()
    {
        // Two lattices of 30 × 25 points, all of one session (1,500 points, 2,890 baselines: above the size where
        // every point's shortest paths are tried): still m − n + c = 2890 − 1500 + 2 = 1392 independent loops, each
        // closed and trivial. Before the fix the large-network candidates (one tree from the first point, paths
        // meeting only at it) missed loops: far fewer than the cycle rank came out.
        var v = Lattice("A", 30, 25, "S1").Concat(Lattice("B", 30, 25, "S1")).ToList();
        var loops = BaselineLoops.Find(v, Grs80, _ => null, 0.95);
        Assert.Equal(1392, loops.Count);
        Assert.Equal(1392, Gf2Rank([.. loops.Select(l => l.Baselines)], v.Count));
        Assert.All(loops, l => Assert.Equal(l.Points[0], l.Points[^1]));
        Assert.All(loops, l => Assert.True(l.Trivial));
        Assert.All(loops, l => Assert.Equal(0, l.Misclosure, 9)); // exact vectors close exactly
    }

    [Fact]
    public void LongLoopIsWalkedPointToPointWhateverTheOrderOfItsBaselines()
    {
        // A ring of 240 points 1 km apart around a circle near 47°N 8°E, its baselines given in a shuffled order and
        // half of them measured backwards. The ring is one loop (cycle rank 240 − 240 + 1, graph theory, common
        // practice), walked point to point: each point once, each step to a neighbour on the ring, a baseline
        // reversed exactly when the loop runs it from its end to its start, and exact vectors close to zero.
        const int count = 240;
        double radius = count * 1000 / (2 * Math.PI);
        string Id(int k) => $"R{k}";
        (double Lat, double Lon) Mark(int k) =>
            (47 * Deg + radius * Math.Sin(2 * Math.PI * k / count) / 6_371_000,
             8 * Deg + radius * Math.Cos(2 * Math.PI * k / count) / (6_371_000 * Math.Cos(47 * Deg)));
        (double X, double Y, double Z) At(int k) => Geocentric.ToGeocentric(Grs80, Mark(k).Lat, Mark(k).Lon, 500);
        double[] cov = [1e-5, 0, 0, 0, 1e-5, 0, 0, 0, 1e-5];
        var rnd = new Random(17);
        var v = Enumerable.Range(0, count).OrderBy(_ => rnd.Next()).Select(k =>
        {
            var (a, b) = k % 2 == 0 ? (k, (k + 1) % count) : ((k + 1) % count, k);
            var (x1, y1, z1) = At(a);
            var (x2, y2, z2) = At(b);
            return new BaselineVector(Id(a), Id(b), x2 - x1, y2 - y1, z2 - z1, cov, null, null);
        }).ToList();
        var ids = Enumerable.Range(0, count).ToDictionary(Id);
        var loop = Assert.Single(BaselineLoops.Find(v, Grs80, p => Mark(ids[p]), 0.95));
        Assert.Equal(count + 1, loop.Points.Count);
        Assert.Equal(loop.Points[0], loop.Points[^1]);
        Assert.Equal(count, loop.Points.Distinct().Count());
        for (int i = 0; i < count; i++)
        {
            int step = (ids[loop.Points[i + 1]] - ids[loop.Points[i]] + count) % count;
            Assert.True(step is 1 or count - 1, $"{loop.Points[i]} to {loop.Points[i + 1]}");
            var baseline = v[loop.Baselines[i]];
            Assert.Equal(loop.Reversed[i] ? (loop.Points[i + 1], loop.Points[i]) : (loop.Points[i], loop.Points[i + 1]),
                (baseline.From, baseline.To));
        }
        Assert.Equal(0, loop.Misclosure, 6);
        Assert.Equal(0, loop.East, 6);
    }

    [Fact]
    public void EachPointsPositionIsFoundOnceHoweverManyLoopsHoldIt()
    {
        // A lattice of 12 × 12 points with known positions: 121 loops of four (graph theory, common practice), so
        // the loops visit 484 points, yet each point's position is found once, at most 144 in all.
        var v = Lattice("Q", 12, 12);
        BaselineLoops.PositionsFound = 0;
        var loops = BaselineLoops.Find(v, Grs80, _ => (47 * Deg, 8 * Deg), 0.95);
        Assert.Equal(121, loops.Count);
        Assert.Equal(484, loops.Sum(l => l.Points.Count - 1));
        Assert.InRange(BaselineLoops.PositionsFound, 1, 144);
    }

    [Property(MaxTest = 60)]
    public Property LoopsOfAnyNetworkAreABasisOfItsCycleSpace() =>
        Prop.ForAll(Gen.Choose(1, int.MaxValue).ToArbitrary(), seed =>
        {
            // Random multigraphs of 2 to 9 points: baselines between random pairs (a pair may repeat, a baseline may
            // join a point to itself), in up to three sessions or none. The loops are independent and span the cycle
            // space: as many as the cycle rank m − n + c (graph theory, common practice), of full GF(2) rank by the
            // elimination written here; the point counts are those of the baselines that join two points.
            var rnd = new Random(seed);
            int points = rnd.Next(2, 10), count = rnd.Next(1, 30);
            string?[] groups = [null, "S1", "S2", "S3"];
            double[] cov = [1e-5, 0, 0, 0, 1e-5, 0, 0, 0, 1e-5];
            var v = new List<BaselineVector>();
            for (int i = 0; i < count; i++)
            {
                int a = rnd.Next(points), b = rnd.Next(points);
                v.Add(new BaselineVector($"P{a}", $"P{b}", 100 * (b - a), 50 * (b - a), 0, cov,
                    groups[rnd.Next(groups.Length)], null));
            }
            var joining = v.Select((x, i) => (x, i)).Where(t => t.x.From != t.x.To).ToList();
            var ids = joining.SelectMany(t => new[] { t.x.From, t.x.To }).Distinct().ToList();
            int parts = PartsOf(ids, joining.Select(t => (t.x.From, t.x.To)));
            int rank = joining.Count - ids.Count + parts;
            var loops = BaselineLoops.Find(v, Grs80, _ => null, 0.95);
            Assert.Equal(rank, loops.Count);
            Assert.Equal(rank, Gf2Rank([.. loops.Select(l => l.Baselines)], v.Count));
            Assert.All(loops, l => Assert.Equal(l.Points[0], l.Points[^1]));
        });

    [Fact]
    public void IndependenceTestReadsShortListsNotAllTheBaselines()
    {
        // A lattice of 30 × 30 points 1 km apart joined to all eight neighbours (the diagonals cross, so many
        // triangles depend on others): 3,422 baselines, cycle rank 3,422 − 900 + 1 = 2,523 (graph theory, common
        // practice). A candidate is reduced by the loops taken as the sorted list of its baselines outside a
        // spanning tree: each reduction reads two short lists. (Dense rows of bits over all baselines read 3,422
        // bits, 54 words, a reduction and made a 428-byte row for every candidate: quadratic in the network's size.)
        double[] cov = [1e-5, 0, 0, 0, 1e-5, 0, 0, 0, 1e-5];
        var v = new List<BaselineVector>();
        string Id(int r, int c) => $"K{r}-{c}";
        for (int r = 0; r < 30; r++)
            for (int c = 0; c < 30; c++)
                foreach (var (dr, dc) in new[] { (0, 1), (1, 0), (1, 1), (1, -1) })
                    if (r + dr < 30 && c + dc >= 0 && c + dc < 30)
                        v.Add(new BaselineVector(Id(r, c), Id(r + dr, c + dc), 1000 * dc, 1000 * dr, 0, cov, "S1",
                            null));
        Assert.Equal(3422, v.Count);
        (BaselineLoops.Reductions, BaselineLoops.CoordinatesRead) = (0, 0);
        var loops = BaselineLoops.Find(v, Grs80, _ => null, 0.95);
        Assert.Equal(2523, loops.Count);
        Assert.Equal(2523, Gf2Rank([.. loops.Select(l => l.Baselines)], v.Count));
        Assert.True(BaselineLoops.Reductions > 1000, $"{BaselineLoops.Reductions} reductions");
        Assert.InRange(BaselineLoops.CoordinatesRead, 2 * BaselineLoops.Reductions, 12 * BaselineLoops.Reductions);
    }

    /// <summary>The connected parts of a graph given by its edges (a union-find written here).</summary>
    private static int PartsOf(List<string> ids, IEnumerable<(string A, string B)> edges)
    {
        var parent = ids.ToDictionary(i => i, i => i);
        string Root(string x) => parent[x] == x ? x : parent[x] = Root(parent[x]);
        foreach (var (a, b) in edges) parent[Root(a)] = Root(b);
        return ids.Select(Root).Distinct().Count();
    }

    private static double Dist(double x1, double y1, double z1, double x2, double y2, double z2) =>
        Math.Sqrt((x2 - x1) * (x2 - x1) + (y2 - y1) * (y2 - y1) + (z2 - z1) * (z2 - z1));

    private static int Gf2Rank(List<IReadOnlyList<int>> rows, int columns)
    {
        var m = rows.Select(r => Enumerable.Range(0, columns).Select(c => r.Contains(c)).ToArray()).ToList();
        int rank = 0;
        for (int c = 0; c < columns && rank < m.Count; c++)
        {
            int pivot = m.FindIndex(rank, r => r[c]);
            if (pivot < 0) continue;
            (m[rank], m[pivot]) = (m[pivot], m[rank]);
            for (int i = 0; i < m.Count; i++)
                if (i != rank && m[i][c])
                    for (int k = 0; k < columns; k++) m[i][k] ^= m[rank][k];
            rank++;
        }
        return rank;
    }
}
