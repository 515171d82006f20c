namespace NetAdjust.Benchmarks;

/// <summary>Finds the demo projects of the repository the benchmarks run from.</summary>
internal static class DemoData
{
    /// <summary>The full path of a file in data/.</summary>
    /// <param name="name">The file name, e.g. <c>brackenmoor.yaml</c>.</param>
    public static string File(string name)
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !System.IO.File.Exists(Path.Combine(d.FullName, "NetAdjust.sln"))) d = d.Parent;
        return Path.Combine(d?.FullName ??
            throw new InvalidOperationException("NetAdjust.sln not found above the benchmark folder"), "data", name);
    }
}
