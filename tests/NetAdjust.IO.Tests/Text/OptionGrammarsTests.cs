using NetAdjust.Diagnosis;
using NetAdjust.Procedures;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Stochastic;
using NetAdjust.Units;
using Xunit;

namespace NetAdjust.IO.Tests.Text;

/// <summary>
/// One data table per grammar of an enumerated option: legal words with the value they stand for, illegal texts
/// with the message that must list the legal words. The words are the project's own (docs/input-format.md,
/// docs/cli.md).
/// </summary>
public class OptionGrammarsTests
{
    public static TheoryData<string, LengthUnit> LegalLengthUnits => new()
    {
        { "m", LengthUnit.Metre }, { "ft", LengthUnit.InternationalFoot }, { "usft", LengthUnit.UsSurveyFoot },
        { " ft ", LengthUnit.InternationalFoot },
    };

    [Theory]
    [MemberData(nameof(LegalLengthUnits))]
    public void Length_units_legal(string text, LengthUnit expected) =>
        Assert.Same(expected, OptionGrammars.LengthUnits.Parse(text).Value);

    [Theory]
    [InlineData("yd")]
    [InlineData("mm")] // a length unit of values, but not a unit of a whole project
    [InlineData("M")]
    [InlineData("")]
    public void Length_units_illegal(string text) =>
        Illegal(OptionGrammars.LengthUnits, text, "is not a length unit here: use m, ft (international foot) or usft");

    [Theory]
    [InlineData("dms", AngleFormat.Dms)]
    [InlineData("deg", AngleFormat.Degrees)]
    [InlineData("gon", AngleFormat.Gons)]
    public void Angle_formats_legal(string text, AngleFormat expected) =>
        Assert.Equal(expected, OptionGrammars.AngleFormats.Parse(text).Value);

    [Theory]
    [InlineData("rad")]
    [InlineData("DMS")]
    [InlineData("grad")]
    public void Angle_formats_illegal(string text) =>
        Illegal(OptionGrammars.AngleFormats, text, "is not an angle format: use dms, deg or gon");

    [Theory]
    [InlineData("arcsec", AngleSdUnit.Arcsecond)]
    [InlineData("mgon", AngleSdUnit.Milligon)]
    public void Angle_sd_units_legal(string text, AngleSdUnit expected) =>
        Assert.Equal(expected, OptionGrammars.AngleSdUnits.Parse(text).Value);

    [Theory]
    [InlineData("sec")]
    [InlineData("cc")]
    public void Angle_sd_units_illegal(string text) =>
        Illegal(OptionGrammars.AngleSdUnits, text, "is not a unit for angular standard deviations: use arcsec or mgon");

    [Theory]
    [InlineData("both", Faces.Both)]
    [InlineData("one", Faces.One)]
    public void Faces_legal(string text, Faces expected) =>
        Assert.Equal(expected, OptionGrammars.Faces.Parse(text).Value);

    [Theory]
    [InlineData("two")]
    [InlineData("Both")]
    [InlineData("left")]
    public void Faces_illegal(string text) =>
        Illegal(OptionGrammars.Faces, text, "is not a choice of faces: use both (face left and face right) or one");

    [Theory]
    [InlineData("uniform", RoundingTreatment.Uniform)]
    [InlineData("half", RoundingTreatment.HalfResolution)]
    public void Rounding_legal(string text, RoundingTreatment expected) =>
        Assert.Equal(expected, OptionGrammars.Rounding.Parse(text).Value);

    [Theory]
    [InlineData("gauss")]
    [InlineData("halfresolution")]
    public void Rounding_illegal(string text) =>
        Illegal(OptionGrammars.Rounding, text,
            "is not a rounding treatment: use uniform (resolution/sqrt(12)) or half");

    [Fact]
    public void Centering_legal()
    {
        Assert.Equal(CenteringModel.Independent, OptionGrammars.Centering.Parse("independent").Value);
        Assert.Equal(CenteringModel.Correlated, OptionGrammars.Centering.Parse("correlated").Value);
    }

    [Theory]
    [InlineData("maybe")]
    [InlineData("diagonal")]
    public void Centering_illegal(string text) =>
        Illegal(OptionGrammars.Centering, text,
            "is not a centering model: use independent (diagonal weights) or correlated");

    [Theory]
    [InlineData("control", DatumMode.Control)]
    [InlineData("minimal", DatumMode.MinimalConstraints)]
    [InlineData("free", DatumMode.InnerConstraints)]
    public void Datum_modes_legal(string text, DatumMode expected) =>
        Assert.Equal(expected, OptionGrammars.DatumModes.Parse(text).Value);

    [Theory]
    [InlineData("loose")]
    [InlineData("inner")]
    public void Datum_modes_illegal(string text) =>
        Illegal(OptionGrammars.DatumModes, text, "is not a datum mode: use control, minimal or free");

    [Theory]
    [InlineData("known", VarianceFactorBasis.Known)]
    [InlineData("estimated", VarianceFactorBasis.Estimated)]
    public void Variance_factor_basis_legal(string text, VarianceFactorBasis expected) =>
        Assert.Equal(expected, OptionGrammars.VarianceFactorBasis.Parse(text).Value);

    [Theory]
    [InlineData("guessed")]
    [InlineData("apriori")]
    public void Variance_factor_basis_illegal(string text) =>
        Illegal(OptionGrammars.VarianceFactorBasis, text, "is not a variance-factor basis: use known (");

    [Theory]
    [InlineData("sidak", MultipleTestAdjustment.Sidak)]
    [InlineData("bonferroni", MultipleTestAdjustment.Bonferroni)]
    public void Tau_adjustment_legal(string text, MultipleTestAdjustment expected) =>
        Assert.Equal(expected, OptionGrammars.TauAdjustment.Parse(text).Value);

    [Theory]
    [InlineData("holm")]
    [InlineData("šidák")]
    public void Tau_adjustment_illegal(string text) =>
        Illegal(OptionGrammars.TauAdjustment, text, "is not a tau-test adjustment: use sidak or bonferroni");

    [Theory]
    [InlineData("auto", ExternalReliabilityMode.Auto)]
    [InlineData("always", ExternalReliabilityMode.Always)]
    [InlineData("never", ExternalReliabilityMode.Never)]
    public void External_reliability_legal(string text, ExternalReliabilityMode expected) =>
        Assert.Equal(expected, OptionGrammars.ExternalReliability.Parse(text).Value);

    [Theory]
    [InlineData("sometimes")]
    public void External_reliability_illegal(string text) =>
        Illegal(OptionGrammars.ExternalReliability, text,
            "is not an external-reliability setting: use auto, always or never");

    [Theory]
    [InlineData("huber", RobustMethod.Huber)]
    [InlineData("danish", RobustMethod.Danish)]
    public void Robust_methods_legal(string text, RobustMethod expected) =>
        Assert.Equal(expected, OptionGrammars.RobustMethods.Parse(text).Value);

    [Theory]
    [InlineData("median")]
    [InlineData("tukey")]
    public void Robust_methods_illegal(string text) =>
        Illegal(OptionGrammars.RobustMethods, text, "is not a robust method: use huber or danish");

    [Theory]
    [InlineData("unexplained_bias", BlunderKind.UnexplainedBias)]
    [InlineData("target_height", BlunderKind.TargetHeight)]
    [InlineData("instrument_height", BlunderKind.InstrumentHeight)]
    [InlineData("prism_constant", BlunderKind.PrismConstant)]
    [InlineData("feet_for_metres", BlunderKind.FeetForMetres)]
    [InlineData("survey_foot_for_foot", BlunderKind.SurveyFootForFoot)]
    [InlineData("face_mix_up", BlunderKind.FaceMixUp)]
    [InlineData(" transposition ", BlunderKind.Transposition)]
    [InlineData("wrong_point", BlunderKind.WrongPoint)]
    [InlineData("set_backsight", BlunderKind.SetBacksight)]
    public void Blunder_kinds_legal(string text, BlunderKind expected) =>
        Assert.Equal(expected, OptionGrammars.BlunderKinds.Parse(text).Value);

    [Theory]
    [InlineData("prism")]
    [InlineData("Target_Height")]
    [InlineData("target height")]
    public void Blunder_kinds_illegal(string text) =>
        Illegal(OptionGrammars.BlunderKinds, text, "is not a kind of blunder: use unexplained_bias, target_height");

    [Theory]
    [InlineData("true", true)]
    [InlineData("YES", true)]
    [InlineData("1", true)]
    [InlineData("false", false)]
    [InlineData("No", false)]
    [InlineData("0", false)]
    public void Yes_no_legal(string text, bool expected) =>
        Assert.Equal(expected, OptionGrammars.YesNo.Parse(text).Value);

    [Theory]
    [InlineData("maybe")]
    [InlineData("2")]
    [InlineData("y")]
    public void Yes_no_illegal(string text) =>
        Illegal(OptionGrammars.YesNo, text, "is not true or false: use true or false (also yes/no, 1/0)");

    [Theory]
    [InlineData("plane", SyntheticNetworkKind.Plane)]
    [InlineData("levels", SyntheticNetworkKind.Levels)]
    public void Synthetic_kinds_legal(string text, SyntheticNetworkKind expected) =>
        Assert.Equal(expected, OptionGrammars.SyntheticKinds.Parse(text).Value);

    [Theory]
    [InlineData("level")]
    [InlineData("3d")]
    public void Synthetic_kinds_illegal(string text) =>
        Illegal(OptionGrammars.SyntheticKinds, text, "is not a kind of synthetic network: use plane (");

    [Theory]
    [InlineData("brackenmoor", DemoScenario.Brackenmoor)]
    [InlineData("harrowfield", DemoScenario.Harrowfield)]
    [InlineData("harrowgate", DemoScenario.Harrowgate)]
    public void Demo_scenarios_legal(string text, DemoScenario expected) =>
        Assert.Equal(expected, OptionGrammars.DemoScenarios.Parse(text).Value);

    [Theory]
    [InlineData("moorside")]
    [InlineData("harrowfield-blunder")]
    public void Demo_scenarios_illegal(string text) =>
        Illegal(OptionGrammars.DemoScenarios, text, "is not a demo scenario: use brackenmoor (");

    [Theory]
    [InlineData("e", Fixity.E)]
    [InlineData("en", Fixity.EN)]
    [InlineData("ne", Fixity.EN)]
    [InlineData("h", Fixity.H)]
    [InlineData("enh", Fixity.ENH)]
    [InlineData("", Fixity.None)]
    public void Held_components_legal(string text, Fixity expected) =>
        Assert.Equal(expected, OptionGrammars.HeldComponents(text).Value);

    [Theory]
    [InlineData("x")]
    [InlineData("EN")]
    [InlineData("e,n")]
    public void Held_components_illegal(string text)
    {
        var r = OptionGrammars.HeldComponents(text);
        Assert.False(r.Success);
        Assert.Contains($"'{text}' is not a set of held components: write the letters e, n, h", r.Error);
    }

    [Theory]
    [InlineData(Fixity.None, "")]
    [InlineData(Fixity.EN, "en")]
    [InlineData(Fixity.H, "h")]
    [InlineData(Fixity.ENH, "enh")]
    public void Held_components_are_written_as_read(Fixity fix, string text)
    {
        Assert.Equal(text, OptionGrammars.FormatHeldComponents(fix));
        Assert.Equal(fix, OptionGrammars.HeldComponents(text).Value);
    }

    /// <summary>Every word reads back to the value whose written word it is (Format is the inverse of Parse).</summary>
    [Fact]
    public void Every_written_word_reads_back()
    {
        RoundTrip(OptionGrammars.LengthUnits);
        RoundTrip(OptionGrammars.AngleFormats);
        RoundTrip(OptionGrammars.AngleSdUnits);
        RoundTrip(OptionGrammars.Faces);
        RoundTrip(OptionGrammars.Rounding);
        RoundTrip(OptionGrammars.Centering);
        RoundTrip(OptionGrammars.DatumModes);
        RoundTrip(OptionGrammars.VarianceFactorBasis);
        RoundTrip(OptionGrammars.TauAdjustment);
        RoundTrip(OptionGrammars.ExternalReliability);
        RoundTrip(OptionGrammars.RobustMethods);
        RoundTrip(OptionGrammars.YesNo);
        RoundTrip(OptionGrammars.SyntheticKinds);
        RoundTrip(OptionGrammars.DemoScenarios);
        RoundTrip(OptionGrammars.BlunderKinds);
        Assert.Equal("yes", OptionGrammars.YesNo.Words[1]); // an alias reads, but the first word is written
        Assert.Equal("true", OptionGrammars.YesNo.Format(true));
    }

    /// <summary>Each enum a grammar covers has a word for every member, so no value is unreachable from text.</summary>
    [Fact]
    public void Every_enum_member_has_a_word()
    {
        Covers(OptionGrammars.AngleFormats);
        Covers(OptionGrammars.AngleSdUnits);
        Covers(OptionGrammars.Faces);
        Covers(OptionGrammars.Rounding);
        Covers(OptionGrammars.DatumModes);
        Covers(OptionGrammars.VarianceFactorBasis);
        Covers(OptionGrammars.TauAdjustment);
        Covers(OptionGrammars.ExternalReliability);
        Covers(OptionGrammars.RobustMethods);
        Covers(OptionGrammars.SyntheticKinds);
        Covers(OptionGrammars.DemoScenarios);
        Covers(OptionGrammars.BlunderKinds);
    }

    private static void Illegal<T>(TextChoice<T> grammar, string text, string message)
    {
        var r = grammar.Parse(text);
        Assert.False(r.Success);
        Assert.Equal($"'{text.Trim()}' {message}", r.Error![..($"'{text.Trim()}' ".Length + message.Length)]);
        foreach (var word in grammar.Words.Where(w => !char.IsDigit(w[0]))) // every legal word is named
            Assert.Contains(word, r.Error, StringComparison.Ordinal);
    }

    private static void RoundTrip<T>(TextChoice<T> grammar)
    {
        foreach (var word in grammar.Words)
        {
            var value = grammar.Parse(word).Value;
            Assert.Equal(value, grammar.Parse(grammar.Format(value)).Value);
        }
    }

    private static void Covers<T>(TextChoice<T> grammar) where T : struct, Enum
    {
        foreach (var member in Enum.GetValues<T>())
            Assert.Contains(grammar.Words, w => EqualityComparer<T>.Default.Equals(grammar.Parse(w).Value, member));
    }
}
