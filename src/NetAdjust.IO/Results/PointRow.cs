using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>One row of the report model's point table (SI units; standard deviations and ellipse at one basis)
/// </summary>
/// <param name="Source">The adjusted point as the result holds it (standard deviations at the a-priori factor).</param>
/// <param name="SdE">Standard deviation of the easting at the table's basis.</param>
/// <param name="SdN">Standard deviation of the northing at the table's basis.</param>
/// <param name="SdH">Standard deviation of the height at the table's basis.</param>
/// <param name="Ellipse">The standard error ellipse at the table's basis; null without a plan position or when held
/// in plan.</param>
/// <param name="Held">The held components, e.g. <c>en</c>.</param>
/// <param name="Weighted">The weighted components, e.g. <c>h</c>.</param>
/// <param name="Role">The role in the plan network.</param>
internal sealed record PointRow(AdjustedPoint Source, double? SdE, double? SdN, double? SdH, ErrorEllipse? Ellipse,
    string Held, string Weighted, PointRole Role)
{
    /// <summary>The point id.</summary>
    public string Id => Source.Id;

    /// <summary>True when the point has a plan position.</summary>
    public bool HasPlan => ReportFigures.HasPlan(Source);

    /// <summary>The row of one point.</summary>
    public static PointRow Of(AdjustmentResult r, AdjustedPoint p, SdBasis basis) =>
        new(p, basis.Sd(p.SdE), basis.Sd(p.SdN), basis.Sd(p.SdH), ReportFigures.Ellipse(r, p),
            Components(p.Input.Fixed), Weights(p.Input), ReportFigures.Role(p));

    /// <summary>Held components in words: <c>e</c>, <c>n</c>, <c>h</c> in that order.</summary>
    public static string Components(Fixity f) =>
        ((f & Fixity.E) != 0 ? "e" : "") + ((f & Fixity.N) != 0 ? "n" : "") + ((f & Fixity.H) != 0 ? "h" : "");

    /// <summary>Weighted components (given a standard deviation) in the same form.</summary>
    public static string Weights(Point p) =>
        (p.SdE.HasValue ? "e" : "") + (p.SdN.HasValue ? "n" : "") + (p.SdH.HasValue ? "h" : "");

    /// <summary>Azimuth of the ellipse's semi-major axis in degrees, rounded to the exchange files' 4
    /// decimals.</summary>
    public double? EllipseAzimuthDegrees => Ellipse is ErrorEllipse e ? e.AzimuthDegreesRounded(AzimuthDecimals) : null;

    /// <summary>Decimals of the ellipse azimuth in degrees in the exchange files.</summary>
    public const int AzimuthDecimals = 4;

    /// <summary>The columns of a full listing (the coordinates CSV shows them all).</summary>
    public static readonly IReadOnlyList<ReportColumn<PointRow>> Columns =
    [
        new("id", "Point", ColumnUnit.None, ValueKind.PointId, r => ReportCell.Of(r.Id)),
        new("easting", "Easting", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.Source.E)),
        new("northing", "Northing", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.Source.N)),
        new("height", "Height", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.Source.H)),
        new("sd_e", "sd E", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.SdE)),
        new("sd_n", "sd N", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.SdN)),
        new("sd_h", "sd H", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.SdH)),
        new("ellipse_a", "a", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.Ellipse?.A)),
        new("ellipse_b", "b", ColumnUnit.Length, ValueKind.Number, r => ReportCell.Of(r.Ellipse?.B)),
        new("ellipse_azimuth", "Azimuth of a", ColumnUnit.Degrees, ValueKind.Number,
            r => ReportCell.Of(r.EllipseAzimuthDegrees)),
        new("held", "Held", ColumnUnit.None, ValueKind.Text, r => ReportCell.Of(r.Held)),
        new("weighted", "Weighted", ColumnUnit.None, ValueKind.Text, r => ReportCell.Of(r.Weighted)),
    ];
}
