using System.Text.Json.Serialization;

namespace NetAdjust.IO.Results;

/// <summary>
/// Source-generated serialisation of <see cref="ResultJson"/> documents: two-space indentation, snake-case keys.
/// </summary>
[JsonSourceGenerationOptions(WriteIndented = true, PropertyNamingPolicy = JsonKnownNamingPolicy.SnakeCaseLower,
    DefaultIgnoreCondition = JsonIgnoreCondition.Never, GenerationMode = JsonSourceGenerationMode.Metadata)]
[JsonSerializable(typeof(ResultJson.Document))]
[JsonSerializable(typeof(ResultJson.Sequence))]
internal sealed partial class ResultJsonContext : JsonSerializerContext;
