using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>Formats values in the project's units for the human-readable reports (text, HTML, plot).</summary>
internal sealed class ReportUnits
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private readonly LengthPattern _len;
    private readonly AnglePattern _ang;

    private readonly Dictionary<ObservationKind, LengthPattern> _booked = [];

    public ReportUnits(ProjectUnits units)
    {
        Units = units;
        _len = new LengthPattern(units.Length, Decimals);
        _ang = new AnglePattern(units.Angle, units.Angle == AngleFormat.Dms ? 1 : 5);
    }

    /// <summary>The decimals of lengths in the project's unit (0.1 mm in metres).</summary>
    public const int Decimals = 4;

    /// <summary>At most this many decimals, however finely a value was booked.</summary>
    public const int MaxDecimals = 5;

    /// <summary>
    /// The same units, with the observed lengths of each kind printed to as many decimals as their values were
    /// booked to (e.g. height differences booked to 0.01 mm printed to 0.01 mm), never fewer than
    /// <see cref="Decimals"/> nor more than <see cref="MaxDecimals"/>: observed and adjusted values, residuals and
    /// standard deviations of that kind.
    /// </summary>
    /// <param name="network">The network whose observations were booked.</param>
    public ReportUnits Booked(SurveyNetwork network)
    {
        var units = new ReportUnits(Units);
        foreach (var group in network.Observations.Where(o => !o.Kind.IsAngular()).GroupBy(o => o.Kind))
        {
            int d = group.Max(o => BookedDecimals(NetAdjust.Units.Length.FromMetres(o.Value).In(Units.Length)));
            if (d > Decimals) units._booked[group.Key] = new LengthPattern(Units.Length, d);
        }
        return units;
    }

    /// <summary>The fewest decimals (up to <see cref="MaxDecimals"/>) that write a booked value exactly.</summary>
    internal static int BookedDecimals(double value)
    {
        for (int d = 0; d < MaxDecimals; d++)
        {
            double scaled = value * Math.Pow(10, d);
            if (Math.Abs(scaled - Math.Round(scaled)) <= 1e-6 * Math.Max(1, Math.Abs(scaled) * 1e-9)) return d;
        }
        return MaxDecimals;
    }

    /// <summary>A length of an observation kind (value, residual, sd), to the decimals it was booked to.</summary>
    public string KindLength(ObservationKind kind, double? metres) => metres is double m && double.IsFinite(m)
        ? (_booked.TryGetValue(kind, out var p) ? p : _len).Format(NetAdjust.Units.Length.FromMetres(m)) : "-";

    public ProjectUnits Units { get; }

    /// <summary>The length unit's symbol (m, ft, usft).</summary>
    public string LengthSymbol => Units.Length.Symbol;

    /// <summary>The unit of angular standard deviations and residuals (arcsec, mgon).</summary>
    public string SmallAngleSymbol => Units.AngleSd.Symbol();

    /// <summary>The angle format in words.</summary>
    public string AngleName =>
        Units.Angle switch { AngleFormat.Dms => "DMS (d-mm-ss)", AngleFormat.Degrees => "decimal degrees", _ =>
        "gons" };

    /// <summary>A coordinate or distance, or "-" when absent.</summary>
    public string Length(double? metres) => metres is double m &&
        double.IsFinite(m) ? _len.Format(NetAdjust.Units.Length.FromMetres(m)) : "-";

    /// <summary>A standard deviation or residual length, or "-" when absent.</summary>
    public string SmallLength(double? metres) => metres is double m &&
        double.IsFinite(m) ? _len.Format(NetAdjust.Units.Length.FromMetres(m)) : "-";

    /// <summary>An angle value in the project's angle format.</summary>
    // in [0, 360) after rounding
    public string AngleValue(double radians) => _ang.FormatDirection(Angle.FromRadians(radians));

    /// <summary>A small angle (sd, residual) in arcsec or mgon, 2 decimals.</summary>
    public string SmallAngle(double radians) => (radians / Units.AngleSd.RadiansPerUnit()).ToString("F2", Inv);

    /// <summary>An observed or adjusted value of an observation.</summary>
    public string ObservationValue(ObservationKind kind, double si) =>
        kind.IsAngular() ? AngleValue(si) : KindLength(kind, si);

    /// <summary>A residual or standard deviation of an observation.</summary>
    public string ObservationSmall(ObservationKind kind, double si) => kind.IsAngular() ? SmallAngle(si) :
        KindLength(kind, si);

    /// <summary>An azimuth in [0, π) as an angle in the project's format (one decimal of seconds, or 2
    /// decimals).</summary>
    public string Azimuth(double radians)
    {
        var pattern = Units.Angle == AngleFormat.Dms ? new AnglePattern(AngleFormat.Dms, 0) :
            new AnglePattern(Units.Angle, 2);
        string text = pattern.Format(Angle.FromRadians(radians));
        var back = pattern.Parse(text); // rounded up to a half turn (180-00-00, 200.00 gon): the axis points at 0
        return back.Success && back.Value.Radians >= Math.PI - 1e-12 ? pattern.Format(Angle.FromRadians(0)) : text;
    }

    /// <summary>Invariant fixed-point text.</summary>
    public static string F(double v, int decimals) => v.ToString("F" + decimals, Inv);
}
