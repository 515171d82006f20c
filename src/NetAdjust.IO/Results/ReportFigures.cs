using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>
/// What <see cref="ResultReport"/> takes from a result beyond its coordinates, all from the shared statistics
/// (<c>AdjustmentResult.Analysis</c>), so that every output shows the same numbers: the error ellipses and the
/// standardised residuals w; plus the roles of the points.
/// </summary>
internal static class ReportFigures
{
    /// <summary>
    /// The point's standard error ellipse from the statistics (at the variance factor the analysis uses, the a-priori
    /// σ0² unless the project asks for the estimated one); null when the point has no plan position or is held in plan.
    /// </summary>
    /// <param name="r">The result.</param>
    /// <param name="p">One of its points.</param>
    public static ErrorEllipse? Ellipse(AdjustmentResult r, AdjustedPoint p) =>
        !HasPlan(p) || IsPlanFixed(p) ? null : r.Analysis.Points[r.Network.IndexOf(p.Id)].Ellipse;

    /// <summary>
    /// Standardised residuals w per observation (in result order) from the statistics; null for observations that
    /// cannot be tested (uncontrolled) and for those set aside (their w is a misclosure, not a residual).
    /// </summary>
    /// <param name="r">The result.</param>
    public static IReadOnlyList<double?> StandardisedResiduals(AdjustmentResult r) =>
        r.Analysis.Observations.Select(t => t.Flag == ObservationFlag.Excluded ? null : t.W).ToList();

    /// <summary>True when the point is held fixed in both plan coordinates.</summary>
    /// <param name="p">The point.</param>
    public static bool IsPlanFixed(AdjustedPoint p) => p.Input.IsFixed(Network.Fixity.E) &&
        p.Input.IsFixed(Network.Fixity.N);

    /// <summary>True when the point has adjusted or held plan coordinates.</summary>
    /// <param name="p">The point.</param>
    public static bool HasPlan(AdjustedPoint p) => p.E is double e && p.N is double n && double.IsFinite(e) &&
        double.IsFinite(n);

    /// <summary>The role in words, as printed in reports and exchange files.</summary>
    /// <param name="role">The role.</param>
    public static string RoleText(PointRole role) => role switch
    {
        PointRole.Fixed => "fixed control",
        PointRole.Weighted => "weighted control",
        _ => "new point",
    };

    /// <summary>The observations with the largest |w|, largest first (ties by input order); empty without
    /// w-values.</summary>
    /// <param name="r">The result.</param>
    /// <param name="w">Standardised residuals by observation index, or null.</param>
    /// <param name="count">How many to return at most.</param>
    public static List<(AdjustedObservation Observation, double W)> Worst(AdjustmentResult r, IReadOnlyList<double?>? w,
        int count)
    {
        if (w is null || count <= 0) return [];
        // one pass keeping the leading few in order (largest |w| first, ties by input order), not a sort of all
        var worst = new List<(AdjustedObservation Observation, double W)>(count + 1);
        foreach (var o in r.Observations)
        {
            if (o.Index >= w.Count || w[o.Index] is not double x || !double.IsFinite(x)) continue;
            int at = worst.Count;
            while (at > 0 && Before((o, x), worst[at - 1])) at--;
            if (at >= count) continue;
            worst.Insert(at, (o, x));
            if (worst.Count > count) worst.RemoveAt(count);
        }
        return worst;

        static bool Before((AdjustedObservation O, double W) a, (AdjustedObservation O, double W) b) =>
            Math.Abs(a.W) > Math.Abs(b.W) || (Math.Abs(a.W) == Math.Abs(b.W) && a.O.Index < b.O.Index);
    }

    /// <summary>The point's role in the plan network: fixed control, weighted control or new point.</summary>
    /// <param name="p">The point.</param>
    public static PointRole Role(AdjustedPoint p) =>
        IsPlanFixed(p) ? PointRole.Fixed
        : p.Input.SdE.HasValue || p.Input.SdN.HasValue || p.Input.IsFixed(Network.Fixity.E) ||
            p.Input.IsFixed(Network.Fixity.N) ? PointRole.Weighted
        : PointRole.New;
}

/// <summary>The role of a point in the plan network, as shown on plots and in exchange files.</summary>
internal enum PointRole
{
    /// <summary>Both plan coordinates held fixed.</summary>
    Fixed,

    /// <summary>Control observed with a standard deviation (or held in one coordinate only).</summary>
    Weighted,

    /// <summary>A new point, determined by the observations alone.</summary>
    New,
}
