using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// What the report model needs to know about an observation kind: its names in the outputs and its unit class.
/// The one place of the outputs that switches on the kind.
/// </summary>
internal static class ObservationLabels
{
    /// <summary>The machine name (JSON, GeoJSON), e.g. <c>height_difference</c>.</summary>
    public static string Key(ObservationKind kind) => ObservationKindRegistry.Of(kind).Name;

    /// <summary>The name in running text and HTML tables, e.g. <c>height difference</c>.</summary>
    public static string Words(ObservationKind kind) => Key(kind).Replace('_', ' ');

    /// <summary>The name in the text report's narrow Kind column, e.g. <c>height</c>.</summary>
    public static string Short(ObservationKind kind) => ObservationKindRegistry.Of(kind).ReportLabel;

    /// <summary>The key of a coordinate component in the outputs: <c>e</c>, <c>n</c> or <c>h</c>.</summary>
    public static string ComponentKey(Geometry.Parameter component) => component switch
    {
        Geometry.Parameter.E => "e",
        Geometry.Parameter.N => "n",
        Geometry.Parameter.H => "h",
        _ => throw new ArgumentOutOfRangeException(nameof(component), component, "not a coordinate component"),
    };

    /// <summary>True when values are angles (radians), false when lengths (metres).</summary>
    public static bool IsAngular(ObservationKind kind) => ObservationKindRegistry.Of(kind).Unit == UnitClass.Angle;

    /// <summary>The station an observation was measured from (the instrument point: the station of a direction or
    /// angle, the from point of a distance, slope distance or zenith angle); null for a levelled height difference
    /// or an observed azimuth.</summary>
    public static string? Station(Observation o) => o.At ?? ObservationKindRegistry.Of(o).Instrument(o);

    /// <summary>The "from" point as the tables show it beside the station: empty when it is the station.</summary>
    public static string FromShown(Observation o) => o.From == Station(o) ? "" : o.From;

    /// <summary>True for a levelled height difference: measured along a levelling line, not along a sight line
    /// between its two points.</summary>
    public static bool IsLevelled(ObservationKind kind) =>
        ObservationKindRegistry.Of(kind).Measurement == Measurement.Levelling;

    /// <summary>The factor from SI to the JSON unit of residuals and standard deviations (arcsec or metres).</summary>
    public static double JsonSmallFactor(ObservationKind kind) => IsAngular(kind) ? Angle.ArcsecondsPerRadian : 1.0;

    /// <summary>An observed or adjusted value in the JSON unit (decimal degrees or metres).</summary>
    public static double JsonValue(ObservationKind kind, double si) =>
        IsAngular(kind) ? Angle.FromRadians(si).Degrees : si;
}
