using System.Globalization;
using System.Text;
using System.Text.Json;
using NetAdjust.IO.Text;

namespace NetAdjust.IO.Results;

/// <summary>
/// One object of a long list of a JSON output (a point, an observation, a relative precision), rendered straight to
/// UTF-8 in the layout of <see cref="JsonResultWriter.WriterOptions"/> (two-space indentation, LF line ends, the
/// relaxed encoder's escaping) and handed to the <see cref="Utf8JsonWriter"/> as one raw value: the same bytes as
/// writing it member by member, for a fraction of the work. Members are written with the writer's own method names.
/// Strings and numbers that need more than the plain fast paths (escapes, exponent notation) are encoded by the
/// same encoder and formatter as the writer's.
/// </summary>
internal sealed class JsonRow
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Printable ASCII characters the writer's encoder leaves as they are (asked of the encoder itself).
    /// </summary>
    private static readonly bool[] Plain = PlainCharacters();

    private byte[] _bytes = new byte[4096];
    private int _length;
    private int _indent; // of the innermost open object's braces or array's brackets; its members two spaces further
    private bool _empty; // the innermost open object (or array) has no member yet

    private static bool[] PlainCharacters()
    {
        var plain = new bool[128];
        var encoder = JsonResultWriter.WriterOptions.Encoder;
        for (int c = 0x20; c < 0x7F; c++)
        {
            string s = ((char)c).ToString();
            plain[c] = JsonEncodedText.Encode(s, encoder).Value == s;
        }
        return plain;
    }

    /// <summary>Starts the object of the next element of the array that <paramref name="j"/> is writing (indented
    /// to the writer's depth).</summary>
    public JsonRow Start(Utf8JsonWriter j)
    {
        _length = 0;
        _indent = 2 * j.CurrentDepth;
        NewLine(_indent);
        Put((byte)'{');
        _empty = true;
        return this;
    }

    /// <summary>Ends the element and writes it to <paramref name="j"/> as the next value of its array.</summary>
    public void WriteTo(Utf8JsonWriter j)
    {
        WriteEndObject();
        j.WriteRawValue(_bytes.AsSpan(0, _length), skipInputValidation: true);
    }

    /// <summary>A string member; null writes <c>null</c>.</summary>
    public void WriteString(JsonEncodedText name, string? value)
    {
        Member(name);
        Text(value);
    }

    /// <summary>A string element of the innermost array; null writes <c>null</c>.</summary>
    public void WriteStringValue(string? value)
    {
        Element();
        Text(value);
    }

    private void Text(string? value)
    {
        if (value is null)
        {
            Put("null"u8);
            return;
        }
        Reserve(value.Length + 2);
        int at = _length;
        _bytes[at++] = (byte)'"';
        foreach (char ch in value)
        {
            if (ch >= 128 || !Plain[ch])
            {
                Put((byte)'"');
                Put(JsonEncodedText.Encode(value, JsonResultWriter.WriterOptions.Encoder).EncodedUtf8Bytes);
                Put((byte)'"');
                return;
            }
            _bytes[at++] = (byte)ch;
        }
        _bytes[at++] = (byte)'"';
        _length = at;
    }

    /// <summary>An integer member.</summary>
    public void WriteNumber(JsonEncodedText name, long value)
    {
        Member(name);
        Integer(value);
    }

    /// <summary>An integer element of the innermost array.</summary>
    public void WriteNumberValue(long value)
    {
        Element();
        Integer(value);
    }

    private void Integer(long value)
    {
        Reserve(24);
        value.TryFormat(_bytes.AsSpan(_length), out int n, default, Inv);
        _length += n;
    }

    /// <summary>A number member, as <see cref="Utf8JsonWriter.WriteNumber(JsonEncodedText, double)"/> writes it
    /// (non-finite values are refused as there).</summary>
    public void Real(JsonEncodedText name, double value) => Real(name.EncodedUtf8Bytes, value);

    /// <inheritdoc cref="Real(JsonEncodedText, double)"/>
    public void Real(string name, double value) => Real(JsonEncodedText.Encode(name,
        JsonResultWriter.WriterOptions.Encoder).EncodedUtf8Bytes, value);

    private void Real(ReadOnlySpan<byte> name, double value)
    {
        if (!double.IsFinite(value))
            throw new ArgumentException($"'{Encoding.UTF8.GetString(name)}': {value} is not a JSON number");
        Member(name);
        Reserve(32);
        _length += NumberText.Shortest(value, _bytes.AsSpan(_length));
    }

    /// <summary>A number member when finite, else <c>null</c> (a missing or non-finite value).</summary>
    public void Num(JsonEncodedText name, double? value)
    {
        if (value is double x && double.IsFinite(x)) Real(name, x);
        else WriteNull(name);
    }

    /// <summary>A Boolean member.</summary>
    public void WriteBoolean(JsonEncodedText name, bool value)
    {
        Member(name);
        Put(value ? "true"u8 : "false"u8);
    }

    /// <summary>A Boolean member when known, else <c>null</c>.</summary>
    public void WriteBoolean(JsonEncodedText name, bool? value)
    {
        if (value is bool b) WriteBoolean(name, b);
        else WriteNull(name);
    }

    /// <summary>A <c>null</c> member.</summary>
    public void WriteNull(JsonEncodedText name)
    {
        Member(name);
        Put("null"u8);
    }

    /// <summary>Starts an object member.</summary>
    public void WriteStartObject(JsonEncodedText name)
    {
        Member(name);
        Open((byte)'{');
    }

    /// <summary>Ends the innermost object (<c>{}</c> when it has no member).</summary>
    public void WriteEndObject() => Close((byte)'}');

    /// <summary>Starts an object element of the innermost array.</summary>
    public void WriteStartObject()
    {
        Element();
        Open((byte)'{');
    }

    /// <summary>Starts an array member.</summary>
    public void WriteStartArray(JsonEncodedText name)
    {
        Member(name);
        Open((byte)'[');
    }

    /// <summary>Ends the innermost array (<c>[]</c> when it has no element).</summary>
    public void WriteEndArray() => Close((byte)']');

    private void Open(byte bracket)
    {
        Put(bracket);
        _indent += 2;
        _empty = true;
    }

    private void Close(byte bracket)
    {
        if (!_empty) NewLine(_indent);
        Put(bracket);
        _indent -= 2;
        _empty = false;
    }

    private void Member(JsonEncodedText name) => Member(name.EncodedUtf8Bytes);

    private void Member(ReadOnlySpan<byte> name)
    {
        Element();
        Reserve(name.Length + 4);
        _bytes[_length++] = (byte)'"';
        name.CopyTo(_bytes.AsSpan(_length));
        _length += name.Length;
        _bytes[_length++] = (byte)'"';
        _bytes[_length++] = (byte)':';
        _bytes[_length++] = (byte)' ';
    }

    /// <summary>The separator and line of the next member or element of the innermost object or array.</summary>
    private void Element()
    {
        if (!_empty) Put((byte)',');
        _empty = false;
        NewLine(_indent + 2);
    }

    private void NewLine(int indent)
    {
        Reserve(indent + 1);
        _bytes[_length++] = (byte)'\n';
        _bytes.AsSpan(_length, indent).Fill((byte)' ');
        _length += indent;
    }

    private void Put(byte b)
    {
        Reserve(1);
        _bytes[_length++] = b;
    }

    private void Put(ReadOnlySpan<byte> bytes)
    {
        Reserve(bytes.Length);
        bytes.CopyTo(_bytes.AsSpan(_length));
        _length += bytes.Length;
    }

    private void Reserve(int more)
    {
        if (_length + more > _bytes.Length) Array.Resize(ref _bytes, Math.Max(2 * _bytes.Length, _length + more));
    }
}
