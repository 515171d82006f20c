using NetAdjust.IO.Text;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// Reads the value of an enumerated command-line option through its grammar (<see cref="OptionGrammars"/>).
/// </summary>
internal static class CliChoice
{
    /// <summary>The value the text stands for; the option's default when it was not given.</summary>
    /// <exception cref="InvalidInputException">When the text is none of the legal words (listed in the message).
    /// </exception>
    public static T Parse<T>(string? text, string option, TextChoice<T> grammar, T fallback) =>
        text is null ? fallback : Parse(text, option, grammar);

    /// <summary>The value the text stands for.</summary>
    /// <exception cref="InvalidInputException">When the text is none of the legal words (listed in the message).
    /// </exception>
    public static T Parse<T>(string text, string option, TextChoice<T> grammar)
    {
        var r = grammar.Parse(text);
        return r.Success ? r.Value : throw new InvalidInputException($"{option}: {r.Error}");
    }
}
