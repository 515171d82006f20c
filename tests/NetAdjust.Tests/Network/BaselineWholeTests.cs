using System.Collections.Immutable;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary>
/// The three components of a baseline hold what they have in common (vector, id, covariance, grid, group, scale,
/// frame) once, but each must behave as a record with those init-only properties of its own: a component made by the
/// public constructor and initialisers equal to (with the hash code of) the same component of
/// <see cref="BaselineObservation.Components"/>; a member set on one component leaving every other component, and
/// the component it was copied from, as they were; and components equal only when every member is (C# records
/// compare their members; common practice).
/// </summary>
public class BaselineWholeTests
{
    // one immutable list for all the components made here: a covariance is compared by reference (as a record's
    // member of a list type is)
    private static readonly ImmutableArray<double> Cov = [4e-6, 1e-7, 2e-7, 1e-7, 5e-6, 3e-7, 2e-7, 3e-7, 9e-6];

    private static (Length, Length, Length) Vector =>
        (Length.FromMetres(1234.5678), Length.FromMetres(-2345.6789), Length.FromMetres(345.6789));

    private static IReadOnlyList<BaselineObservation> Three() =>
        BaselineObservation.Components("B1", "GA1", "GA2", Vector, Cov, BaselineTestNetworks.Grid);

    [Fact]
    public void AComponentMadeByItsPropertiesEqualsTheSameComponentOfComponents()
    {
        var three = Three();
        var (dx, dy, dz) = Vector;
        for (int k = 0; k < 3; k++)
        {
            var made = new BaselineObservation("GA1", "GA2", dx, dy, dz)
            {
                Component = (BaselineComponent)k, Grid = BaselineTestNetworks.Grid, BaselineId = "B1",
                Covariance = three[0].Covariance, Sd = ObservationSd.FromSi(Math.Sqrt(Cov[4 * k]), isAngle: false),
            };
            Assert.Equal(three[k], made);
            Assert.Equal(three[k].GetHashCode(), made.GetHashCode());
        }
    }

    [Fact]
    public void AMemberSetOnOneComponentLeavesTheOthersAsTheyWere()
    {
        var three = Three();
        var other = new GridSystem { Projection = BaselineTestNetworks.Utm33, GeoidSeparation = 40 };
        var frame = new BaselineFrame("gnss", FrameParameterSet.Rotations);
        var y = three[1] with
        {
            Dx = Length.FromMetres(1), Dy = Length.FromMetres(2), Dz = Length.FromMetres(3), BaselineId = "B2",
            Covariance = [9e-6, 0, 0, 0, 9e-6, 0, 0, 0, 9e-6], Grid = other, Group = "S1", GroupScale = 2,
            Frame = frame,
        };
        Assert.Equal((1.0, 2.0, 3.0), y.Vector);
        Assert.Equal(("B2", 9e-6, "S1", 2.0), (y.BaselineId, y.Covariance![0], y.Group, y.GroupScale));
        Assert.Same(other, y.Grid);
        Assert.Same(frame, y.Frame);
        foreach (var c in three) // the component copied from, and the two made with it
        {
            Assert.Equal((1234.5678, -2345.6789, 345.6789), c.Vector);
            Assert.Equal(("B1", 4e-6, null, 1.0), (c.BaselineId, c.Covariance![0], c.Group, c.GroupScale));
            Assert.Same(BaselineTestNetworks.Grid, c.Grid);
            Assert.Null(c.Frame);
        }
        Assert.Equal(Three(), three);
    }

    [Fact]
    public void ComponentsAreEqualOnlyWhenEveryMemberIs()
    {
        var x = Three()[0];
        Assert.Equal(x, Three()[0]);
        Assert.NotEqual(x, x with { Dx = Length.FromMetres(1234.5679) });
        Assert.NotEqual(x, x with { Dy = Length.FromMetres(1) });
        Assert.NotEqual(x, x with { Dz = Length.FromMetres(1) });
        Assert.NotEqual(x, x with { BaselineId = "B2" });
        Assert.NotEqual(x, x with { Covariance = [.. Cov] }); // another list of the same numbers
        Assert.NotEqual(x, x with { Grid = null });
        Assert.NotEqual(x, x with { Group = "S1" });
        Assert.NotEqual(x, x with { GroupScale = 1.5 });
        Assert.NotEqual(x, x with { Frame = new BaselineFrame("gnss", FrameParameterSet.Rotations) });
        Assert.NotEqual(x, x with { Component = BaselineComponent.Y });
        Assert.Equal(x, x with { Dx = x.Dx, Grid = x.Grid, GroupScale = 1.0 });
    }

    [Fact]
    public void TheConstructorStillChecksItsArguments()
    {
        var (dx, dy, _) = Vector;
        Assert.Equal("From", Assert.ThrowsAny<ArgumentException>(() =>
            new BaselineObservation(" ", "GA2", dx, dy, Length.FromMetres(double.NaN))).ParamName);
        Assert.Equal("Dz", Assert.Throws<ArgumentOutOfRangeException>(() =>
            new BaselineObservation("GA1", "GA2", dx, dy, Length.FromMetres(double.NaN))).ParamName);
        Assert.Equal("Dy", Assert.Throws<ArgumentOutOfRangeException>(() =>
            Three()[0] with { Dy = Length.FromMetres(double.PositiveInfinity) }).ParamName);
        var (from, to, _, _, z) = Three()[2];
        Assert.Equal(("GA1", "GA2", 345.6789), (from, to, z.Metres));
    }
}
