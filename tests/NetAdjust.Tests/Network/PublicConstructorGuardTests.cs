using System.Reflection;
using FsCheck;
using FsCheck.Fluent;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary>
/// Every public constructor of an observation, a point, a typed standard deviation, an error budget and an instrument
/// specification refuses impossible input: a standard deviation that is NaN, infinite, negative or zero, a value
/// that is not finite, a distance, section length or instrument height below zero, an empty id. Observations,
/// points, standard deviations and budgets throw an <see cref="ArgumentException"/>
/// (<see cref="ArgumentOutOfRangeException"/> for numbers of observations and points) naming the parameter;
/// specifications throw <see cref="InvalidInputException"/> naming the quantity, as
/// the project reader reports it. Common practice: a standard deviation is a positive finite number; a measured
/// distance is positive; an instrument stands above its mark.
/// The observation constructors are found by reflection, so a new kind is checked without being listed here.
/// </summary>
public sealed class PublicConstructorGuardTests
{
    /// <summary>NaN and both infinities.</summary>
    private static readonly Gen<double> NotFinite =
        Gen.Elements(double.NaN, double.PositiveInfinity, double.NegativeInfinity);

    /// <summary>Negative numbers of every magnitude, from the smallest subnormal to the largest double.</summary>
    private static readonly Gen<double> Negative = Gen.OneOf(
        Gen.Elements(-double.Epsilon, -0.001, -double.MaxValue),
        Gen.Choose(1, int.MaxValue).Select(k => -k * 1e-6),
        Gen.Choose(-300, 300).Select(e => -Math.Pow(10, e)));

    /// <summary>Every bad standard deviation: not finite, negative, or zero (a weight of 1/0).</summary>
    private static readonly Gen<double> BadSd = Gen.OneOf(NotFinite, Negative, Gen.Constant(0.0));

    /// <summary>Empty and white-space ids.</summary>
    private static readonly Gen<string> EmptyId = Gen.Elements("", " ", "\t", "  \n");

    /// <summary>Parameters whose value must not be negative (and for distances and section lengths not zero).</summary>
    private static readonly HashSet<string> NotNegative = ["Distance", "InstrumentHeight", "LineLength"];

    /// <summary>The public constructor of every public observation record.</summary>
    private static readonly ConstructorInfo[] ObservationConstructors = typeof(Observation).Assembly.GetExportedTypes()
        .Where(t => t.IsSubclassOf(typeof(Observation)) && !t.IsAbstract)
        .SelectMany(t => t.GetConstructors().Where(c => c.GetParameters().All(p => p.ParameterType != t)))
        .OrderBy(c => c.DeclaringType!.Name, StringComparer.Ordinal)
        .ToArray();

    [Fact]
    public void EveryObservationKindHasOnePublicConstructorChecked()
    {
        var kinds = ObservationConstructors.Select(c => ((Observation)c.Invoke(Valid(c))).Kind).ToList();
        Assert.Equal(ObservationKinds.All.OrderBy(k => k), kinds.OrderBy(k => k));
    }

    [Fact]
    public void ValidArgumentsAreTaken()
    {
        // The guards do not refuse what they must take: positive lengths, finite angles, ids with characters, a
        // negative height difference and target height, a zero instrument height.
        foreach (var c in ObservationConstructors)
        {
            var args = Valid(c);
            foreach (var p in c.GetParameters())
                if (p.ParameterType == typeof(Length) && !NotNegative.Contains(p.Name!))
                    args[p.Position] = Length.FromMetres(-1.5);
                else if (p.Name == "InstrumentHeight")
                    args[p.Position] = Length.Zero;
            Assert.IsAssignableFrom<Observation>(c.Invoke(args));
        }
    }

    [Fact]
    public void NotFiniteValuesAreRefusedByEveryObservationConstructor()
    {
        Prop.ForAll(Arb.From(NotFinite), v => ObservationConstructors.All(c => c.GetParameters()
                .Where(p => p.ParameterType == typeof(Length) || p.ParameterType == typeof(Length?)
                    || p.ParameterType == typeof(Angle))
                .All(p => RefusesWith<ArgumentOutOfRangeException>(c, p,
                    p.ParameterType == typeof(Angle) ? Angle.FromRadians(v) : Length.FromMetres(v)))))
            .QuickCheckThrowOnFailure();
    }

    [Fact]
    public void NegativeDistancesSectionLengthsAndInstrumentHeightsAreRefused()
    {
        Assert.Contains(ObservationConstructors, c => c.GetParameters().Any(p => NotNegative.Contains(p.Name!)));
        Prop.ForAll(Arb.From(Negative), v => ObservationConstructors.All(c => c.GetParameters()
                .Where(p => NotNegative.Contains(p.Name!))
                .All(p => RefusesWith<ArgumentOutOfRangeException>(c, p, Length.FromMetres(v)))))
            .QuickCheckThrowOnFailure();
        // A distance and a section length of zero are no measurement (common practice).
        foreach (var c in ObservationConstructors)
            foreach (var p in c.GetParameters().Where(p => p.Name is "Distance" or "LineLength"))
                Assert.True(RefusesWith<ArgumentOutOfRangeException>(c, p, Length.Zero), $"{c.DeclaringType} {p}");
    }

    [Fact]
    public void EmptyIdsAreRefusedByEveryObservationConstructorAndByPoint()
    {
        Prop.ForAll(Arb.From(EmptyId), id => ObservationConstructors.All(c => c.GetParameters()
                .Where(p => p.ParameterType == typeof(string))
                .All(p => RefusesWith<ArgumentException>(c, p, id))))
            .QuickCheckThrowOnFailure();
        foreach (var c in ObservationConstructors)
            foreach (var p in c.GetParameters().Where(p => p.ParameterType == typeof(string)))
                Assert.True(RefusesWith<ArgumentNullException>(c, p, null), $"{c.DeclaringType} {p}");
        var e = Assert.Throws<ArgumentException>(() => new Point(" "));
        Assert.Equal("Id", e.ParamName);
        Assert.Equal("Id", Assert.Throws<ArgumentException>(() => new Point("A") with { Id = "" }).ParamName);
    }

    [Fact]
    public void WithExpressionsAreGuardedToo()
    {
        var d = new DistanceObservation("A", "B", Length.FromMetres(100));
        Assert.Equal("Distance",
            Assert.Throws<ArgumentOutOfRangeException>(() => d with { Distance = Length.FromMetres(-1) }).ParamName);
        var a = new AngleObservation("A", "B", "C", Angle.FromDegrees(90));
        Assert.Equal("Station", Assert.Throws<ArgumentException>(() => a with { Station = "" }).ParamName);
    }

    [Fact]
    public void EveryTypedStandardDeviationRefusesNanInfiniteNegativeAndZero()
    {
        var obs = new DistanceObservation("A", "B", Length.FromMetres(100));
        var dir = new DirectionObservation("A", "B", Angle.FromDegrees(10), "A/1");
        var point = new Point("A") { E = 1, N = 2, H = 3 };
        Prop.ForAll(Arb.From(BadSd), v =>
                Refuses<ArgumentOutOfRangeException>(() => ObservationSd.Of(Length.FromMetres(v)), "sd")
                && Refuses<ArgumentOutOfRangeException>(() => ObservationSd.Of(Angle.FromRadians(v)), "sd")
                && Refuses<ArgumentOutOfRangeException>(() => obs with { Sd = Length.FromMetres(v) }, "sd")
                && Refuses<ArgumentOutOfRangeException>(() => dir with { Sd = Angle.FromRadians(v) }, "sd")
                && Refuses<ArgumentOutOfRangeException>(() => point with { SdE = v }, "SdE")
                && Refuses<ArgumentOutOfRangeException>(() => point with { SdN = v }, "SdN")
                && Refuses<ArgumentOutOfRangeException>(() => point with { SdH = v }, "SdH")
                && Refuses<ArgumentException>(() => new ErrorBudget([new("pointing", v)]), "contributions"))
            .QuickCheckThrowOnFailure();
        // The default of the struct (zero) cannot slip through the observation's init either.
        Assert.Equal("Sd", Assert.Throws<ArgumentOutOfRangeException>(() => obs with { Sd = default(ObservationSd) })
            .ParamName);
    }

    [Fact]
    public void EveryTypedSpecificationConstructorRefusesNanInfiniteAndNegativeStandardDeviations()
    {
        var sd = Angle.FromArcseconds(1);
        var mm = Length.FromMillimetres(1);
        (string Name, Action<double> Build)[] constructors =
        [
            ("direction standard deviation",
                v => _ = new TotalStationSpecification("TS", Angle.FromRadians(v), sd, null, mm, mm)),
            ("zenith angle standard deviation",
                v => _ = new TotalStationSpecification("TS", sd, Angle.FromRadians(v), null, mm, mm)),
            ("centering error of instrument",
                v => _ = new TotalStationSpecification("TS", sd, sd, null, Length.FromMetres(v), mm)),
            ("height measurement error of instrument",
                v => _ = new TotalStationSpecification("TS", sd, sd, null, mm, Length.FromMetres(v))),
            ("EDM constant part", v => _ = new EdmSpecification(Length.FromMetres(v), 2)),
            ("EDM proportional part", v => _ = new EdmSpecification(mm, v)),
            ("centering error of target", v => _ = new TargetSpecification("T", Length.FromMetres(v), mm)),
            ("height measurement error of target", v => _ = new TargetSpecification("T", mm, Length.FromMetres(v))),
            ("standard deviation per km", v => _ = LevelSpecification.PerKm("L", Length.FromMetres(v))),
            ("reading standard deviation",
                v => _ = LevelSpecification.PerReading("L", Length.FromMetres(v), mm, RoundingTreatment.Uniform)),
            ("reading resolution",
                v => _ = LevelSpecification.PerReading("L", mm, Length.FromMetres(v), RoundingTreatment.Uniform)),
        ];
        Prop.ForAll(Arb.From(Gen.OneOf(NotFinite, Negative)), v => constructors.All(c => RefusesInput(c.Build, v,
                c.Name)))
            .QuickCheckThrowOnFailure();
        foreach (var (_, build) in constructors)
            build(0.0015);
        Assert.Throws<InvalidInputException>(() => new TargetSpecification(" ", mm, mm));
    }

    [Fact]
    public void ATypedStandardDeviationKeepsItsUnit()
    {
        // The SI Brochure (BIPM, 9th ed. 2019): 1″ = (1/60)′ = (π/648 000) rad (Table 8) and milli = 10⁻³ (Table 7);
        // the table numbers are from memory, the two definitions common practice.
        var d = new DirectionObservation("A", "B", Angle.FromDegrees(10), "A/1") { Sd = Angle.FromArcseconds(2) };
        Assert.Equal(2 * Math.PI / 648000, d.StandardDeviation, 1e-18);
        Assert.Equal(2, d.Sd!.Value.AsAngle!.Value.Arcseconds, 12);
        Assert.Null(d.Sd.Value.AsLength);
        var s = new DistanceObservation("A", "B", Length.FromMetres(100)) { Sd = Length.FromMillimetres(3) };
        Assert.Equal(0.003, s.StandardDeviation, 1e-18);
        Assert.Equal("3 mm", s.Sd!.Value.ToString());
        Assert.Equal("2\"", d.Sd.Value.ToString());
        // No standard deviation: the stochastic model derives it from the weighting.
        Assert.Null(new DistanceObservation("A", "B", Length.FromMetres(100)).Sd);
    }

    [Fact]
    public void AnAngleForALengthKindOrALengthForAnAngularKindIsRefused()
    {
        var e = Assert.Throws<ArgumentException>(() =>
            new DistanceObservation("A", "B", Length.FromMetres(100)) { Sd = Angle.FromArcseconds(2) });
        Assert.Equal("Sd", e.ParamName);
        Assert.Throws<ArgumentException>(() =>
            new ZenithObservation("A", "B", Angle.FromDegrees(90), Length.Zero, Length.Zero)
            { Sd = Length.FromMillimetres(2) });
    }

    [Fact]
    public void TheSdDimensionOfEveryKindAgreesWithItsDescription()
    {
        foreach (var kind in ObservationKinds.All)
            Assert.Equal(kind.IsAngular(), ObservationKinds.ValueIsAngle(kind));
    }

    [Fact]
    public void NoPublicInputMemberTakesAStandardDeviationAsABareDouble()
    {
        // Standard deviations of observations and instruments are typed (Length, Angle): a number of arcseconds
        // given where radians are meant would weight the adjustment 206 265 times wrong without an error. Points
        // keep metres as doubles like their coordinates; a factor (SdFactor) and the sd of the refraction
        // coefficient (RefractionSd) have no unit.
        var types = new[]
        {
            typeof(Observation), typeof(TotalStationSpecification), typeof(TargetSpecification),
            typeof(EdmSpecification), typeof(LevelSpecification), typeof(ObservationSd),
        }.Concat(ObservationConstructors.Select(c => c.DeclaringType!));
        var bare = new List<string>();
        foreach (var t in types)
        {
            foreach (var m in t.GetMembers(BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static))
            {
                IEnumerable<(string Name, Type Type)> named = m switch
                {
                    PropertyInfo p => [(p.Name, p.PropertyType)],
                    MethodBase b => b.GetParameters().Select(p => (p.Name!, p.ParameterType)),
                    _ => [],
                };
                foreach (var (name, type) in named)
                    if ((type == typeof(double) || type == typeof(double?))
                        && name is not ("SdFactor" or "RefractionSd")
                        && (name.Contains("sd", StringComparison.OrdinalIgnoreCase)
                            || name.Contains("deviation", StringComparison.OrdinalIgnoreCase)))
                        bare.Add($"{t.Name}.{m.Name}: {name}");
            }
        }
        Assert.Empty(bare);
    }

    /// <summary>Valid arguments: distinct ids P1, P2..., lengths of 100 m, angles of 1 rad, no section
    /// length.</summary>
    private static object?[] Valid(ConstructorInfo c)
    {
        int id = 0;
        return c.GetParameters().Select(p => p.ParameterType switch
        {
            var t when t == typeof(string) => (object?)$"P{++id}",
            var t when t == typeof(Length) => Length.FromMetres(100),
            var t when t == typeof(Angle) => Angle.FromRadians(1),
            var t when t == typeof(Length?) => null,
            var t => throw new InvalidOperationException($"no valid value for {t} in {c.DeclaringType}"),
        }).ToArray();
    }

    /// <summary>True when the constructor, given <paramref name="value"/> for <paramref name="p"/> and valid
    /// values elsewhere, throws <typeparamref name="T"/> naming the parameter.</summary>
    private static bool RefusesWith<T>(ConstructorInfo c, ParameterInfo p, object? value) where T : ArgumentException
    {
        var args = Valid(c);
        args[p.Position] = value;
        try
        {
            c.Invoke(args);
            return false;
        }
        catch (TargetInvocationException e) when (e.InnerException is ArgumentException a)
        {
            return a is T && a.ParamName == p.Name;
        }
    }

    private static bool Refuses<T>(Func<object> build, string parameter) where T : ArgumentException
    {
        try
        {
            build();
            return false;
        }
        catch (ArgumentException e)
        {
            return e is T && string.Equals(e.ParamName, parameter, StringComparison.OrdinalIgnoreCase);
        }
    }

    private static bool RefusesInput(Action<double> build, double value, string name)
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
