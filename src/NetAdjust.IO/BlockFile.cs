using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace NetAdjust.IO;

/// <summary>
/// An output file written front to back in blocks by one thread, past the system's page cache where the system
/// allows it (Linux on x64 and arm64, a local disk file system: the file's <c>O_DIRECT</c> flag). On the machines
/// measured in docs/performance.md, copying a large output into the page cache cost about 2.5 s of system CPU per
/// 900 MB, on the cores that render the outputs, and a direct write of the same bytes about 0.15 s. A direct write
/// needs the memory, the file offset and the length aligned to the device's block: blocks from
/// <see cref="AllocateBlock"/> are aligned to <see cref="Alignment"/>; an unaligned tail (the last block) or a
/// direct write the system refuses (a file system without direct I/O, a device with larger blocks) falls back to
/// ordinary writes for the rest of the file, from the start of that block. The bytes in the file are the same
/// either way.
/// </summary>
internal sealed class BlockFile
{
    /// <summary>The alignment of memory, offsets and lengths of direct writes (bytes): 4096, a multiple of the
    /// logical block size of common devices (512 or 4096 bytes).</summary>
    public const int Alignment = 4096;

    private readonly SafeFileHandle _handle;
    private long _offset;

    /// <summary>Takes over writing <paramref name="handle"/> (opened for writing, empty, left open) from offset 0;
    /// with <paramref name="direct"/>, tries to write past the page cache.</summary>
    public BlockFile(SafeFileHandle handle, bool direct)
    {
        _handle = handle;
        IsDirect = direct && DirectWrites.TrySet(handle, on: true);
    }

    /// <summary>Whether the writes go past the page cache (until a write needs the ordinary path).</summary>
    public bool IsDirect { get; private set; }

    /// <summary>The bytes written so far.</summary>
    public long Length => _offset;

    /// <summary>A block of <paramref name="size"/> bytes (a multiple of <see cref="Alignment"/>) whose memory does
    /// not move and whose first byte, at <c>Start</c>, is aligned to <see cref="Alignment"/>.</summary>
    public static (byte[] Array, int Start) AllocateBlock(int size)
    {
        var array = GC.AllocateUninitializedArray<byte>(size + Alignment, pinned: true);
        long address = Marshal.UnsafeAddrOfPinnedArrayElement(array, 0);
        int start = (int)((Alignment - (address % Alignment)) % Alignment);
        return (array, start);
    }

    /// <summary>Appends <paramref name="count"/> bytes of <paramref name="array"/> from <paramref name="start"/>
    /// (an array from <see cref="AllocateBlock"/> for a direct write).</summary>
    /// <exception cref="IOException">When the system cannot write the file.</exception>
    public void Append(byte[] array, int start, int count)
    {
        int direct = 0;
        if (IsDirect)
        {
            bool aligned = _offset % Alignment == 0
                && Marshal.UnsafeAddrOfPinnedArrayElement(array, start) % Alignment == 0;
            direct = aligned ? count & ~(Alignment - 1) : 0;
            if (direct > 0)
            {
                try { RandomAccess.Write(_handle, array.AsSpan(start, direct), _offset); }
                catch (IOException)
                {
                    // refused past the cache (or a short write left the rest unaligned): the ordinary path from
                    // this block's start, whose own failure, if any, is the one to report
                    direct = 0;
                }
            }
            if (direct < count) Ordinary();
        }
        if (direct < count)
            RandomAccess.Write(_handle, array.AsSpan(start + direct, count - direct), _offset + direct);
        _offset += count;
    }

    private void Ordinary()
    {
        IsDirect = false;
        DirectWrites.TrySet(_handle, on: false);
    }

    /// <summary>The file status flag <c>O_DIRECT</c> of an open file (Linux), set and cleared with
    /// <c>fcntl(F_SETFL)</c>.</summary>
    private static class DirectWrites
    {
        private const int GetStatusFlags = 3, SetStatusFlags = 4; // F_GETFL, F_SETFL (Linux, every architecture)

        // O_DIRECT differs between architectures (asm-generic/fcntl.h against arch/arm64/include/uapi/asm/fcntl.h)
        private static readonly int Flag =
            !OperatingSystem.IsLinux() ? 0
            : RuntimeInformation.ProcessArchitecture switch
            {
                Architecture.X64 => 0x4000,
                Architecture.Arm64 => 0x10000,
                _ => 0,
            };

        // Local disk file systems (linux/magic.h): ext2/3/4, XFS, Btrfs, F2FS. On a network file system a direct
        // write waits for each block's round trip, and a memory file system has no cache to spare: both keep the
        // ordinary writes.
        private static readonly long[] LocalDisk = [0xEF53, 0x58465342, 0x9123683E, 0xF2F52010];

        public static bool TrySet(SafeFileHandle handle, bool on)
        {
            if (Flag == 0 || handle.IsInvalid || handle.IsClosed) return false;
            bool added = false;
            try
            {
                handle.DangerousAddRef(ref added);
                int fd = (int)handle.DangerousGetHandle();
                if (on)
                {
                    // struct statfs begins with the file system's type as a long on every 64-bit Linux
                    var info = new byte[256];
                    if (Fstatfs(fd, info) != 0 || !LocalDisk.Contains(BitConverter.ToInt64(info, 0))) return false;
                }
                int flags = Fcntl(fd, GetStatusFlags, 0);
                if (flags < 0) return false;
                int wanted = on ? flags | Flag : flags & ~Flag;
                return Fcntl(fd, SetStatusFlags, wanted) == 0;
            }
            catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException)
            {
                return false;
            }
            finally
            {
                if (added) handle.DangerousRelease();
            }
        }

        [DllImport("libc", EntryPoint = "fcntl", SetLastError = true)]
        private static extern int Fcntl(int fd, int command, int argument);

        [DllImport("libc", EntryPoint = "fstatfs", SetLastError = true)]
        private static extern int Fstatfs(int fd, [Out] byte[] info);
    }
}
