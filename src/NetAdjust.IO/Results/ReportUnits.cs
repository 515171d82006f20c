using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>Formats values in the project's units for the human-readable reports (text, HTML, plot).</summary>
internal sealed class ReportUnits
{
    private readonly LengthPattern _len;
    private readonly AnglePattern _ang;

    private readonly Dictionary<ObservationKind, LengthPattern> _booked = [];

    private readonly AnglePattern _az;
    private readonly string _halfTurn, _zeroAzimuth;
    private readonly double _radPerSmall;

    public ReportUnits(ProjectUnits units)
    {
        Units = units;
        _len = new LengthPattern(units.Length, Decimals);
        _ang = new AnglePattern(units.Angle, units.Angle == AngleFormat.Dms ? 1 : 5);
        _az = units.Angle == AngleFormat.Dms ? new AnglePattern(AngleFormat.Dms, 0) : new AnglePattern(units.Angle, 2);
        _halfTurn = _az.Format(Angle.FromRadians(Math.PI));
        _zeroAzimuth = _az.Format(Angle.FromRadians(0));
        _radPerSmall = units.AngleSd.RadiansPerUnit();
    }

    /// <summary>The text of a length as <see cref="LengthPattern.Format"/> writes it.</summary>
    private static string Format(LengthPattern p, double metres) =>
        NumberText.Fixed(NetAdjust.Units.Length.FromMetres(metres).In(p.Unit), p.Decimals);

    /// <summary>The text of an angle as <see cref="AnglePattern.Format"/> of <paramref name="p"/> writes it.</summary>
    private static string Format(AnglePattern p, double radians) => p.Style switch
    {
        AngleFormat.Degrees => NumberText.Fixed(Angle.FromRadians(radians).Degrees, p.Decimals),
        AngleFormat.Gons => NumberText.Fixed(Angle.FromRadians(radians).Gons, p.Decimals),
        _ => p.Format(Angle.FromRadians(radians)),
    };

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
        ? Format(_booked.Count > 0 && _booked.TryGetValue(kind, out var p) ? p : _len, m) : "-";

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
        double.IsFinite(m) ? Format(_len, m) : "-";

    /// <summary>A standard deviation or residual length, or "-" when absent.</summary>
    public string SmallLength(double? metres) => metres is double m &&
        double.IsFinite(m) ? Format(_len, m) : "-";

    /// <summary>An angle value in the project's angle format.</summary>
    // in [0, 360) after rounding
    public string AngleValue(double radians)
    {
        // As AnglePattern.FormatDirection, which parses its text back to tell a value rounded up to a full turn:
        // only a direction within a hundredth of a radian of the full turn can be one, so only those are parsed.
        double reduced = Angle.Reduce0To2Pi(radians);
        return reduced < (2 * Math.PI) - 0.01 ? Format(_ang, reduced)
            : _ang.FormatDirection(Angle.FromRadians(radians));
    }

    /// <summary>A small angle (sd, residual) in arcsec or mgon, 2 decimals.</summary>
    public string SmallAngle(double radians) => NumberText.Fixed(radians / _radPerSmall, 2);

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
        string text = Format(_az, radians);
        // rounded up to a half turn (180-00-00, 200.00 gon): the axis points at 0; only an azimuth within a
        // hundredth of a radian of the half turn can round up to it, so only those are parsed back
        if (radians < Math.PI - 0.01 && text != _halfTurn) return text;
        var back = _az.Parse(text);
        return back.Success && back.Value.Radians >= Math.PI - 1e-12 ? _zeroAzimuth : text;
    }

    /// <summary>Invariant fixed-point text.</summary>
    public static string F(double v, int decimals) => NumberText.Fixed(v, decimals);
}
