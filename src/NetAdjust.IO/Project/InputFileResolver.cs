namespace NetAdjust.IO.Project;

/// <summary>
/// How the project reader finds and opens its files (the project file and the CSV files it names). The reader opens
/// files only through a resolver, so a service that embeds NetAdjust can confine reading, e.g. to one folder with
/// <see cref="ConfinedTo"/>. The default, <see cref="FileSystem"/>, reads any path the user may read: CSV paths are
/// relative to the project file's folder and may leave it (<c>../fieldbook/day1.csv</c>) or be absolute.
/// </summary>
public abstract class InputFileResolver
{
    /// <summary>Reads from the file system without restriction (the command-line tool's behaviour).</summary>
    public static InputFileResolver FileSystem { get; } = new FileSystemResolver(null);

    /// <summary>A resolver that refuses every file outside <paramref name="folder"/> (and its subfolders).</summary>
    /// <param name="folder">The only folder files may be read from.</param>
    public static InputFileResolver ConfinedTo(string folder) => new FileSystemResolver(Path.GetFullPath(folder));

    /// <summary>The full path of <paramref name="path"/> named in a file in <paramref name="baseDirectory"/>.</summary>
    /// <param name="baseDirectory">The folder of the file that names the path.</param>
    /// <param name="path">The path as written (relative or absolute).</param>
    /// <exception cref="UnauthorizedAccessException">When the resolver does not allow the path.</exception>
    public virtual string Resolve(string baseDirectory, string path) => Path.GetFullPath(Path.Combine(baseDirectory,
        path));

    /// <summary>Opens a resolved file for reading.</summary>
    /// <param name="fullPath">A path returned by <see cref="Resolve"/>.</param>
    /// <returns>A readable stream; the caller disposes it.</returns>
    /// <exception cref="IOException">When the file is missing or cannot be read.</exception>
    /// <exception cref="UnauthorizedAccessException">When reading it is not allowed.</exception>
    public abstract Stream Open(string fullPath);

    private sealed class FileSystemResolver(string? root) : InputFileResolver
    {
        public override string Resolve(string baseDirectory, string path)
        {
            string full = base.Resolve(baseDirectory, path);
            if (root is not null && !Inside(full))
                throw new UnauthorizedAccessException("the file lies outside the folder that input may be read from");
            return full;
        }

        public override Stream Open(string fullPath)
        {
            if (root is not null && !Inside(Path.GetFullPath(fullPath)))
                throw new UnauthorizedAccessException("the file lies outside the folder that input may be read from");
            if (Directory.Exists(fullPath)) throw new IOException("it is a folder, not a file");
            return new FileStream(fullPath, FileMode.Open, FileAccess.Read, FileShare.Read);
        }

        private bool Inside(string full)
        {
            string r = root!.EndsWith(Path.DirectorySeparatorChar) ? root : root + Path.DirectorySeparatorChar;
            return full.StartsWith(r, StringComparison.Ordinal);
        }
    }
}
