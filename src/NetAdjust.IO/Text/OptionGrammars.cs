using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.Simulation;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.IO.Text;

/// <summary>
/// The words of every enumerated option, in one place: the project file (YAML), the CSV observation files and the
/// command line read them through these grammars, so that a word and its message are written once
/// (docs/input-format.md and docs/cli.md list the same words). Each grammar's message names the legal words;
/// callers put the key or option name in front.
/// </summary>
public static class OptionGrammars
{
    /// <summary>
    /// The unit of bare lengths of a project (<c>units.length</c>) or of the command line (<c>--units</c>).
    /// </summary>
    public static TextChoice<LengthUnit> LengthUnits { get; } = new("a length unit here",
        "m, ft (international foot) or usft (US survey foot)", false,
        ("m", LengthUnit.Metre), ("ft", LengthUnit.InternationalFoot), ("usft", LengthUnit.UsSurveyFoot));

    /// <summary>The text form of observed angles (<c>units.angle</c>).</summary>
    public static TextChoice<AngleFormat> AngleFormats { get; } = new("an angle format", "dms, deg or gon", false,
        ("dms", AngleFormat.Dms), ("deg", AngleFormat.Degrees), ("gon", AngleFormat.Gons));

    /// <summary>The unit of angular standard deviations (<c>units.angle_sd</c>, <c>--angle-units</c>).</summary>
    public static TextChoice<AngleSdUnit> AngleSdUnits { get; } = new("a unit for angular standard deviations",
        "arcsec or mgon", false, ("arcsec", AngleSdUnit.Arcsecond), ("mgon", AngleSdUnit.Milligon));

    /// <summary>The faces observed in each set (<c>faces</c> of a setup, <c>--faces</c>).</summary>
    public static TextChoice<Faces> Faces { get; } = new("a choice of faces",
        "both (face left and face right) or one (one face only)", false,
        ("both", Network.Faces.Both), ("one", Network.Faces.One));

    /// <summary>How the rounding of a rod reading is counted (<c>rounding</c> of a level, <c>--rounding</c>).</summary>
    public static TextChoice<RoundingTreatment> Rounding { get; } = new("a rounding treatment",
        "uniform (resolution/sqrt(12)) or half (half the resolution)", false,
        ("uniform", RoundingTreatment.Uniform), ("half", RoundingTreatment.HalfResolution));

    /// <summary>
    /// How instrument centering enters the weights (<c>adjustment.centering</c>): independent (diagonal) weights,
    /// or one covariance block per setup.
    /// </summary>
    public static TextChoice<CenteringModel> Centering { get; } = new("a centering model",
        "independent (diagonal weights) or correlated (one covariance block per setup)", false,
        ("independent", CenteringModel.Independent), ("correlated", CenteringModel.Correlated));

    /// <summary>What the horizontal distances of a project are (<c>grid.distances</c>).</summary>
    public static TextChoice<Geodesy.DistanceBasis> DistanceBases { get; } = new("a kind of distance",
        "ground (measured at the marks' height) or grid (already reduced to the grid)", false,
        ("ground", Geodesy.DistanceBasis.Ground), ("grid", Geodesy.DistanceBasis.Grid));

    /// <summary>Which frame parameters between the GNSS frame and the local control are unknowns
    /// (<c>gnss.frame_parameters</c>).</summary>
    public static TextChoice<FrameParameterSet> FrameParameterSets { get; } = new("a choice of frame parameters",
        "none, rotations (three small rotations) or rotations_and_scale (three rotations and a scale)", false,
        ("none", FrameParameterSet.None), ("rotations", FrameParameterSet.Rotations),
        ("rotations_and_scale", FrameParameterSet.RotationsAndScale));

    /// <summary>What the azimuths of a project are (<c>grid.azimuths</c>).</summary>
    public static TextChoice<Geodesy.AzimuthBasis> AzimuthBases { get; } = new("a kind of azimuth",
        "geodetic (from true north; astronomic azimuths too) or grid (grid bearings)", false,
        ("geodetic", Geodesy.AzimuthBasis.Geodetic), ("grid", Geodesy.AzimuthBasis.Grid));

    /// <summary>The kind of datum (<c>datum.mode</c>).</summary>
    public static TextChoice<DatumMode> DatumModes { get; } = new("a datum mode", "control, minimal or free", false,
        ("control", DatumMode.Control), ("minimal", DatumMode.MinimalConstraints),
        ("free", DatumMode.InnerConstraints));

    /// <summary>
    /// Whether the variance factor is taken as known or estimated (<c>statistics.variance_factor_basis</c>,
    /// <c>--variance-factor</c>).
    /// </summary>
    public static TextChoice<VarianceFactorBasis> VarianceFactorBasis { get; } = new("a variance-factor basis",
        "known (w-test, chi-square scale) or estimated (tau test, F scale)", false,
        ("known", Adjustment.VarianceFactorBasis.Known), ("estimated", Adjustment.VarianceFactorBasis.Estimated));

    /// <summary>How the tau test splits its level over the observations (<c>statistics.tau_adjustment</c>).</summary>
    public static TextChoice<MultipleTestAdjustment> TauAdjustment { get; } = new("a tau-test adjustment",
        "sidak or bonferroni", false,
        ("sidak", MultipleTestAdjustment.Sidak), ("bonferroni", MultipleTestAdjustment.Bonferroni));

    /// <summary>When external reliability is computed (<c>statistics.external_reliability</c>).</summary>
    public static TextChoice<ExternalReliabilityMode> ExternalReliability { get; } = new(
        "an external-reliability setting", "auto, always or never", false,
        ("auto", ExternalReliabilityMode.Auto), ("always", ExternalReliabilityMode.Always),
        ("never", ExternalReliabilityMode.Never));

    /// <summary>The robust re-weighting method (<c>--robust</c>).</summary>
    public static TextChoice<RobustMethod> RobustMethods { get; } = new("a robust method", "huber or danish", false,
        ("huber", RobustMethod.Huber), ("danish", RobustMethod.Danish));

    /// <summary>
    /// The kinds of field blunder the diagnosis tries (<c>adjust --diagnose-skip</c>, docs/diagnosis.md); the JSON
    /// result names them with the same words.
    /// </summary>
    public static TextChoice<BlunderKind> BlunderKinds { get; } = new("a kind of blunder",
        "unexplained_bias, target_height, instrument_height, prism_constant, feet_for_metres, survey_foot_for_foot, "
        + "face_mix_up, transposition, wrong_point or set_backsight", false,
        ("unexplained_bias", BlunderKind.UnexplainedBias), ("target_height", BlunderKind.TargetHeight),
        ("instrument_height", BlunderKind.InstrumentHeight), ("prism_constant", BlunderKind.PrismConstant),
        ("feet_for_metres", BlunderKind.FeetForMetres), ("survey_foot_for_foot", BlunderKind.SurveyFootForFoot),
        ("face_mix_up", BlunderKind.FaceMixUp), ("transposition", BlunderKind.Transposition),
        ("wrong_point", BlunderKind.WrongPoint), ("set_backsight", BlunderKind.SetBacksight));

    /// <summary>A yes-or-no mark such as <c>exclude</c> (letter case ignored).</summary>
    public static TextChoice<bool> YesNo { get; } = new("true or false", "true or false (also yes/no, 1/0)", true,
        ("true", true), ("yes", true), ("1", true), ("false", false), ("no", false), ("0", false));

    /// <summary>The kind of synthetic network (<c>simulate --kind</c>).</summary>
    public static TextChoice<SyntheticNetworkKind> SyntheticKinds { get; } = new("a kind of synthetic network",
        "plane (directions and distances) or levels (height differences)", false,
        ("plane", SyntheticNetworkKind.Plane), ("levels", SyntheticNetworkKind.Levels));

    /// <summary>The demo scenarios of data/ (<c>simulate --scenario</c>).</summary>
    public static TextChoice<DemoScenario> DemoScenarios { get; } = new("a demo scenario",
        "brackenmoor (traverse and level loop), harrowfield (braced network with a blunder), harrowgate "
        + "(control check with a disturbed mark), corvan (3D traverse in rounds of both faces), tarnholm (braced "
        + "network on a UTM grid, ground distances) or skelmoor (GNSS baselines with a traverse and a level line)",
        false,
        ("brackenmoor", DemoScenario.Brackenmoor), ("harrowfield", DemoScenario.Harrowfield),
        ("harrowgate", DemoScenario.Harrowgate), ("corvan", DemoScenario.CorvanFell),
        ("tarnholm", DemoScenario.Tarnholm), ("skelmoor", DemoScenario.Skelmoor));

    /// <summary>
    /// Reads the held components of a point (<c>fix</c>): the letters e, n and h in any order (e.g. <c>en</c>,
    /// <c>h</c>, <c>enh</c>); empty text holds nothing.
    /// </summary>
    /// <param name="text">The text; surrounding white space is ignored.</param>
    /// <returns>The held components, or a message naming the legal letters.</returns>
    public static ParseResult<Fixity> HeldComponents(string? text)
    {
        string t = text?.Trim() ?? "";
        var fix = Fixity.None;
        foreach (char c in t)
        {
            var one = c switch { 'e' => Fixity.E, 'n' => Fixity.N, 'h' => Fixity.H, _ => Fixity.None };
            if (one == Fixity.None)
                return ParseResult<Fixity>.Fail(
                    $"'{t}' is not a set of held components: write the letters e, n, h (e.g. en or h)");
            fix |= one;
        }
        return ParseResult<Fixity>.Ok(fix);
    }

    /// <summary>The letters of held components as <see cref="HeldComponents"/> reads them (empty: none held).</summary>
    /// <param name="fix">The held components.</param>
    public static string FormatHeldComponents(Fixity fix) =>
        ((fix & Fixity.E) != 0 ? "e" : "") + ((fix & Fixity.N) != 0 ? "n" : "") + ((fix & Fixity.H) != 0 ? "h" : "");
}
