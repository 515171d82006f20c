using System.Globalization;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// One CSV line split into trimmed fields within the documented limits (<see cref="InputLimits"/>), as ranges of the
/// buffer that holds the line (<see cref="CsvLines.Buffer"/>): a field becomes a string only when asked, and point ids
/// are shared (one string per id of the file). Reused from line to line by <see cref="CsvObservationReader"/>.
/// </summary>
internal sealed class CsvRow
{
    private const NumberStyles Number =
        NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent;
    private char[] _buffer = [];
    // the known ids (only read once made, so shared by the rows of both halves of a file) and the others met
    private readonly Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> _knownLookup;
    private readonly Dictionary<string, string> _ids = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> _idLookup;

    /// <summary>The rows of a file; <paramref name="knownIds"/> (e.g. the project's points) are the strings its point
    /// ids share.</summary>
    public CsvRow(IReadOnlyCollection<string>? knownIds = null)
    {
        var known = new Dictionary<string, string>(knownIds?.Count ?? 0, StringComparer.Ordinal);
        if (knownIds is not null) foreach (string id in knownIds) known.TryAdd(id, id);
        _knownLookup = known.GetAlternateLookup<ReadOnlySpan<char>>();
        _idLookup = _ids.GetAlternateLookup<ReadOnlySpan<char>>();
    }

    private CsvRow(Dictionary<string, string>.AlternateLookup<ReadOnlySpan<char>> known)
    {
        _knownLookup = known;
        _idLookup = _ids.GetAlternateLookup<ReadOnlySpan<char>>();
    }

    /// <summary>A row for another half of the same file (on another core): the same known ids, its own others.
    /// </summary>
    public CsvRow Twin() => new(_knownLookup);
    private int[] _start = new int[16], _length = new int[16];
    private string?[] _strings = new string?[16];

    /// <summary>The number of fields of the line.</summary>
    public int Count { get; private set; }

    /// <summary>Splits the line <c>buffer[lineStart..lineEnd]</c> at its commas; throws when the line or a field is
    /// over its limit. The fields are read from <paramref name="buffer"/> until the next line is split.</summary>
    public void Split(char[] buffer, int lineStart, int lineEnd, string file, int lineNo)
    {
        _buffer = buffer;
        if (lineEnd - lineStart > InputLimits.MaxCsvLineLength)
            throw new ProjectFileException(file, lineNo, "",
                $"the line has {lineEnd - lineStart} characters, more than the limit of " +
                $"{InputLimits.MaxCsvLineLength} (docs/input-format.md, \"Limits\")");
        Count = 0;
        for (int p = lineStart; ;)
        {
            int comma = _buffer.AsSpan(p, lineEnd - p).IndexOf(',');
            int end = comma < 0 ? lineEnd : p + comma;
            int a = p, b = end;
            while (a < b && char.IsWhiteSpace(_buffer[a])) a++;
            while (b > a && char.IsWhiteSpace(_buffer[b - 1])) b--;
            if (Count == _start.Length)
            {
                Array.Resize(ref _start, Count * 2);
                Array.Resize(ref _length, Count * 2);
                Array.Resize(ref _strings, Count * 2);
            }
            _start[Count] = a;
            _length[Count] = b - a;
            _strings[Count] = null;
            Count++;
            if (comma < 0) break;
            p = end + 1;
        }
        for (int k = 0; k < Count; k++)
            if (_length[k] > InputLimits.MaxValueLength)
                throw new ProjectFileException(file, lineNo, "",
                    $"a field of {_length[k]} characters is longer than the limit of {InputLimits.MaxValueLength} " +
                    $"(it starts '{InputLimits.Excerpt(Field(k))}')");
    }

    private ReadOnlySpan<char> Span(int k) => _buffer.AsSpan(_start[k], _length[k]);

    /// <summary>True when the field is empty or the column is absent (<paramref name="k"/> &lt; 0).</summary>
    public bool IsEmpty(int k) => k < 0 || _length[k] == 0;

    /// <summary>The field as a string ("" when empty or absent).</summary>
    public string Field(int k) => IsEmpty(k) ? "" : _strings[k] ??= Span(k).ToString();

    /// <summary>The field as a point id: the same string for the same id throughout the file (a known id), or
    /// throughout the file or half of it read by this row (another).</summary>
    public string Id(int k)
    {
        if (IsEmpty(k)) return "";
        // the id of the column's row before (e.g. the station of a set), else looked up
        var chars = Span(k);
        if (k < _lastIds.Length && _lastIds[k] is string last && chars.SequenceEqual(last)) return last;
        // else one of the ids met lately (the neighbours of a station come back row after row), else looked up
        int slot = RecentSlot(chars);
        string? id = _recent[slot];
        if (id is null || !chars.SequenceEqual(id))
        {
            if (!_knownLookup.TryGetValue(chars, out id) && !_idLookup.TryGetValue(chars, out id))
            {
                id = chars.ToString();
                _ids[id] = id;
            }
            _recent[slot] = id;
        }
        if (k < _lastIds.Length) _lastIds[k] = id;
        return id;
    }

    /// <summary>Ids met lately, each in the slot of <see cref="RecentSlot"/> (a small table that stays in the
    /// processor's cache, where the table of all the file's ids does not).</summary>
    private readonly string?[] _recent = new string?[1 << RecentBits];

    private const int RecentBits = 12;

    /// <summary>The slot of an id among <see cref="_recent"/>: a hash of its length and its last four characters.
    /// </summary>
    private static int RecentSlot(ReadOnlySpan<char> id)
    {
        ulong h = (ulong)id.Length;
        for (int i = Math.Max(0, id.Length - 4); i < id.Length; i++) h = (h << 16) | id[i];
        return (int)((h * 0x9E3779B97F4A7C15UL) >> (64 - RecentBits));
    }

    /// <summary>Per column (the first few), the id its last row held.</summary>
    private readonly string?[] _lastIds = new string?[8];

    /// <summary>The field's characters (empty when empty or absent), without a string.</summary>
    public ReadOnlySpan<char> Chars(int k) => IsEmpty(k) ? [] : Span(k);

    /// <summary>True when the field holds the same characters as <paramref name="s"/>.</summary>
    public bool FieldEquals(int k, string? s) => s is not null && !IsEmpty(k) && Span(k).SequenceEqual(s);

    /// <summary>The field as a plain finite number (as <c>AnglePattern.TryNumber</c> reads one), without a string.
    /// </summary>
    public bool TryNumber(int k, out double value)
    {
        value = 0;
        return !IsEmpty(k) && double.TryParse(Span(k), Number, CultureInfo.InvariantCulture, out value) &&
            double.IsFinite(value);
    }

    /// <summary>Every field as a string (the header).</summary>
    public string[] All() => [.. Enumerable.Range(0, Count).Select(Field)];
}

/// <summary>The standard deviations of the rows: the same text as the row before (of the same angular or linear
/// kind) is not parsed again.</summary>
internal sealed class SdCache
{
    private string? _angularText, _linearText;
    private double _angular, _linear;

    public double Parse(CsvRow row, int k, ObservationKind kind, ProjectUnits units, out string? error)
    {
        bool angular = kind.IsAngular();
        error = null;
        if (angular ? row.FieldEquals(k, _angularText) : row.FieldEquals(k, _linearText))
            return angular ? _angular : _linear;
        // a plain number of a linear kind (e.g. each distance's own σ): in the project's length unit, as
        // LengthPattern.Parse reads it, without a string
        if (!angular && row.TryNumber(k, out double number))
        {
            double metres = Length.From(number, units.Length).Metres;
            if (!(metres > 0)) error = "a standard deviation must be positive";
            return metres > 0 ? metres : 0;
        }
        string text = row.Field(k);
        double v = ProjectReader.ParseSd(text, kind, units, out error);
        if (error is null)
        {
            if (angular) (_angularText, _angular) = (text, v);
            else (_linearText, _linear) = (text, v);
        }
        return v;
    }
}
