using System.Runtime.ExceptionServices;
using System.Text;

namespace NetAdjust.IO;

/// <summary>An output file could not be written; nothing was left behind.</summary>
public sealed class OutputException : NetAdjustException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">What failed and where.</param>
    /// <param name="inner">The cause.</param>
    public OutputException(string message, Exception? inner = null) : base(message, inner) { }
}

/// <summary>
/// Writes output files safely: refuses to overwrite an input, writes to a temporary file in the target folder,
/// then renames it into place, so a failure never leaves a partial file or spoils an earlier one.
/// </summary>
public static class SafeFileWriter
{
    /// <summary>Checks that none of the outputs is an input or named twice; call before any work is done.</summary>
    /// <param name="outputs">Output paths as the user gave them.</param>
    /// <param name="inputs">Full paths of the inputs.</param>
    /// <exception cref="OutputException">When an output would overwrite an input or two outputs coincide.</exception>
    public static void CheckPlan(IEnumerable<string> outputs, IEnumerable<string> inputs)
    {
        var ins = new HashSet<string>(inputs.Select(Path.GetFullPath), StringComparer.Ordinal);
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in outputs)
        {
            if (string.IsNullOrWhiteSpace(o)) throw new OutputException("an output path is empty: name a file");
            string full;
            try { full = Path.GetFullPath(o); }
            catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
            { throw new OutputException($"'{o}' is not a usable file path ({e.Message})", e); }
            if (ins.Contains(full))
                throw new OutputException($"{o}: refusing to overwrite an input file; choose another output path");
            if (!seen.Add(full)) throw new OutputException($"{o}: named for two outputs; choose distinct paths");
        }
    }

    /// <summary>
    /// Writes several files as one step: every text goes to a temporary file in its target folder first, and only when
    /// all of them are written are they renamed into place. A failure while writing leaves no partial file and every
    /// earlier file untouched (none of the outputs is replaced).
    /// </summary>
    /// <param name="files">Target paths and contents, in order.</param>
    /// <exception cref="OutputException">When a file cannot be written; the temporary files are removed.</exception>
    public static void WriteAll(IReadOnlyList<(string Path, string Text)> files)
    {
        ArgumentNullException.ThrowIfNull(files);
        var utf8 = new UTF8Encoding(false);
        WriteAll(files.Select(f => (f.Path, (Action<Stream>)(s =>
        {
            using var w = new StreamWriter(s, utf8, BufferSize, leaveOpen: true);
            w.Write(f.Text);
        }))).ToList());
    }

    /// <summary>
    /// Writes several files as one step, each straight from its writer to a temporary file in its target folder
    /// (buffered, never held whole in memory); only when all of them are written are they renamed into place. A
    /// failure while writing leaves no partial file and every earlier file untouched (none of the outputs is
    /// replaced).
    /// </summary>
    /// <param name="files">Target paths and the writers of their contents, in order; a writer gets the open
    /// stream of its temporary file and must not close it.</param>
    /// <exception cref="OutputException">When a file cannot be written; the temporary files are removed.</exception>
    public static void WriteAll(IReadOnlyList<(string Path, Action<Stream> Write)> files)
    {
        ArgumentNullException.ThrowIfNull(files);
        var staged = new List<(string Tmp, string Full, string Given)>();
        try
        {
            foreach (var (path, write) in files) WriteOne(path, write, t => staged.Add(t));
            OutputCommit.RenameAll(staged);
        }
        finally
        {
            foreach (var (tmp, _, _) in staged) TryDelete(tmp);
        }
    }

    /// <summary>
    /// Writes several files as one step, as <see cref="WriteAll(IReadOnlyList{ValueTuple{string, Action{Stream}}})"/>
    /// does, with up to <paramref name="concurrency"/> of the writers running at once (the calling thread and
    /// others); each file is still written by one writer on one thread, so its bytes are those of a write one after
    /// the other when the writers do not depend on the order. The writers are started in the files' order. Only
    /// when all of them are written are the files renamed into place; when one fails, no file is replaced, the
    /// temporary files are removed, the files after the first failed one are not started, and the exception of the
    /// first failed file in the files' order is thrown (as a write one after the other would throw it).
    /// </summary>
    /// <param name="files">Target paths and the writers of their contents, in order; a writer gets the open
    /// stream of its temporary file and must not close it. Writers that run at once must be safe to run together
    /// (they may read shared data, not change it).</param>
    /// <param name="concurrency">How many writers may run at once (1: one after the other).</param>
    /// <exception cref="OutputException">When a file cannot be written; the temporary files are removed.</exception>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="concurrency"/> is less than 1.</exception>
    public static void WriteAll(IReadOnlyList<(string Path, Action<Stream> Write)> files, int concurrency)
    {
        ArgumentNullException.ThrowIfNull(files);
        ArgumentOutOfRangeException.ThrowIfLessThan(concurrency, 1);
        int workers = Math.Min(concurrency, files.Count);
        if (workers <= 1)
        {
            WriteAll(files);
            return;
        }
        var staged = new (string Tmp, string Full, string Given)?[files.Count];
        var failures = new ExceptionDispatchInfo?[files.Count];
        var gate = new object();
        int next = 0, firstFailed = int.MaxValue;
        // Each worker takes the next file in order; after a failure, only the files before the failed one are still
        // started (one of them may fail too, and the first failure in order is the one to report).
        void Work()
        {
            while (true)
            {
                int i;
                lock (gate)
                {
                    if (next >= files.Count || next > firstFailed) return;
                    i = next++;
                }
                try { WriteOne(files[i].Path, files[i].Write, t => staged[i] = t); }
                catch (Exception e)
                {
                    failures[i] = ExceptionDispatchInfo.Capture(e);
                    lock (gate) firstFailed = Math.Min(firstFailed, i);
                }
            }
        }
        try
        {
            var helpers = new Task[workers - 1];
            for (int k = 0; k < helpers.Length; k++)
                helpers[k] = Task.Factory.StartNew(Work, CancellationToken.None, TaskCreationOptions.LongRunning,
                    TaskScheduler.Default);
            Work();
            Task.WaitAll(helpers);
            foreach (var failure in failures) failure?.Throw();
            OutputCommit.RenameAll(staged.Select(t => t!.Value).ToList());
        }
        finally
        {
            foreach (var t in staged)
                if (t is { } s) TryDelete(s.Tmp);
        }
    }

    /// <summary>Writes one file to its temporary file, handing the staged paths to <paramref name="stage"/> before
    /// the file is made (so that it is removed whatever happens next).</summary>
    private static void WriteOne(string path, Action<Stream> write,
        Action<(string Tmp, string Full, string Given)> stage)
    {
        string full = Path.GetFullPath(path);
        string tmp = TemporaryPath(full);
        stage((tmp, full, path));
        try
        {
            using var handle = File.OpenHandle(tmp, FileMode.CreateNew, FileAccess.Write, FileShare.None);
            // the file is written on a thread of its own while the writer renders the rest, past the page cache
            // where the system allows it (BlockFile)
            using var overlapped = new OverlappedWriteStream(new BlockFile(handle, direct: true));
            write(overlapped);
            overlapped.Complete();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            throw new OutputException($"{path}: cannot write the file ({e.Message})", e);
        }
    }

    private static void TryDelete(string tmp)
    {
        try { if (File.Exists(tmp)) File.Delete(tmp); }
        catch (IOException) { } catch (UnauthorizedAccessException) { }
    }

    /// <summary>The buffer of the output streams (bytes).</summary>
    private const int BufferSize = 1 << 16;

    private static string TemporaryPath(string full) =>
        Path.Combine(Path.GetDirectoryName(full) ?? ".",
            "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N")[..8] + ".tmp");

    /// <summary>Writes text (UTF-8, no byte-order mark) to a file through a temporary file and a rename.</summary>
    /// <param name="path">The target path.</param>
    /// <param name="text">The content.</param>
    /// <exception cref="OutputException">When the file cannot be written; no partial file remains.</exception>
    public static void WriteText(string path, string text)
    {
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full) ?? ".";
        string tmp = Path.Combine(dir, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N")[..8] + ".tmp");
        try
        {
            File.WriteAllText(tmp, text, new UTF8Encoding(false));
            File.Move(tmp, full, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException)
        {
            try { if (File.Exists(tmp)) File.Delete(tmp); }
            catch (IOException) { } catch (UnauthorizedAccessException) { }
            throw new OutputException($"{path}: cannot write the file ({e.Message})", e);
        }
    }
}
