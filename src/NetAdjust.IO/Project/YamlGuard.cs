using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace NetAdjust.IO.Project;

/// <summary>
/// The parser of project YAML, checking each event as the document model takes it (one pass over the text): one
/// document only, nesting within <see cref="InputLimits.MaxNestingDepth"/> (checked before the model, which recurses
/// once per nesting level, goes deeper), values within <see cref="InputLimits.MaxValueLength"/>, every alias defined
/// earlier. Parser errors are given the line of the offending character.
/// </summary>
internal sealed class YamlGuard : IParser
{
    private readonly Parser _parser;
    private readonly string _text, _file;
    private readonly HashSet<string> _anchors = new(StringComparer.Ordinal);
    private readonly Stack<string?> _open = new(); // the anchors of the mappings and lists being read
    private int _depth, _documents, _lastLine = 1;

    /// <summary>A guarded parser over <paramref name="text"/>; errors name <paramref name="file"/>.</summary>
    public YamlGuard(string text, string file)
    {
        _parser = new Parser(new StringReader(text));
        (_text, _file) = (text, file);
    }

    /// <inheritdoc />
    public ParsingEvent? Current => _parser.Current;

    /// <inheritdoc />
    public bool MoveNext()
    {
        bool more;
        try
        {
            more = _parser.MoveNext();
        }
        catch (YamlException e)
        {
            throw Explain(_file, _text, e);
        }
        catch (InvalidOperationException) // YamlDotNet's scanner fails this way, e.g. on an unclosed '{' or '['
        {
            throw ProjectReader.UnclosedBracket(_file, _text, _lastLine);
        }
        if (more) Check(_parser.Current!);
        return more;
    }

    private void Check(ParsingEvent ev)
    {
        int line = (int)ev.Start.Line;
        _lastLine = Math.Max(1, line);
        switch (ev)
        {
            case DocumentStart:
                if (++_documents > 1)
                    throw new ProjectFileException(_file, line, "",
                        "a second YAML document ('---') follows the project: a project file holds one " +
                            "document");
                break;
            case MappingStart or SequenceStart:
                if (++_depth > InputLimits.MaxNestingDepth)
                    throw new ProjectFileException(_file, line, "",
                        $"mappings and lists are nested deeper than {InputLimits.MaxNestingDepth} levels " +
                        "(docs/input-format.md, \"Limits\")");
                Anchor(((NodeEvent)ev).Anchor);
                _open.Push(((NodeEvent)ev).Anchor.IsEmpty ? null : ((NodeEvent)ev).Anchor.Value);
                break;
            case MappingEnd or SequenceEnd:
                _depth--;
                if (_open.Count > 0) _open.Pop();
                break;
            case Scalar s:
                if (s.Value.Length > InputLimits.MaxValueLength && !(s.Value.Length <= InputLimits.MaxWktLength
                    && s.Value.StartsWith("PROJCS[", StringComparison.OrdinalIgnoreCase)))
                    throw new ProjectFileException(_file, line, "",
                        $"a value of {s.Value.Length} characters is longer than the limit of " +
                            $"{InputLimits.MaxValueLength} " +
                        $"(it starts '{InputLimits.Excerpt(s.Value)}'; docs/input-format.md, \"Limits\")");
                Anchor(s.Anchor);
                break;
            case AnchorAlias a:
                if (!_anchors.Contains(a.Value.Value))
                    throw new ProjectFileException(_file, line, "",
                        $"this is not valid YAML: the alias '*{InputLimits.Excerpt(a.Value.Value)}' " +
                            $"names no anchor defined above");
                // an alias inside the node it names makes a structure that holds itself
                if (_open.Contains(a.Value.Value))
                    throw new ProjectFileException(_file, line, "",
                        $"the alias '*{InputLimits.Excerpt(a.Value.Value)}' stands inside the list or " +
                            "mapping it names (a structure that holds itself): write the values out");
                break;
        }
    }

    private void Anchor(AnchorName name)
    {
        if (!name.IsEmpty) _anchors.Add(name.Value);
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
