using NetAdjust.IO.Project;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The points list read from its lines (<see cref="PointLines"/>) gives what the YAML document model gives for the
/// same text: the same points, the same errors at the same lines; other writings are left to the model.
/// </summary>
public class PointLinesTests
{
    private const string Head = """
        units: {length: m, angle: dms}
        default_sd: {distance: 3 mm}
        points:
        """;

    private const string Tail = """
        setups:
          - at: A
            distances:
              - {to: B, value: 99.99}
        """;

    private static string Project(string entries) => Head + "\n" + entries + "\n" + Tail;

    private static SurveyProject Parse(string yaml) =>
        ProjectReader.Parse(yaml, "p.yaml", Path.GetTempPath(), File.ReadAllText);

    // The same entries; a comment after the last one (the same lines) makes the document model read the list.
    private const string Lines = """
          - {id: A, e: 1000.125, n: 2000.5, h: 12.25, fix: enh}
          - {id: B, e: 1.1e3, n: -2.5, sd_e: 0.01, sd_n: 0.02}

          # a comment line inside the list
          - {id: C_1.x, e: 100ft, n: +7, sd_h: 5mm, h: 3}
          - {id: D}
        """;

    [Fact]
    public void PointLinesGiveTheSamePointsAsTheDocumentModel()
    {
        string fast = Project(Lines), model = Project(Lines + "  # end of the points");
        Assert.NotNull(PointLines.Find(fast));
        Assert.Null(PointLines.Find(model));
        var a = Parse(fast).Network.Points;
        var b = Parse(model).Network.Points;
        Assert.Equal(4, a.Count);
        // records: id, coordinates, held components, standard deviations and source (file:line) alike
        Assert.Equal(b, a);
        Assert.Equal("p.yaml:8", a[2].Source);
        Assert.Equal(30.48, a[2].E!.Value, 12); // 100 ft: the international foot is 0.3048 m (common practice)
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void ALongListReadInTwoHalvesGivesTheDocumentModelsPointsAndErrors(bool block)
    {
        // over 50,000 entries: the second half is read on another core; an entry the lines refuse there (a held
        // component that is none) sends the whole list to the document model, which names it
        string Written(int i, string badFix)
        {
            string id = i < 2 ? ((char)('A' + i)).ToString() : "P" + i;
            double e = 1000 + (0.5 * i), n = 2000 - (0.25 * i);
            string fix = i == 45_000 ? badFix : i % 7 == 0 ? "en" : "";
            var inv = System.Globalization.CultureInfo.InvariantCulture;
            return block
                ? string.Create(inv, $"  - id: {id}\n    e: {e}\n    n: {n}") +
                    (fix.Length > 0 ? "\n    fix: " + fix : "")
                : string.Create(inv, $"  - {{id: {id}, e: {e}, n: {n}{(fix.Length > 0 ? ", fix: " + fix : "")}}}");
        }
        string Entries(string badFix) => string.Join("\n", Enumerable.Range(0, 60_000).Select(i => Written(i, badFix)));
        string fast = Project(Entries("n")), model = Project(Entries("n") + "  # end of the points");
        Assert.Equal(60_000, PointLines.Find(fast)!.Count);
        Assert.Null(PointLines.Find(model));
        var a = Parse(fast).Network.Points;
        Assert.Equal(60_000, a.Count);
        Assert.Equal(Parse(model).Network.Points, a);
        string bad = Project(Entries("nq")), badModel = Project(Entries("nq") + "  # end of the points");
        var e1 = Assert.Throws<ProjectFileException>(() => Parse(bad));
        var e2 = Assert.Throws<ProjectFileException>(() => Parse(badModel));
        Assert.Equal(e2.Message, e1.Message);
        // the line of 'fix': one line an entry; or three lines an entry, a fourth for every seventh before it, and
        // 'fix' the fourth line of its own
        int line = block ? 4 + (45_000 * 3) + ((45_000 + 6) / 7) + 3 : 45_000 + 4;
        Assert.StartsWith($"p.yaml:{line}: ", e1.Message);
    }

    // Block mapping entries, one key a line (mixed with a flow entry, blank and comment lines inside the list and
    // inside an entry, trailing spaces); a comment after the last value (the same lines) makes the document model
    // read the list.
    private const string BlockLines = "- id: A\n  e: 1000.125\n  n: 2000.5\n  h: 12.25  \n  fix: enh\n" +
        "- {id: B, e: 1.1e3, n: -2.5, sd_e: 0.01, sd_n: 0.02}\n\n# a comment line inside the list\n" +
        "- e: 100ft\n\n  id: C_1.x\n  # a comment line inside an entry\n  n: +7\n  sd_h: 5mm\n  h: 3\n" +
        "- id: D";

    [Fact]
    public void BlockMappingEntriesGiveTheSamePointsAsTheDocumentModel()
    {
        // the entries at the points key's own indentation, as YAML allows for a sequence under a key, and further in
        foreach (string entries in new[] { BlockLines, "  " + BlockLines.Replace("\n", "\n  ") })
        {
            string fast = Project(entries), model = Project(entries + " # the last point");
            Assert.Equal(4, PointLines.Find(fast)?.Count);
            Assert.Null(PointLines.Find(model));
            var a = Parse(fast).Network.Points;
            Assert.Equal(Parse(model).Network.Points, a);
            Assert.Equal(4, a.Count);
            Assert.Equal(("p.yaml:4", "p.yaml:12"), (a[0].Source, a[2].Source)); // the entry's first line
            Assert.Equal(30.48, a[2].E!.Value, 12); // 100 ft: the international foot is 0.3048 m (common practice)
            Assert.Equal((Network.Fixity.ENH, 5e-3), (a[0].Fixed, a[2].SdH!.Value));
        }
    }

    [Theory]
    [InlineData("  - id: A\n    e: 1 # a comment")] // a comment after a value
    [InlineData("  - id: A\n     e: 1")] // further in than the first key
    [InlineData("  - id: A\n   e: 1")] // less far in
    [InlineData("  -  id: A\n     e: 1")] // two spaces after the dash
    [InlineData("  - id: A\n    e: 1\n    e: 2")] // a key twice
    [InlineData("  - id: A\n    x: 1")] // an unknown key
    [InlineData("  - id: A\n    e:")] // no value
    [InlineData("  - id: A\n    e: '1'")] // quoted
    [InlineData("  - e: 1\n    n: 2\n  - id: B")] // no id
    [InlineData("  - id: B\n  - e: 1\n    n: 2")] // no id in the last entry
    [InlineData("  - {id: A}\n    e: 1")] // a key line after a flow entry
    [InlineData("  - id: A\n    - e: 1")] // a list inside
    public void OtherBlockWritingsAreLeftToTheDocumentModel(string entries)
    {
        Assert.Null(PointLines.Find(Project(entries)));
    }

    [Fact]
    public void LinesAfterThePointsKeepTheirNumbers()
    {
        // an error in the setups (line 13) is named at its line whether the points were read from their lines or not
        string fast = Project(Lines).Replace("value: 99.99", "value: x"), model = fast.Replace("- {id: D}",
            "- {id: D}  # end");
        Assert.NotNull(PointLines.Find(fast));
        var e1 = Assert.Throws<ProjectFileException>(() => Parse(fast));
        var e2 = Assert.Throws<ProjectFileException>(() => Parse(model));
        Assert.StartsWith("p.yaml:13: ", e1.Message);
        Assert.Equal(e2.Message, e1.Message);
    }

    [Theory]
    [InlineData("  - {id: A, e: abc, n: 2}")] // not a length
    [InlineData("  - {id: A, e: 1, n: 2, sd_e: -1}")] // a standard deviation the point refuses
    [InlineData("  - {id: A, e: 1, n: 2, fix: q}")] // not held components
    [InlineData("  - {id: A, e: 1, n: 2, sd_n: 0.01}\n  - {id: A, e: 1, n: 2}")] // an id twice
    public void ARefusedEntryGivesTheDocumentModelsError(string entries)
    {
        string fast = Project(entries), model = Project(entries + "  # end");
        Assert.NotNull(PointLines.Find(fast));
        var e1 = Assert.ThrowsAny<InvalidInputException>(() => Parse(fast));
        var e2 = Assert.ThrowsAny<InvalidInputException>(() => Parse(model));
        Assert.Equal(e2.Message, e1.Message);
        Assert.Contains("p.yaml:", e1.Message);
    }

    [Theory]
    [InlineData("  - {id: 'A', e: 1, n: 2}")] // quoted
    [InlineData("  - {id: A, e: 1, n: 2} # comment")]
    [InlineData("  - {id: A,\n     e: 1, n: 2}")] // over two lines
    [InlineData("  - {id: A, e: 1, n: 2, x: 3}")] // an unknown key
    [InlineData("  - {id: A, e: 1, e: 2}")] // a key twice
    [InlineData("  - {id: A B, e: 1}")] // a value with a space
    [InlineData("  - {id: A, e: 1,}")] // a trailing comma
    [InlineData("  - {id: &a A, e: 1}")] // an anchor
    [InlineData("  - {id: -, e: 1}")] // an indicator alone
    [InlineData("  - {id: A, e:1}")] // no space after the colon
    [InlineData("  - {e: 1, n: 2}")] // no id
    [InlineData("  - {id: A}\n    - {id: B}")] // another indentation
    [InlineData("  - {id: A}\n\t- {id: B}")] // a tab
    [InlineData("  - {id: A}\r  - {id: B}")] // a line ending in CR alone
    [InlineData("")] // no entry
    public void OtherWritingsAreLeftToTheDocumentModel(string entries)
    {
        Assert.Null(PointLines.Find(Project(entries)));
    }

    [Fact]
    public void APointsKeyWithAValueOrTwiceIsLeftToTheDocumentModel()
    {
        Assert.Null(PointLines.Find(Project("  - {id: A}").Replace("points:", "points: # the marks")));
        Assert.Null(PointLines.Find(Project("  - {id: A}") + "\npoints:\n  - {id: B}\n"));
        Assert.Null(PointLines.Find(Project("  - {id: A}").Replace("points:", "  points:")));
    }

    [Fact]
    public void WindowsLineEndsAreRead()
    {
        string fast = Project(Lines).Replace("\n", "\r\n");
        var lines = PointLines.Find(fast);
        Assert.NotNull(lines);
        Assert.Equal(4, lines.Count);
        Assert.Equal(Parse(Project(Lines)).Network.Points, Parse(fast).Network.Points);
    }
}
