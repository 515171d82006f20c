using MathNet.Numerics.Distributions;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Tests.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary>
/// An invented GNSS control network for the tests: four marks GA1 to GA4 a few kilometres apart in UTM zone 33 on
/// GRS 80 (transverse Mercator by Krüger's series, independent of the library), heights above a geoid 45.2 m above the
/// ellipsoid, all six baselines observed with full covariances, simulated from the chosen truth with seeded noise.
/// </summary>
internal static class BaselineTestNetworks
{
    public const double GeoidSeparation = 45.2;

    public static readonly KruegerTransverseMercator Utm33 = KruegerTransverseMercator.Utm(Ellipsoid.Grs80, 33);

    public static readonly GridSystem Grid = new() { Projection = Utm33, GeoidSeparation = GeoidSeparation };

    /// <summary>The true grid coordinates and heights (E, N, H in metres).</summary>
    public static readonly (string Id, double E, double N, double H)[] Truth =
    [
        ("GA1", 512_300.000, 5_262_100.000, 412.300),
        ("GA2", 516_850.412, 5_263_402.187, 455.812),
        ("GA3", 515_204.733, 5_258_311.504, 390.127),
        ("GA4", 511_093.250, 5_257_618.926, 501.744),
    ];

    /// <summary>The baselines observed: (from, to) by index into <see cref="Truth"/>.</summary>
    public static readonly (int From, int To)[] Pairs = [(0, 1), (0, 2), (0, 3), (1, 2), (1, 3), (2, 3)];

    /// <summary>The true earth-centred position of a mark.</summary>
    public static (double X, double Y, double Z) Xyz(double e, double n, double h)
    {
        var (lat, lon) = Utm33.Inverse(e, n);
        return Geocentric.ToGeocentric(Ellipsoid.Grs80, lat, lon, h + GeoidSeparation);
    }

    /// <summary>An invented covariance of baseline k (m², 3×3 row-major): σ of 2 to 6 mm, the up-like Z component
    /// the weakest, correlations up to 0.5.</summary>
    public static double[] Covariance(int k) =>
        BaselineObservation.CovarianceOf((Length.FromMillimetres(2.1 + (0.2 * k)),
            Length.FromMillimetres(1.8 + (0.1 * k)), Length.FromMillimetres(3.5 + (0.4 * k))),
            0.31 - (0.05 * k), -0.42 + (0.03 * k), -0.18 + (0.1 * k));

    /// <summary>
    /// The network: GA1 held in E, N and H, the others free with approximate coordinates 0.4 m off; baselines
    /// simulated from the truth with noise drawn from their covariance × <paramref name="noiseScale"/>², the
    /// stated covariance being × <paramref name="statedScale"/>; <paramref name="bias"/> added to one baseline.
    /// </summary>
    public static SurveyNetwork Network(int seed, double noiseScale = 1, double statedScale = 1,
        (int Baseline, double DX, double DY, double DZ)? bias = null, string? group = null, int copies = 1)
    {
        var rnd = new Random(seed);
        var points = Truth.Select((t, i) => i == 0
            ? new Point(t.Id) { E = t.E, N = t.N, H = t.H, Fixed = Fixity.E | Fixity.N | Fixity.H }
            : new Point(t.Id) { E = t.E + 0.4, N = t.N - 0.3, H = t.H + 0.25 }).ToList();
        var obs = new List<Observation>();
        for (int c = 0; c < copies; c++)
            for (int k = 0; k < Pairs.Length; k++)
            {
                var (a, b) = Pairs[k];
                var pa = Xyz(Truth[a].E, Truth[a].N, Truth[a].H);
                var pb = Xyz(Truth[b].E, Truth[b].N, Truth[b].H);
                var cov = Covariance(k);
                var noise = CorrelatedNoise(cov, rnd, noiseScale);
                double dx = pb.X - pa.X + noise[0], dy = pb.Y - pa.Y + noise[1], dz = pb.Z - pa.Z + noise[2];
                if (bias is { } bb && bb.Baseline == k && c == 0) { dx += bb.DX; dy += bb.DY; dz += bb.DZ; }
                var stated = cov.Select(v => v * statedScale).ToArray();
                var parts = BaselineObservation.Components($"B{c}-{k}", Truth[a].Id, Truth[b].Id,
                    (Length.FromMetres(dx), Length.FromMetres(dy), Length.FromMetres(dz)), stated, Grid);
                obs.AddRange(parts.Select(p => p with { Group = group }));
            }
        return new SurveyNetwork("GNSS test network", points, obs);
    }

    /// <summary>L z with Σ = L Lᵀ (Cholesky) and z standard normal: a draw from N(0, scale² Σ).</summary>
    public static double[] CorrelatedNoise(double[] cov, Random rnd, double scale)
    {
        var l = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfRowMajor(3, 3, cov).Cholesky().Factor;
        var z = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(3, _ => Normal.Sample(rnd, 0, 1));
        return [.. (l * z * scale)];
    }
}
