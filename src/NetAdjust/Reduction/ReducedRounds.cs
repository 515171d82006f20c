using NetAdjust.Network;

namespace NetAdjust.Reduction;

/// <summary>The reduction of the rounds of one setup: the figures of each set and of each target, and the tests of
/// the spread over the sets (ISO 17123-3).</summary>
/// <param name="Faces">Both faces in every set, or one face in every set.</param>
/// <param name="Sets">One entry per set, in the order observed.</param>
/// <param name="Targets">One entry per target, in the order of the first set.</param>
/// <param name="ReferenceTarget">The target the directions are reduced to (the first of the first set with a
/// horizontal reading), or null when no horizontal reading was booked.</param>
/// <param name="Directions">The test of the spread of all reduced directions over the sets, or null when there are
/// fewer than two sets or fewer than two targets with horizontal readings.</param>
/// <param name="Zeniths">The test of the spread of all zenith angles over the sets, or null when there are fewer
/// than two sets, no zenith angles or no zenith standard deviation.</param>
public sealed record ReducedRounds(Faces Faces, IReadOnlyList<SetFigures> Sets, IReadOnlyList<TargetFigures> Targets,
    string? ReferenceTarget, SpreadTest? Directions, SpreadTest? Zeniths)
{
    /// <summary>The observing procedure the reduced observations are weighted with: the number of sets and the
    /// faces.</summary>
    public ObservingProcedure Procedure => new(Sets.Count, Faces);

    /// <summary>True when every spread test that could be made passes.</summary>
    public bool Passes => (Directions?.Passes ?? true) && (Zeniths?.Passes ?? true)
        && Targets.All(t => (t.DirectionTest?.Passes ?? true) && (t.ZenithTest?.Passes ?? true));
}

/// <summary>The instrument errors of one set, from its face-left and face-right readings.</summary>
/// <param name="Collimation">The collimation (line-of-sight) error c, radians: face left reads c/sin z more than
/// the mean of both faces; the mean over the set's targets of (L − R ± 180°)/2 · sin z. NaN in a one-face set or
/// without horizontal readings.</param>
/// <param name="IndexError">The vertical index error i, radians: z_L + z_R = 360° + 2i; the mean over the set's
/// targets. NaN in a one-face set or without zenith angles.</param>
public sealed record SetFigures(double Collimation, double IndexError);

/// <summary>The reduced observations of one target over all sets, with their spread.</summary>
/// <param name="Target">The point sighted.</param>
/// <param name="Reading">Index of its reading in the first set (0-based).</param>
/// <param name="Direction">Mean reduced direction, radians in [0, 2π), the reference target's being 0; NaN when no
/// horizontal reading was booked.</param>
/// <param name="Zenith">Mean zenith angle (face left, corrected for the index error in both faces), radians; NaN
/// when none was booked.</param>
/// <param name="SlopeDistance">Mean slope distance over faces and sets, metres; NaN when none was booked.</param>
/// <param name="DirectionTest">The test of the spread of this target's reduced direction over the sets, or
/// null.</param>
/// <param name="ZenithTest">The test of the spread of this target's zenith angle over the sets, or null.</param>
public sealed record TargetFigures(string Target, int Reading, double Direction, double Zenith, double SlopeDistance,
    SpreadTest? DirectionTest, SpreadTest? ZenithTest);

/// <summary>
/// A χ² test of an empirical standard deviation against the one the instrument's ISO 17123-3 figure predicts, as
/// ISO 17123-3 tests its experimental standard deviation: it passes when s ≤ σ·√(χ²(1 − α; ν)/ν).
/// </summary>
/// <param name="DegreesOfFreedom">ν.</param>
/// <param name="Empirical">s, radians: the empirical standard deviation of one direction (or zenith angle) of one
/// set.</param>
/// <param name="Expected">σ, radians: the standard deviation the specification predicts for it.</param>
/// <param name="Bound">σ·√(χ²(1 − α; ν)/ν), radians.</param>
public sealed record SpreadTest(int DegreesOfFreedom, double Empirical, double Expected, double Bound)
{
    /// <summary>True when s ≤ the bound.</summary>
    public bool Passes => Empirical <= Bound;
}
