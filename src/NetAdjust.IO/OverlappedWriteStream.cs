using System.Runtime.ExceptionServices;

namespace NetAdjust.IO;

/// <summary>
/// A write-only stream that gathers what is written into blocks and hands each full block to a thread of its own,
/// which writes it to the inner stream: the rendering of an output and the system's work of writing its file
/// overlap (on a large network the file writes of the JSON are about a third of its time). At most
/// <see cref="Depth"/> blocks wait at any time, so the memory it holds is bounded. The bytes reach the inner stream
/// in the order written. A failure of the inner stream surfaces at the next <see cref="Write(ReadOnlySpan{byte})"/>
/// or at <see cref="Complete"/>, which must be called once everything is written; disposing without it abandons
/// the blocks not yet written. Over a <see cref="BlockFile"/>, the blocks are aligned for writes past the page cache.
/// </summary>
internal sealed class OverlappedWriteStream : Stream
{
    /// <summary>The size of a block (bytes).</summary>
    public const int BlockSize = 1 << 20;

    /// <summary>How many full blocks may wait for the writing thread.</summary>
    public const int Depth = 4;

    private readonly Stream? _inner;
    private readonly BlockFile? _file;
    // Full blocks waiting and blocks written, under one lock; the two threads wait on it without spinning (a spin
    // wait per block would take a core from the renderers on a two-core machine).
    private readonly object _gate = new();
    private readonly Queue<((byte[] Array, int Start) Block, int Count)> _full = new();
    private readonly Stack<(byte[] Array, int Start)> _free = new();
    private bool _noMore;
    private readonly Thread _writer;
    private volatile ExceptionDispatchInfo? _failure;
    private (byte[] Array, int Start) _block;
    private int _count;
    private bool _completed;

    /// <summary>Starts the writing thread over <paramref name="inner"/> (left open).</summary>
    public OverlappedWriteStream(Stream inner) : this(inner, null) { }

    /// <summary>Starts the writing thread over <paramref name="file"/>.</summary>
    public OverlappedWriteStream(BlockFile file) : this(null, file) { }

    private OverlappedWriteStream(Stream? inner, BlockFile? file)
    {
        _inner = inner;
        _file = file;
        _block = BlockFile.AllocateBlock(BlockSize);
        _writer = new Thread(WriteBlocks) { IsBackground = true, Name = "netadjust file writer" };
        _writer.Start();
    }

    private void WriteBlocks()
    {
        while (true)
        {
            ((byte[] Array, int Start) Block, int Count) next;
            lock (_gate)
            {
                while (_full.Count == 0 && !_noMore) Monitor.Wait(_gate);
                if (_full.Count == 0) return;
                next = _full.Dequeue();
                Monitor.PulseAll(_gate);
            }
            if (_failure is null)
            {
                try
                {
                    if (_file is not null) _file.Append(next.Block.Array, next.Block.Start, next.Count);
                    else _inner!.Write(next.Block.Array, next.Block.Start, next.Count);
                }
                catch (Exception e) { _failure = ExceptionDispatchInfo.Capture(e); }
            }
            lock (_gate) _free.Push(next.Block);
        }
    }

    /// <inheritdoc />
    public override void Write(ReadOnlySpan<byte> buffer)
    {
        ObjectDisposedException.ThrowIf(_completed, this);
        while (buffer.Length > 0)
        {
            int n = Math.Min(buffer.Length, BlockSize - _count);
            buffer[..n].CopyTo(_block.Array.AsSpan(_block.Start + _count));
            _count += n;
            buffer = buffer[n..];
            if (_count == BlockSize) HandOver();
        }
    }

    /// <inheritdoc />
    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    /// <inheritdoc />
    public override void WriteByte(byte value) => Write([value]);

    private void HandOver()
    {
        _failure?.Throw();
        (byte[] Array, int Start) free;
        bool reuse;
        lock (_gate)
        {
            while (_full.Count >= Depth) Monitor.Wait(_gate);
            _full.Enqueue((_block, _count));
            Monitor.PulseAll(_gate);
            reuse = _free.TryPop(out free);
        }
        _block = reuse ? free : BlockFile.AllocateBlock(BlockSize);
        _count = 0;
    }

    private void NoMore()
    {
        lock (_gate)
        {
            _noMore = true;
            Monitor.PulseAll(_gate);
        }
        _writer.Join();
    }

    /// <summary>Writes what is left, waits for the writing thread to finish and flushes the inner stream; throws the
    /// inner stream's (or file's) failure, if any.</summary>
    public void Complete()
    {
        if (_completed) return;
        if (_count > 0) HandOver();
        _completed = true;
        NoMore();
        _failure?.Throw();
        _inner?.Flush();
    }

    /// <inheritdoc />
    protected override void Dispose(bool disposing)
    {
        if (disposing && !_completed)
        {
            _completed = true;
            _failure ??= ExceptionDispatchInfo.Capture(new ObjectDisposedException(nameof(OverlappedWriteStream)));
            NoMore();
        }
        base.Dispose(disposing);
    }

    /// <summary>Blocks reach the inner stream only when full or at <see cref="Complete"/>: nothing to do here.
    /// </summary>
    public override void Flush() { }

    /// <inheritdoc />
    public override bool CanRead => false;

    /// <inheritdoc />
    public override bool CanSeek => false;

    /// <inheritdoc />
    public override bool CanWrite => !_completed;

    /// <inheritdoc />
    public override long Length => throw new NotSupportedException();

    /// <inheritdoc />
    public override long Position
    {
        get => throw new NotSupportedException();
        set => throw new NotSupportedException();
    }

    /// <inheritdoc />
    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    /// <inheritdoc />
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    /// <inheritdoc />
    public override void SetLength(long value) => throw new NotSupportedException();
}
