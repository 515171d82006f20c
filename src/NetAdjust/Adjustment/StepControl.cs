namespace NetAdjust.Adjustment;

/// <summary>
/// Step control of the Gauss-Newton iterations: the full correction is tried first; while the weighted sum of
/// squared misclosures vᵀPv at the new point exceeds its value at the old one, the step is halved (at most
/// <see cref="MaxHalvings"/> times). The Gauss-Newton correction is a descent direction of vᵀPv, so a short
/// enough step always decreases it; this makes approximate coordinates that are metres off converge where the
/// full step overshoots. Method: H. O. Hartley (1961), "The modified Gauss-Newton method for the fitting of
/// non-linear regression functions by least squares", <i>Technometrics</i> 3(2), 269–280 (from memory); see
/// also Nocedal &amp; Wright, <i>Numerical Optimization</i>, 2nd ed., §10.3 (line search on Gauss-Newton steps).
/// </summary>
internal static class StepControl
{
    /// <summary>The largest number of halvings in one iteration.</summary>
    public const int MaxHalvings = 12;

    /// <summary>Applies λ·Δx to the state with the largest λ ∈ {1, ½, ¼, …} that does not increase vᵀPv.</summary>
    /// <param name="state">The parameters, updated in place.</param>
    /// <param name="index">The unknowns.</param>
    /// <param name="dx">The Gauss-Newton correction.</param>
    /// <param name="before">vᵀPv at the current state.</param>
    /// <param name="vtpvAtState">Computes vᵀPv at the state as it is now.</param>
    /// <returns>The factor λ applied (1 for a full step).</returns>
    public static double Apply(ParameterState state, UnknownIndex index, double[] dx, double before,
        Func<double> vtpvAtState)
    {
        double lambda = 1;
        Move(state, index, dx, 1);
        for (int k = 0; k < MaxHalvings; k++)
        {
            double after = vtpvAtState();
            // Accept unless vᵀPv clearly grew (rounding near the minimum must not trigger halving).
            if (double.IsFinite(after) && after <= (before * (1 + 1e-9)) + 1e-12) return lambda;
            Move(state, index, dx, -lambda / 2);
            lambda /= 2;
        }
        return lambda;
    }

    private static void Move(ParameterState state, UnknownIndex index, double[] dx, double factor)
    {
        for (int j = 0; j < dx.Length; j++) state.Add(index.Unknowns[j], factor * dx[j]);
    }
}
