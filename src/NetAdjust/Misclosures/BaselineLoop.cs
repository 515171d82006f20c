namespace NetAdjust.Misclosures;

/// <summary>
/// The misclosure of one closed loop of GNSS baselines (docs/methods.md, "Misclosures before the adjustment"): the sum
/// of the earth-centred vectors round the loop, with the sign of the direction of travel, tested against the sum of
/// their covariances (χ² with 3 degrees of freedom), and shown in parts per million of the loop's length and in the
/// local east, north, up frame at the loop's mean position. SI units.
/// </summary>
/// <param name="Points">The points in running order, the first repeated at the end.</param>
/// <param name="Baselines">Indices of the baselines in running order, in the list that was checked.</param>
/// <param name="Reversed">For each baseline, true when the loop runs it from its end to its start.</param>
/// <param name="Groups">The groups (sessions) of the baselines, each once, in running order; null for a baseline
/// with no group.</param>
/// <param name="Trivial">True when every baseline comes from one group (one session): such a loop closes by the
/// processing itself and checks little.</param>
/// <param name="Dx">Misclosure ΔX (m).</param>
/// <param name="Dy">Misclosure ΔY (m).</param>
/// <param name="Dz">Misclosure ΔZ (m).</param>
/// <param name="Length">The loop length, the sum of the baselines' lengths (m).</param>
/// <param name="East">The misclosure's east component at the loop's mean position (m); NaN when no position of a
/// point is known.</param>
/// <param name="North">Its north component (m); NaN likewise.</param>
/// <param name="Up">Its up component (m); NaN likewise.</param>
/// <param name="SdEast">Expected standard deviation of <paramref name="East"/> (m).</param>
/// <param name="SdNorth">Expected standard deviation of <paramref name="North"/> (m).</param>
/// <param name="SdUp">Expected standard deviation of <paramref name="Up"/> (m).</param>
/// <param name="Statistic">wᵀ C⁻¹ w of the misclosure w with the summed covariance C; NaN when C is singular.
/// </param>
/// <param name="Critical">The χ²(3) quantile at the check's confidence.</param>
/// <param name="ComponentCritical">The two-sided normal quantile z at the check's confidence, for the components.
/// </param>
public sealed record BaselineLoop(IReadOnlyList<string> Points, IReadOnlyList<int> Baselines,
    IReadOnlyList<bool> Reversed, IReadOnlyList<string?> Groups, bool Trivial, double Dx, double Dy, double Dz,
    double Length, double East, double North, double Up, double SdEast, double SdNorth, double SdUp,
    double Statistic, double Critical, double ComponentCritical)
{
    /// <summary>Indices of the baselines' component observations in the network's observation list (ΔX, ΔY, ΔZ of
    /// each baseline in running order); empty when the loop was checked on vectors outside a network.</summary>
    public IReadOnlyList<int> Observations { get; init; } = [];

    /// <summary>The length of the misclosure vector √(ΔX² + ΔY² + ΔZ²) (m).</summary>
    public double Misclosure => Math.Sqrt(Dx * Dx + Dy * Dy + Dz * Dz);

    /// <summary>The misclosure in parts per million of the loop length.</summary>
    public double Ppm => Length > 0 ? Misclosure / Length * 1e6 : double.NaN;

    /// <summary>True when the summed covariance is positive definite, so the loop can be tested.</summary>
    public bool Testable => double.IsFinite(Statistic);

    /// <summary>√(wᵀC⁻¹w / χ²): the misclosure against its allowance (≤ 1 passes); NaN when not testable.</summary>
    public double Ratio => Math.Sqrt(Statistic / Critical);

    /// <summary>The largest |component| / (z σ) of east, north and up (for locating the cause; the pass or fail is
    /// the χ² test's); NaN when no position is known.</summary>
    public double ComponentRatio => Math.Max(Math.Abs(East) / (ComponentCritical * SdEast),
        Math.Max(Math.Abs(North) / (ComponentCritical * SdNorth), Math.Abs(Up) / (ComponentCritical * SdUp)));

    /// <summary>True when the χ² test passes or the loop cannot be tested.</summary>
    public bool Passed => !Testable || Ratio <= 1;
}
