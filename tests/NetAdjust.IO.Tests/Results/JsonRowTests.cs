using System.Buffers;
using System.Text;
using System.Text.Json;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// The objects of the long lists rendered straight to bytes (<see cref="JsonRow"/>) against the reference they must
/// equal byte for byte: System.Text.Json's <see cref="Utf8JsonWriter"/> with the options of the JSON outputs,
/// writing the same members one by one.
/// </summary>
public class JsonRowTests
{
    private static readonly JsonEncodedText Id = JsonEncodedText.Encode("id");
    private static readonly JsonEncodedText Value = JsonEncodedText.Encode("value");
    private static readonly JsonEncodedText Inner = JsonEncodedText.Encode("inner");
    private static readonly JsonEncodedText Missing = JsonEncodedText.Encode("missing");
    private static readonly JsonEncodedText Flag = JsonEncodedText.Encode("flag");
    private static readonly JsonEncodedText Count = JsonEncodedText.Encode("count");
    private static readonly JsonEncodedText Names = JsonEncodedText.Encode("names");
    private static readonly JsonEncodedText Numbers = JsonEncodedText.Encode("numbers");
    private static readonly JsonEncodedText Parts = JsonEncodedText.Encode("parts");
    private static readonly JsonEncodedText Passed = JsonEncodedText.Encode("passed");

    private static readonly string[] Ids =
    [
        "P1", "", "a \"quoted\" id", @"back\slash", "tab\tand\nnew line", "Bäckerstraße 7", "测站", "emoji 📍",
        "<html> & 'quote' +`", "\u007f delete", "\u2028 separator",
    ];

    private static string Reference(bool nested)
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var j = new Utf8JsonWriter(buffer, JsonResultWriter.WriterOptions))
        {
            j.WriteStartObject();
            if (nested) j.WriteStartObject("solution");
            j.WriteStartArray("list");
            for (int i = 0; i < Ids.Length; i++)
            {
                j.WriteStartObject();
                j.WriteString(Id, Ids[i]);
                j.WriteNumber(Value, (i - 5) * 1234.56789e-3);
                j.WriteNumber(Count, -i);
                j.WriteStartObject(Inner);
                if (i % 2 == 0) j.WriteNumber(Ids[i], 1e-7 * i);
                j.WriteEndObject();
                if (i % 3 == 0) j.WriteString(Missing, (string?)null);
                else j.WriteNull(Missing);
                j.WriteBoolean(Flag, i % 2 == 1);
                // lists inside a row: of strings (some null, escaped), of integers, of objects; empty ones too
                j.WriteStartArray(Names);
                for (int k = 0; k < i % 4; k++)
                    if (k == 2) j.WriteNullValue();
                    else j.WriteStringValue(Ids[(i + k) % Ids.Length]);
                j.WriteEndArray();
                j.WriteStartArray(Numbers);
                for (int k = 0; k < i % 3; k++) j.WriteNumberValue(1000L * k - i);
                j.WriteEndArray();
                j.WriteStartArray(Parts);
                for (int k = 0; k < i % 3; k++)
                {
                    j.WriteStartObject();
                    if (k == 1)
                    {
                        j.WriteNumber(Count, k);
                        j.WriteStartArray(Numbers);
                        j.WriteEndArray();
                    }
                    j.WriteEndObject();
                }
                j.WriteEndArray();
                if (i % 3 == 2) j.WriteNull(Passed);
                else j.WriteBoolean(Passed, i % 3 == 1);
                j.WriteEndObject();
            }
            j.WriteEndArray();
            if (nested) j.WriteEndObject();
            j.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.WrittenSpan);
    }

    private static string Rendered(bool nested)
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var j = new Utf8JsonWriter(buffer, JsonResultWriter.WriterOptions))
        {
            var row = new JsonRow();
            j.WriteStartObject();
            if (nested) j.WriteStartObject("solution");
            j.WriteStartArray("list");
            for (int i = 0; i < Ids.Length; i++)
            {
                var e = row.Start(j);
                e.WriteString(Id, Ids[i]);
                e.Real(Value, (i - 5) * 1234.56789e-3);
                e.WriteNumber(Count, -i);
                e.WriteStartObject(Inner);
                if (i % 2 == 0) e.Real(Ids[i], 1e-7 * i);
                e.WriteEndObject();
                if (i % 3 == 0) e.WriteString(Missing, null);
                else e.Num(Missing, double.NaN);
                e.WriteBoolean(Flag, i % 2 == 1);
                e.WriteStartArray(Names);
                for (int k = 0; k < i % 4; k++) e.WriteStringValue(k == 2 ? null : Ids[(i + k) % Ids.Length]);
                e.WriteEndArray();
                e.WriteStartArray(Numbers);
                for (int k = 0; k < i % 3; k++) e.WriteNumberValue(1000L * k - i);
                e.WriteEndArray();
                e.WriteStartArray(Parts);
                for (int k = 0; k < i % 3; k++)
                {
                    e.WriteStartObject();
                    if (k == 1)
                    {
                        e.WriteNumber(Count, k);
                        e.WriteStartArray(Numbers);
                        e.WriteEndArray();
                    }
                    e.WriteEndObject();
                }
                e.WriteEndArray();
                e.WriteBoolean(Passed, i % 3 == 2 ? null : i % 3 == 1);
                e.WriteTo(j);
            }
            j.WriteEndArray();
            if (nested) j.WriteEndObject();
            j.WriteEndObject();
        }
        return Encoding.UTF8.GetString(buffer.WrittenSpan);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)] // a list one object deeper, as in a sequence's solutions
    public void ObjectsRenderedStraightToBytesEqualTheWritersMemberByMember(bool nested)
    {
        string expected = Reference(nested);
        Assert.Contains("a \\\"quoted\\\" id", expected); // the data does take the encoder's escapes
        Assert.Contains("\"parts\": [\n", expected); // and lists of every kind, with members and without
        Assert.Contains("\"numbers\": []", expected);
        Assert.Equal(expected, Rendered(nested));
    }

    [Fact]
    public void ANonFiniteNumberIsRefusedAsTheWriterRefusesIt()
    {
        using var j = new Utf8JsonWriter(new ArrayBufferWriter<byte>(), JsonResultWriter.WriterOptions);
        j.WriteStartArray();
        var row = new JsonRow().Start(j);
        Assert.Throws<ArgumentException>(() => row.Real(Value, double.PositiveInfinity));
    }
}
