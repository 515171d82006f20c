using FsCheck;
using FsCheck.Fluent;
using NetAdjust.Geodesy;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Tests.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

/// <summary>
/// Error budgets are typed like the values they weight: a budget of a distance or a height difference is made of
/// lengths, one of a direction, an angle or a zenith angle of angles, so a caller cannot read radians as metres or
/// arcseconds. The public methods that took radians take and give <see cref="Angle"/> (the SI forms are internal).
/// </summary>
public sealed class TypedBudgetTests
{
    private static readonly ObservingProcedure OneSetBothFaces = new(1, Faces.Both);

    private static TotalStationSpecification Station(double isoArcsec, EdmSpecification? edm = null) =>
        new("T", Angle.FromArcseconds(isoArcsec), Angle.FromArcseconds(isoArcsec), edm, Length.Zero,
            Length.FromMillimetres(1));

    [Fact]
    public void BudgetsOfAnglesAreAngles()
    {
        // ISO 17123-3: σ is the standard deviation of one direction observed in both faces, so one set in both faces
        // weights a direction with σ itself, and an angle (difference of two directions) with √2·σ (common practice).
        var direction = DirectionBudgetBuilder.Build(Station(5), null, OneSetBothFaces, 200);
        Assert.True(direction.TotalSd.IsAngle);
        Assert.Null(direction.TotalSd.AsLength);
        Assert.Equal(5.0, direction.TotalSd.AsAngle!.Value.Arcseconds, 9);
        Assert.All(direction.Contributions, c => Assert.True(c.Sd.IsAngle, c.Name));

        var angle = AngleBudgetBuilder.Build(Station(5), null, null, OneSetBothFaces, 150, 150,
            Angle.FromDegrees(90));
        Assert.Equal(5.0 * Math.Sqrt(2), angle.TotalSd.AsAngle!.Value.Arcseconds, 9);
        Assert.Equal(angle.TotalSd, angle.SdOf(ContributionNames.PointingReading));

        var zenith = ZenithBudgetBuilder.Build(Station(5), null, OneSetBothFaces, 200);
        Assert.All(zenith.Contributions, c => Assert.True(c.Sd.IsAngle, c.Name));
        // σ_h/s of the instrument height: 1 mm at 200 m is 1/200000 rad (docs/methods.md, common practice).
        Assert.Equal(0.001 / 200, zenith.SdOf(ContributionNames.InstrumentHeight).AsAngle!.Value.Radians, 15);
    }

    [Fact]
    public void BudgetsOfLengthsAreLengths()
    {
        // An EDM specification a + b·ppm: σ = √(a² + (b·D)²), 2 mm + 2 ppm at 500 m → √(2² + 1²) mm (common
        // practice, ISO 17123-4's form of the specification).
        var distance = DistanceBudgetBuilder.Build(Station(5, new EdmSpecification(Length.FromMillimetres(2), 2)),
            null, 500);
        Assert.False(distance.TotalSd.IsAngle);
        Assert.Null(distance.TotalSd.AsAngle);
        Assert.Equal(Math.Sqrt(5), distance.TotalSd.AsLength!.Value.Metres * 1000, 9);
        Assert.Equal(1.0, distance.SdOf(ContributionNames.EdmProportional).AsLength!.Value.Metres * 1000, 9);

        // ISO 17123-2: σ of 1 km double-run levelling; a 4 km line double run: 0.7 mm × √4 (common practice).
        var level = LevelSpecification.PerKm("L", Length.FromMillimetres(0.7));
        var height = HeightDifferenceBudgetBuilder.Build(level, 4000, null);
        Assert.Equal(1.4, height.TotalSd.AsLength!.Value.Metres * 1000, 9);
        Assert.All(height.Contributions, c => Assert.False(c.Sd.IsAngle, c.Name));
    }

    [Fact]
    public void ABudgetGivenInCodeKeepsItsKindAndRefusesMixedKinds()
    {
        // Root-sum-square of independent parts: 3″ and 4″ give 5″ (error of a sum, common practice).
        var b = new ErrorBudget([new("pointing", Quantity.Of(Angle.FromArcseconds(3))),
            new("centering", Quantity.Of(Angle.FromArcseconds(4)))]);
        Assert.Equal(5.0, b.TotalSd.AsAngle!.Value.Arcseconds, 12);
        Assert.Equal(10.0, b.Scaled(2).TotalSd.AsAngle!.Value.Arcseconds, 12);
        Assert.Equal(Quantity.Of(Angle.Zero), b.SdOf("no_such_part"));
        var mixed = Assert.Throws<ArgumentException>(() => new ErrorBudget([
            new("pointing", Quantity.Of(Angle.FromArcseconds(3))),
            new("edm", Quantity.Of(Length.FromMillimetres(2)))]));
        Assert.Equal("contributions", mixed.ParamName);
        Assert.Throws<ArgumentException>(() => new ErrorBudget([]));
    }

    [Fact]
    public void AContributionRefusesNegativeAndNonFiniteStandardDeviations()
    {
        // Common practice: a standard deviation is zero or positive and finite (zero: a part that does not apply).
        var bad = Gen.OneOf(Gen.Elements(double.NaN, double.PositiveInfinity, double.NegativeInfinity,
            -double.Epsilon, -double.MaxValue), Gen.Choose(1, int.MaxValue).Select(k => -k * 1e-6));
        Prop.ForAll(Arb.From(bad), v =>
                Throws(() => new ErrorContribution("a", Quantity.Of(Angle.FromRadians(v))))
                && Throws(() => new ErrorContribution("a", Quantity.Of(Length.FromMetres(v)))))
            .QuickCheckThrowOnFailure();
        Assert.Equal(0.0, new ErrorContribution("a", Quantity.Of(Length.Zero)).Sd.AsLength!.Value.Metres);
    }

    private static bool Throws(Func<ErrorContribution> make)
    {
        try
        {
            make();
            return false;
        }
        catch (ArgumentOutOfRangeException e)
        {
            return e.ParamName == "sd";
        }
    }

    [Fact]
    public void PointingReadingIsTypedAndFollowsSetsAndFaces()
    {
        // ISO 17123-3 σ of one direction in both faces: n sets → σ/√n, one face → σ·√2 (common practice).
        var iso = Angle.FromArcseconds(6);
        Assert.Equal(3.0, DirectionBudgetBuilder.PointingReading(iso, new ObservingProcedure(4, Faces.Both))
            .Arcseconds, 12);
        Assert.Equal(6.0 * Math.Sqrt(2), DirectionBudgetBuilder.PointingReading(iso, new ObservingProcedure(1,
            Faces.One)).Arcseconds, 12);
    }

    [Fact]
    public void EllipsoidRadiiTakeATypedLatitude()
    {
        // WGS 84 at φ = 45°: M = 6 367 381.816 m, ν = 6 388 838.290 m (docs/references.md §14, computed once
        // from a and f with the formulas written there).
        var wgs = Ellipsoid.Wgs84;
        var phi = Angle.FromDegrees(45);
        Assert.Equal(6_367_381.816, wgs.MeridianRadius(phi).Metres, 3);
        Assert.Equal(6_388_838.290, wgs.PrimeVerticalRadius(phi).Metres, 3);
        // Euler: the normal section along the meridian has radius M, across it ν (common practice).
        Assert.Equal(wgs.MeridianRadius(phi).Metres, wgs.RadiusInAzimuth(phi, Angle.Zero).Metres, 6);
        Assert.Equal(wgs.PrimeVerticalRadius(phi).Metres, wgs.RadiusInAzimuth(phi, Angle.FromDegrees(90)).Metres, 6);
        Assert.Equal(Math.Sqrt(6_367_381.816 * 6_388_838.290), wgs.GaussianMeanRadius(phi).Metres, 2);
        // A line at height 0 lies on the ellipsoid: elevation factor 1 (common practice).
        Assert.Equal(1.0, ProjectionFactors.ElevationFactor(wgs, phi, Angle.FromDegrees(30), Length.Zero), 15);
    }

    [Fact]
    public void ProjectionsAreUsedWithTypedAnglesAndLengths()
    {
        // UTM zone 33: central meridian 15° E, k0 = 0.9996, false easting 500 000 m (Snyder 1987, USGS Professional
        // Paper 1395, §8): on the central meridian the easting is the false easting and the convergence is zero.
        var utm = KruegerTransverseMercator.Utm(Ellipsoid.Wgs84, 33);
        var (e, n) = utm.GridOf(Angle.FromDegrees(47), Angle.FromDegrees(15));
        Assert.Equal(500_000.0, e.Metres, 6);
        Assert.Equal(0.0, ProjectionFactors.Convergence(utm, e, n).Radians, 10);
        var (lat, lon) = utm.GeodeticOf(e, n);
        Assert.Equal(47.0, lat.Degrees, 9);
        Assert.Equal(15.0, lon.Degrees, 9);
        // East of the central meridian grid north turns west of true north: γ ≈ Δλ sin φ > 0 (common practice).
        var (e2, n2) = utm.GridOf(Angle.FromDegrees(47), Angle.FromDegrees(16));
        Assert.Equal(Math.Sin(47 * Math.PI / 180), ProjectionFactors.Convergence(utm, e2, n2).Degrees, 2);
        Assert.Equal(ProjectionFactors.ArcToChord(utm, e.Metres, n.Metres, e2.Metres, n2.Metres),
            ProjectionFactors.ArcToChord(utm, e, n, e2, n2).Radians);
    }
}
