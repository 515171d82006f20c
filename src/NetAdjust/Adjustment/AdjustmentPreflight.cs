using NetAdjust.Adjustment.Datum;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// The checks an adjustment makes before it solves anything — options, datum diagnosis, approximate coordinates,
/// coordinate sanity and the convergence tolerance — run on their own, so that a validation (<c>netadjust check</c>)
/// fails exactly where the adjustment would.
/// </summary>
public static class AdjustmentPreflight
{
    /// <summary>Runs the checks; returns normally when the adjustment can start.</summary>
    /// <param name="network">The network.</param>
    /// <param name="options">Options; null for <see cref="AdjustmentOptions.Default"/>.</param>
    /// <exception cref="InvalidInputException">When options, coordinates or the datum's named points are
    /// invalid.</exception>
    /// <exception cref="DatumDefectException">When the observations and control leave the datum undefined.</exception>
    public static void Check(SurveyNetwork network, AdjustmentOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(network);
        options ??= AdjustmentOptions.Default;
        options.Validate();
        var plan = DatumPlan.Create(network, options.Datum);
        Approximation.CoordinateCheck.CheckTolerance(plan.State, network, options.LengthTolerance);
    }
}
