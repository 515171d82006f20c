namespace NetAdjust.Tests;

/// <summary>
/// House style of the sources (DEVELOPERS.md, .editorconfig: lines of at most 120 characters). Checks the C# files
/// under src/, tests/, samples/ and benchmarks/ as text, so a long line fails here and not only in an editor.
/// </summary>
public class HouseStyleTests
{
    private const int MaxLineLength = 120;

    [Fact]
    public void SourceLinesAreAtMost120Characters()
    {
        string root = RepoRoot();
        var files = new[] { "src", "tests", "samples", "benchmarks" }
            .Where(d => Directory.Exists(Path.Combine(root, d)))
            .SelectMany(d => Directory.EnumerateFiles(Path.Combine(root, d), "*.cs", SearchOption.AllDirectories))
            .Select(f => Path.GetRelativePath(root, f).Replace('\\', '/'))
            .Where(f => !f.Contains("/obj/") && !f.Contains("/bin/"))
            .Order(StringComparer.Ordinal)
            .ToList();
        Assert.NotEmpty(files);

        var tooLong = new List<string>();
        foreach (string file in files)
        {
            string[] lines = File.ReadAllText(Path.Combine(root, file)).Split('\n');
            for (int i = 0; i < lines.Length; i++)
            {
                int length = lines[i].TrimEnd('\r').Length;
                if (length > MaxLineLength) tooLong.Add($"{file}:{i + 1} ({length} characters)");
            }
        }
        Assert.True(tooLong.Count == 0,
            $"{tooLong.Count} lines longer than {MaxLineLength} characters:\n" + string.Join("\n", tooLong));
    }

    internal static string RepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "NetAdjust.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("NetAdjust.sln not found above the test folder");
    }
}
