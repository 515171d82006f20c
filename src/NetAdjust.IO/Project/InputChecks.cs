using System.Globalization;
using NetAdjust.Observations;
using NetAdjust.Network;

namespace NetAdjust.IO.Project;

/// <summary>
/// Checks a project once it is read against the documented limits (<see cref="InputLimits"/>): standard deviations
/// (given, default, derived from a specification, re-weighted) in the sane range; coordinates, heights and measured
/// lengths within <see cref="InputLimits.MaxCoordinate"/>; a convergence tolerance the doubles can meet.
/// Each error names the file, the line and the item.
/// </summary>
internal static class InputChecks
{
    public static void Points(IEnumerable<Point> points, string file)
    {
        foreach (var p in points)
        {
            // the values in the order e, n, h, then sd_e, sd_n, sd_h; the place is made for an error only
            Coordinate(p, "e", p.E, file);
            Coordinate(p, "n", p.N, file);
            Coordinate(p, "h", p.H, file);
            Sd(p, "sd_e", p.SdE, file);
            Sd(p, "sd_n", p.SdN, file);
            Sd(p, "sd_h", p.SdH, file);
        }
    }

    private static void Coordinate(Point p, string key, double? v, string file)
    {
        if (v is double x && !(Math.Abs(x) <= InputLimits.MaxCoordinate))
        {
            var (f, line) = Where(p.Source, file);
            throw new ProjectFileException(f, line, "point " + p.Id,
                $"{key} = {G(x)} m is beyond the limit of ±1e8 m for coordinates and heights " +
                    $"(docs/input-format.md, \"Limits\")");
        }
    }

    private static void Sd(Point p, string key, double? v, string file)
    {
        if (v is double sd && InputLimits.SdProblem(sd, angular: false) is string problem)
        {
            var (f, line) = Where(p.Source, file);
            throw new ProjectFileException(f, line, "point " + p.Id, $"{key}: {problem}");
        }
    }

    /// <summary>Checks the observations; returns the kinds among them, as bits <c>1 &lt;&lt; kind</c> (the reader
    /// then skips the passes for kinds it does not hold).</summary>
    public static int Observations(List<Observation> observations, string file)
    {
        int kinds = 0;
        foreach (var o in observations)
        {
            kinds |= 1 << (int)o.Kind;
            // A standard deviation still to be derived from specifications (NaN) is checked where it is derived
            // (Stochastic.StochasticModel), with the same limits.
            bool derived = double.IsNaN(o.StandardDeviation) && o.Weighting is not null;
            if (!derived && InputLimits.SdProblem(o.StandardDeviation, o.Kind.IsAngular()) is string problem)
                throw Error(o, file, problem);
            if (!o.Kind.IsAngular() && !(Math.Abs(o.Value) <= InputLimits.MaxCoordinate))
                throw Error(o, file, $"the value {G(o.Value)} m is beyond the limit of ±1e8 m for lengths");
            if (o is DistanceObservation or SlopeDistanceObservation && !(o.Value >= InputLimits.MinMeasuredLength))
                throw Error(o, file, $"the distance {G(o.Value)} m is shorter than the limit of 1 mm for a " +
                    "measured distance (docs/input-format.md, \"Limits\")");
            if (o is HeightDifferenceObservation { LineLength: { } len } && !(len.Metres <= InputLimits.MaxCoordinate))
                throw Error(o, file, $"the section length {G(len.Metres)} m is beyond the limit of 1e8 m");
        }
        return kinds;
    }

    /// <summary>True when <paramref name="kinds"/> (from <see cref="Observations"/>) holds <paramref name="kind"/>.
    /// </summary>
    public static bool Holds(int kinds, ObservationKind kind) => (kinds & (1 << (int)kind)) != 0;

    /// <summary>The error of one observation, naming its file, line and item (made only when there is one).</summary>
    private static ProjectFileException Error(Observation o, string file, string problem)
    {
        var (f, line) = Where(o.Source, file);
        string item = o.Describe();
        if (o.Source is not null && item.EndsWith($" ({o.Source})", StringComparison.Ordinal))
            item = item[..^(o.Source.Length + 3)];
        return new ProjectFileException(f, line, item, problem);
    }

    /// <summary>
    /// Refuses a convergence tolerance that the spacing of doubles at the coordinates' magnitude cannot meet: the
    /// tolerance must be at least <see cref="MinToleranceUlps"/> times that spacing.
    /// </summary>
    public static void Tolerance(double tolerance, IEnumerable<Point> points, string file, int line)
    {
        double largest = points.SelectMany(p => new[] { p.E, p.N,
            p.H }).OfType<double>().Select(Math.Abs).DefaultIfEmpty(0).Max();
        double least = MinimumTolerance(largest);
        if (tolerance < least)
            throw new ProjectFileException(file, line, "adjustment.tolerance",
                $"{G(tolerance)} m can never be met: at coordinates of {G(largest)} m doubles are spaced " +
                $"{G(Math.BitIncrement(largest) - largest)} m apart; give at least {G(least)} m");
    }

    /// <summary>How many spacings of doubles (at the largest coordinate) the tolerance must span at least.</summary>
    public const double MinToleranceUlps = 32;

    /// <summary>The smallest tolerance accepted at coordinates of magnitude <paramref name="largest"/>
    /// (metres).</summary>
    public static double MinimumTolerance(double largest) =>
        MinToleranceUlps * (Math.BitIncrement(Math.Max(largest, 1.0)) - Math.Max(largest, 1.0));

    private static string G(double x) => x.ToString("G4", CultureInfo.InvariantCulture);

    private static (string File, int Line) Where(string? source, string file)
    {
        int colon = source?.LastIndexOf(':') ?? -1;
        return colon > 0 && int.TryParse(source![(colon + 1)..], NumberStyles.None, CultureInfo.InvariantCulture,
            out int line)
            ? (source[..colon], line) : (file, 0);
    }
}
