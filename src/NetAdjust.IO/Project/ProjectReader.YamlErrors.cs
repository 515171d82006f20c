namespace NetAdjust.IO.Project;

public static partial class ProjectReader
{
    /// <summary>
    /// The error for YAML that the parser could not read because a flow mapping or sequence was left open: it names the
    /// first line whose '{' / '[' are not closed on the same line (comments and quoted text ignored), or the file.
    /// </summary>
    internal static ProjectFileException UnclosedBracket(string displayName, string text, int fallbackLine = 0)
    {
        var lines = text.Split('\n');
        for (int i = 0; i < lines.Length; i++)
        {
            int depth = 0;
            char quote = '\0';
            foreach (char ch in lines[i])
            {
                if (quote != '\0') { if (ch == quote) quote = '\0'; continue; }
                if (ch is '"' or '\'') quote = ch;
                else if (ch == '#') break;
                else if (ch is '{' or '[') depth++;
                else if (ch is '}' or ']') depth--;
            }
            if (depth > 0)
                return new ProjectFileException(displayName, i + 1, "", "this is not valid YAML: a '{' or '[' is not closed on this line (write {id: A, e: 1, n: 2})");
        }
        return fallbackLine > 0
            ? new ProjectFileException(displayName, fallbackLine, "",
                "this is not valid YAML at or after this line: check the indentation and that every '{' or '[' " +
                    "is closed")
            : new ProjectFileException(displayName, 0, "", "this is not valid YAML: a '{' or '[' is not closed");
    }
}
