using System.Buffers;
using System.Text.Json;

namespace NetAdjust.IO.Results;

/// <summary>
/// A <see cref="Utf8JsonWriter"/> (with the options of the JSON outputs) whose bytes are passed on to a stream in
/// pieces of about <see cref="Threshold"/> bytes while a document is written, so that no document is held whole in
/// memory. The stream is written, not flushed: a buffered file stream gathers the pieces into its own writes.
/// </summary>
internal sealed class JsonSink : IDisposable
{
    /// <summary>Bytes gathered before they are passed on: as many as the buffer of the output files (64 KiB), so
    /// that a buffered file stream writes each piece straight to the file instead of copying it into its buffer.
    /// </summary>
    public const int Threshold = 1 << 16;

    private readonly Stream _stream;
    private readonly ArrayBufferWriter<byte> _buffer = new(Threshold * 2);

    /// <summary>Starts a document on a stream (left open).</summary>
    public JsonSink(Stream stream)
    {
        _stream = stream;
        Json = new Utf8JsonWriter(_buffer, JsonResultWriter.WriterOptions);
    }

    /// <summary>The writer of the document.</summary>
    public Utf8JsonWriter Json { get; }

    /// <summary>Passes what is written on to the stream once it holds <see cref="Threshold"/> bytes.</summary>
    public void PassWhenFull()
    {
        if (Json.BytesPending + _buffer.WrittenCount >= Threshold) Pass();
    }

    /// <summary>Passes everything written so far on to the stream.</summary>
    public void Pass()
    {
        Json.Flush();
        if (_buffer.WrittenCount == 0) return;
        _stream.Write(_buffer.WrittenSpan);
        _buffer.ResetWrittenCount();
    }

    /// <summary>Releases the writer (what was not passed on is dropped: call <see cref="Pass"/> first).</summary>
    public void Dispose() => Json.Dispose();
}
