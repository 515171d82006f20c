using System.Text.Json.Serialization;

namespace NetAdjust.IO.Results;

/// <summary>The <c>gnss</c> object of the JSON result (docs/output-format.md, "GNSS baselines"): lengths in metres,
/// rotations in arcseconds, the scale difference in ppm.</summary>
internal static partial class ResultJson
{
    internal sealed record Gnss(string? Frame, IEnumerable<Baseline> Baselines,
        [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
        IReadOnlyList<FrameParameter>? FrameParameters);

    internal sealed record Baseline(string Id, string From, string To, string? Group, double Scale, double Dx,
        double Dy, double Dz, Xyz Residual, Neu LocalResidual, VectorTest VectorTest,
        IEnumerable<BaselineComponentTest> Components, Neu? LocalW, Neu? LocalMdb);

    internal sealed record Xyz(double X, double Y, double Z);

    internal sealed record Neu(double? North, double? East, double? Up);

    internal sealed record VectorTest(double? Statistic, int Dimension, double? Critical, bool? Passed);

    internal sealed record BaselineComponentTest(string Component, int Index, double Redundancy, double? W,
        double? Mdb, double? ExternalReliability, string? Flag);

    internal sealed record FrameParameter(string Frame, string Parameter, double Value, double Sd);
}
