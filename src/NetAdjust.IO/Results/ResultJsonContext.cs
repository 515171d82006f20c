using System.Text.Json.Serialization;

namespace NetAdjust.IO.Results;

/// <summary>
/// Source-generated serialisation of the <see cref="ResultJson"/> sections: two-space indentation, snake-case keys.
/// </summary>
[JsonSourceGenerationOptions(WriteIndented = true, PropertyNamingPolicy = JsonKnownNamingPolicy.SnakeCaseLower,
    DefaultIgnoreCondition = JsonIgnoreCondition.Never, GenerationMode = JsonSourceGenerationMode.Metadata)]
[JsonSerializable(typeof(ResultJson.Particulars))]
[JsonSerializable(typeof(IReadOnlyList<ResultJson.Refraction>))]
[JsonSerializable(typeof(ResultJson.BlunderHunt))]
[JsonSerializable(typeof(ResultJson.DiagnosisSection))]
[JsonSerializable(typeof(ResultJson.VarianceComponents))]
[JsonSerializable(typeof(IReadOnlyList<ResultJson.Rounds>))]
[JsonSerializable(typeof(ResultJson.Grid))]
[JsonSerializable(typeof(ResultJson.Standards))]
[JsonSerializable(typeof(ResultJson.ConstraintTest))]
[JsonSerializable(typeof(IEnumerable<ResultJson.Discrepancy>))]
[JsonSerializable(typeof(IEnumerable<ResultJson.Shift>))]
[JsonSerializable(typeof(IEnumerable<ResultJson.Testability>))]
internal sealed partial class ResultJsonContext : JsonSerializerContext;
