using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Reduction;

/// <summary>The reduction of the rounds of one setup: the figures of each set and of each target, and the tests of
/// the spread over the sets (ISO 17123-3). Made by the reduction of rounds only (the constructor is internal).
/// </summary>
public sealed record ReducedRounds
{
    /// <summary>Made by the reduction of rounds.</summary>
    internal ReducedRounds(Faces Faces, IReadOnlyList<SetFigures> Sets, IReadOnlyList<TargetFigures> Targets,
        string? ReferenceTarget, SpreadTest? Directions, SpreadTest? Zeniths)
    {
        this.Faces = Faces; this.Sets = Sets; this.Targets = Targets; this.ReferenceTarget = ReferenceTarget;
        this.Directions = Directions; this.Zeniths = Zeniths;
    }

    /// <summary>Both faces in every set, or one face in every set.</summary>
    public Faces Faces { get; internal init; }

    /// <summary>One entry per set, in the order observed.</summary>
    public IReadOnlyList<SetFigures> Sets { get; internal init; }

    /// <summary>One entry per target, in the order of the first set.</summary>
    public IReadOnlyList<TargetFigures> Targets { get; internal init; }

    /// <summary>The target the directions are reduced to (the first of the first set with a horizontal reading), or
    /// null when no horizontal reading was booked.</summary>
    public string? ReferenceTarget { get; internal init; }

    /// <summary>The test of the spread of all reduced directions over the sets, or null when there are fewer than two
    /// sets or fewer than two targets with horizontal readings.</summary>
    public SpreadTest? Directions { get; internal init; }

    /// <summary>The test of the spread of all zenith angles over the sets, or null when there are fewer than two sets,
    /// no zenith angles or no zenith standard deviation.</summary>
    public SpreadTest? Zeniths { get; internal init; }

    /// <summary>The observing procedure the reduced observations are weighted with: the number of sets and the
    /// faces.</summary>
    public ObservingProcedure Procedure => new(Sets.Count, Faces);

    /// <summary>True when every spread test that could be made passes.</summary>
    public bool Passes => (Directions?.Passes ?? true) && (Zeniths?.Passes ?? true)
        && Targets.All(t => (t.DirectionTest?.Passes ?? true) && (t.ZenithTest?.Passes ?? true));
}

/// <summary>The instrument errors of one set, from its face-left and face-right readings. Made by the reduction of
/// rounds only (the constructor is internal).</summary>
public sealed record SetFigures
{
    /// <summary>Made by the reduction of rounds.</summary>
    internal SetFigures(double Collimation, double IndexError)
    {
        this.Collimation = Collimation; this.IndexError = IndexError;
    }

    /// <summary>The collimation (line-of-sight) error c, radians: face left reads c/sin z more than the mean of both
    /// faces; the mean over the set's targets of (L − R ± 180°)/2 · sin z. NaN in a one-face set or without horizontal
    /// readings.</summary>
    internal double Collimation { get; init; }

    /// <summary>The vertical index error i, radians: z_L + z_R = 360° + 2i; the mean over the set's targets. NaN in a
    /// one-face set or without zenith angles.</summary>
    internal double IndexError { get; init; }

    /// <summary>The collimation (line-of-sight) error c: face left reads c/sin z more than the mean of both faces; the
    /// mean over the set's targets of (L − R ± 180°)/2 · sin z. NaN in a one-face set or without horizontal
    /// readings.</summary>
    public Angle CollimationAngle => Lengths.Radians(Collimation);

    /// <summary>The vertical index error i: z_L + z_R = 360° + 2i; the mean over the set's targets. NaN in a one-face
    /// set or without zenith angles.</summary>
    public Angle IndexErrorAngle => Lengths.Radians(IndexError);
}

/// <summary>The reduced observations of one target over all sets, with their spread. Made by the reduction of rounds
/// only (the constructor is internal).</summary>
public sealed record TargetFigures
{
    /// <summary>Made by the reduction of rounds.</summary>
    internal TargetFigures(string Target, int Reading, double Direction, double Zenith, double SlopeDistance,
        SpreadTest? DirectionTest, SpreadTest? ZenithTest)
    {
        this.Target = Target; this.Reading = Reading; this.Direction = Direction; this.Zenith = Zenith;
        this.SlopeDistance = SlopeDistance; this.DirectionTest = DirectionTest; this.ZenithTest = ZenithTest;
    }

    /// <summary>The point sighted.</summary>
    public string Target { get; internal init; }

    /// <summary>Index of its reading in the first set (0-based).</summary>
    public int Reading { get; internal init; }

    /// <summary>Mean reduced direction, radians in [0, 2π), the reference target's being 0; NaN when no horizontal
    /// reading was booked.</summary>
    internal double Direction { get; init; }

    /// <summary>Mean zenith angle (face left, corrected for the index error in both faces), radians; NaN when none was
    /// booked.</summary>
    internal double Zenith { get; init; }

    /// <summary>Mean slope distance over faces and sets, metres; NaN when none was booked.</summary>
    internal double SlopeDistance { get; init; }

    /// <summary>The test of the spread of this target's reduced direction over the sets, or null.</summary>
    public SpreadTest? DirectionTest { get; internal init; }

    /// <summary>The test of the spread of this target's zenith angle over the sets, or null.</summary>
    public SpreadTest? ZenithTest { get; internal init; }

    /// <summary>Mean reduced direction in [0, 2π), the reference target's being 0; NaN when no horizontal reading was
    /// booked.</summary>
    public Angle DirectionAngle => Lengths.Radians(Direction);

    /// <summary>Mean zenith angle (face left, corrected for the index error in both faces); NaN when none was
    /// booked.</summary>
    public Angle ZenithAngle => Lengths.Radians(Zenith);

    /// <summary>Mean slope distance over faces and sets; NaN when none was booked.</summary>
    public Length SlopeDistanceLength => Lengths.Metres(SlopeDistance);
}

/// <summary>
/// A χ² test of an empirical standard deviation against the one the instrument's ISO 17123-3 figure predicts, as
/// ISO 17123-3 tests its experimental standard deviation: it passes when s ≤ σ·√(χ²(1 − α; ν)/ν).
/// Made by the reduction of rounds only (the constructor is internal).
/// </summary>
public sealed record SpreadTest
{
    /// <summary>Made by the reduction of rounds.</summary>
    internal SpreadTest(int DegreesOfFreedom, double Empirical, double Expected, double Bound)
    {
        this.DegreesOfFreedom = DegreesOfFreedom; this.Empirical = Empirical; this.Expected = Expected;
        this.Bound = Bound;
    }

    /// <summary>ν.</summary>
    public int DegreesOfFreedom { get; internal init; }

    /// <summary>s, radians: the empirical standard deviation of one direction (or zenith angle) of one set.</summary>
    internal double Empirical { get; init; }

    /// <summary>σ, radians: the standard deviation the specification predicts for it.</summary>
    internal double Expected { get; init; }

    /// <summary>σ·√(χ²(1 − α; ν)/ν), radians.</summary>
    internal double Bound { get; init; }

    /// <summary>s: the empirical standard deviation of one direction (or zenith angle) of one set.</summary>
    public Angle EmpiricalAngle => Lengths.Radians(Empirical);

    /// <summary>σ: the standard deviation the specification predicts for it.</summary>
    public Angle ExpectedAngle => Lengths.Radians(Expected);

    /// <summary>σ·√(χ²(1 − α; ν)/ν).</summary>
    public Angle BoundAngle => Lengths.Radians(Bound);

    /// <summary>True when s ≤ the bound.</summary>
    public bool Passes => Empirical <= Bound;
}
