using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace NetAdjust.IO.Project;

/// <summary>
/// Checks project YAML before the document model is built (which recurses once per nesting level): one document
/// only, nesting within <see cref="InputLimits.MaxNestingDepth"/>, values within <see
/// cref="InputLimits.MaxValueLength"/>,
/// every alias defined earlier. Parser errors are given the line of the offending character.
/// </summary>
internal static class YamlGuard
{
    public static void Check(string text, string file)
    {
        var parser = new Parser(new StringReader(text));
        var anchors = new HashSet<string>(StringComparer.Ordinal);
        var open = new Stack<string?>(); // the anchors of the mappings and lists being read
        int depth = 0, documents = 0, lastLine = 1;
        try
        {
            while (parser.MoveNext())
            {
                var ev = parser.Current!;
                int line = (int)ev.Start.Line;
                lastLine = Math.Max(1, line);
                switch (ev)
                {
                    case DocumentStart:
                        if (++documents > 1)
                            throw new ProjectFileException(file, line, "",
                                "a second YAML document ('---') follows the project: a project file holds one " +
                                    "document");
                        break;
                    case MappingStart or SequenceStart:
                        if (++depth > InputLimits.MaxNestingDepth)
                            throw new ProjectFileException(file, line, "",
                                $"mappings and lists are nested deeper than {InputLimits.MaxNestingDepth} levels " +
                                "(docs/input-format.md, \"Limits\")");
                        Anchor(((NodeEvent)ev).Anchor);
                        open.Push(((NodeEvent)ev).Anchor.IsEmpty ? null : ((NodeEvent)ev).Anchor.Value);
                        break;
                    case MappingEnd or SequenceEnd:
                        depth--;
                        if (open.Count > 0) open.Pop();
                        break;
                    case Scalar s:
                        if (s.Value.Length > InputLimits.MaxValueLength && !(s.Value.Length <= InputLimits.MaxWktLength
                            && s.Value.StartsWith("PROJCS[", StringComparison.OrdinalIgnoreCase)))
                            throw new ProjectFileException(file, line, "",
                                $"a value of {s.Value.Length} characters is longer than the limit of " +
                                    $"{InputLimits.MaxValueLength} " +
                                $"(it starts '{InputLimits.Excerpt(s.Value)}'; docs/input-format.md, \"Limits\")");
                        Anchor(s.Anchor);
                        break;
                    case AnchorAlias a:
                        if (!anchors.Contains(a.Value.Value))
                            throw new ProjectFileException(file, line, "",
                                $"this is not valid YAML: the alias '*{InputLimits.Excerpt(a.Value.Value)}' " +
                                    $"names no anchor defined above");
                        // an alias inside the node it names makes a structure that holds itself
                        if (open.Contains(a.Value.Value))
                            throw new ProjectFileException(file, line, "",
                                $"the alias '*{InputLimits.Excerpt(a.Value.Value)}' stands inside the list or " +
                                    "mapping it names (a structure that holds itself): write the values out");
                        break;
                }
            }
        }
        catch (YamlException e)
        {
            throw Explain(file, text, e);
        }
        catch (InvalidOperationException) // YamlDotNet's scanner fails this way, e.g. on an unclosed '{' or '['
        {
            throw ProjectReader.UnclosedBracket(file, text, lastLine);
        }

        void Anchor(AnchorName name)
        {
            if (!name.IsEmpty) anchors.Add(name.Value);
        }
    }

    /// <summary>
    /// The error for YAML the parser accepts but the document model cannot hold (e.g. a line holding only ':' after a
    /// nested mapping): names the first line that starts with ':' (a key is missing), else the file's first line.
    /// </summary>
    public static ProjectFileException Unreadable(string file, string text)
    {
        var lines = text.Split('\n');
        int i = Array.FindIndex(lines, l => l.TrimStart().StartsWith(':'));
        return new ProjectFileException(file, i >= 0 ? i + 1 : 1, "",
            "this is not valid YAML: a value has no key (a line starts with ':'); write 'key: value'");
    }

    /// <summary>The parser's error with the line of the offending character where the parser's own line is
    /// off.</summary>
    private static ProjectFileException Explain(string file, string text, YamlException e)
    {
        string message = (e.InnerException?.Message ?? e.Message).Split('\n')[0].Trim();
        var lines = text.Split('\n');
        int line = (int)e.Start.Line;
        if (message.Contains("tab", StringComparison.OrdinalIgnoreCase))
        {
            int tab = Array.FindIndex(lines, l => l.TrimEnd('\r').TakeWhile(c => c is ' ' or '\t').Contains('\t'));
            if (tab >= 0) line = tab + 1;
        }
        int last = lines.Length;
        while (last > 1 && lines[last - 1].Trim().Length == 0) last--;
        if (line > last) line = last; // the parser reports the end of input one line past the last
        if (line < 1) line = 1;
        return new ProjectFileException(file, line, "", "this is not valid YAML: " + InputLimits.Excerpt200(message));
    }
}
