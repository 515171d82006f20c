using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using Json.Schema;
using NetAdjust.IO.Tests.Results;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Tests.Schemas;

/// <summary>
/// Validation against the repository's JSON Schemas (docs/project.schema.json, docs/result.schema.json, draft
/// 2020-12) with JsonSchema.Net, an independent validator, and the conversion of a YAML project file to the JSON
/// instance an editor's YAML language server validates: scalars typed by the YAML 1.2 core schema.
/// </summary>
internal static partial class SchemaValidation
{
    private static readonly Lazy<JsonSchema> ProjectSchema = new(() => Load("project.schema.json"));
    private static readonly Lazy<JsonSchema> ResultSchema = new(() => Load("result.schema.json"));

    /// <summary>Path of a schema file in docs/.</summary>
    public static string SchemaPath(string name) => Path.Combine(TestProjects.RepoRoot, "docs", name);

    /// <summary>The schema's complaints about a YAML project text (empty when it is valid).</summary>
    public static IReadOnlyList<string> ProjectErrors(string yaml) => Errors(ProjectSchema.Value, YamlToJson(yaml));

    /// <summary>The schema's complaints about one <c>netadjust-result/1</c> document (empty when it is
    /// valid).</summary>
    public static IReadOnlyList<string> ResultErrors(JsonElement document) => Errors(ResultSchema.Value, document);

    private static JsonSchema Load(string name) => JsonSchema.FromText(File.ReadAllText(SchemaPath(name)));

    private static IReadOnlyList<string> Errors(JsonSchema schema, JsonElement instance)
    {
        var results = schema.Evaluate(instance, new EvaluationOptions { OutputFormat = OutputFormat.List });
        if (results.IsValid) return [];
        var errors = (results.Details ?? [])
            .Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key}: {e.Value}"))
            .ToList();
        return errors.Count > 0 ? errors : ["invalid (no detail given)"];
    }

    /// <summary>
    /// The JSON instance of a YAML document: mappings become objects, sequences arrays; a quoted scalar is a string,
    /// a plain scalar is typed as the YAML 1.2 core schema types it (null, boolean, integer, float, else string).
    /// </summary>
    public static JsonElement YamlToJson(string yaml)
    {
        var stream = new YamlStream();
        stream.Load(new StringReader(yaml));
        JsonNode? root = stream.Documents.Count == 0 ? null : Convert(stream.Documents[0].RootNode);
        return JsonSerializer.SerializeToElement(root);
    }

    private static JsonNode? Convert(YamlNode node) => node switch
    {
        YamlMappingNode m => new JsonObject(m.Children.Select(kv =>
            KeyValuePair.Create(((YamlScalarNode)kv.Key).Value ?? "", Convert(kv.Value)))),
        YamlSequenceNode s => new JsonArray(s.Children.Select(Convert).ToArray()),
        YamlScalarNode sc => Scalar(sc),
        _ => throw new NotSupportedException("YAML aliases are not used in project files"),
    };

    private static JsonNode? Scalar(YamlScalarNode s)
    {
        string v = s.Value ?? "";
        if (s.Style != ScalarStyle.Plain) return JsonValue.Create(v);
        if (NullRegex().IsMatch(v)) return null;
        if (v is "true" or "True" or "TRUE") return JsonValue.Create(true);
        if (v is "false" or "False" or "FALSE") return JsonValue.Create(false);
        if (IntRegex().IsMatch(v)) return JsonValue.Create(decimal.Parse(v, CultureInfo.InvariantCulture));
        if (FloatRegex().IsMatch(v)) return JsonValue.Create(double.Parse(v, CultureInfo.InvariantCulture));
        return JsonValue.Create(v);
    }

    // YAML 1.2 core schema, tag resolution (yaml.org/spec/1.2.2, section 10.3.2).
    [GeneratedRegex("^(|~|null|Null|NULL)$")]
    private static partial Regex NullRegex();

    [GeneratedRegex("^[-+]?[0-9]+$")]
    private static partial Regex IntRegex();

    [GeneratedRegex(@"^[-+]?(\.[0-9]+|[0-9]+(\.[0-9]*)?)([eE][-+]?[0-9]+)?$")]
    private static partial Regex FloatRegex();
}
