using System.Globalization;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// Checks the given and approximate coordinates before the adjustment: every coordinate a finite number, no two
/// points that one observation joins on the same spot (their azimuth is undefined), and a convergence tolerance the
/// spacing of doubles at the coordinates' magnitude can meet. Says what is wrong with the coordinates, rather than
/// letting a singular normal matrix report an undefined datum.
/// </summary>
internal static class CoordinateCheck
{
    /// <summary>How many spacings of doubles (at the largest coordinate) the length tolerance must span at
    /// least.</summary>
    public const double MinToleranceUlps = 32;

    /// <summary>Largest magnitude of a coordinate the adjustment accepts (metres); beyond it differences lose
    /// all precision.</summary>
    public const double MaxCoordinate = 1e10;

    /// <summary>Checks the coordinates located so far (<paramref name="e"/>, <paramref name="n"/>: given and
    /// approximate, by point id); <paramref name="ids"/> are the points of the network's observations.</summary>
    /// <returns>The easting and northing of each point by its index in the network, and whether it has them.</returns>
    /// <exception cref="InvalidInputException">When a coordinate is not finite or two joined points
    /// coincide.</exception>
    public static (double[] E, double[] N, bool[] Located) Check(SurveyNetwork network, ObservationPoints ids,
        Dictionary<string, double> e, Dictionary<string, double> n)
    {
        var points = network.Points;
        var pe = new double[points.Count];
        var pn = new double[points.Count];
        var located = new bool[points.Count];
        for (int i = 0; i < points.Count; i++)
        {
            var p = points[i];
            if (!e.TryGetValue(p.Id, out double x) || !n.TryGetValue(p.Id, out double y)) continue;
            (pe[i], pn[i], located[i]) = (x, y, true);
            if (!(Math.Abs(x) <= MaxCoordinate && Math.Abs(y) <= MaxCoordinate))
                throw new InvalidInputException($"point {p.Id}{Where(p.Source)}: its " +
                    $"{(p.E is null ? "approximate " : "")}coordinates " +
                    $"({G(x)}, {G(y)}) are beyond ±1e10 m or not numbers: give coordinates of a sensible size");
        }
        for (int i = 0; i < ids.Count; i++)
        {
            var o = network.Observations[i];
            if (o.Excluded || !ObservationKindRegistry.IsHorizontal(o.Kind)) continue;
            var of = ids.Of(i);
            for (int a = 0; a < of.Length; a++)
                for (int b = a + 1; b < of.Length; b++)
                {
                    int ia = of[a], ib = of[b];
                    if (!located[ia] || !located[ib]) continue;
                    double ea = pe[ia], eb = pe[ib], na = pn[ia], nb = pn[ib];
                    double scale = Math.Max(1.0, Math.Max(Math.Abs(ea), Math.Abs(na)));
                    if (Math.Abs(ea - eb) + Math.Abs(na - nb) > 1e-12 * scale) continue;
                    bool given = points[ia].E is not null && points[ib].E is not null;
                    throw new InvalidInputException(
                        $"{o.Describe()}: points {points[ia].Id} and {points[ib].Id} have the same " +
                            $"{(given ? "" : "approximate ")}coordinates " +
                        $"({G(ea)}, {G(na)}), so the direction between them is undefined. " +
                        (given ? "Check the coordinates given for them (a copied line?)." : "Give approximate " +
                            "coordinates (e, n) for them."));
                }
        }
        return (pe, pn, located);
    }

    /// <summary>
    /// Refuses a length tolerance below <see cref="MinToleranceUlps"/> spacings of doubles at the largest coordinate:
    /// the corrections could never fall below it, and the adjustment would run to its iteration limit.
    /// </summary>
    /// <exception cref="InvalidInputException">When the tolerance cannot be met.</exception>
    public static void CheckTolerance(ParameterState state, SurveyNetwork network, double tolerance)
    {
        double largest = 1.0;
        foreach (var p in network.Points)
            foreach (var par in new[] { Parameter.E, Parameter.N, Parameter.H })
                if (state.TryGet(p.Id, par, out double v) && double.IsFinite(v))
                    largest = Math.Max(largest, Math.Abs(v));
        double least = MinToleranceUlps * (Math.BitIncrement(largest) - largest);
        if (tolerance < least)
            throw new InvalidInputException(
                $"The convergence tolerance {G(tolerance)} m can never be met: at coordinates of {G(largest)} m " +
                $"doubles are spaced {G(Math.BitIncrement(largest) - largest)} m apart. " +
                $"Give a tolerance of at least {G(least)} m.");
    }

    private static string Where(string? source) => source is null ? "" : $" ({source})";

    private static string G(double x) => x.ToString("G6", CultureInfo.InvariantCulture);
}
