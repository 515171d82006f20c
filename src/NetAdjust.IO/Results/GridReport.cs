using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The grid-and-ground part of the report model (docs/output-format.md): the header's grid line, the factors of
/// each distance with the grid and ground lengths of the adjusted lines, the convergence and scale factor at each
/// point, and the corrections of the angular observations. Built only when the project declares a grid system.
/// </summary>
internal static class GridReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The header's grid line: the system and the range of the combined factors; null without a grid
    /// system (the writers keep their former line).</summary>
    public static string? HeaderLine(ReportContext c)
    {
        if (c.Grid is not GridReductionResult g) return null;
        string text = g.System.Describe();
        var combined = g.Observations.Where(o => o.Observed.Kind == ObservationKind.Distance)
            .Select(o => o.CombinedFactor).OfType<double>().ToList();
        if (combined.Count > 0)
            text += $"; combined factors {combined.Min().ToString("F8", Inv)} to {combined.Max().ToString("F8", Inv)}";
        if (g.System.MeanHeight is double mh)
            text += $"; mean height {mh.ToString("F1", Inv)} m" + (g.System.MeanHeightSd is double sd
                ? $" ± {sd.ToString("F1", Inv)} m (scale uncertainty {(sd / 6.371e6 * 1e6).ToString("F2", Inv)} ppm)"
                : "");
        return text;
    }

    /// <summary>One row of the distance table, in SI units.</summary>
    internal sealed record LineRow(string From, string To, double Ground, double? ElevationFactor,
        double? ScaleFactor, double? CombinedFactor, double Grid, double AdjustedGrid, double? AdjustedGround,
        double? EllipsoidalHeight);

    /// <summary>The distances with their factors and the adjusted lengths on the grid and on the ground.</summary>
    public static IEnumerable<LineRow> Lines(AdjustmentResult r, GridReductionResult g) =>
        g.Observations.Where(o => o.Observed.Kind == ObservationKind.Distance).Select(o =>
        {
            double adjusted = r.Observations[o.Index].Adjusted;
            bool reduced = g.System.Distances == DistanceBasis.Ground;
            double? ground = o.CombinedFactor is double f ? adjusted / f : null;
            return new LineRow(o.Observed.From, o.Observed.To, reduced ? o.Observed.Value :
                o.CombinedFactor is double cf ? o.Observed.Value / cf : double.NaN, o.ElevationFactor, o.ScaleFactor,
                o.CombinedFactor, o.Reduced.Value, adjusted, ground, o.EllipsoidalHeight);
        });

    /// <summary>The <c>grid</c> member of the JSON result (lengths in m, convergence in degrees, corrections in
    /// arcsec), or null without a grid system.</summary>
    public static ResultJson.Grid? Json(AdjustmentResult r, ReportContext c)
    {
        if (c.Grid is not GridReductionResult g) return null;
        var s = g.System;
        var combined = g.Observations.Where(o => o.Observed.Kind == ObservationKind.Distance)
            .Select(o => o.CombinedFactor).OfType<double>().ToList();
        static double? Finite(double v) => double.IsFinite(v) ? v : null;
        var lines = g.Observations.Where(o => o.Observed.Kind == ObservationKind.Distance).Zip(Lines(r, g),
            (o, l) => new ResultJson.GridLine(o.Index, l.From, l.To, Finite(l.Ground), l.ElevationFactor,
                l.ScaleFactor, l.CombinedFactor, l.Grid, l.AdjustedGrid, l.AdjustedGround, l.EllipsoidalHeight));
        return new ResultJson.Grid(s.Describe(), c.Crs, s.Distances == DistanceBasis.Ground ? "ground" : "grid",
            s.Azimuths == AzimuthBasis.Geodetic ? "geodetic" : "grid", s.ProjectScale, s.GeoidSeparation,
            s.MeanHeight, s.MeanHeightSd, combined.Count > 0 ? combined.Min() : null,
            combined.Count > 0 ? combined.Max() : null, lines,
            g.Points.Select(p => new ResultJson.GridPoint(p.Point, p.Convergence * 180 / Math.PI, p.ScaleFactor)),
            g.Observations.Where(o => o.AngleCorrection is not null).Select(o => new ResultJson.GridCorrection(
                o.Index, o.Observed.Kind.Name(), o.Observed.At ?? o.Observed.From, o.Observed.To,
                o.AngleCorrection!.Value * Angle.ArcsecondsPerRadian)));
    }

    /// <summary>The report sections (none without a grid system).</summary>
    public static IReadOnlyList<ReportSection> Build(AdjustmentResult r, ReportContext c)
    {
        if (c.Grid is not GridReductionResult g) return [];
        var units = new ReportUnits(c.Units);
        string lu = c.Units.Length.Symbol;
        static string Factor(double? f) => f is double x ? x.ToString("F8", Inv) : "-";
        static SectionColumn Id(string header) => new(header, null, ValueKind.PointId, 8, true, Clip: true);
        static SectionColumn Nr(string header, string? unit, int width) => new(header, unit, ValueKind.Number, width);
        var sections = new List<ReportSection>();
        var lines = Lines(r, g).ToList();
        if (lines.Count > 0)
            sections.Add(new ReportSection("grid-distances", $"GROUND AND GRID DISTANCES ({lu})",
                "Ground and grid distances",
                [
                    "  grid = ground × combined factor; combined = elevation factor R/(R+h) × line scale factor " +
                    "(Simpson's rule)",
                    g.System.Distances == DistanceBasis.Ground
                        ? "  the distances were measured on the ground and adjusted on the grid"
                        : "  the distances were given on the grid; their ground lengths are shown for reference",
                ],
                [Id("From"), Id("To"), Nr("Ground", lu, 11), Nr("Elev.f", null, 10), Nr("Scale f", null, 10),
                    Nr("Combined", null, 10), Nr("Grid", lu, 11), Nr("Adj grid", lu, 11), Nr("Adj ground", lu, 11)],
                lines.Select(l => new SectionRow([l.From, l.To, units.Length(l.Ground), Factor(l.ElevationFactor),
                    Factor(l.ScaleFactor), Factor(l.CombinedFactor), units.Length(l.Grid), units.Length(l.AdjustedGrid),
                    units.Length(l.AdjustedGround)])).ToList(),
                []));
        if (g.Points.Count > 0)
        {
            bool gons = c.Units.Angle == AngleFormat.Gons;
            string unit = gons ? "gon" : "deg";
            double per = gons ? 200 / Math.PI : 180 / Math.PI;
            sections.Add(new ReportSection("grid-points", "CONVERGENCE AND POINT SCALE FACTOR",
                "Convergence and point scale factor",
                ["  grid azimuth = geodetic azimuth − convergence",
                    "  (the convergence is positive when grid north lies clockwise from true north)"],
                [Id("Point"), Nr("Convergence", unit, 13), Nr("Scale factor", null, 12)],
                g.Points.Select(p => new SectionRow([p.Point, (p.Convergence * per).ToString("F6", Inv),
                    Factor(p.ScaleFactor)])).ToList(),
                []));
        }
        var turned = g.Observations.Where(o => o.AngleCorrection is not null).ToList();
        if (turned.Count > 0)
        {
            string au = units.SmallAngleSymbol;
            sections.Add(new ReportSection("grid-angles", $"CORRECTIONS OF ANGULAR OBSERVATIONS ({au})",
                "Corrections of angular observations",
                ["  added to the observed value: the arc-to-chord correction (t − T) of directions and angles;",
                    "  for geodetic azimuths also minus the convergence; for zenith angles the horizontal part scaled"],
                [new SectionColumn("Observation", null, ValueKind.Text, 40, true, Clip: true),
                    Nr("Correction", au, 12)],
                turned.Select(o => new SectionRow([(o.Observed with { Source = null }).Describe(),
                    units.SmallAngle(o.AngleCorrection!.Value)])).ToList(),
                []));
        }
        return sections;
    }
}
