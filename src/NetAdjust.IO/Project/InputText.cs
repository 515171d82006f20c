using System.Text;

namespace NetAdjust.IO.Project;

/// <summary>Reads input files within a size limit (<see cref="InputLimits.MaxFileBytes"/> for a project file,
/// <see cref="InputLimits.MaxCsvFileBytes"/> for a CSV file) and decodes them as strict UTF-8.</summary>
internal static class InputText
{
    private static readonly UTF8Encoding Strict = new(encoderShouldEmitUTF8Identifier: false,
        throwOnInvalidBytes: true);

    /// <summary>Reads at most <paramref name="limit"/> bytes from the stream; refuses a longer stream (also an
    /// endless one such as /dev/zero).</summary>
    public static byte[] ReadBounded(Stream stream, string file, long limit)
    {
        // a file of known length is read straight into its array (no growing buffer, no copy)
        long left = stream.CanSeek ? stream.Length - stream.Position : -1;
        if (left >= 0 && left <= limit)
        {
            var bytes = new byte[left];
            int got = stream.ReadAtLeast(bytes, bytes.Length, throwOnEndOfStream: false);
            if (got < bytes.Length) return bytes.AsSpan(0, got).ToArray(); // it shrank meanwhile
            int next = stream.ReadByte();
            if (next < 0) return bytes;
            // it grew meanwhile: read on as for a stream of unknown length
            using var grown = new MemoryStream();
            grown.Write(bytes);
            grown.WriteByte((byte)next);
            return ReadOn(stream, grown, file, limit);
        }
        using var buffer = new MemoryStream();
        return ReadOn(stream, buffer, file, limit);
    }

    private static byte[] ReadOn(Stream stream, MemoryStream buffer, string file, long limit)
    {
        var chunk = new byte[81920];
        int n;
        while ((n = stream.Read(chunk, 0, chunk.Length)) > 0)
        {
            if (buffer.Length + n > limit) throw TooLarge(file, limit);
            buffer.Write(chunk, 0, n);
        }
        return buffer.ToArray();
    }

    /// <summary>Decodes UTF-8 (a byte-order mark is skipped); an invalid byte is refused with its line.</summary>
    public static string Decode(byte[] bytes, string file)
    {
        int start = bytes.Length >= 3 && bytes[0] == 0xEF && bytes[1] == 0xBB && bytes[2] == 0xBF ? 3 : 0;
        try
        {
            return Strict.GetString(bytes, start, bytes.Length - start);
        }
        catch (DecoderFallbackException e)
        {
            int at = start + Math.Max(0, e.Index);
            // The decoder reports the index within its current block: find the first invalid byte ourselves.
            at = FirstInvalid(bytes, start) ?? at;
            int line = 1;
            for (int i = 0; i < at && i < bytes.Length; i++) if (bytes[i] == (byte)'\n') line++;
            throw NotUtf8(file, line, bytes[at], at);
        }
    }

    /// <summary>The refusal of a file longer than <paramref name="limit"/> bytes.</summary>
    public static ProjectFileException TooLarge(string file, long limit) =>
        new(file, 0, "", $"the file is larger than the limit of {limit / (1024 * 1024)} MiB " +
            "(docs/input-format.md, \"Limits\")");

    /// <summary>The refusal of a file that is not UTF-8: the invalid byte <paramref name="value"/> at 0-based
    /// <paramref name="position"/> in the file (a byte-order mark counted), on <paramref name="line"/>.</summary>
    public static ProjectFileException NotUtf8(string file, int line, byte value, long position) =>
        new(file, line, "", $"the file is not valid UTF-8 (byte 0x{value:X2} at position {position + 1}): save it as " +
            "UTF-8");

    private static int? FirstInvalid(byte[] b, int start)
    {
        int i = start;
        while (i < b.Length)
        {
            var chars = new char[Math.Min(4096, ((b.Length - i) * 2) + 2)];
            var status = System.Text.Unicode.Utf8.ToUtf16(b.AsSpan(i), chars, out int read, out _,
                replaceInvalidSequences: false, isFinalBlock: true);
            if (status == System.Buffers.OperationStatus.Done) return null;
            if (status is System.Buffers.OperationStatus.InvalidData or System.Buffers.OperationStatus.NeedMoreData)
                return i + read;
            i += read; // destination too small: go on
        }
        return null;
    }
}
