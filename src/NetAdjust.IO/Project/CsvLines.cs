using System.Buffers;
using System.Text.Unicode;

namespace NetAdjust.IO.Project;

/// <summary>
/// The lines of a CSV observation file, one after another, read from its UTF-8 bytes a piece at a time (or from a
/// text already in memory): a line is a range of <see cref="Buffer"/>, which holds the current piece of the text, so
/// that neither the file's bytes nor its whole text are ever held at once. Lines end at CR LF, CR or LF alike; the
/// last line is what follows the last line end (empty when the file ends with one), as in a text split at its line
/// ends. A byte-order mark at the start is skipped. An invalid UTF-8 byte is refused, naming its line, once the lines
/// before it have been read: the first problem in the file is the one reported.
/// </summary>
internal sealed class CsvLines : IDisposable
{
    /// <summary>Bytes read (or characters copied from a text) at a time.</summary>
    internal const int DefaultPiece = 1 << 20;

    private readonly Stream? _stream;
    private readonly string? _text;
    private readonly string _file;
    private readonly long _limit;
    private readonly byte[] _bytes;
    private readonly int _piece;
    private int _carried; // bytes of an incomplete UTF-8 sequence kept at the start of _bytes for the next piece
    private long _offset; // the position in the file of _bytes[0]
    private long _read; // bytes read so far
    private int _textAt; // characters of _text copied so far
    private bool _started;
    private char[] _chars;
    private int _pos, _end; // characters not yet taken as lines: _chars[_pos.._end)
    private bool _exhausted; // no characters come after _chars[.._end)
    private bool _done; // the last line has been given
    private long _lineFeeds; // LF characters decoded so far (an invalid byte's line is one more than those before it)
    private ProjectFileException? _invalid; // an invalid byte after the characters decoded so far

    private CsvLines(Stream? stream, string? text, string file, long limit, int piece)
    {
        (_stream, _text, _file, _limit, _piece) = (stream, text, file, limit, piece);
        _bytes = stream is null ? [] : new byte[piece];
        _chars = new char[2 * piece];
    }

    /// <summary>The lines of a stream of UTF-8 bytes of at most <paramref name="limit"/> bytes (a longer stream is
    /// refused: at once when its length is known, else when the limit is passed). The stream is disposed with this.
    /// </summary>
    /// <param name="stream">The file's bytes.</param>
    /// <param name="file">The file name as shown in messages.</param>
    /// <param name="limit">The most bytes read.</param>
    /// <param name="piece">Bytes read at a time (tests take small pieces to cross every boundary).</param>
    public static CsvLines OfUtf8(Stream stream, string file, long limit, int piece = DefaultPiece)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentOutOfRangeException.ThrowIfLessThan(piece, 4); // a whole UTF-8 sequence fits one piece
        if (stream.CanSeek && stream.Length - stream.Position > limit)
        {
            stream.Dispose();
            throw InputText.TooLarge(file, limit);
        }
        return new CsvLines(stream, null, file, limit, piece);
    }

    /// <summary>The lines of a text already in memory (copied a piece at a time into <see cref="Buffer"/>).</summary>
    public static CsvLines OfText(string text, int piece = DefaultPiece)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentOutOfRangeException.ThrowIfLessThan(piece, 4);
        return new CsvLines(null, text, "", long.MaxValue, piece);
    }

    /// <summary>The characters that hold the current line (and others): valid until the next call of
    /// <see cref="Next"/>.</summary>
    public char[] Buffer => _chars;

    /// <summary>Where the current line starts in <see cref="Buffer"/>.</summary>
    public int LineStart { get; private set; }

    /// <summary>Where the current line ends in <see cref="Buffer"/> (its line end left out).</summary>
    public int LineEnd { get; private set; }

    /// <summary>The current line's number, from 1.</summary>
    public int LineNumber { get; private set; }

    /// <summary>About how many lines the file has (for the capacity of a list of its rows): the count of a text in
    /// memory, the lines of the first piece scaled to the length of a stream that has one, or those of the first
    /// piece.</summary>
    public int EstimateLines()
    {
        if (_text is not null) return _text.AsSpan().Count('\n') + 1;
        if (!_started) Fill();
        long lines = _lineFeeds + 1;
        if (_stream!.CanSeek && !_exhausted && _read > 0)
            lines = (long)(1.05 * _lineFeeds * ((double)_stream.Length / _read)) + 16;
        return (int)Math.Min(lines, Array.MaxLength / 2);
    }

    /// <summary>Moves to the next line; false after the last.</summary>
    /// <exception cref="ProjectFileException">The file is not valid UTF-8 where the next line stands, or it is longer
    /// than its limit.</exception>
    public bool Next()
    {
        if (_done) return false;
        while (true)
        {
            int eol = _chars.AsSpan(_pos, _end - _pos).IndexOfAny('\r', '\n');
            if (eol >= 0)
            {
                int at = _pos + eol;
                // a CR at the end of the characters so far may be the first half of a CR LF
                if (_chars[at] == '\r' && at + 1 == _end && !_exhausted)
                {
                    Fill();
                    continue;
                }
                (LineStart, LineEnd) = (_pos, at);
                _pos = at + (_chars[at] == '\r' && at + 1 < _end && _chars[at + 1] == '\n' ? 2 : 1);
                LineNumber++;
                return true;
            }
            if (!_exhausted)
            {
                Fill();
                continue;
            }
            if (_invalid is not null) throw _invalid;
            (LineStart, LineEnd, _pos, _done) = (_pos, _end, _end, true);
            LineNumber++;
            return true;
        }
    }

    /// <summary>Brings in the next piece behind the characters not yet taken (moved to the front of the buffer, which
    /// grows when a line is longer than a piece).</summary>
    private void Fill()
    {
        _started = true;
        int keep = _end - _pos;
        _chars.AsSpan(_pos, keep).CopyTo(_chars);
        (_pos, _end) = (0, keep);
        if (_chars.Length - _end < _piece) Array.Resize(ref _chars, Math.Max(2 * _chars.Length, _end + _piece));
        if (_text is not null)
        {
            int n = Math.Min(_piece, _text.Length - _textAt);
            _text.AsSpan(_textAt, n).CopyTo(_chars.AsSpan(_end));
            (_textAt, _end) = (_textAt + n, _end + n);
            _exhausted = _textAt == _text.Length;
            return;
        }
        int got = _stream!.ReadAtLeast(_bytes.AsSpan(_carried), _piece - _carried, throwOnEndOfStream: false);
        _read += got;
        if (_read > _limit) throw InputText.TooLarge(_file, _limit);
        bool final = got < _piece - _carried;
        int start = 0, count = _carried + got;
        if (_offset == 0 && count >= 3 && _bytes[0] == 0xEF && _bytes[1] == 0xBB && _bytes[2] == 0xBF) start = 3;
        var status = Utf8.ToUtf16(_bytes.AsSpan(start, count - start), _chars.AsSpan(_end), out int used,
            out int written, replaceInvalidSequences: false, isFinalBlock: final);
        _lineFeeds += _chars.AsSpan(_end, written).Count('\n');
        _end += written;
        int next = start + used; // the first byte not decoded
        switch (status)
        {
            case OperationStatus.Done:
                _carried = 0;
                _exhausted = final;
                break;
            case OperationStatus.NeedMoreData: // an incomplete sequence at the end of a piece that is not the last
                _carried = count - next;
                _bytes.AsSpan(next, _carried).CopyTo(_bytes);
                break;
            case OperationStatus.InvalidData:
                _invalid = InputText.NotUtf8(_file, (int)Math.Min(int.MaxValue, _lineFeeds + 1), _bytes[next],
                    _offset + next);
                _exhausted = true;
                break;
            default: // the buffer always has room for a character per byte
                throw new InvalidOperationException($"UTF-8 decoding stopped: {status}");
        }
        _offset += next;
    }

    /// <inheritdoc />
    public void Dispose() => _stream?.Dispose();
}
