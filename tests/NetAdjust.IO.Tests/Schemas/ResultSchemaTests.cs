using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Procedures;

namespace NetAdjust.IO.Tests.Schemas;

/// <summary>
/// The JSON Schema of <c>netadjust-result/1</c> (docs/result.schema.json): every JSON result the tests produce is
/// valid against it — the golden outputs of the command (all demos and variants, each solution of a sequence) and
/// the results written here in process — and it refuses a result that breaks the format.
/// </summary>
public sealed class ResultSchemaTests
{
    private static string GoldenFolder => Path.Combine(TestProjects.RepoRoot, "tests", "NetAdjust.Cli.Tests", "Golden");

    public static TheoryData<string> GoldenResults()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.GetFiles(GoldenFolder, "result.json", SearchOption.AllDirectories)
                     .Order(StringComparer.Ordinal))
            data.Add(Path.GetRelativePath(GoldenFolder, f));
        return data;
    }

    [Theory]
    [MemberData(nameof(GoldenResults))]
    public void EveryGoldenJsonResultIsValid(string relative)
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(GoldenFolder, relative)));
        foreach (var result in Results(doc.RootElement))
            Assert.Empty(SchemaValidation.ResultErrors(result));
    }

    [Fact]
    public void TheGoldenFolderHoldsResultsOfEveryVariant()
    {
        // The theory above must not pass by finding nothing: four demos, five variants (one demo has two).
        Assert.True(GoldenResults().Count >= 17);
    }

    [Fact]
    public void ResultsWrittenInProcessAreValid()
    {
        var demos = new[] { TestProjects.Demo(), TestProjects.AshgroveFeet() };
        foreach (var (result, context) in demos)
            AssertValid(JsonResultWriter.Write(ResultReport.Build(result, context)));

        // With the optional members: the blunder hunt on the demo with a planted blunder.
        string path = Path.Combine(TestProjects.RepoRoot, "data", "harrowfield-blunder.yaml");
        var project = ProjectReader.Read(path);
        var hunt = DataSnooping.Run(project.Network, project.Options);
        var huntContext = new ReportContext("data/harrowfield-blunder.yaml", TestProjects.RunDate, project.Units)
            { Hunt = hunt };
        string json = JsonResultWriter.Write(ResultReport.Build(hunt.Final, huntContext));
        Assert.Contains("\"blunder_hunt\"", json, StringComparison.Ordinal);
        AssertValid(json);
    }

    [Fact]
    public void TheSchemaRefusesABrokenResult()
    {
        var (result, context) = TestProjects.Demo();
        string json = JsonResultWriter.Write(ResultReport.Build(result, context));
        // A missing key, a key of another format, and a wrong type: each must be found.
        Assert.NotEmpty(Errors(Change(json, "\"generator\":", "\"program\":")));
        Assert.NotEmpty(Errors(Change(json, "\"netadjust-result/1\"", "\"netadjust-result/2\"")));
        Assert.NotEmpty(Errors(Change(json, "\"degrees_of_freedom\": 4", "\"degrees_of_freedom\": \"4\"")));
        Assert.Empty(Errors(json));
    }

    private static string Change(string json, string find, string replace)
    {
        Assert.Contains(find, json, StringComparison.Ordinal);
        return json.Replace(find, replace, StringComparison.Ordinal);
    }

    private static IReadOnlyList<string> Errors(string json)
    {
        using var doc = JsonDocument.Parse(json);
        return SchemaValidation.ResultErrors(doc.RootElement);
    }

    private static void AssertValid(string json) => Assert.Empty(Errors(json));

    /// <summary>The <c>netadjust-result/1</c> documents of a file: itself, or the solutions of a sequence.</summary>
    private static IEnumerable<JsonElement> Results(JsonElement root) =>
        root.GetProperty("format").GetString() == "netadjust-sequence/1"
            ? root.GetProperty("solutions").EnumerateArray().ToList()
            : [root];
}
