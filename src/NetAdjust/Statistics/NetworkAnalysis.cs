using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Statistics;

namespace NetAdjust.Statistics;

/// <summary>The statistical state of one tested row.</summary>
public enum ObservationFlag
{
    /// <summary>Controlled and accepted.</summary>
    None,

    /// <summary>Redundancy number below <see cref="AnalysisOptions.WeakRedundancy"/>: weakly controlled, large
    /// MDB.</summary>
    Weak,

    /// <summary>The deciding test (w-test when the variance factor is known, tau test when estimated) rejects it:
    /// suspected blunder.</summary>
    Rejected,

    /// <summary>Redundancy number below <see cref="AnalysisOptions.UncontrolledRedundancy"/>: no test is possible, a
    /// blunder would go unseen.</summary>
    Uncontrolled,

    /// <summary>Set aside by the user or a blunder hunt: no weight; its w is its standardised misclosure.</summary>
    Excluded,
}

/// <summary>Names of <see cref="ObservationFlag"/> for files and reports.</summary>
public static class ObservationFlags
{
    /// <summary>The snake_case name (null for <see cref="ObservationFlag.None"/>).</summary>
    /// <param name="flag">The flag.</param>
    public static string? Name(this ObservationFlag flag) => flag switch
    {
        ObservationFlag.None => null,
        ObservationFlag.Weak => "weak",
        ObservationFlag.Rejected => "rejected",
        ObservationFlag.Uncontrolled => "uncontrolled",
        _ => "excluded",
    };
}

/// <summary>
/// Tests and reliability of one observation (or one weighted-control component). Values in SI units of the
/// observation (m or rad) unless stated.
/// </summary>
/// <param name="Index">Position in the result's observation list (or in the control list).</param>
/// <param name="Redundancy">Redundancy number rᵢ = (Qvv P)ᵢᵢ in [0, 1]; 0 for excluded.</param>
/// <param name="W">Standardised residual wᵢ (Baarda); for an excluded observation its standardised misclosure; null
/// when uncontrolled.</param>
/// <param name="Tau">Pope's τᵢ = wᵢ σ0/σ̂0; null when uncontrolled, excluded or r = 0.</param>
/// <param name="Mdb">Minimal detectable bias (m or rad); null when uncontrolled or excluded.</param>
/// <param name="ExternalReliability">Largest coordinate shift (m) an undetected MDB would cause; null when not
/// computed.</param>
/// <param name="ExternalReliabilityPoint">The point that shift falls on; null when not computed.</param>
/// <param name="BiasToNoiseRatio">λ̄ᵢ = δ0 √((1 − rᵢ)/rᵢ): the effect of an MDB on any estimated quantity, in its
/// standard deviations.</param>
/// <param name="WPassed">The w-test outcome; null when not possible.</param>
/// <param name="TauPassed">The tau-test outcome; null when not possible.</param>
/// <param name="Flag">The summary flag.</param>
public sealed record ObservationTest(int Index, double Redundancy, double? W, double? Tau, double? Mdb,
    double? ExternalReliability,
    string? ExternalReliabilityPoint, double? BiasToNoiseRatio, bool? WPassed, bool? TauPassed, ObservationFlag Flag);

/// <summary>A weighted-control component treated as an observation, with its test.</summary>
/// <param name="PointId">The control point.</param>
/// <param name="Component">The coordinate tested: <see cref="Parameter.E"/>, <see cref="Parameter.N"/> or
/// <see cref="Parameter.H"/>.</param>
/// <param name="Residual">v = adjusted − given (m).</param>
/// <param name="Test">Its redundancy and tests.</param>
public sealed record ControlTest(string PointId, Parameter Component, double Residual, ObservationTest Test);

/// <summary>The precision of one adjusted point.</summary>
/// <param name="Id">The point id.</param>
/// <param name="Ellipse">The standard error ellipse (m); null when the point has no adjusted plane coordinates.</param>
/// <param name="Confidence">The confidence ellipse (the standard one scaled by <see
/// cref="NetworkAnalysis.EllipseScale"/>); null likewise.</param>
/// <param name="SdHeight">Standard deviation of the height (m); null when the height is not adjusted.</param>
/// <param name="HeightConfidence">Half-width of the height confidence interval (m); null likewise.</param>
public sealed record PointPrecision(string Id, ErrorEllipse? Ellipse, ErrorEllipse? Confidence, double? SdHeight,
    double? HeightConfidence);

/// <summary>The relative precision of two points: the ellipse of the coordinate difference (to − from).</summary>
/// <param name="From">First point.</param>
/// <param name="To">Second point.</param>
/// <param name="Ellipse">Standard relative ellipse (m).</param>
/// <param name="Confidence">Confidence relative ellipse (m).</param>
/// <param name="Distance">Adjusted horizontal distance (m).</param>
/// <param name="SdDistance">Standard deviation of that distance (m).</param>
/// <param name="SdAzimuth">Standard deviation of the azimuth from → to (rad).</param>
/// <param name="Observed">True when the pair is joined by an observation; false when listed by the user.</param>
public sealed record RelativePrecision(string From, string To, ErrorEllipse Ellipse, ErrorEllipse Confidence,
    double Distance,
    double SdDistance, double SdAzimuth, bool Observed)
{
    /// <summary>Relative distance precision as the denominator of 1 : k (distance / its standard deviation); infinite
    /// when exact.</summary>
    public double Ratio => SdDistance > 0 ? Distance / SdDistance : double.PositiveInfinity;
}

/// <summary>The relative precision of the heights of two points: the standard deviation of H(to) − H(from).</summary>
/// <param name="From">First point.</param>
/// <param name="To">Second point.</param>
/// <param name="Difference">Adjusted height difference H(to) − H(from) (m).</param>
/// <param name="SdDifference">Its standard deviation (m).</param>
/// <param name="Confidence">Half-width of its confidence interval (m).</param>
/// <param name="Observed">True when the pair is joined by a height difference; false when listed by the user.</param>
public sealed record RelativeHeightPrecision(string From, string To, double Difference, double SdDifference,
    double Confidence, bool Observed);

/// <summary>
/// The statistics of one adjustment (see docs/methods.md): observation tests and reliability, absolute and relative
/// precision. Immutable. Obtain it from <c>AdjustmentResult.Analysis</c> or <see cref="ResultAnalysis.Analyse"/>.
/// </summary>
public sealed record NetworkAnalysis
{
    /// <summary>The options used.</summary>
    public required AnalysisOptions Options { get; init; }

    /// <summary>The variance factor basis actually used (estimated falls back to known when r = 0).</summary>
    public required VarianceFactorBasis Basis { get; init; }

    /// <summary>The variance factor that scales the covariances: σ0² (known) or σ̂0² (estimated).</summary>
    public required double VarianceFactor { get; init; }

    /// <summary>The w-test critical value z(1 − α0/2).</summary>
    public required double WCritical { get; init; }

    /// <summary>Baarda's non-centrality δ0.</summary>
    public required double Delta0 { get; init; }

    /// <summary>The tau-test critical value; null when r &lt; 2.</summary>
    public required double? TauCritical { get; init; }

    /// <summary>The scale from a standard ellipse to the confidence ellipse.</summary>
    public required double EllipseScale { get; init; }

    /// <summary>The scale from a standard deviation to the half-width of a 1D confidence interval.</summary>
    public required double IntervalScale { get; init; }

    /// <summary>True when external reliability was computed.</summary>
    public required bool ExternalReliabilityComputed { get; init; }

    /// <summary>One test per observation of the result, in the same order.</summary>
    public required IReadOnlyList<ObservationTest> Observations
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Tests of weighted-control components, in point order (E, N, H).</summary>
    public required IReadOnlyList<ControlTest> Control
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>One entry per point of the result, in the same order.</summary>
    public required IReadOnlyList<PointPrecision> Points
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Relative precision of observed pairs (first appearance order) then user-listed pairs.</summary>
    public required IReadOnlyList<RelativePrecision> Relative
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Relative height precision of pairs joined by a height difference (first appearance order) then
    /// user-listed pairs with heights.</summary>
    public IReadOnlyList<RelativeHeightPrecision> RelativeHeights
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List<RelativeHeightPrecision>([]);

    /// <summary>Σ rᵢ over all weighted rows (equals the degrees of freedom up to rounding).</summary>
    public required double RedundancySum { get; init; }
}
