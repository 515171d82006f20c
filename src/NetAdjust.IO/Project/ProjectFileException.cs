namespace NetAdjust.IO.Project;

/// <summary>
/// A project file (YAML or CSV) is invalid. The message reads <c>file:line: item: what is wrong</c>.
/// </summary>
public sealed class ProjectFileException : InvalidInputException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="file">The file, as the user named it.</param>
    /// <param name="line">The 1-based line, or 0 when the whole file is concerned.</param>
    /// <param name="item">The point, observation or key concerned (may be empty).</param>
    /// <param name="problem">What is wrong, in the surveyor's terms.</param>
    public ProjectFileException(string file, int line, string item, string problem)
        : base(Compose(file, line, Clip(item), Clip(problem)))
    {
        File = file; Line = line; Item = Clip(item); Problem = Clip(problem);
    }

    /// <summary>Input quoted in a message is clipped to a short excerpt (docs/input-format.md, "Limits").</summary>
    private static string Clip(string text)
    {
        text = System.Text.RegularExpressions.Regex.Replace(text, "'([^'\\s]{41,})'", m => "'"
            + InputLimits.Excerpt(m.Groups[1].Value) + "'");
        return text.Length <= 600 ? text : text[..600] + "…";
    }

    /// <summary>The file concerned.</summary>
    public string File { get; }

    /// <summary>The 1-based line (0 for the whole file).</summary>
    public int Line { get; }

    /// <summary>The item concerned (point id, observation, key).</summary>
    public string Item { get; }

    /// <summary>What is wrong.</summary>
    public string Problem { get; }

    private static string Compose(string file, int line, string item, string problem)
    {
        string where = line > 0 ? $"{file}:{line}" : file;
        return string.IsNullOrEmpty(item) ? $"{where}: {problem}" : $"{where}: {item}: {problem}";
    }
}
