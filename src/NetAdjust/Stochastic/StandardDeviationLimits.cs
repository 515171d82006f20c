using System.Globalization;

namespace NetAdjust.Stochastic;

/// <summary>
/// The sane range of an a-priori standard deviation, given or derived from specifications (docs/input-format.md,
/// "Limits"): outside it the weights 1/σ² lose meaning (or overflow) long before any survey gets there.
/// </summary>
internal static class StandardDeviationLimits
{
    /// <summary>Smallest standard deviation of a length: 1 µm (no survey measures better).</summary>
    public const double MinLength = 1e-6;

    /// <summary>Largest standard deviation of a length: 1 km.</summary>
    public const double MaxLength = 1e3;

    /// <summary>Smallest angular standard deviation: 1e-9 rad (about 0.0002 arcsec).</summary>
    public const double MinAngle = 1e-9;

    /// <summary>Largest angular standard deviation: 1 rad (about 57°).</summary>
    public const double MaxAngle = 1.0;

    /// <summary>Null when the standard deviation is in the sane range, else what is wrong, in words.</summary>
    /// <param name="sd">The standard deviation in SI units (metres or radians).</param>
    /// <param name="angular">True for an angular standard deviation (radians).</param>
    public static string? Problem(double sd, bool angular)
    {
        var (lo, hi) = angular ? (MinAngle, MaxAngle) : (MinLength, MaxLength);
        if (double.IsFinite(sd) && sd >= lo && sd <= hi) return null;
        string range = angular ? "1e-9 rad (0.0002 arcsec) to 1 rad" : "1 µm to 1 km";
        string value = sd.ToString("G4", CultureInfo.InvariantCulture) + (angular ? " rad" : " m");
        return $"the standard deviation {value} is outside the accepted range ({range}; docs/input-format.md, " +
            "\"Limits\")";
    }
}
