using NetAdjust.Adjustment;

namespace NetAdjust.Adjustment.Datum;

/// <summary>How the datum (the reference frame the observations leave undetermined) is defined.</summary>
public enum DatumMode
{
    /// <summary>By the control points: fixed components are held, weighted components enter as observations.</summary>
    Control,

    /// <summary>
    /// Explicit minimal constraints: all control is set aside (its coordinates serve only as approximate values);
    /// one point's position is held, the azimuth from it to a second point is held when no azimuth is observed
    /// (and their distance when no distance is observed), and one height is held.
    /// </summary>
    MinimalConstraints,

    /// <summary>
    /// A free network with inner constraints: all control is set aside and the datum is chosen so that the
    /// trace of the coordinate covariance over all points, or over a chosen subset, is smallest.
    /// </summary>
    InnerConstraints,
}

/// <summary>The datum of an adjustment. Immutable; build one with the factories.</summary>
public sealed record DatumDefinition
{
    /// <summary>The datum of the control points (the default).</summary>
    public static DatumDefinition ByControl { get; } = new();

    /// <summary>Which kind of datum.</summary>
    public DatumMode Mode { get; init; } = DatumMode.Control;

    /// <summary>Minimal constraints: the point whose easting and northing are held; null for the first control
    /// point.</summary>
    public string? HoldPoint { get; init; }

    /// <summary>
    /// Minimal constraints: the second point of the held azimuth (and held distance when no distance is observed);
    /// null for the control point farthest from <see cref="HoldPoint"/>. Ignored when an azimuth is observed.
    /// </summary>
    public string? AzimuthTo { get; init; }

    /// <summary>Minimal constraints: the point whose height is held; null for the first point with a held or weighted
    /// height.</summary>
    public string? HoldHeight { get; init; }

    /// <summary>
    /// Minimal constraints, as resolved by the adjustment: control points that no observation places but a single
    /// sight line (reference objects), held in position together with <see cref="HoldPoint"/>; null when none.
    /// </summary>
    public IReadOnlyList<string>? ReferenceObjects { get; init => field = ReadOnlyCopies.ListOrNull(value); }

    /// <summary>Inner constraints: the points over which the trace is minimised; null for all points.</summary>
    public IReadOnlyList<string>? InnerPoints { get; init => field = ReadOnlyCopies.ListOrNull(value); }

    /// <summary>Explicit minimal constraints.</summary>
    /// <param name="holdPoint">Point whose position is held (null: first control point).</param>
    /// <param name="azimuthTo">Second point of the held azimuth (null: farthest control point).</param>
    /// <param name="holdHeight">Point whose height is held (null: first height control point).</param>
    public static DatumDefinition Minimal(string? holdPoint = null, string? azimuthTo = null,
        string? holdHeight = null) =>
        new() { Mode = DatumMode.MinimalConstraints, HoldPoint = holdPoint, AzimuthTo = azimuthTo,
            HoldHeight = holdHeight };

    /// <summary>A free network with inner constraints.</summary>
    /// <param name="points">The points over which the covariance trace is minimised; null for all points.</param>
    public static DatumDefinition Free(IReadOnlyList<string>? points = null) =>
        new() { Mode = DatumMode.InnerConstraints, InnerPoints = points };

    /// <summary>A one-line description for reports, e.g. "inner constraints over 4 points".</summary>
    public string Describe() => Mode switch
    {
        DatumMode.Control => "control points (fixed and weighted as given)",
        DatumMode.MinimalConstraints =>
            "minimal constraints" + (HoldPoint is null ? "" : $": position of {HoldPoint}") +
            (ReferenceObjects is { Count: > 0 } ro ? $" and of the reference object(s) {string.Join(", ", ro)}"
                : AzimuthTo is null ? "" : $", azimuth to {AzimuthTo}") +
                    (HoldHeight is null ? "" : $", height of {HoldHeight}"),
        _ => InnerPoints is null
            ? "free network, inner constraints over all points"
            : $"free network, inner constraints over {string.Join(", ", InnerPoints)}",
    };
}
