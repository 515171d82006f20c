using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>A target (prism on a pole, on a tripod with tribrach, on a bipod...). Lengths in metres.</summary>
public sealed record TargetSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="centeringSd">Centering σ per axis (≥ 0), e.g. <c>Length.FromMillimetres(1)</c>.</param>
    /// <param name="heightSd">Target height measurement σ (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public TargetSpecification(string id, Length centeringSd, Length heightSd)
        : this(id, centeringSd.Metres, heightSd.Metres) { }

    /// <summary>Creates a specification from SI values (for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="centeringSd">Centering σ per axis, metres (≥ 0).</param>
    /// <param name="heightSd">Target height measurement σ, metres (≥ 0). Stored for 3D use.</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    internal TargetSpecification(string id, double centeringSd, double heightSd)
    {
        Checks.Id(id, "a target");
        Id = id;
        Checks.NonNegative(centeringSd, $"the centering error of target {id}");
        Checks.NonNegative(heightSd, $"the height measurement error of target {id}");
        CenteringSd = centeringSd;
        HeightSd = heightSd;
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>Centering σ per axis, metres (SI, for the stochastic model).</summary>
    internal double CenteringSd { get; }

    /// <summary>Height measurement σ, metres.</summary>
    internal double HeightSd { get; }

    /// <summary>Centering σ per axis.</summary>
    public Length CenteringStandardDeviation => Length.FromMetres(CenteringSd);

    /// <summary>Target height measurement σ.</summary>
    public Length HeightStandardDeviation => Length.FromMetres(HeightSd);
}
