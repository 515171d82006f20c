namespace NetAdjust.IO.Project;

/// <summary>Splits a CSV line into trimmed fields within the documented limits (<see cref="InputLimits"/>).</summary>
internal static class CsvLimits
{
    public static string[] Fields(string line, string file, int lineNo)
    {
        if (line.Length > InputLimits.MaxCsvLineLength)
            throw new ProjectFileException(file, lineNo, "",
                $"the line has {line.Length} characters, more than the limit of {InputLimits.MaxCsvLineLength} " +
                "(docs/input-format.md, \"Limits\")");
        var f = line.Split(',', StringSplitOptions.TrimEntries);
        foreach (var v in f)
            if (v.Length > InputLimits.MaxValueLength)
                throw new ProjectFileException(file, lineNo, "",
                    $"a field of {v.Length} characters is longer than the limit of {InputLimits.MaxValueLength} " +
                    $"(it starts '{InputLimits.Excerpt(v)}')");
        return f;
    }
}
