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

    /// <exception cref="InvalidInputException">When a coordinate is not finite or two joined points
    /// coincide.</exception>
    public static void Check(SurveyNetwork network, Dictionary<string, double> e, Dictionary<string, double> n)
    {
        foreach (var p in network.Points)
            if (e.TryGetValue(p.Id, out double x) && n.TryGetValue(p.Id, out double y)
                && !(Math.Abs(x) <= MaxCoordinate && Math.Abs(y) <= MaxCoordinate))
                throw new InvalidInputException($"point {p.Id}{Where(p.Source)}: its " +
                    $"{(p.E is null ? "approximate " : "")}coordinates " +
                    $"({G(x)}, {G(y)}) are beyond ±1e10 m or not numbers: give coordinates of a sensible size");
        foreach (var o in network.Observations)
        {
            if (o.Excluded || !ObservationKindRegistry.IsHorizontal(o.Kind)) continue;
            var ids = o.Points.ToList();
            for (int a = 0; a < ids.Count; a++)
                for (int b = a + 1; b < ids.Count; b++)
                {
                    if (!e.TryGetValue(ids[a], out double ea) || !e.TryGetValue(ids[b], out double eb)) continue;
                    double na = n[ids[a]], nb = n[ids[b]];
                    double scale = Math.Max(1.0, Math.Max(Math.Abs(ea), Math.Abs(na)));
                    if (Math.Abs(ea - eb) + Math.Abs(na - nb) > 1e-12 * scale) continue;
                    bool given = network[ids[a]].E is not null && network[ids[b]].E is not null;
                    throw new InvalidInputException(
                        $"{o.Describe()}: points {ids[a]} and {ids[b]} have the same " +
                            $"{(given ? "" : "approximate ")}coordinates " +
                        $"({G(ea)}, {G(na)}), so the direction between them is undefined. " +
                        (given ? "Check the coordinates given for them (a copied line?)." : "Give approximate " +
                            "coordinates (e, n) for them."));
                }
        }
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
