using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Procedures;

/// <summary>
/// The test of the added constraints: does the control fit the observations? T = (Ω_c − Ω_m)/σ0², the increase
/// of vᵀPv from the minimally-constrained to the constrained solution, follows χ²(Δr) with Δr = r_c − r_m added
/// constraints when the control is right (one-tailed, reject when T &gt; χ²(1 − α; Δr)). When σ0 is estimated,
/// F = ((Ω_c − Ω_m)/Δr) / (Ω_m / r_m) follows F(Δr, r_m). Koch (1999), §4.3 (test of linear hypotheses);
/// Caspary (1987), §4 (testing control in network analysis).
/// Made by the adjustment sequence only (the constructor is internal).
/// </summary>
public sealed record ConstraintTest
{
    /// <summary>Made by the adjustment sequence.</summary>
    internal ConstraintTest(double Alpha, int AddedConstraints, double VtpvIncrease, double ChiSquare,
        double? ChiSquareCritical, double? F, double? FCritical, bool SigmaEstimated = false)
    {
        this.Alpha = Alpha; this.AddedConstraints = AddedConstraints; this.VtpvIncrease = VtpvIncrease;
        this.ChiSquare = ChiSquare; this.ChiSquareCritical = ChiSquareCritical; this.F = F; this.FCritical = FCritical;
        this.SigmaEstimated = SigmaEstimated;
    }

    /// <summary>Significance level α.</summary>
    public double Alpha { get; internal init; }

    /// <summary>Δr = r_c − r_m.</summary>
    public int AddedConstraints { get; internal init; }

    /// <summary>Ω_c − Ω_m.</summary>
    public double VtpvIncrease { get; internal init; }

    /// <summary>T = (Ω_c − Ω_m)/σ0².</summary>
    public double ChiSquare { get; internal init; }

    /// <summary>χ²(1 − α; Δr); null when Δr = 0.</summary>
    public double? ChiSquareCritical { get; internal init; }

    /// <summary>The F statistic; null when Δr = 0 or r_m = 0.</summary>
    public double? F { get; internal init; }

    /// <summary>F(1 − α; Δr, r_m); null with <see cref="F"/>.</summary>
    public double? FCritical { get; internal init; }

    /// <summary>True when the variance factor is taken as estimated (statistics option): the F test decides.</summary>
    public bool SigmaEstimated { get; internal init; }

    /// <summary>The χ² decision (σ0 known): true when the control fits, null when there is nothing to test.</summary>
    public bool? PassedChiSquare => ChiSquareCritical is double c ? ChiSquare <= c : null;

    /// <summary>
    /// True when the control fits, false when not, null when there is nothing to test: the χ² test when σ0 is
    /// known (default), the F test when it is taken as estimated.
    /// </summary>
    public bool? Passed => SigmaEstimated ? PassedF : PassedChiSquare;

    /// <summary>The same decision by the F test (σ0 estimated from the minimally-constrained solution); null when not
    /// possible.</summary>
    public bool? PassedF => F is double f && FCritical is double c ? f <= c : null;
}

/// <summary>
/// The difference between a control point's given coordinates and the minimally-constrained result,
/// d = given − adjusted, per component with its standard deviation √(σ0² Q_dd) and standardised value w = d/σ_d.
/// Q_dd is the point's cofactor in the minimally-constrained datum (plus the given variance of weighted control).
/// Components not controlled are null.
/// Made by the adjustment sequence only (the constructor is internal).
/// </summary>
public sealed record ControlDiscrepancy
{
    /// <summary>Made by the adjustment sequence.</summary>
    internal ControlDiscrepancy(string Id, double? DE, double? DN, double? DH, double? SdE, double? SdN, double? SdH)
    {
        this.Id = Id; this.DE = DE; this.DN = DN; this.DH = DH; this.SdE = SdE; this.SdN = SdN; this.SdH = SdH;
    }

    /// <summary>The point.</summary>
    public string Id { get; internal init; }

    /// <summary>Easting discrepancy (m).</summary>
    internal double? DE { get; init; }

    /// <summary>Northing discrepancy (m).</summary>
    internal double? DN { get; init; }

    /// <summary>Height discrepancy (m).</summary>
    internal double? DH { get; init; }

    /// <summary>Standard deviation of the easting discrepancy (m).</summary>
    internal double? SdE { get; init; }

    /// <summary>Standard deviation of the northing discrepancy (m).</summary>
    internal double? SdN { get; init; }

    /// <summary>Standard deviation of the height discrepancy (m).</summary>
    internal double? SdH { get; init; }

    /// <summary>Easting discrepancy.</summary>
    public Length? EastingDiscrepancy => Lengths.Of(DE);

    /// <summary>Northing discrepancy.</summary>
    public Length? NorthingDiscrepancy => Lengths.Of(DN);

    /// <summary>Height discrepancy.</summary>
    public Length? HeightDiscrepancy => Lengths.Of(DH);

    /// <summary>Standard deviation of the easting discrepancy.</summary>
    public Length? SdEasting => Lengths.Of(SdE);

    /// <summary>Standard deviation of the northing discrepancy.</summary>
    public Length? SdNorthing => Lengths.Of(SdN);

    /// <summary>Standard deviation of the height discrepancy.</summary>
    public Length? SdHeight => Lengths.Of(SdH);

    /// <summary>Standardised easting discrepancy d/σ_d.</summary>
    public double? WE => Standardise(DE, SdE);

    /// <summary>Standardised northing discrepancy.</summary>
    public double? WN => Standardise(DN, SdN);

    /// <summary>Standardised height discrepancy.</summary>
    public double? WH => Standardise(DH, SdH);

    /// <summary>The largest absolute standardised discrepancy of the point; null when none can be formed.</summary>
    public double? MaxAbsW =>
        new[] { WE, WN, WH }.Where(w => w.HasValue).Select(w =>
        Math.Abs(w!.Value)).DefaultIfEmpty(double.NaN).Max() is double m && !double.IsNaN(m) ? m : null;

    private static double? Standardise(double? d, double? sd) => d is double x && sd is double s &&
        s > 0 ? x / s : null;
}

/// <summary>The change of a point's coordinates from the minimally-constrained to the constrained solution (constrained
/// − minimal), m. Made by the adjustment sequence only (the constructor is internal).</summary>
public sealed record CoordinateShift
{
    /// <summary>Made by the adjustment sequence.</summary>
    internal CoordinateShift(string Id, double? DE, double? DN, double? DH)
    {
        this.Id = Id; this.DE = DE; this.DN = DN; this.DH = DH;
    }

    /// <summary>The point.</summary>
    public string Id { get; internal init; }

    /// <summary>Easting shift.</summary>
    internal double? DE { get; init; }

    /// <summary>Northing shift.</summary>
    internal double? DN { get; init; }

    /// <summary>Height shift.</summary>
    internal double? DH { get; init; }

    /// <summary>Easting shift.</summary>
    public Length? EastingShift => Lengths.Of(DE);

    /// <summary>Northing shift.</summary>
    public Length? NorthingShift => Lengths.Of(DN);

    /// <summary>Height shift.</summary>
    public Length? HeightShift => Lengths.Of(DH);

    /// <summary>The horizontal shift √(ΔE² + ΔN²); null when not a plane point.</summary>
    public Length? HorizontalShift => Lengths.Of(Horizontal);

    /// <summary>The horizontal shift √(ΔE² + ΔN²) (m); null when not a plane point.</summary>
    internal double? Horizontal => DE is double e && DN is double n ? Math.Sqrt((e * e) + (n * n)) : null;
}

/// <summary>The result of the sequence: minimally-constrained, then constrained, and their comparison. Made by the
/// adjustment sequence only (the constructor is internal).</summary>
public sealed record SequenceResult
{
    /// <summary>Made by the adjustment sequence.</summary>
    internal SequenceResult(AdjustmentResult Minimal, AdjustmentResult Constrained, string MinimalDatum,
        ConstraintTest Test, IReadOnlyList<ControlDiscrepancy> Discrepancies, IReadOnlyList<CoordinateShift> Shifts)
    {
        this.Minimal = Minimal; this.Constrained = Constrained; this.MinimalDatum = MinimalDatum; this.Test = Test;
        this.Discrepancies = Discrepancies; this.Shifts = Shifts;
    }

    /// <summary>The minimally-constrained solution (tests the observations alone).</summary>
    public AdjustmentResult Minimal { get; internal init; }

    /// <summary>The solution with all control as given.</summary>
    public AdjustmentResult Constrained { get; internal init; }

    /// <summary>The datum of the first solution, in words.</summary>
    public string MinimalDatum { get; internal init; }

    /// <summary>The test of the added constraints.</summary>
    public ConstraintTest Test { get; internal init; }

    /// <summary>Per controlled component (E, N, H) of each control mark, whether the observations can check it: its
    /// redundancy number in the constrained step and the components it cannot be told apart from
    /// (<see cref="ControlTestability"/>).</summary>
    public IReadOnlyList<ControlTestability> Testability
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List<ControlTestability>([]);

    /// <summary>Per control point, in input order.</summary>
    public IReadOnlyList<ControlDiscrepancy> Discrepancies
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Per point, in input order.</summary>
    public IReadOnlyList<CoordinateShift> Shifts
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }
}

/// <summary>
/// Good practice for control surveys: adjust first with minimal constraints, to test the observations alone,
/// then with all control, and test whether the control fits (Caspary 1987, ch. 4; Koch 1999, §4.3).
/// </summary>
public static class AdjustmentSequence
{
    /// <summary>Runs the minimally-constrained and then the constrained adjustment.</summary>
    /// <param name="network">The network.</param>
    /// <param name="options">
    /// Options of the constrained run. The first run uses <see cref="AdjustmentOptions.Datum"/> when it is minimal or
    /// inner constraints; when it is the control, the first run is a free network with inner constraints over the
    /// control points (the minimally-constrained solution closest to the given control, so a disturbed mark stands
    /// out), or over all points when the control points alone cannot fix the datum.
    /// </param>
    /// <returns>Both results and their comparison.</returns>
    public static SequenceResult Run(SurveyNetwork network, AdjustmentOptions? options = null)
    {
        options ??= AdjustmentOptions.Default;
        var minimalDatum = options.Datum.Mode != DatumMode.Control ? options.Datum : DefaultMinimal(network);
        var minimal = Adjuster.Adjust(network, options with { Datum = minimalDatum });
        var constrained = Adjuster.Adjust(network, options with { Datum = DatumDefinition.ByControl });

        double s2 = options.AprioriVarianceFactor;
        var sm = minimal.Statistics;
        var sc = constrained.Statistics;
        int dr = sc.DegreesOfFreedom - sm.DegreesOfFreedom;
        double inc = sc.Vtpv - sm.Vtpv;
        double alpha = options.GlobalTestAlpha;
        bool estimated = options.Analysis.VarianceFactor == VarianceFactorBasis.Estimated;
        var test = dr <= 0
            ? new ConstraintTest(alpha, Math.Max(dr, 0), inc, inc / s2, null, null, null, estimated)
            : new ConstraintTest(alpha, dr, inc, inc / s2, ChiSquared.InvCDF(dr, 1 - alpha),
                sm.DegreesOfFreedom > 0 && sm.Vtpv > 0 ? inc / dr / (sm.Vtpv / sm.DegreesOfFreedom) : null,
                sm.DegreesOfFreedom > 0 && sm.Vtpv > 0 ? FisherSnedecor.InvCDF(dr, sm.DegreesOfFreedom, 1 - alpha) :
                    null, estimated);

        // The variance factor of the discrepancies' standard deviations: the a-priori one, or, when it is taken as
        // estimated, that of the minimally-constrained run (the control takes no part in it), as in the statistics.
        double basisFactor = estimated && sm.VarianceFactor is double vf && vf > 0 ? vf : s2;
        var discrepancies = new List<ControlDiscrepancy>();
        foreach (var p in minimal.Points)
        {
            var pt = network[p.Id]; // as given: the minimal solution reports its points without control
            bool ce = pt.IsFixed(Fixity.E) || pt.SdE.HasValue, cn = pt.IsFixed(Fixity.N) || pt.SdN.HasValue, ch =
                pt.IsFixed(Fixity.H) || pt.SdH.HasValue;
            if (!ce && !cn && !ch) continue;
            (double?, double?) One(bool controlled, double? given, double? adjusted, Parameter par, double? givenSd)
            {
                if (!controlled || given is null || adjusted is null) return (null, null);
                int j = minimal.Unknowns.IndexOf(pt.Id, par);
                double q = j >= 0 ? minimal.Cofactor(j, j) : 0;
                double sd = Math.Sqrt(Math.Max(0, (basisFactor * q) + (givenSd is double g ? g * g : 0)));
                // A component held by the minimal constraints has zero variance up to rounding (~1e−10 m): no
                // standardised value.
                return (given - adjusted, sd < HeldSd ? 0 : sd);
            }
            var (de, sde) = One(ce, pt.E, p.E, Parameter.E, pt.SdE);
            var (dn, sdn) = One(cn, pt.N, p.N, Parameter.N, pt.SdN);
            var (dh, sdh) = One(ch, pt.H, p.H, Parameter.H, pt.SdH);
            if (de is null && dn is null && dh is null) continue;
            discrepancies.Add(new ControlDiscrepancy(pt.Id, de, dn, dh, sde, sdn, sdh));
        }

        var shifts = new List<CoordinateShift>();
        for (int i = 0; i < minimal.Points.Count; i++)
        {
            var a = minimal.Points[i];
            var b = constrained.Points[i];
            double? D(double? x, double? y) => x is double u && y is double v ? v - u : null;
            bool inPlane = a.SdE.HasValue || b.SdE.HasValue, inHeight = a.SdH.HasValue || b.SdH.HasValue;
            if (!inPlane && !inHeight) continue;
            shifts.Add(new CoordinateShift(a.Id, inPlane ? D(a.E, b.E) : null, inPlane ? D(a.N, b.N) : null,
                inHeight ? D(a.H, b.H) : null));
        }
        return new SequenceResult(minimal, constrained, minimal.Options.Datum.Describe(), test, discrepancies, shifts)
        {
            Testability = ControlTestability.Of(constrained, discrepancies),
        };
    }

    /// <summary>Standard deviations below this (m) are those of components held by the minimal constraints:
    /// zero.</summary>
    private const double HeldSd = 1e-8;

    /// <summary>Inner constraints over the control points when they can fix the datum, otherwise over all
    /// points.</summary>
    internal static DatumDefinition DefaultMinimal(SurveyNetwork network)
    {
        var planeParts = DatumDiagnosis.Parts(network, plane: true);
        var heightParts = DatumDiagnosis.Parts(network, plane: false);
        var planeIds = planeParts.SelectMany(p => p.Points).ToHashSet(StringComparer.Ordinal);
        var heightIds = heightParts.SelectMany(p => p.Points).ToHashSet(StringComparer.Ordinal);
        var planeControl = network.Points.Where(p => planeIds.Contains(p.Id) && (p.IsFixed(Fixity.E) ||
            p.IsFixed(Fixity.N) || p.SdE.HasValue || p.SdN.HasValue)).ToList();
        var heightControl = network.Points.Where(p => heightIds.Contains(p.Id) && (p.IsFixed(Fixity.H) ||
            p.SdH.HasValue)).ToList();
        var fixes = ObservationKindRegistry.FixedBy(network.Observations);
        bool rotationOrScale = !fixes.HasFlag(DatumElements.Orientation) || !fixes.HasFlag(DatumElements.Scale);
        // Reference objects (control placed by a sight line only) take no part in the fit: the datum rests on the
        // control marks the observations place, and the objects are held along their sight line only.
        var links = new Adjustment.Approximation.ObservationIndex(network);
        bool objects = planeControl.RemoveAll(p => !DatumPlan.IsPlaced(links, p.Id)) > 0;
        bool planeOk = planeIds.Count == 0 || planeControl.Count >= (rotationOrScale ? 2 : 1);
        bool heightOk = heightIds.Count == 0 || heightControl.Count >= 1;
        if (objects && (!planeOk || !heightOk)) return DatumDefinition.Minimal();
        if (!planeOk || !heightOk) return DatumDefinition.Free();
        return DatumDefinition.Free(planeControl.Concat(heightControl).Select(p =>
            p.Id).Distinct(StringComparer.Ordinal).ToList());
    }
}
