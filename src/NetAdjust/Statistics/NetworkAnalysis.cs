using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Statistics;
using NetAdjust.Units;

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
/// Tests and reliability of one observation (or one weighted-control component). Made by the analysis only (the
/// constructor is internal). The minimal detectable bias is a <see cref="Quantity"/> typed like the observation
/// (a length for a control component); the external reliability is a length.
/// </summary>
public sealed record ObservationTest
{
    /// <summary>Made by the analysis: MDB in the SI unit of the row (m or rad), external reliability in m.</summary>
    internal ObservationTest(int Index, double Redundancy, double? W, double? Tau, double? Mdb,
        double? ExternalReliability, string? ExternalReliabilityPoint, double? BiasToNoiseRatio, bool? WPassed,
        bool? TauPassed, ObservationFlag Flag)
    {
        this.Index = Index; this.Redundancy = Redundancy; this.W = W; this.Tau = Tau; this.Mdb = Mdb;
        this.ExternalReliability = ExternalReliability; this.ExternalReliabilityPoint = ExternalReliabilityPoint;
        this.BiasToNoiseRatio = BiasToNoiseRatio; this.WPassed = WPassed; this.TauPassed = TauPassed;
        this.Flag = Flag;
    }

    /// <summary>Position in the result's observation list (or in the control list).</summary>
    public int Index { get; internal init; }

    /// <summary>Redundancy number rᵢ = (Qvv P)ᵢᵢ in [0, 1]; 0 for excluded.</summary>
    public double Redundancy { get; internal init; }

    /// <summary>Standardised residual wᵢ (Baarda); for an excluded observation its standardised misclosure; null
    /// when uncontrolled.</summary>
    public double? W { get => Get(_w, HasW); internal init => _w = Set(value, HasW); }

    /// <summary>Pope's τᵢ = wᵢ σ0/σ̂0; null when uncontrolled, excluded or r = 0.</summary>
    public double? Tau { get => Get(_tau, HasTau); internal init => _tau = Set(value, HasTau); }

    /// <summary>Minimal detectable bias (m or rad); null when uncontrolled or excluded.</summary>
    internal double? Mdb { get => Get(_mdb, HasMdb); init => _mdb = Set(value, HasMdb); }

    /// <summary>True when the row is an angular observation (its MDB is an angle).</summary>
    internal bool IsAngle { get => (_bits & Angular) != 0; init => _bits = value ? _bits | Angular : _bits & ~Angular; }

    /// <summary>Largest coordinate shift (m) an undetected MDB would cause; null when not computed.</summary>
    internal double? ExternalReliability { get => Get(_ext, HasExt); init => _ext = Set(value, HasExt); }

    /// <summary>The point that shift falls on; null when not computed.</summary>
    public string? ExternalReliabilityPoint { get; internal init; }

    /// <summary>λ̄ᵢ = δ0 √((1 − rᵢ)/rᵢ): the effect of an MDB on any estimated quantity, in its standard
    /// deviations.</summary>
    public double? BiasToNoiseRatio { get => Get(_bnr, HasBnr); internal init => _bnr = Set(value, HasBnr); }

    /// <summary>The w-test outcome; null when not possible.</summary>
    public bool? WPassed { get => Outcome(HasWPassed); internal init => SetOutcome(value, HasWPassed); }

    /// <summary>The tau-test outcome; null when not possible.</summary>
    public bool? TauPassed { get => Outcome(HasTauPassed); internal init => SetOutcome(value, HasTauPassed); }

    // The optional numbers and outcomes are kept as plain doubles and bits (a number is 0 when absent, so that the
    // record's equality and hash code are as with nullable members): a row takes 48 bytes less, and a
    // million-point network has nine million rows.
    private readonly double _w, _tau, _mdb, _ext, _bnr;
    private int _bits;
    private const int HasW = 1, HasTau = 2, HasMdb = 4, HasExt = 8, HasBnr = 16, HasWPassed = 32, HasTauPassed = 128,
        Angular = 512; // an outcome's value is the bit above its own

    private double? Get(double value, int bit) => (_bits & bit) != 0 ? value : null;

    private double Set(double? value, int bit)
    {
        _bits = value is null ? _bits & ~bit : _bits | bit;
        return value ?? 0;
    }

    private bool? Outcome(int bit) => (_bits & bit) != 0 ? (_bits & (bit << 1)) != 0 : null;

    private void SetOutcome(bool? value, int bit) =>
        _bits = (_bits & ~(bit | (bit << 1))) | (value is bool b ? bit | (b ? bit << 1 : 0) : 0);

    /// <summary>The summary flag.</summary>
    public ObservationFlag Flag { get; internal init; }

    /// <summary>Minimal detectable bias, typed like the observation (an angle for angular kinds, a length
    /// otherwise); null when uncontrolled or excluded.</summary>
    public Quantity? MinimalDetectableBias => Mdb is double m ? Quantity.FromSi(m, IsAngle) : null;

    /// <summary>External reliability: the largest coordinate shift an undetected minimal detectable bias would
    /// cause (at <see cref="ExternalReliabilityPoint"/>); null when not computed.</summary>
    public Length? ExternalReliabilityShift => Lengths.Of(ExternalReliability);
}

/// <summary>A weighted-control component treated as an observation, with its test. Made by the analysis only.
/// </summary>
public sealed record ControlTest
{
    /// <summary>Made by the analysis: residual in m.</summary>
    internal ControlTest(string PointId, Parameter Component, double Residual, ObservationTest Test)
    {
        this.PointId = PointId; this.Component = Component; this.Residual = Residual; this.Test = Test;
    }

    /// <summary>The control point.</summary>
    public string PointId { get; internal init; }

    /// <summary>The coordinate tested: <see cref="Parameter.E"/>, <see cref="Parameter.N"/> or
    /// <see cref="Parameter.H"/>.</summary>
    public Parameter Component { get; internal init; }

    /// <summary>v = adjusted − given (m).</summary>
    internal double Residual { get; init; }

    /// <summary>Its redundancy and tests.</summary>
    public ObservationTest Test { get; internal init; }

    /// <summary>The residual v = adjusted − given of the control coordinate.</summary>
    public Length ResidualLength => Length.FromMetres(Residual);
}

/// <summary>The precision of one adjusted point. Made by the analysis only.</summary>
public sealed record PointPrecision
{
    /// <summary>Made by the analysis: height standard deviation and interval in m.</summary>
    internal PointPrecision(string Id, ErrorEllipse? Ellipse, ErrorEllipse? Confidence, double? SdHeight,
        double? HeightConfidence)
    {
        this.Id = Id; this.Ellipse = Ellipse; this.Confidence = Confidence; this.SdHeight = SdHeight;
        this.HeightConfidence = HeightConfidence;
    }

    /// <summary>The point id.</summary>
    public string Id { get; internal init; }

    /// <summary>The standard error ellipse; null when the point has no adjusted plane coordinates.</summary>
    public ErrorEllipse? Ellipse { get; internal init; }

    /// <summary>The confidence ellipse (the standard one scaled by <see cref="NetworkAnalysis.EllipseScale"/>);
    /// null likewise.</summary>
    public ErrorEllipse? Confidence { get; internal init; }

    /// <summary>Standard deviation of the height (m); null when the height is not adjusted.</summary>
    internal double? SdHeight { get; init; }

    /// <summary>Half-width of the height confidence interval (m); null likewise.</summary>
    internal double? HeightConfidence { get; init; }

    /// <summary>Standard deviation of the height; null when the height is not adjusted.</summary>
    public Length? SdHeightLength => Lengths.Of(SdHeight);

    /// <summary>Half-width of the height's confidence interval; null when the height is not adjusted.</summary>
    public Length? HeightConfidenceLength => Lengths.Of(HeightConfidence);
}

/// <summary>The relative precision of two points: the ellipse of the coordinate difference (to − from). Made by the
/// analysis only.</summary>
public sealed record RelativePrecision
{
    /// <summary>Made by the analysis: distance and its standard deviation in m, azimuth standard deviation in
    /// rad.</summary>
    internal RelativePrecision(string From, string To, ErrorEllipse Ellipse, ErrorEllipse Confidence,
        double Distance, double SdDistance, double SdAzimuth, bool Observed)
    {
        this.From = From; this.To = To; this.Ellipse = Ellipse; this.Confidence = Confidence;
        this.Distance = Distance; this.SdDistance = SdDistance; this.SdAzimuth = SdAzimuth; this.Observed = Observed;
    }

    /// <summary>First point.</summary>
    public string From { get; internal init; }

    /// <summary>Second point.</summary>
    public string To { get; internal init; }

    /// <summary>Standard relative ellipse.</summary>
    public ErrorEllipse Ellipse { get; internal init; }

    /// <summary>Confidence relative ellipse.</summary>
    public ErrorEllipse Confidence { get; internal init; }

    /// <summary>Adjusted horizontal distance (m).</summary>
    internal double Distance { get; init; }

    /// <summary>Standard deviation of that distance (m).</summary>
    internal double SdDistance { get; init; }

    /// <summary>Standard deviation of the azimuth from → to (rad).</summary>
    internal double SdAzimuth { get; init; }

    /// <summary>True when the pair is joined by an observation; false when listed by the user.</summary>
    public bool Observed { get; internal init; }

    /// <summary>The adjusted horizontal distance.</summary>
    public Length DistanceLength => Length.FromMetres(Distance);

    /// <summary>The standard deviation of <see cref="DistanceLength"/>.</summary>
    public Length SdDistanceLength => Length.FromMetres(SdDistance);

    /// <summary>The standard deviation of the azimuth from → to.</summary>
    public Angle SdAzimuthAngle => Angle.FromRadians(SdAzimuth);

    /// <summary>Relative distance precision as the denominator of 1 : k (distance / its standard deviation); infinite
    /// when exact.</summary>
    public double Ratio => SdDistance > 0 ? Distance / SdDistance : double.PositiveInfinity;
}

/// <summary>The relative precision of the heights of two points: the standard deviation of H(to) − H(from). Made by
/// the analysis only.</summary>
public sealed record RelativeHeightPrecision
{
    /// <summary>Made by the analysis: lengths in m.</summary>
    internal RelativeHeightPrecision(string From, string To, double Difference, double SdDifference,
        double Confidence, bool Observed)
    {
        this.From = From; this.To = To; this.Difference = Difference; this.SdDifference = SdDifference;
        this.Confidence = Confidence; this.Observed = Observed;
    }

    /// <summary>First point.</summary>
    public string From { get; internal init; }

    /// <summary>Second point.</summary>
    public string To { get; internal init; }

    /// <summary>Adjusted height difference H(to) − H(from) (m).</summary>
    internal double Difference { get; init; }

    /// <summary>Its standard deviation (m).</summary>
    internal double SdDifference { get; init; }

    /// <summary>Half-width of its confidence interval (m).</summary>
    internal double Confidence { get; init; }

    /// <summary>True when the pair is joined by a height difference; false when listed by the user.</summary>
    public bool Observed { get; internal init; }

    /// <summary>The adjusted height difference H(to) − H(from).</summary>
    public Length DifferenceLength => Length.FromMetres(Difference);

    /// <summary>The standard deviation of <see cref="DifferenceLength"/>.</summary>
    public Length SdDifferenceLength => Length.FromMetres(SdDifference);

    /// <summary>The half-width of the confidence interval of <see cref="DifferenceLength"/>.</summary>
    public Length ConfidenceLength => Length.FromMetres(Confidence);
}

/// <summary>
/// The statistics of one adjustment (see docs/methods.md): observation tests and reliability, absolute and relative
/// precision. Immutable. Obtain it from <c>AdjustmentResult.Analysis</c> or <see cref="ResultAnalysis.Analyse"/>.
/// </summary>
public sealed record NetworkAnalysis
{
    /// <summary>Made by the analysis (<see cref="ResultAnalysis.Analyse"/>).</summary>
    internal NetworkAnalysis()
    {
    }

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
