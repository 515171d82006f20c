using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>The reference height H0 of the plane coordinates in the header's grid line (docs/methods.md, "Spatial
/// model"), for projects whose slope distances or zenith angles use it.</summary>
internal static class PlaneHeightReport
{
    /// <summary>"; plane coordinates horizontal at H0 = 150.657 m (the mean given height)", or "" when the report
    /// states no reference height.</summary>
    public static string Suffix(ReportContext c)
    {
        if (c.PlaneHeight is not double h) return "";
        var unit = c.Units.Length;
        string value = Length.FromMetres(h).In(unit).ToString("F3", CultureInfo.InvariantCulture);
        string basis = c.PlaneHeightBasis switch
        {
            PlaneHeightBasis.Stated => "stated",
            PlaneHeightBasis.Ellipsoid => "the ellipsoid",
            _ => "the mean given height",
        };
        return $"; plane coordinates horizontal at H0 = {value} {unit.Symbol} ({basis})";
    }
}
