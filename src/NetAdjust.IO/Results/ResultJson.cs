using System.Text.Json.Serialization;

namespace NetAdjust.IO.Results;

/// <summary>
/// The sections of the JSON result (<c>netadjust-result/1</c>) and of the sequence (<c>netadjust-sequence/1</c>)
/// that <see cref="JsonResultWriter"/> writes through <see cref="ResultJsonContext"/> (System.Text.Json source
/// generation): those of the other procedures and checks, when run. The members of the document itself and its long
/// lists (points, observations, orientations, relative precision, control tests, robust weights) are written by
/// <see cref="JsonResultWriter"/> from the report model. Keys are the snake-case names of the properties, in
/// declaration order (docs/output-format.md). A nullable property is written as <c>null</c> unless it is marked to be
/// left out when null (the optional keys). Arrays are sequences, enumerated while the section is written.
/// </summary>
internal static partial class ResultJson
{
    /// <summary>The survey's particulars (key <c>survey</c>; items not given are null).</summary>
    internal sealed record Particulars(string? Client, string? Site, string? Reference, string? Surveyor, string? Firm,
        IEnumerable<string> Observed, IEnumerable<Equipment> Equipment, string? Weather, string? Note);

    /// <summary>One item of equipment.</summary>
    internal sealed record Equipment(string Item, string? Serial, string? Calibrated);

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

    internal sealed record Refraction(string Group, double K, double Sd);

    internal sealed record BlunderHunt(string StopReason, IEnumerable<int> SetAside, IEnumerable<HuntRound> Rounds);

    internal sealed record HuntRound(int Round, int DegreesOfFreedom, double? VarianceFactor, bool? GlobalTestPassed,
        int? WorstIndex, double? WorstStatistic, double? Critical, bool SetAside);

    internal sealed record VarianceComponents(int Iterations, bool Converged, IEnumerable<ComponentGroup> Groups);

    internal sealed record ComponentGroup(string Kind, int Count, double Redundancy, double? VarianceFactor,
        double? SdScale, double? ScaledSd, double? ConstantPart, double? PpmPart, string? Note)
    {
        /// <summary>The group of GNSS baselines (empty for baselines in no group); left out for other kinds.</summary>
        [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        public string? Group { get; init; }
    }

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
