namespace NetAdjust.IO.Tests;

/// <summary>
/// The stream that writes an output's file on a thread of its own (<see cref="OverlappedWriteStream"/>): the bytes
/// reach the file in the order written, whatever the sizes of the writes; a failure of the file surfaces to the
/// writer; nothing written after a failure is lost silently.
/// </summary>
public sealed class OverlappedWriteStreamTests
{
    private sealed class FailingStream(long failAfter) : MemoryStream
    {
        public override void Write(byte[] buffer, int offset, int count)
        {
            if (Length + count > failAfter) throw new IOException("no space left on device");
            base.Write(buffer, offset, count);
        }
    }

    [Fact]
    public void BytesArriveInTheOrderWrittenWhateverTheSizesOfTheWrites()
    {
        var random = new Random(7);
        var expected = new MemoryStream();
        using var inner = new MemoryStream();
        using (var s = new OverlappedWriteStream(inner))
        {
            // several blocks' worth, in writes from one byte to more than a block
            while (expected.Length < (5 * OverlappedWriteStream.BlockSize) + 12345)
            {
                int n = random.Next(4) switch
                {
                    0 => 1,
                    1 => random.Next(1, 100),
                    2 => random.Next(1, 1 << 16),
                    _ => random.Next(OverlappedWriteStream.BlockSize / 2, 2 * OverlappedWriteStream.BlockSize),
                };
                var piece = new byte[n];
                random.NextBytes(piece);
                if (n == 1) s.WriteByte(piece[0]);
                else s.Write(piece, 0, n);
                expected.Write(piece);
            }
            s.Complete();
        }
        Assert.Equal(expected.ToArray(), inner.ToArray());
    }

    [Fact]
    public void AFailureOfTheFileSurfacesAtTheLatestAtCompletion()
    {
        using var inner = new FailingStream(3 * OverlappedWriteStream.BlockSize / 2);
        using var s = new OverlappedWriteStream(inner);
        var block = new byte[OverlappedWriteStream.BlockSize];
        var failure = Assert.Throws<IOException>(() =>
        {
            for (int i = 0; i < 4; i++) s.Write(block);
            s.Complete();
        });
        Assert.Contains("no space left", failure.Message);
    }

    [Fact]
    public void ASmallOutputIsWrittenWholeAtCompletion()
    {
        using var inner = new MemoryStream();
        using (var s = new OverlappedWriteStream(inner))
        {
            s.Write("small\n"u8);
            Assert.Equal(0, inner.Length); // still in its block
            s.Complete();
        }
        Assert.Equal("small\n"u8.ToArray(), inner.ToArray());
    }

    [Fact]
    public void WritingAfterCompletionIsRefused()
    {
        using var inner = new MemoryStream();
        using var s = new OverlappedWriteStream(inner);
        s.Complete();
        Assert.Throws<ObjectDisposedException>(() => s.Write([1]));
    }
}
