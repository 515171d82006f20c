using NetAdjust.Adjustment;

namespace NetAdjust.IO.Results;

/// <summary>The standard (1σ) absolute error ellipse of one point, in SI units.</summary>
/// <param name="SemiMajor">Semi-major axis a, m.</param>
/// <param name="SemiMinor">Semi-minor axis b, m (0 ≤ b ≤ a).</param>
/// <param name="Azimuth">Azimuth of the semi-major axis, clockwise from grid north, rad in [0, π).</param>
internal readonly record struct PointEllipse(double SemiMajor, double SemiMinor, double Azimuth);

/// <summary>
/// The figures the writers take from a result beyond its coordinates: error ellipses and standardised residuals.
/// </summary>
/// <remarks>
/// TO BE REPLACED ON MERGE: the statistics work (issue 4) adds shared public types for error ellipses and
/// per-observation w-values to the result. When it lands in main, <see cref="Ellipse"/> and
/// <see cref="StandardisedResiduals"/> must delegate to those types, so that every report shows the same numbers.
/// </remarks>
internal static class ReportFigures
{
    /// <summary>
    /// The standard error ellipse from the point's covariance matrix [σE² σEN; σEN σN²] (eigenvalues of a
    /// symmetric 2×2 matrix in closed form): a² , b² = (σE² + σN²)/2 ± √(((σN² − σE²)/2)² + σEN²), and the azimuth
    /// of a is θ = ½ atan2(2σEN, σN² − σE²) (Mikhail &amp; Ackermann 1976, error ellipses; from memory: the
    /// tests check it against an independent eigen-decomposition). Null when the point has no plan position or
    /// no adjusted plan coordinates.
    /// </summary>
    /// <param name="p">The adjusted point.</param>
    public static PointEllipse? Ellipse(AdjustedPoint p)
    {
        if (p.SdE is not double se || p.SdN is not double sn || p.E is null || p.N is null) return null;
        double cov = p.CovEN ?? 0.0;
        double qe = se * se, qn = sn * sn;
        double mean = 0.5 * (qe + qn);
        double half = 0.5 * (qn - qe);
        double root = Math.Sqrt((half * half) + (cov * cov));
        double a2 = mean + root, b2 = Math.Max(0.0, mean - root);
        double az = 0.5 * Math.Atan2(2 * cov, qn - qe);
        if (az < 0) az += Math.PI;
        if (az >= Math.PI) az -= Math.PI;
        return new PointEllipse(Math.Sqrt(a2), Math.Sqrt(b2), az);
    }

    /// <summary>
    /// Standardised residuals w per observation (in result order), or null when the result carries none.
    /// The foundation result has none yet: reports then leave out the histogram and the highlighting.
    /// </summary>
    /// <param name="r">The result.</param>
    public static IReadOnlyList<double?>? StandardisedResiduals(AdjustmentResult r)
    {
        _ = r;
        return null;
    }

    /// <summary>The critical value of the w-test used for highlighting: 3.29, α0 = 0.001 two-sided (Baarda 1968).</summary>
    public const double WCritical = 3.29;

    /// <summary>True when the point is held fixed in both plan coordinates.</summary>
    /// <param name="p">The point.</param>
    public static bool IsPlanFixed(AdjustedPoint p) => p.Input.IsFixed(Network.Fixity.E) && p.Input.IsFixed(Network.Fixity.N);

    /// <summary>True when the point has adjusted or held plan coordinates.</summary>
    /// <param name="p">The point.</param>
    public static bool HasPlan(AdjustedPoint p) => p.E is double e && p.N is double n && double.IsFinite(e) && double.IsFinite(n);

    /// <summary>The role in words, as printed in reports and exchange files.</summary>
    /// <param name="role">The role.</param>
    public static string RoleText(PointRole role) => role switch
    {
        PointRole.Fixed => "fixed control",
        PointRole.Weighted => "weighted control",
        _ => "new point",
    };

    /// <summary>The observations with the largest |w|, largest first (ties by input order); empty without w-values.</summary>
    /// <param name="r">The result.</param>
    /// <param name="w">Standardised residuals by observation index, or null.</param>
    /// <param name="count">How many to return at most.</param>
    public static List<(AdjustedObservation Observation, double W)> Worst(AdjustmentResult r, IReadOnlyList<double?>? w, int count)
    {
        if (w is null) return [];
        return r.Observations.Where(o => o.Index < w.Count && w[o.Index] is double x && double.IsFinite(x))
            .Select(o => (o, w[o.Index]!.Value))
            .OrderByDescending(t => Math.Abs(t.Item2)).ThenBy(t => t.o.Index)
            .Take(count).ToList();
    }

    /// <summary>The point's role in the plan network: fixed control, weighted control or new point.</summary>
    /// <param name="p">The point.</param>
    public static PointRole Role(AdjustedPoint p) =>
        IsPlanFixed(p) ? PointRole.Fixed
        : p.Input.SdE.HasValue || p.Input.SdN.HasValue || p.Input.IsFixed(Network.Fixity.E) || p.Input.IsFixed(Network.Fixity.N) ? PointRole.Weighted
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
