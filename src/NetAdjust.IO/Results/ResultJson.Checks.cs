using NetAdjust.Misclosures;
using NetAdjust.Standards;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>The JSON of the accuracy standards (docs/output-format.md); the checks before the adjustment are written
/// row by row (<see cref="JsonResultWriter"/>).</summary>
internal static partial class ResultJson
{
    private static double? Num(double v) => double.IsFinite(v) ? v : null;

    /// <summary>Key <c>standards</c>: the standards applied, their items (worst first) and the caution.</summary>
    internal sealed record Standards(IEnumerable<Standard> Applied, IEnumerable<StandardItem> Items, string Caution)
    {
        public static Standards? Of(StandardsReport? s) => s is null || s.Standards.Count == 0 ? null : new(
            s.Standards.Select(x => new Standard(x.Name, x.Kind switch
            {
                StandardKind.RelativePrecision => "relative_precision",
                StandardKind.GeodeticAccuracy => "geodetic_accuracy",
                _ => "levelling",
            }, x.Source)),
            s.Items.Select(i => new StandardItem(i.Standard, i.Item, i.Quantity, Num(i.Value), i.Allowance,
                i.Ratio is double r && double.IsFinite(r) ? r : null,
                i.ClassReached, i.Passed)),
            StandardsReport.Caution);
    }

    /// <summary>One standard applied.</summary>
    internal sealed record Standard(string Name, string Kind, string Source);

    /// <summary>One checked item (lengths m).</summary>
    internal sealed record StandardItem(string Standard, string Item, string Quantity, double? Value,
        double? Allowance, double? Ratio, double? ClassReached, bool? Passed);
}
