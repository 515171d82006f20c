using System.Globalization;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// The project's top-level <c>points</c> list read straight from the text, without the YAML document model, when every
/// entry is one line of the form <c>  - {id: A1, e: 1.0, n: 2.0, fix: en}</c> (a flow mapping, as <c>netadjust
/// simulate</c> and the project writer write them) or a block mapping of one key a line, <c>- id: A1</c> then
/// <c>e: 1.0</c>, <c>n: 2.0</c> ... two spaces further in (as many other programs write YAML): the point keys, each
/// once, with plain values of letters, digits and <c>. _ + -</c>. The document model then reads the text with those
/// lines emptied (<see cref="Blanked"/>: line numbers kept) and <see cref="Read"/> makes the points from the lines.
/// Anything else (quotes, comments after a value, a flow mapping over several lines, other indentations, an unknown
/// or repeated key, a value the point refuses) is left to the document model reading the whole text, which gives the
/// error it always gave: the lines are only a faster way to the same points.
/// </summary>
internal sealed class PointLines
{
    private const int Slots = 8, Stride = 1 + (2 * Slots); // per entry: its line, then (start, length) per key
    private const NumberStyles Number =
        NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent;

    private readonly string _text;
    private readonly int[] _entries;

    private PointLines(string text, int keyLine, int[] entries, int count, string blanked)
    {
        (_text, KeyLine, _entries, Count, Blanked) = (text, keyLine, entries, count, blanked);
    }

    /// <summary>The line (1-based) of the <c>points:</c> key.</summary>
    public int KeyLine { get; }

    /// <summary>The number of entries.</summary>
    public int Count { get; }

    /// <summary>The project text with the entries' lines emptied: the same lines, <c>points:</c> without a value.
    /// </summary>
    public string Blanked { get; }

    /// <summary>The points list of <paramref name="text"/> when it is written one plain entry per line as above;
    /// null otherwise (the document model reads it).</summary>
    public static PointLines? Find(string text)
    {
        // the one 'points:' key at the start of a line, with nothing after it
        int key = text.StartsWith("points:", StringComparison.Ordinal) ? 0 : -1;
        int other = text.IndexOf("\npoints:", StringComparison.Ordinal);
        if (key < 0 && other < 0) return null;
        if (key < 0) (key, other) = (other + 1, text.IndexOf("\npoints:", other + 1, StringComparison.Ordinal));
        if (other >= 0) return null;
        int p = key + "points:".Length;
        while (p < text.Length && text[p] == ' ') p++;
        if (p < text.Length && text[p] == '\r' && p + 1 < text.Length && text[p + 1] == '\n') p++;
        if (p >= text.Length || text[p] != '\n') return null;
        int keyLine = 1;
        foreach (char c in text.AsSpan(0, key)) if (c == '\n') keyLine++;
        int blockStart = p + 1, line = keyLine, indent = -1, count = 0, breaks = 0;
        bool open = false; // the entry before is a block mapping that further lines may add keys to
        var entries = new int[Stride * 64];
        int end = blockStart;
        while (end < text.Length)
        {
            int eol = text.IndexOf('\n', end);
            int next = eol < 0 ? text.Length : eol + 1;
            int stop = eol < 0 ? text.Length : eol;
            if (stop > end && text[stop - 1] == '\r') stop--;
            var span = text.AsSpan(end, stop - end);
            if (span.Contains('\r') || span.Contains('\t')) return null; // a lone CR or a tab: the model reads it
            line++;
            int lead = 0;
            while (lead < span.Length && span[lead] == ' ') lead++;
            if (lead == span.Length || span[lead] == '#')
            {
                // a blank or comment line inside the list
            }
            else if (lead == 0 && span[0] != '-')
            {
                if (!(char.IsAsciiLetter(span[0]) || span[0] == '_')) return null;
                break; // the next top-level key
            }
            else if (open && lead == indent + 2)
            {
                // the next key of a block mapping entry
                if (!KeyValueLine(span, lead, end, entries.AsSpan((count - 1) * Stride, Stride))) return null;
            }
            else
            {
                if (indent < 0) indent = lead;
                if (lead != indent) return null;
                if (open && entries[((count - 1) * Stride) + 1] < 0) return null; // a block entry with no id
                if (count * Stride == entries.Length) Array.Resize(ref entries, entries.Length * 2);
                var slots = entries.AsSpan(count * Stride, Stride);
                open = !span[lead..].StartsWith("- {");
                if (open ? !BlockEntry(span, lead, end, line, slots)
                    : !Entry(span[lead..], end + lead, line, slots)) return null;
                count++;
            }
            if (eol >= 0) breaks++;
            end = next;
        }
        if (count == 0 || (open && entries[((count - 1) * Stride) + 1] < 0)) return null;
        string blanked = string.Concat(text.AsSpan(0, blockStart), new string('\n', breaks),
            text.AsSpan(end));
        return new PointLines(text, keyLine, entries, count, blanked);
    }

    /// <summary>Reads <c>- {key: value, ...}</c> (trailing spaces allowed) into the entry's slots.</summary>
    private static bool Entry(ReadOnlySpan<char> s, int offset, int line, Span<int> slots)
    {
        if (!s.StartsWith("- {")) return false;
        slots.Fill(-1);
        slots[0] = line;
        int i = 3;
        while (true)
        {
            while (i < s.Length && s[i] == ' ') i++;
            if (!Pair(s, ref i, offset, slots)) return false;
            while (i < s.Length && s[i] == ' ') i++;
            if (i >= s.Length) return false;
            if (s[i] == '}') break;
            if (s[i] != ',') return false;
            i++;
        }
        for (i++; i < s.Length; i++) if (s[i] != ' ') return false;
        return slots[1] >= 0; // an id
    }

    /// <summary>Reads <c>- key: value</c>, the first line of a block mapping entry (the line <paramref name="s"/>,
    /// the dash at <paramref name="lead"/>, the line at <paramref name="start"/> of the text).</summary>
    private static bool BlockEntry(ReadOnlySpan<char> s, int lead, int start, int line, Span<int> slots)
    {
        if (!s[lead..].StartsWith("- ")) return false;
        slots.Fill(-1);
        slots[0] = line;
        return KeyValueLine(s, lead + 2, start, slots);
    }

    /// <summary>Reads <c>key: value</c> at <paramref name="at"/> of the line <paramref name="s"/> (at
    /// <paramref name="start"/> of the text), nothing but spaces after it.</summary>
    private static bool KeyValueLine(ReadOnlySpan<char> s, int at, int start, Span<int> slots)
    {
        int i = at;
        if (!Pair(s, ref i, start, slots)) return false;
        for (; i < s.Length; i++) if (s[i] != ' ') return false;
        return true;
    }

    /// <summary>Reads <c>key: value</c> from <paramref name="i"/> into the key's slot (its value's place in the text
    /// is <paramref name="offset"/> + its place in <paramref name="s"/>); <paramref name="i"/> ends after the value.
    /// False for an unknown or repeated key, or a value that is not plain.</summary>
    private static bool Pair(ReadOnlySpan<char> s, ref int i, int offset, Span<int> slots)
    {
        int k = i;
        while (i < s.Length && (char.IsAsciiLetterLower(s[i]) || s[i] == '_')) i++;
        int slot = Slot(s[k..i]);
        if (slot < 0 || slots[1 + (2 * slot)] >= 0) return false; // unknown or repeated key
        if (i + 1 >= s.Length || s[i] != ':' || s[i + 1] != ' ') return false;
        i += 2;
        while (i < s.Length && s[i] == ' ') i++;
        int v = i;
        while (i < s.Length && (char.IsAsciiLetterOrDigit(s[i]) || s[i] is '.' or '_' or '+' or '-')) i++;
        // a plain value: not empty, within the limit, and not starting with an indicator ('-' alone)
        if (i == v || i - v > InputLimits.MaxValueLength || (s[v] == '-' && i - v == 1)) return false;
        slots[1 + (2 * slot)] = offset + v;
        slots[2 + (2 * slot)] = i - v;
        return true;
    }

    /// <summary>The slot of a point key (the keys ReadPoint allows); -1 for another key.</summary>
    private static int Slot(ReadOnlySpan<char> key) => key switch
    {
        "id" => 0, "e" => 1, "n" => 2, "h" => 3, "fix" => 4, "sd_e" => 5, "sd_n" => 6, "sd_h" => 7, _ => -1,
    };

    /// <summary>The points, as the document model's reading of the same entries makes them; null when an entry is
    /// refused (the document model then reads the whole text and names the problem).</summary>
    public List<Point>? Read(string file, LengthPattern lengths)
    {
        // A long list is read in two halves, the second on another core, each entry alone into its own slot: the
        // same points whatever the schedule; an entry the lines do not take gives null whichever half it is in, as
        // one pass would.
        var points = new Point[Count];
        int half = SideBySide.Half(Count, ConcurrentEntries);
        bool first = true, second = true;
        SideBySide.Run(() => first = ReadEntries(0, half, points, file, lengths),
            half < Count ? () => second = ReadEntries(half, Count, points, file, lengths) : null);
        return first && second ? [.. points] : null;
    }

    /// <summary>Entries from which the list is read in two halves.</summary>
    private const int ConcurrentEntries = 50_000;

    /// <summary>Reads entries <paramref name="from"/> to <paramref name="to"/> into their slots; false at the first
    /// one the lines do not take.</summary>
    private bool ReadEntries(int from, int to, Point[] points, string file, LengthPattern lengths)
    {
        try
        {
            for (int k = from; k < to; k++)
            {
                int[] e = _entries;
                int at = k * Stride;
                string id = _text.Substring(e[at + 1], e[at + 2]);
                var fix = Fixity.None;
                if (e[at + 9] >= 0)
                {
                    var r = Text.OptionGrammars.HeldComponents(_text.Substring(e[at + 9], e[at + 10]));
                    if (!r.Success) return false;
                    fix = r.Value;
                }
                double? east = Len(at, 1, lengths, out bool b1), north = Len(at, 2, lengths, out bool b2),
                    up = Len(at, 3, lengths, out bool b3), sdE = Len(at, 5, lengths, out bool b5),
                    sdN = Len(at, 6, lengths, out bool b6), sdH = Len(at, 7, lengths, out bool b7);
                if (b1 || b2 || b3 || b5 || b6 || b7) return false;
                points[k] = new Point(id)
                {
                    E = east, N = north, H = up, Fixed = fix, SdE = sdE, SdN = sdN, SdH = sdH,
                    Source = $"{file}:{e[at]}",
                };
            }
        }
        catch (ArgumentException)
        {
            return false; // a value the point refuses: the document model's reading names it
        }
        return true;
    }

    /// <summary>The length under a key of the entry at <paramref name="at"/>, in metres; null when the entry has no
    /// such key or (with <paramref name="bad"/>) when the value is not a length.</summary>
    private double? Len(int at, int slot, LengthPattern lengths, out bool bad)
    {
        bad = false;
        int start = _entries[at + 1 + (2 * slot)], length = _entries[at + 2 + (2 * slot)];
        if (start < 0) return null;
        var span = _text.AsSpan(start, length);
        // a plain number in the project's unit, as LengthPattern.Parse reads it
        if (double.TryParse(span, Number, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v))
            return Length.From(v, lengths.Unit).Metres;
        var parsed = lengths.Parse(span.ToString());
        bad = !parsed.Success;
        return parsed.Success ? parsed.Value.Metres : null;
    }
}
