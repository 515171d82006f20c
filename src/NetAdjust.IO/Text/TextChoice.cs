using NetAdjust.Units;

namespace NetAdjust.IO.Text;

/// <summary>
/// The grammar of one enumerated option: the words a project file, a CSV column or the command line may give for it,
/// the value each word stands for, and the message naming the legal words when the text is none of them. Immutable;
/// <see cref="Parse"/> never throws for malformed text. The instances live in <see cref="OptionGrammars"/>.
/// </summary>
/// <typeparam name="T">The value the words stand for.</typeparam>
public sealed class TextChoice<T>
{
    private readonly (string Word, T Value)[] _words;
    private readonly StringComparison _comparison;

    /// <summary>Creates a grammar.</summary>
    /// <param name="what">What a legal word is, with its article, for messages (e.g. <c>a datum mode</c>).</param>
    /// <param name="legal">The legal words as the message lists them, with their meaning where it helps.</param>
    /// <param name="ignoreCase">Whether letter case is ignored.</param>
    /// <param name="words">Each word and its value; <see cref="Format"/> writes the first word of a value.</param>
    internal TextChoice(string what, string legal, bool ignoreCase, params (string Word, T Value)[] words)
    {
        What = what;
        Legal = legal;
        _comparison = ignoreCase ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;
        _words = words;
    }

    /// <summary>What a legal word is, with its article (e.g. <c>a datum mode</c>).</summary>
    public string What { get; }

    /// <summary>The legal words as messages and help texts list them (e.g. <c>control, minimal or free</c>).</summary>
    public string Legal { get; }

    /// <summary>Every legal word, in documented order (aliases included).</summary>
    public IReadOnlyList<string> Words => _words.Select(w => w.Word).ToArray();

    /// <summary>Reads a word; surrounding white space is ignored.</summary>
    /// <param name="text">The text.</param>
    /// <returns>The value, or a message that names the legal words.</returns>
    public ParseResult<T> Parse(string? text)
    {
        string t = text?.Trim() ?? "";
        foreach (var (word, value) in _words)
            if (string.Equals(word, t, _comparison)) return ParseResult<T>.Ok(value);
        return ParseResult<T>.Fail($"'{t}' is not {What}: use {Legal}");
    }

    /// <summary>The word written for a value (the first word that stands for it).</summary>
    /// <param name="value">The value.</param>
    /// <exception cref="ArgumentOutOfRangeException">When no word stands for the value.</exception>
    public string Format(T value)
    {
        foreach (var (word, v) in _words)
            if (EqualityComparer<T>.Default.Equals(v, value)) return word;
        throw new ArgumentOutOfRangeException(nameof(value), value, $"no word stands for this value of {What}");
    }
}
