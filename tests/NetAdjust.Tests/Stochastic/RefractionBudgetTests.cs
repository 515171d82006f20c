using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

/// <summary>
/// The uncertainty of the refraction coefficient, of the instrument and target heights and of centering in the
/// budgets of zenith angles and slope distances, and their propagation into adjusted heights (docs/methods.md,
/// "Error budgets").
/// </summary>
public class RefractionBudgetTests
{
    private const double Arcsec = Math.PI / 648000;
    private const double R = 6_371_008.8; // the mean earth radius of docs/methods.md

    private static readonly TotalStationSpecification Ts =
        new("ts", 1 * Arcsec, 2 * Arcsec, new EdmSpecification(0.002, 2), 0.0008, 0.0015);

    private static readonly TargetSpecification Prism = new("prism", 0.0012, 0.002);

    [Fact]
    public void AnAssumedKEntersAZenithAngleAsItsSdTimesSOverTwoR()
    {
        // ∂z/∂k = −s/(2R): the derivative of the curvature-and-refraction correction (1 − k)s²/(2R) (Ghilani & Wolf,
        // Elementary Surveying, ch. 4; docs/references.md §10) divided by s. σ_k = 0.05 over 1 km: 0.81″.
        var b = ZenithBudgetBuilder.Build(Ts, Prism, ObservingProcedure.Default, 1000, refractionSd: 0.05);
        Assert.Equal(0.05 * 1000 / (2 * R), b.ValueOf(ContributionNames.Refraction), 1e-15);
        Assert.Equal(0.809, b.ValueOf(ContributionNames.Refraction) / Arcsec, 0.001);
        Assert.Contains(b.Contributions, c => c.Name == "refraction");
        Assert.Throws<InvalidInputException>(() =>
            ZenithBudgetBuilder.Build(Ts, Prism, ObservingProcedure.Default, 1000, refractionSd: -0.1));
    }

    private static ZenithObservation Zenith(double sdK, bool estimated = false) =>
        new("A", "B", Angle.FromDegrees(90), Length.FromMetres(1.5), Length.FromMetres(1.6))
        {
            Weighting = new ObservationWeighting { Instrument = Ts, Target = Prism }, RefractionSd = sdK,
            RefractionGroup = estimated ? "G" : null, RefractionEstimated = estimated,
        };

    private sealed class Flat : NetAdjust.Observations.ICoordinates
    {
        public PlanePoint Plane(string id) => id == "A" ? new(0, 0) : new(600, 800);

        public double Height(string id) => 100;

        public double Orientation(string setId) => 0;
    }

    [Fact]
    public void AnEstimatedKHasNoRefractionTermInTheBudget()
    {
        // The adjustment estimates k: its uncertainty is the unknown's standard deviation, not a budget term.
        Assert.Equal(0.05 * 1000 / (2 * R),
            ObservationBudgets.Of(Zenith(0.05), new Flat())!.ValueOf(ContributionNames.Refraction), 1e-15);
        Assert.Equal(0.0,
            ObservationBudgets.Of(Zenith(0.05, estimated: true), new Flat())!.ValueOf(ContributionNames.Refraction));
    }

    [Fact]
    public void ASlopeDistanceCarriesCenteringAsAHorizontalDistanceDoes()
    {
        // Centering offsets move the line's end points; along the line they change a slope distance as a horizontal
        // one (common practice; the EDM a + b ppm specification is the same, ISO 17123-4).
        var w = new ObservationWeighting { Instrument = Ts, Target = Prism };
        var slope = new SlopeDistanceObservation("A", "B", Length.FromMetres(1000), Length.FromMetres(1.5),
            Length.FromMetres(1.6)) { Weighting = w };
        var plane = new DistanceObservation("A", "B", Length.FromMetres(1000)) { Weighting = w };
        var bs = ObservationBudgets.Of(slope, new Flat())!;
        var bp = ObservationBudgets.Of(plane, new Flat())!;
        Assert.Equal(0.0008, bs.ValueOf(ContributionNames.InstrumentCentering), 1e-15);
        Assert.Equal(0.0012, bs.ValueOf(ContributionNames.TargetCentering), 1e-15);
        Assert.Equal(bp.Contributions.Select(c => (c.Name, c.Value)), bs.Contributions.Select(c => (c.Name, c.Value)));
    }

    /// <summary>B held in plan 1 km from A (held in full), its height from one zenith angle weighted from the
    /// specifications: sd(H_B) is the zenith budget propagated to the height.</summary>
    private static double SdHeight(double sdK, TotalStationSpecification ts, TargetSpecification target)
    {
        var points = new[]
        {
            new Point("A") { E = 0, N = 0, H = 100, Fixed = Fixity.ENH },
            new Point("B") { E = 600, N = 800, H = 100, Fixed = Fixity.EN },
        };
        var z = new ZenithObservation("A", "B", Angle.FromDegrees(90), Length.FromMetres(1.5), Length.FromMetres(1.5))
        { Weighting = new ObservationWeighting { Instrument = ts, Target = target }, RefractionSd = sdK };
        return Adjuster.Adjust(new SurveyNetwork("one sight", points, [z])).Points[1].SdH!.Value;
    }

    [Fact]
    public void HeightFromAZenithAngleCarriesInstrumentHeightTargetHeightAndRefractionSds()
    {
        // Trigonometric height of a near-horizontal sight, ΔH = D cos z + (1 − k)s²/(2R) + i − t (Ghilani & Wolf,
        // Elementary Surveying, ch. 4; docs/references.md §10): σ_i and σ_t enter 1:1, σ_k as σ_k·s²/(2R) and the
        // zenith angle as s·σ_z. Expected σ_H² is their sum; the curved-earth model agrees to 1e-3 (γ = s/R).
        const double s = 1000, sdK = 0.05;
        double pointing = 2 * Arcsec;
        double expected = Math.Pow(s * pointing, 2) + Math.Pow(0.0015, 2) + Math.Pow(0.002, 2)
            + Math.Pow(sdK * s * s / (2 * R), 2);
        double sd = SdHeight(sdK, Ts, Prism);
        Assert.Equal(expected, sd * sd, 1e-3 * expected);
        // Each part on its own: taking it out lowers σ_H² by its square.
        double noK = SdHeight(0, Ts, Prism);
        Assert.Equal(Math.Pow(sdK * s * s / (2 * R), 2), (sd * sd) - (noK * noK), 1e-3 * expected);
        var noHeights = SdHeight(sdK, new TotalStationSpecification("ts", 1 * Arcsec, 2 * Arcsec, null, 0, 0),
            new TargetSpecification("prism", 0, 0));
        Assert.Equal(Math.Pow(0.0015, 2) + Math.Pow(0.002, 2), (sd * sd) - (noHeights * noHeights), 1e-3 * expected);
    }
}
