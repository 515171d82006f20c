using FsCheck;
using FsCheck.Fluent;
using NetAdjust.Network;

namespace NetAdjust.Tests.Network;

/// <summary>
/// Every public constructor of an instrument, target or level specification refuses a NaN, infinite or negative
/// standard deviation (and a zero one where it must be positive) with an <see cref="InvalidInputException"/> that
/// names the quantity, instead of weighting the adjustment with it (common practice: a standard deviation is a
/// finite number of at least zero).
/// </summary>
public sealed class SpecificationGuardTests
{
    /// <summary>NaN, both infinities and negative numbers of every magnitude.</summary>
    private static readonly Gen<double> Bad = Gen.OneOf(
        Gen.Elements(double.NaN, double.PositiveInfinity, double.NegativeInfinity, -double.Epsilon, -0.001),
        Gen.Choose(1, int.MaxValue).Select(k => -k * 1e-9),
        Gen.Choose(1, 300).Select(e => -Math.Pow(10, e - 150)));

    /// <summary>Each constructor with one bad standard deviation, the others valid, and the word its message
    /// names.</summary>
    private static readonly (string Name, Action<double> Build)[] Constructors =
    [
        ("direction standard deviation", v => _ = new TotalStationSpecification("TS", v, 1e-5, null, 0.001, 0.001)),
        ("zenith angle standard deviation", v => _ = new TotalStationSpecification("TS", 1e-5, v, null, 0.001, 0.001)),
        ("centering error of instrument", v => _ = new TotalStationSpecification("TS", 1e-5, 1e-5, null, v, 0.001)),
        ("height measurement error of instrument",
            v => _ = new TotalStationSpecification("TS", 1e-5, 1e-5, null, 0.001, v)),
        ("EDM constant part", v => _ = new EdmSpecification(v, 2)),
        ("EDM proportional part", v => _ = new EdmSpecification(0.002, v)),
        ("centering error of target", v => _ = new TargetSpecification("T", v, 0.001)),
        ("height measurement error of target", v => _ = new TargetSpecification("T", 0.001, v)),
        ("standard deviation per km", v => _ = LevelSpecification.PerKm("L", v)),
        ("reading standard deviation", v => _ = LevelSpecification.PerReading("L", v, 0.001,
            RoundingTreatment.Uniform)),
        ("reading resolution", v => _ = LevelSpecification.PerReading("L", 0.0005, v, RoundingTreatment.Uniform)),
    ];

    [Fact]
    public void EveryConstructorRefusesNanInfiniteAndNegativeStandardDeviations()
    {
        Prop.ForAll(Arb.From(Bad), v => Constructors.All(c => Refuses(c.Build, v, c.Name)))
            .QuickCheckThrowOnFailure();
    }

    [Fact]
    public void PositiveStandardDeviationsMustNotBeZero()
    {
        Assert.True(Refuses(v => _ = new TotalStationSpecification("TS", v, 0, null, 0, 0), 0.0, "positive"));
        Assert.True(Refuses(v => _ = LevelSpecification.PerKm("L", v), 0.0, "positive"));
    }

    [Fact]
    public void ValidValuesAreTaken()
    {
        // The guard does not refuse what it must take: each constructor accepts a finite value of zero or more
        // (a positive one where zero is refused).
        foreach (var (name, build) in Constructors)
            build(0.0015);
    }

    private static bool Refuses(Action<double> build, double value, string name)
    {
        try
        {
            build(value);
            return false;
        }
        catch (InvalidInputException e)
        {
            return e.Message.Contains(name, StringComparison.Ordinal);
        }
    }
}
