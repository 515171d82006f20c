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
    private long _stop = long.MaxValue; // the most bytes this reader takes (the first half of a split file: its half)
    private readonly Func<Stream>? _reopen; // opens the file again (for a second half read on another core)
    private readonly long _splitBytes; // the least length of a file read in two halves
    private long _counted = -1; // a second half: the file's bytes before it, whose lines are counted at its first fill
    private long _feedsBefore; // a second half: the LF characters before it

    private CsvLines(Stream? stream, string? text, string file, long limit, int piece, Func<Stream>? reopen = null,
        long splitBytes = long.MaxValue)
    {
        (_stream, _text, _file, _limit, _piece, _reopen, _splitBytes) =
            (stream, text, file, limit, piece, reopen, splitBytes);
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
    /// <param name="reopen">Opens the file again, from its start: given, a seekable file of at least
    /// <paramref name="splitBytes"/> bytes can be read in two halves (<see cref="SplitOff"/>).</param>
    /// <param name="splitBytes">The least length of a file read in two halves.</param>
    public static CsvLines OfUtf8(Stream stream, string file, long limit, int piece = DefaultPiece,
        Func<Stream>? reopen = null, long splitBytes = DefaultSplitBytes)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentOutOfRangeException.ThrowIfLessThan(piece, 4); // a whole UTF-8 sequence fits one piece
        if (stream.CanSeek && stream.Length - stream.Position > limit)
        {
            stream.Dispose();
            throw InputText.TooLarge(file, limit);
        }
        return new CsvLines(stream, null, file, limit, piece, reopen, splitBytes);
    }

    /// <summary>The least length of a file read in two halves by default (about 350,000 rows).</summary>
    internal const long DefaultSplitBytes = 16L << 20;

    /// <summary>
    /// Splits a file read from its start into two halves at the first line end after its middle: this reader then
    /// stops there, and the reader returned (over a second opening of the file) gives the lines after it, numbered
    /// as in the whole file (it counts the lines of the first half when it first reads, so on the core that reads
    /// it). Null, and this reader unchanged, when the file cannot be split: a text in memory, a stream that cannot
    /// seek or has no second opening (or the second opening fails), a file shorter than its split length, a reader
    /// that has read past the middle, or no line end after it.
    /// </summary>
    public CsvLines? SplitOff()
    {
        if (_reopen is null || _stream is not { CanSeek: true } || _counted >= 0 || _stop != long.MaxValue ||
            _stream.Position != _read) // (a stream that did not stand at the file's start)
            return null;
        long length = _stream.Length;
        if (length < _splitBytes || length < 2 * _piece) return null;
        Stream? other;
        try { other = _reopen(); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return null; // (e.g. the file moved since it was opened: the open stream reads it all in one pass)
        }
        try
        {
            long middle = length / 2, at = middle;
            if (_read > middle) return null;
            other.Position = middle;
            // the first line end at or after the middle: LF, CR LF or a CR alone; the half starts after it
            var look = new byte[Math.Min(_piece, 1 << 16)];
            long start = -1;
            for (int got; start < 0 && (got = other.ReadAtLeast(look, look.Length, false)) > 0; at += got)
            {
                int k = look.AsSpan(0, got).IndexOfAny((byte)'\r', (byte)'\n');
                if (k < 0) continue;
                if (look[k] == '\n') start = at + k + 1;
                else if (k + 1 < got) start = at + k + (look[k + 1] == '\n' ? 2 : 1);
                else // a CR at the end of the bytes read: is an LF next?
                {
                    other.Position = at + k + 1;
                    start = at + k + 1 + (other.ReadByte() == '\n' ? 1 : 0);
                }
            }
            if (start < 0 || start >= length) return null;
            // the second half counts the first half's lines from its start before it reads from the split
            other.Position = 0;
            var second = new CsvLines(other, null, _file, _limit - start, _piece) { _counted = start, _offset = start };
            _stop = start;
            other = null;
            return second;
        }
        finally { other?.Dispose(); }
    }

    /// <summary>A second half, before its first line: counts the line ends of the file's bytes before it (its
    /// stream stands at the file's start), so that its line numbers and an invalid byte's line are those of the
    /// whole file; the stream then stands where the half starts.</summary>
    private void CountLinesBefore()
    {
        long left = _counted;
        long lineEnds = 0, lineFeeds = 0;
        bool crBefore = false; // the byte before this piece is a CR
        while (left > 0)
        {
            int want = (int)Math.Min(_bytes.Length, left);
            int got = _stream!.ReadAtLeast(_bytes.AsSpan(0, want), want, throwOnEndOfStream: true);
            var span = _bytes.AsSpan(0, got);
            int lf = span.Count((byte)'\n'), cr = span.Count((byte)'\r');
            // a line ends at each LF and at each CR that no LF follows
            int crlf = (cr == 0 ? 0 : span.Count("\r\n"u8)) + (crBefore && span[0] == '\n' ? 1 : 0);
            lineEnds += lf + cr - crlf;
            lineFeeds += lf;
            crBefore = span[^1] == '\r';
            left -= got;
        }
        LineNumber = (int)Math.Min(int.MaxValue, lineEnds);
        (_lineFeeds, _feedsBefore) = (lineFeeds, lineFeeds);
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
        long fed = _lineFeeds - _feedsBefore, lines = fed + 1;
        if (_stream!.CanSeek && !_exhausted && _read > 0)
            lines = (long)(1.05 * fed * ((double)Math.Min(_stream.Length - (_counted < 0 ? 0 : _counted), _stop) /
                _read)) + 16;
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
        if (!_started && _counted >= 0) CountLinesBefore();
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
        int want = (int)Math.Min(_piece - _carried, _stop - _read);
        int got = want == 0 ? 0 : _stream!.ReadAtLeast(_bytes.AsSpan(_carried, want), want, throwOnEndOfStream: false);
        _read += got;
        if (_read > _limit) throw InputText.TooLarge(_file, _limit);
        bool final = got < want || _read == _stop;
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
