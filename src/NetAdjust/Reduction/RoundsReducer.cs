using System.Globalization;
using MathNet.Numerics.Distributions;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Reduction;

/// <summary>
/// Reduces the rounds of one setup (several sets, each with face-left and face-right readings per target) to the
/// observations the adjustment takes: one mean direction per target reduced to the first target, one mean zenith
/// angle and one mean slope distance, weighted as the mean of n sets. Pure mathematics, no input or output.
/// <list type="bullet">
/// <item>Per set and target: the mean of both faces, L + (R − 180° − L)/2 for a horizontal reading and
/// (z_L − z_R + 360°)/2 for a zenith angle; in one face the reading itself (face right: R − 180°, 360° − z_R).</item>
/// <item>Per set: the collimation error c, the mean of (L − R ± 180°)/2 · sin z over the targets, and the index
/// error i, the mean of (z_L + z_R − 360°)/2 (both cancel in the mean of the faces; common practice).</item>
/// <item>Directions are reduced to the set's first target, so that sets begun at different circle positions agree,
/// then averaged over the sets. With complete sets the mean reduced directions are sufficient for the target
/// directions: fed to the adjustment as one direction set with its own orientation unknown (which absorbs the
/// error of the reference target's direction), they give the same estimate as every set with its own
/// orientation, while the residuals within the rounds, which tell only the precision, are tested here.</item>
/// <item>The spread: the residuals r of the reduced directions from their means over the sets, less each set's
/// mean residual, give s = √(Σr²/ν), ν = (n − 1)(t − 1) for n sets of t targets, the experimental standard deviation
/// of one direction in one set (ISO 17123-3:2001, full test procedure for horizontal directions; from memory for
/// the clause). It is tested as ISO 17123-3 tests it, s ≤ σ·√(χ²(1 − α; ν)/ν), with σ the instrument's
/// ISO 17123-3 figure (times √2 in one face). Per target, the same residuals give Σr²/(σ²(1 − 1/t)) ~ χ²(n − 1);
/// zenith angles have no orientation to remove, so ν = t(n − 1) over the setup and n − 1 per target.</item>
/// </list>
/// </summary>
public static class RoundsReducer
{
    private const double TwoPi = 2 * Math.PI;

    /// <summary>Reduces the sets of one setup.</summary>
    /// <param name="sets">The sets in the order observed, each a list of readings; every set sights the same
    /// targets with the same quantities booked, in both faces or in one face.</param>
    /// <param name="options">The instrument's figures and the tolerances.</param>
    /// <returns>The reduction.</returns>
    /// <exception cref="RoundsReadingException">When a reading or a set is refused (the face difference beyond the
    /// tolerance, a zenith angle outside its face's range, sets that do not match); it names the set and the
    /// reading.</exception>
    public static ReducedRounds Reduce(IReadOnlyList<IReadOnlyList<FaceReadings>> sets, RoundsOptions options)
    {
        ArgumentNullException.ThrowIfNull(sets);
        ArgumentNullException.ThrowIfNull(options);
        if (!(options.Alpha is > 0 and < 1))
            throw new InvalidInputException("the significance level of the spread tests must be between 0 and 1");
        if (!(options.FaceTolerance > 0))
            throw new InvalidInputException("the tolerance of the face differences must be positive");
        if (sets.Count == 0) throw new RoundsReadingException(0, -1, "the rounds hold no set");
        if (sets.Count > 1000) throw new RoundsReadingException(1000, -1, "the rounds hold more than 1000 sets");
        var first = sets[0];
        if (first.Count == 0) throw new RoundsReadingException(0, -1, "the set holds no reading");
        var order = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int k = 0; k < first.Count; k++)
            if (!order.TryAdd(first[k].Target, k))
                throw new RoundsReadingException(0, k, $"target {first[k].Target} is read twice in the set");
        int t = first.Count, n = sets.Count;
        // rows[s][k]: the reading of target k (in the first set's order) in set s
        var rows = new FaceReadings[n][];
        Faces? faces = null;
        for (int s = 0; s < n; s++)
        {
            rows[s] = Arrange(sets[s], s, order, first);
            var setFaces = SetFaces(sets[s], s);
            if (faces is Faces f && f != setFaces)
                throw new RoundsReadingException(s, -1, $"set {s + 1} is observed in {Words(setFaces)} and set 1 " +
                    $"in {Words(f)}: every set of a setup must be observed alike");
            faces = setFaces;
            for (int r = 0; r < sets[s].Count; r++) CheckReading(sets[s][r], s, r, options);
        }
        return Compute(rows, faces!.Value, options);
    }

    private static string Words(Faces f) => f == Faces.Both ? "both faces" : "one face";

    /// <summary>The set's readings in the first set's order; refuses a missing, extra or repeated target and a
    /// change of the quantities booked.</summary>
    private static FaceReadings[] Arrange(IReadOnlyList<FaceReadings> set, int s, Dictionary<string, int> order,
        IReadOnlyList<FaceReadings> first)
    {
        var row = new FaceReadings?[first.Count];
        for (int r = 0; r < set.Count; r++)
        {
            var reading = set[r] ?? throw new RoundsReadingException(s, r, "the reading is empty");
            if (!order.TryGetValue(reading.Target, out int k))
                throw new RoundsReadingException(s, r, $"target {reading.Target} is not in set 1: every set must " +
                    "sight the same targets (book a partial set as a setup of its own)");
            if (row[k] is not null)
                throw new RoundsReadingException(s, r, $"target {reading.Target} is read twice in the set");
            var f = first[k];
            if (Has(reading.HorizontalLeft, reading.HorizontalRight) != Has(f.HorizontalLeft, f.HorizontalRight)
                || Has(reading.ZenithLeft, reading.ZenithRight) != Has(f.ZenithLeft, f.ZenithRight)
                || Has(reading.SlopeLeft, reading.SlopeRight) != Has(f.SlopeLeft, f.SlopeRight))
                throw new RoundsReadingException(s, r, $"the reading of target {reading.Target} books other " +
                    "quantities (horizontal, zenith, slope) than in set 1: every set must book the same");
            row[k] = reading;
        }
        for (int k = 0; k < row.Length; k++)
            if (row[k] is null)
                throw new RoundsReadingException(s, -1, $"set {s + 1} has no reading of target {first[k].Target}, " +
                    "which set 1 sights: every set must sight the same targets");
        return row!;
    }

    private static bool Has<T>(T? left, T? right) where T : struct => left.HasValue || right.HasValue;

    /// <summary>Both faces when every reading of the set books both faces of each of its angles, one face when each
    /// books one face only (the same face for all of its quantities).</summary>
    private static Faces SetFaces(IReadOnlyList<FaceReadings> set, int s)
    {
        Faces? faces = null;
        for (int r = 0; r < set.Count; r++)
        {
            var x = set[r];
            bool any = x.HorizontalLeft.HasValue || x.HorizontalRight.HasValue || x.ZenithLeft.HasValue
                || x.ZenithRight.HasValue;
            if (!any)
                throw new RoundsReadingException(s, r, $"the reading of target {x.Target} books neither a " +
                    "horizontal reading nor a zenith angle (a slope distance needs a zenith angle)");
            if (x.SlopeLeft.HasValue || x.SlopeRight.HasValue)
                if (!(x.ZenithLeft.HasValue || x.ZenithRight.HasValue))
                    throw new RoundsReadingException(s, r, $"the slope distance to {x.Target} needs a zenith angle " +
                        "in the same reading: alone it cannot separate the horizontal distance from the height " +
                        "difference");
            bool left = x.HorizontalLeft.HasValue || x.ZenithLeft.HasValue;
            bool right = x.HorizontalRight.HasValue || x.ZenithRight.HasValue;
            bool both = Pair(x.HorizontalLeft, x.HorizontalRight) && Pair(x.ZenithLeft, x.ZenithRight);
            Faces f = both && left && right ? Faces.Both
                : left != right ? Faces.One
                : throw new RoundsReadingException(s, r, $"the reading of target {x.Target} books one of its angles " +
                    "in both faces and another in one face: book both angles in the same faces");
            if (faces is Faces g && g != f)
                throw new RoundsReadingException(s, r, $"the reading of target {x.Target} is in {Words(f)}, the " +
                    $"set's first in {Words(g)}: a set is observed in both faces or in one face throughout");
            faces = f;
        }
        return faces!.Value;
    }

    private static bool Pair(Angle? left, Angle? right) => left.HasValue == right.HasValue;

    private static void CheckReading(FaceReadings x, int s, int r, RoundsOptions options)
    {
        foreach (var reading in new[] { x.HorizontalLeft, x.HorizontalRight, x.ZenithLeft, x.ZenithRight })
            if (reading is Angle v && !double.IsFinite(v.Radians))
                throw new RoundsReadingException(s, r, $"a reading to {x.Target} is not a finite angle");
        if (x.ZenithLeft is Angle zl && !(zl.Radians > 0 && zl.Radians < Math.PI))
            throw new RoundsReadingException(s, r, $"the face-left zenith angle to {x.Target} must lie between 0 and " +
                $"180° (0 at the zenith), not {Degrees(zl.Radians)}");
        if (x.ZenithRight is Angle zr && !(zr.Radians > Math.PI && zr.Radians < TwoPi))
            throw new RoundsReadingException(s, r, $"the face-right zenith angle to {x.Target} must lie between 180 " +
                $"and 360°, not {Degrees(zr.Radians)}");
        foreach (var d in new[] { x.SlopeLeft, x.SlopeRight })
            if (d is Length l && !(l.Metres > 0 && double.IsFinite(l.Metres)))
                throw new RoundsReadingException(s, r, $"a slope distance to {x.Target} must be positive, not " +
                    l.Metres.ToString("R", CultureInfo.InvariantCulture) + " m");
        if (x.HorizontalLeft is Angle hl && x.HorizontalRight is Angle hr)
        {
            double diff = Wrap(hl.Radians - hr.Radians + Math.PI);
            if (Math.Abs(diff) > options.FaceTolerance)
                throw new RoundsReadingException(s, r, $"the horizontal readings to {x.Target} in face left and face " +
                    $"right differ by {Arcsec(Math.Abs(diff))} after the 180° reversal, more than the tolerance " +
                    $"{Arcsec(options.FaceTolerance)}: a booking or pointing error");
        }
        if (x.ZenithLeft is Angle a && x.ZenithRight is Angle b)
        {
            double diff = a.Radians + b.Radians - TwoPi;
            if (Math.Abs(diff) > options.FaceTolerance)
                throw new RoundsReadingException(s, r, $"the zenith angles to {x.Target} in face left and face right " +
                    $"add up to 360° {(diff < 0 ? "−" : "+")} {Arcsec(Math.Abs(diff))}, more than the tolerance " +
                    $"{Arcsec(options.FaceTolerance)} away: a booking or pointing error");
        }
    }

    private static string Arcsec(double radians) =>
        (radians * Angle.ArcsecondsPerRadian).ToString("0.0", CultureInfo.InvariantCulture) + "″";

    private static string Degrees(double radians) =>
        (radians * 180 / Math.PI).ToString("0.######", CultureInfo.InvariantCulture) + "°";

    /// <summary>An angle reduced to (−π, π].</summary>
    private static double Wrap(double a)
    {
        double w = Math.IEEERemainder(a, TwoPi);
        return w <= -Math.PI ? w + TwoPi : w;
    }

    /// <summary>An angle reduced to [0, 2π).</summary>
    private static double Normalise(double a)
    {
        double w = a % TwoPi;
        if (w < 0) w += TwoPi;
        return w >= TwoPi ? 0 : w;
    }

    private static ReducedRounds Compute(FaceReadings[][] rows, Faces faces, RoundsOptions options)
    {
        int n = rows.Length, t = rows[0].Length;
        var dir = new double[n, t];
        var zen = new double[n, t];
        var slope = new double[n, t];
        var setFigures = new SetFigures[n];
        for (int s = 0; s < n; s++)
        {
            double cSum = 0, iSum = 0;
            int cCount = 0, iCount = 0;
            for (int k = 0; k < t; k++)
            {
                var x = rows[s][k];
                zen[s, k] = x switch
                {
                    { ZenithLeft: Angle l, ZenithRight: Angle r } => (l.Radians - r.Radians + TwoPi) / 2,
                    { ZenithLeft: Angle l } => l.Radians,
                    { ZenithRight: Angle r } => TwoPi - r.Radians,
                    _ => double.NaN,
                };
                if (x is { ZenithLeft: Angle zl, ZenithRight: Angle zr })
                {
                    iSum += (zl.Radians + zr.Radians - TwoPi) / 2;
                    iCount++;
                }
                dir[s, k] = x switch
                {
                    { HorizontalLeft: Angle l, HorizontalRight: Angle r } =>
                        Normalise(l.Radians - (Wrap(l.Radians - r.Radians + Math.PI) / 2)),
                    { HorizontalLeft: Angle l } => Normalise(l.Radians),
                    { HorizontalRight: Angle r } => Normalise(r.Radians - Math.PI),
                    _ => double.NaN,
                };
                if (x is { HorizontalLeft: Angle hl, HorizontalRight: Angle hr })
                {
                    double sinZ = double.IsNaN(zen[s, k]) ? 1.0 : Math.Sin(zen[s, k]);
                    cSum += Wrap(hl.Radians - hr.Radians + Math.PI) / 2 * sinZ;
                    cCount++;
                }
                var d = new[] { x.SlopeLeft, x.SlopeRight }.Where(v => v.HasValue).Select(v => v!.Value.Metres)
                    .ToList();
                slope[s, k] = d.Count == 0 ? double.NaN : d.Average();
            }
            setFigures[s] = new SetFigures(cCount > 0 ? cSum / cCount : double.NaN,
                iCount > 0 ? iSum / iCount : double.NaN);
        }
        double oneSet = faces == Faces.Both ? 1.0 : Math.Sqrt(2.0);
        var (meanDir, dirTests, dirTest, reference) = Directions(rows, dir, options.DirectionSd * oneSet,
            options.Alpha);
        var (meanZen, zenTests, zenTest) = Zeniths(zen, options.ZenithSd * oneSet, options.Alpha);
        var targets = new TargetFigures[t];
        for (int k = 0; k < t; k++)
        {
            double sl = 0;
            for (int s = 0; s < n; s++) sl += slope[s, k];
            targets[k] = new TargetFigures(rows[0][k].Target, k, meanDir[k], meanZen[k], sl / n, dirTests[k],
                zenTests[k]);
        }
        return new ReducedRounds(faces, setFigures, targets, reference, dirTest, zenTest);
    }

    private static (double[] Mean, SpreadTest?[] PerTarget, SpreadTest? Overall, string? Reference) Directions(
        FaceReadings[][] rows, double[,] dir, double sigma, double alpha)
    {
        int n = rows.Length, t = rows[0].Length;
        var mean = Enumerable.Repeat(double.NaN, t).ToArray();
        var perTarget = new SpreadTest?[t];
        var with = Enumerable.Range(0, t).Where(k => !double.IsNaN(dir[0, k])).ToList();
        if (with.Count == 0) return (mean, perTarget, null, null);
        int reference = with[0];
        // d[s, k] = reading of k − reading of the reference, in [0, 2π)
        var d = new double[n, t];
        foreach (int k in with)
            for (int s = 0; s < n; s++) d[s, k] = Normalise(dir[s, k] - dir[s, reference]);
        var res = new double[n, t];
        foreach (int k in with)
        {
            double sum = 0;
            for (int s = 0; s < n; s++) sum += Wrap(d[s, k] - d[0, k]);
            mean[k] = Normalise(d[0, k] + (sum / n));
            for (int s = 0; s < n; s++) res[s, k] = Wrap(d[s, k] - mean[k]);
        }
        int tw = with.Count;
        if (n < 2 || tw < 2) return (mean, perTarget, null, rows[0][reference].Target);
        // Remove each set's mean residual (its orientation): r' = r − mean over the set's targets.
        for (int s = 0; s < n; s++)
        {
            double m = with.Sum(k => res[s, k]) / tw;
            foreach (int k in with) res[s, k] -= m;
        }
        double total = 0;
        foreach (int k in with)
        {
            double sk = 0;
            for (int s = 0; s < n; s++) sk += res[s, k] * res[s, k];
            total += sk;
            perTarget[k] = Test(sk / (1 - (1.0 / tw)), n - 1, sigma, alpha);
        }
        return (mean, perTarget, Test(total, (n - 1) * (tw - 1), sigma, alpha), rows[0][reference].Target);
    }

    private static (double[] Mean, SpreadTest?[] PerTarget, SpreadTest? Overall) Zeniths(double[,] zen, double sigma,
        double alpha)
    {
        int n = zen.GetLength(0), t = zen.GetLength(1);
        var mean = new double[t];
        var perTarget = new SpreadTest?[t];
        double total = 0;
        int with = 0;
        for (int k = 0; k < t; k++)
        {
            double sum = 0;
            for (int s = 0; s < n; s++) sum += zen[s, k];
            mean[k] = sum / n;
            if (double.IsNaN(mean[k])) continue;
            with++;
            double sk = 0;
            for (int s = 0; s < n; s++) sk += (zen[s, k] - mean[k]) * (zen[s, k] - mean[k]);
            total += sk;
            if (n >= 2 && sigma > 0) perTarget[k] = Test(sk, n - 1, sigma, alpha);
        }
        var overall = n >= 2 && sigma > 0 && with > 0 ? Test(total, with * (n - 1), sigma, alpha) : null;
        return (mean, perTarget, overall);
    }

    /// <summary>s = √(Σr²/ν) against σ·√(χ²(1 − α; ν)/ν).</summary>
    private static SpreadTest Test(double sumOfSquares, int dof, double sigma, double alpha) =>
        new(dof, Math.Sqrt(sumOfSquares / dof), sigma,
            sigma * Math.Sqrt(ChiSquared.InvCDF(dof, 1 - alpha) / dof));
}
