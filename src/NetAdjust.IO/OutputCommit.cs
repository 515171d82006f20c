namespace NetAdjust.IO;

/// <summary>
/// Renames written temporary files into place as one step: an existing file at a target is first moved aside, and
/// when any rename fails every target is restored to its earlier content (or removed when it did not exist), so the
/// promise of docs/cli.md holds: a failed run leaves every earlier output as it was.
/// </summary>
internal static class OutputCommit
{
    /// <summary>Renames each temporary file to its target; all or none.</summary>
    /// <param name="staged">Temporary path, full target path, target as the user named it.</param>
    /// <exception cref="OutputException">When a target cannot be replaced; the earlier files are restored.</exception>
    public static void RenameAll(IReadOnlyList<(string Tmp, string Full, string Given)> staged)
    {
        var done = new List<(string Full, string? Aside)>();
        try
        {
            foreach (var (tmp, full, given) in staged)
            {
                string? aside = null;
                try
                {
                    if (Directory.Exists(full)) throw new IOException("a folder stands where the file should go");
                    if (File.Exists(full))
                    {
                        aside = Path.Combine(Path.GetDirectoryName(full) ?? ".",
                            "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N")[..8] + ".old");
                        File.Move(full, aside);
                    }
                    done.Add((full, aside));
                    File.Move(tmp, full, overwrite: false);
                }
                catch (Exception e) when (e is IOException or UnauthorizedAccessException or NotSupportedException)
                {
                    throw new OutputException($"{given}: cannot write the file ({e.Message})", e);
                }
            }
        }
        catch (OutputException)
        {
            Restore(done);
            throw;
        }
        foreach (var (_, aside) in done)
            if (aside is not null) TryDelete(aside);
    }

    private static void Restore(List<(string Full, string? Aside)> done)
    {
        for (int k = done.Count - 1; k >= 0; k--)
        {
            var (full, aside) = done[k];
            try
            {
                if (aside is null) { if (File.Exists(full)) File.Delete(full); }
                else File.Move(aside, full, overwrite: true);
            }
            catch (IOException) { }
            catch (UnauthorizedAccessException) { }
        }
    }

    private static void TryDelete(string path)
    {
        try { File.Delete(path); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
