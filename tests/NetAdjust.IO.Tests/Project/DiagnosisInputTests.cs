using NetAdjust.Diagnosis;
using NetAdjust.IO.Project;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The project's <c>diagnosis</c> section (docs/input-format.md, "Blunder diagnosis"): kinds not tried and the
/// candidate lists, lengths by the length grammar; a wrong entry is refused naming file, line and item.
/// </summary>
public sealed class DiagnosisInputTests
{
    private const string Head = """
        units: {length: m, angle: dms, angle_sd: arcsec}
        default_sd: {distance: 3 mm}
        points:
          - {id: A, e: 0, n: 0, fix: en}
          - {id: B, e: 100, n: 0}
        setups:
          - at: A
            distances:
              - {to: B, value: 100.002}

        """;

    private static SurveyProject Read(string diagnosis) =>
        ProjectReader.Parse(Head + diagnosis, "p.yaml", ".", _ => "");

    [Fact]
    public void WithoutTheSectionEveryKindIsTried()
    {
        var o = ProjectReader.Parse(Head, "p.yaml", ".", _ => "").Diagnosis;
        Assert.Equal(Enum.GetValues<BlunderKind>().Length, o.Enabled.Count);
        Assert.Equal(DiagnosisOptions.Default.RoundHeightsMetres, o.RoundHeightsMetres);
    }

    [Fact]
    public void TheSectionSkipsKindsAndGivesCandidateLists()
    {
        var o = Read("""
            diagnosis:
              skip: [feet_for_metres, survey_foot_for_foot]
              round_heights: [0.5, 100 cm]
              prism_constants: [0, -17.5 mm, -0.030]
            """).Diagnosis;
        Assert.DoesNotContain(BlunderKind.FeetForMetres, o.Enabled);
        Assert.DoesNotContain(BlunderKind.SurveyFootForFoot, o.Enabled);
        Assert.Contains(BlunderKind.TargetHeight, o.Enabled);
        Assert.Contains(BlunderKind.UnexplainedBias, o.Enabled);
        Assert.Equal([0.5, 1.0], o.RoundHeightsMetres); // 100 cm = 1 m (common practice)
        Assert.Equal(3, o.PrismConstantsMetres.Count);
        Assert.Equal(-0.0175, o.PrismConstantsMetres[1], 12);
        Assert.Equal(-0.030, o.PrismConstantsMetres[2], 12);
    }

    [Theory]
    [InlineData("diagnosis:\n  skip: [prism]\n", 11, "'prism' is not a kind of blunder: use unexplained_bias")]
    [InlineData("diagnosis:\n  skip: [unexplained_bias]\n", 11, "cannot be skipped")]
    [InlineData("diagnosis:\n  skip: transposition\n", 11, "expected a list")]
    [InlineData("diagnosis:\n  round_heights: [0.5, 0]\n", 11, "must be positive")]
    [InlineData("diagnosis:\n  prism_constants: [11]\n", 11, "within 10 m")]
    [InlineData("diagnosis:\n  prism_constants: []\n", 11, "at least one amount")]
    [InlineData("diagnosis:\n  rounds: [1]\n", 11, "unknown key 'rounds'")]
    public void AWrongEntryNamesFileLineAndItem(string diagnosis, int line, string message)
    {
        var e = Assert.Throws<ProjectFileException>(() => Read(diagnosis));
        Assert.Contains($"p.yaml:{line}", e.Message, StringComparison.Ordinal);
        Assert.Contains(message, e.Message, StringComparison.Ordinal);
    }
}
