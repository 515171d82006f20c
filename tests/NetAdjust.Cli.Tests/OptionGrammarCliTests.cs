using NetAdjust.IO.Project;
using NetAdjust.IO.Text;

namespace NetAdjust.Cli.Tests;

/// <summary>
/// The command line and the project file read an enumerated option through the same grammar
/// (NetAdjust.IO.Text.OptionGrammars): a word illegal in one is illegal in the other, with the same message.
/// </summary>
public class OptionGrammarCliTests
{
    [Theory]
    [InlineData("--faces", "two")]
    [InlineData("--units", "yd")]
    [InlineData("--angle-units", "cc")]
    public void Budget_options_give_the_grammar_message(string option, string word)
    {
        var (code, _, stderr) = CliHarness.Run("budget", "direction", "--direction-sd", "1", option, word);
        Assert.Equal(ExitCodes.InvalidInput, code);
        var grammar = option switch
        {
            "--faces" => OptionGrammars.Faces.Parse(word).Error,
            "--units" => OptionGrammars.LengthUnits.Parse(word).Error,
            _ => OptionGrammars.AngleSdUnits.Parse(word).Error,
        };
        Assert.Contains($"{option}: {grammar}", stderr);
    }

    [Fact]
    public void Rounding_and_simulate_kind_give_the_grammar_message()
    {
        var (code, _, stderr) = CliHarness.Run(
            "budget", "level", "--reading-sd", "0.3 mm", "--setups", "4", "--rounding", "gauss");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--rounding: " + OptionGrammars.Rounding.Parse("gauss").Error, stderr);
        (code, _, stderr) = CliHarness.Run("simulate", "--points", "10", "--kind", "cube", "--out", "unused.yaml");
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--kind: 'cube' is not a kind of synthetic network: use plane", stderr);
    }

    [Fact]
    public void The_project_file_gives_the_same_message_as_the_command_line()
    {
        const string head = "instruments:\n  - {id: TS, direction_sd: 1}\npoints:\n  - {id: A, e: 0, n: 0, fix: en}\n" +
                            "  - {id: B, e: 100, n: 0}\nsetups:\n  - at: A\n    instrument: TS\n    faces: two\n" +
                            "    directions:\n      - {to: B, value: 0-00-00}\n";
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(head, "p.yaml", ".", _ => ""));
        var (_, _, stderr) = CliHarness.Run("budget", "direction", "--direction-sd", "1", "--faces", "two");
        string message = OptionGrammars.Faces.Parse("two").Error!;
        Assert.Contains("faces: " + message, e.Message);
        Assert.Contains("--faces: " + message, stderr);
    }
}
