using System.Text.Json.Serialization;

namespace NetAdjust.IO.Results;

/// <summary>
/// The document types of the JSON result (<c>netadjust-result/1</c>) and of the sequence
/// (<c>netadjust-sequence/1</c>), serialised by <see cref="ResultJsonContext"/> (System.Text.Json source generation).
/// Keys are the snake-case names of the properties, in declaration order (docs/output-format.md). A nullable
/// property is written as <c>null</c> unless it is marked to be left out when null (the optional keys). Arrays are
/// sequences, enumerated while the document is written, so no row list is built beside the report model.
/// </summary>
internal static partial class ResultJson
{
    /// <summary>The survey's particulars (key <c>survey</c>; items not given are null).</summary>
    internal sealed record Particulars(string? Client, string? Site, string? Reference, string? Surveyor, string? Firm,
        IEnumerable<string> Observed, IEnumerable<Equipment> Equipment, string? Weather, string? Note);

    /// <summary>One item of equipment.</summary>
    internal sealed record Equipment(string Item, string? Serial, string? Calibrated);

    /// <summary>One result: the whole <c>netadjust-result/1</c> document, or one of a sequence's solutions.</summary>
    internal sealed class Document
    {
        public required string Format { get; init; }
        public required string Generator { get; init; }
        public required string Project { get; init; }
        public required string Input { get; init; }
        public required string RunDate { get; init; }
        public required string Solver { get; init; }
        public required string Datum { get; init; }
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Particulars? Survey { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public IReadOnlyList<string>? Warnings { get; init; }
        public required Units Units { get; init; }
        public required Statistics Statistics { get; init; }
        public required IEnumerable<Point> Points { get; init; }
        public required IEnumerable<Observation> Observations { get; init; }
        public required IEnumerable<Orientation> Orientations { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public IReadOnlyList<Refraction>? Refraction { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Gnss? Gnss { get; init; }
        public required Testing Testing { get; init; }
        public required IEnumerable<Relative> Relative { get; init; }
        public required IEnumerable<RelativeHeight> RelativeHeights { get; init; }
        public required IEnumerable<ControlTest> ControlTests { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public BlunderHunt? BlunderHunt { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public DiagnosisSection? Diagnosis { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Robust? Robust { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public VarianceComponents? VarianceComponents { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public IReadOnlyList<Rounds>? Rounds { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Grid? Grid { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Misclosures? Misclosures { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public Standards? Standards { get; init; }
    }

    /// <summary>The reduction of the rounds of one setup (angles in deg, small angles in arcsec, lengths in m).
    /// </summary>
    internal sealed record Rounds(string Station, string? SetId, string Source, string Faces, string? ReferenceTarget,
        IReadOnlyList<RoundsSet> Sets, IReadOnlyList<RoundsTarget> Targets, SpreadTest? DirectionTest,
        SpreadTest? ZenithTest);

    /// <summary>One set: its line, collimation and index error (null when not determined).</summary>
    internal sealed record RoundsSet(string Source, double? Collimation, double? IndexError);

    /// <summary>One target: its reduced observations and the tests of their spread.</summary>
    internal sealed record RoundsTarget(string Target, double? Direction, double? Zenith, double? SlopeDistance,
        SpreadTest? DirectionTest, SpreadTest? ZenithTest);

    /// <summary>A spread test: s against its bound σ·√(χ²(1 − α; ν)/ν).</summary>
    internal sealed record SpreadTest(int DegreesOfFreedom, double Spread, double Sd, double Bound, bool Passes);

    /// <summary>The grid system and the reductions (key <c>grid</c>; only when the project declares one).</summary>
    internal sealed record Grid(string System, string? Crs, string Distances, string Azimuths, double? ProjectScale,
        double GeoidSeparation, double? MeanHeight, double? MeanHeightSd, double? CombinedFactorMin,
        double? CombinedFactorMax, IEnumerable<GridLine> Lines, IEnumerable<GridPoint> Points,
        IEnumerable<GridCorrection> Corrections);

    /// <summary>One distance: its factors and the adjusted line's grid and ground lengths (m).</summary>
    internal sealed record GridLine(int Index, string From, string To, double? Ground, double? ElevationFactor,
        double? ScaleFactor, double? CombinedFactor, double Grid, double AdjustedGrid, double? AdjustedGround,
        double? EllipsoidalHeight);

    /// <summary>The convergence (degrees) and point scale factor at one point.</summary>
    internal sealed record GridPoint(string Point, double Convergence, double ScaleFactor);

    /// <summary>The correction added to one angular observation (arcsec).</summary>
    internal sealed record GridCorrection(int Index, string Kind, string From, string To, double Correction);

    internal sealed record Units(string Length, string Angle, string AngularResidualAndSd);

    internal sealed record Statistics(int Observations, int Unknowns, int DegreesOfFreedom, double Vtpv,
        double AprioriVarianceFactor, double? VarianceFactor, double? Sigma0, int Iterations, GlobalTest GlobalTest);

    internal sealed record GlobalTest(double Alpha, double Statistic, double? Lower, double? Upper, bool? Passed);

    internal sealed record Point(string Id, double? E, double? N, double? H, string Fixed, string Weighted,
        double? SdE, double? SdN, double? SdH, double? CovEN, Ellipse? Ellipse, double? SdH95);

    internal sealed record Ellipse(double A, double B, double Azimuth, double A95, double B95);

    /// <summary>Test and reliability members shared by observations and control components (written last).</summary>
    internal abstract record Reliability
    {
        [JsonPropertyOrder(1)] public required double Redundancy { get; init; }
        [JsonPropertyOrder(1)] public required double? W { get; init; }
        [JsonPropertyOrder(1)] public required double? Tau { get; init; }
        [JsonPropertyOrder(1)] public required double? Mdb { get; init; }
        [JsonPropertyOrder(1)] public required double? ExternalReliability { get; init; }
        [JsonPropertyOrder(1)] public required string? ExternalReliabilityPoint { get; init; }
        [JsonPropertyOrder(1)] public required double? BiasToNoise { get; init; }
        [JsonPropertyOrder(1)] public required string? Flag { get; init; }
    }

    internal sealed record Observation : Reliability
    {
        public required int Index { get; init; }
        public required string Kind { get; init; }
        public required string? At { get; init; }
        public required string From { get; init; }
        public required string To { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public string? Set { get; init; }

        public required double Observed { get; init; }
        public required double Adjusted { get; init; }
        public required double Residual { get; init; }
        public required double Sd { get; init; }
        public required Dictionary<string, double> SdComponents { get; init; }
        public required double SdAdjusted { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public string? Source { get; init; }

        public required bool Excluded { get; init; }

        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public double? SdFactor { get; init; }
    }

    internal sealed record Orientation(string Set, string Station,
        [property: JsonPropertyName("orientation")] double Value, double Sd);

    internal sealed record Refraction(string Group, double K, double Sd);

    internal sealed record Testing(string VarianceFactorBasis, double VarianceFactorUsed, double WAlpha,
        double WCritical, double TypeIIError, double Delta0, double TauAlpha, string TauAdjustment, double? TauCritical,
        double Confidence, double EllipseScale, double IntervalScale, bool ExternalReliabilityComputed,
            double RedundancySum);

    internal sealed record Relative(string From, string To, double A, double B, double Azimuth, double A95, double B95,
        double Distance, double SdDistance, double? Ratio, double SdAzimuth, bool Observed);

    internal sealed record RelativeHeight(string From, string To, double Dh, double SdDh, double Dh95, bool Observed);

    internal sealed record ControlTest : Reliability
    {
        public required string Point { get; init; }
        public required string Component { get; init; }
        public required double Residual { get; init; }
    }

    internal sealed record BlunderHunt(string StopReason, IEnumerable<int> SetAside, IEnumerable<HuntRound> Rounds);

    internal sealed record HuntRound(int Round, int DegreesOfFreedom, double? VarianceFactor, bool? GlobalTestPassed,
        int? WorstIndex, double? WorstStatistic, double? Critical, bool SetAside);

    internal sealed record Robust(string Method, double Tuning, int Iterations, bool Converged,
        IEnumerable<int> Suspected, IEnumerable<RobustObservation> Observations);

    internal sealed record RobustObservation(int Index, double WeightFactor, double? StandardisedResidual);

    internal sealed record VarianceComponents(int Iterations, bool Converged, IEnumerable<ComponentGroup> Groups);

    internal sealed record ComponentGroup(string Kind, int Count, double Redundancy, double? VarianceFactor,
        double? SdScale, double? ScaledSd, double? ConstantPart, double? PpmPart, string? Note)
    {
        /// <summary>The group of GNSS baselines (empty for baselines in no group); left out for other kinds.</summary>
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public string? Group { get; init; }
    }

    /// <summary>The sequence document: both solutions, the constraint test, discrepancies and shifts.</summary>
    internal sealed record Sequence(string Format, string Generator, string MinimalDatum,
        IEnumerable<Document> Solutions,
        ConstraintTest ConstraintTest, IEnumerable<Discrepancy> ControlDiscrepancies,
        IEnumerable<Shift> CoordinateShifts, IEnumerable<Testability> ControlTestability);

    /// <summary>Whether the observations can check one component (E, N, H) of a control mark.</summary>
    internal sealed record Testability(string Id, string Component, double? Redundancy, bool? Testable,
        IEnumerable<string> CannotBeToldApartFrom);

    internal sealed record ConstraintTest(double Alpha, int AddedConstraints, double VtpvIncrease, TestValue ChiSquare,
        [property: JsonPropertyName("f")] TestValue FTest, string DecidedBy, bool? Passed);

    internal sealed record TestValue(double? Statistic, double? Critical, bool? Passed);

    internal sealed record Discrepancy(string Id, double? De, double? Dn, double? Dh, double? SdDe, double? SdDn,
        double? SdDh, [property: JsonPropertyName("w_e")] double? WE, [property: JsonPropertyName("w_n")] double? WN,
        [property: JsonPropertyName("w_h")] double? WH, double? MaxAbsW, string? Verdict,
        IEnumerable<string> NotTestable);

    internal sealed record Shift(string Id, double? De, double? Dn, double? Dh, double? Horizontal);
}
