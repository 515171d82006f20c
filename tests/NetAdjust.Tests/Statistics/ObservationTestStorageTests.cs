using FsCheck.Xunit;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// <see cref="ObservationTest"/> keeps its optional numbers and outcomes as plain doubles and bits, but it must behave
/// as the record of nullable members of the public API: every member gives back what it was made with (null, zero,
/// negative, NaN alike), each set alone through <c>with</c> leaves the others, and two rows are equal (with one hash
/// code) exactly when all their members are (C# records compare their members; common practice).
/// </summary>
public class ObservationTestStorageTests
{
    private static ObservationTest Make(double? w, double? tau, double? mdb, double? ext, double? bnr, bool? wPassed,
        bool? tauPassed, bool isAngle) =>
        new(7, 0.5, w, tau, mdb, ext, ext is null ? null : "P1", bnr, wPassed, tauPassed, ObservationFlag.None)
        { IsAngle = isAngle };

    private static object?[] Members(ObservationTest t) =>
        [t.Index, t.Redundancy, t.W, t.Tau, t.Mdb, t.ExternalReliability, t.ExternalReliabilityPoint,
            t.BiasToNoiseRatio, t.WPassed, t.TauPassed, t.IsAngle, t.Flag];

    [Property(MaxTest = 300)]
    public bool EveryMemberComesBack(double? w, double? tau, double? mdb, double? ext, double? bnr, bool? wPassed,
        bool? tauPassed, bool isAngle)
    {
        var t = Make(w, tau, mdb, ext, bnr, wPassed, tauPassed, isAngle);
        return Members(t).SequenceEqual(
            [7, 0.5, w, tau, mdb, ext, ext is null ? null : "P1", bnr, wPassed, tauPassed, isAngle,
                ObservationFlag.None]);
    }

    [Property(MaxTest = 300)]
    public bool RowsAreEqualExactlyWhenTheirMembersAre(double? w1, double? w2, bool? p1, bool? p2, double? m1,
        bool a1, bool a2)
    {
        var x = Make(w1, null, m1, null, 1.5, p1, true, a1);
        var y = Make(w2, null, m1, null, 1.5, p2, true, a2);
        bool same = Members(x).SequenceEqual(Members(y));
        return x.Equals(y) == same && (!same || x.GetHashCode() == y.GetHashCode());
    }

    [Fact]
    public void OneMemberSetAloneLeavesTheOthers()
    {
        var t = Make(1.25, -2.5, 0.003, 0.004, 3.9, true, false, true);
        var noW = t with { W = null };
        Assert.Equal(Members(t).Skip(3), Members(noW).Skip(3));
        Assert.Null(noW.W);
        var zero = t with { W = 0 };
        Assert.Equal(0.0, zero.W);
        Assert.NotEqual(noW, zero); // null and zero stay apart
        var failed = t with { TauPassed = null };
        Assert.Equal((true, null), (failed.WPassed, failed.TauPassed));
        var flipped = t with { WPassed = false };
        Assert.Equal((false, false), (flipped.WPassed, flipped.TauPassed));
        Assert.False((t with { IsAngle = false }).IsAngle);
        Assert.Equal(t, t with { });
    }
}
