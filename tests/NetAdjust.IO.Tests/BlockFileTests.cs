using Microsoft.Win32.SafeHandles;

namespace NetAdjust.IO.Tests;

/// <summary>
/// The output file written in blocks past the page cache where the system allows it (<see cref="BlockFile"/>): the
/// file holds exactly the bytes appended, in order, whether the writes went past the cache or not, and an append
/// that cannot go past it (unaligned memory, offset or length) turns the rest of the file to ordinary writes
/// without losing or moving a byte.
/// </summary>
public sealed class BlockFileTests
{
    // A folder beside the test assembly (the disk of the checkout) rather than /tmp, which may be a memory file
    // system without direct writes; both paths are checked by the same assertions.
    private static string NewFolder()
    {
        string dir = Path.Combine(AppContext.BaseDirectory, "blockfile-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(dir);
        return dir;
    }

    private static SafeFileHandle Create(string path) =>
        File.OpenHandle(path, FileMode.CreateNew, FileAccess.Write, FileShare.None);

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void TheFileHoldsTheBytesWrittenThroughTheOverlappedStream(bool direct)
    {
        string dir = NewFolder();
        try
        {
            string path = Path.Combine(dir, "out.bin");
            var random = new Random(11);
            var expected = new MemoryStream();
            using (var handle = Create(path))
            {
                using var s = new OverlappedWriteStream(new BlockFile(handle, direct));
                // several blocks and an unaligned tail (the last block goes the ordinary way for its last bytes)
                while (expected.Length < (3 * OverlappedWriteStream.BlockSize) + 4096 + 777)
                {
                    var piece = new byte[random.Next(1, 200_000)];
                    random.NextBytes(piece);
                    s.Write(piece);
                    expected.Write(piece);
                }
                s.Complete();
            }
            Assert.Equal(expected.ToArray(), File.ReadAllBytes(path));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void AnUnalignedAppendTurnsTheRestToOrdinaryWritesWithoutLosingAByte()
    {
        string dir = NewFolder();
        try
        {
            string path = Path.Combine(dir, "out.bin");
            var random = new Random(3);
            var (first, firstStart) = BlockFile.AllocateBlock(2 * BlockFile.Alignment);
            random.NextBytes(first);
            var unaligned = new byte[5000];
            random.NextBytes(unaligned);
            var (last, lastStart) = BlockFile.AllocateBlock(BlockFile.Alignment);
            random.NextBytes(last);
            using (var handle = Create(path))
            {
                var file = new BlockFile(handle, direct: true);
                file.Append(first, firstStart, 2 * BlockFile.Alignment);      // aligned: past the cache if allowed
                file.Append(unaligned, 1, 4999);                              // unaligned memory and length
                Assert.False(file.IsDirect);
                file.Append(last, lastStart, BlockFile.Alignment);            // offset unaligned now: ordinary
                Assert.False(file.IsDirect);
                Assert.Equal((3 * BlockFile.Alignment) + 4999, file.Length);
            }
            byte[] expected =
            [
                .. first.AsSpan(firstStart, 2 * BlockFile.Alignment),
                .. unaligned.AsSpan(1, 4999),
                .. last.AsSpan(lastStart, BlockFile.Alignment),
            ];
            Assert.Equal(expected, File.ReadAllBytes(path));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    /// <summary>A fact about a Linux memory file system at /dev/shm: skipped elsewhere.</summary>
    public sealed class MemoryFileSystemFactAttribute : FactAttribute
    {
        /// <summary>Sets the skip reason where there is no /dev/shm.</summary>
        public MemoryFileSystemFactAttribute()
        {
            if (!OperatingSystem.IsLinux() || !Directory.Exists("/dev/shm"))
                Skip = "needs Linux with a memory file system at /dev/shm";
        }
    }

    [MemoryFileSystemFact]
    public void AFileInMemoryKeepsOrdinaryWrites()
    {
        // a memory file system has no page cache to spare (common practice: tmpfs pages are the cache itself)
        string dir = Path.Combine("/dev/shm", "netadjust-blockfile-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(dir);
        try
        {
            string path = Path.Combine(dir, "out.bin");
            var (block, start) = BlockFile.AllocateBlock(BlockFile.Alignment);
            new Random(5).NextBytes(block);
            using (var handle = Create(path))
            {
                var file = new BlockFile(handle, direct: true);
                Assert.False(file.IsDirect);
                file.Append(block, start, BlockFile.Alignment);
            }
            Assert.Equal(block.AsSpan(start, BlockFile.Alignment).ToArray(), File.ReadAllBytes(path));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void BlocksAreAlignedForWritesPastTheCache()
    {
        for (int i = 0; i < 8; i++)
        {
            var (array, start) = BlockFile.AllocateBlock(OverlappedWriteStream.BlockSize);
            Assert.True(array.Length - start >= OverlappedWriteStream.BlockSize);
            Assert.Equal(0, System.Runtime.InteropServices.Marshal.UnsafeAddrOfPinnedArrayElement(array, start)
                % BlockFile.Alignment);
        }
    }
}
