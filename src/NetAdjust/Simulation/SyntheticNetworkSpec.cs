namespace NetAdjust.Simulation;

/// <summary>What synthetic network to make.</summary>
/// <param name="Kind">Plane or level network.</param>
/// <param name="Points">The number of points (≥ 3).</param>
/// <param name="Seed">The random seed.</param>
public sealed record SyntheticNetworkSpec(SyntheticNetworkKind Kind, int Points, int Seed = 1)
{
    /// <summary>Nearest neighbours each point is joined to. Default 6 (plane) — about 9 observations per
    /// point.</summary>
    public int Neighbours { get; init; } = 6;

    /// <summary>Mean distance between neighbouring points, m. Default 300 m.</summary>
    public double Spacing { get; init; } = 300;

    /// <summary>One point in this many is held as control (at least two). Default 500.</summary>
    public int ControlEvery { get; init; } = 500;

    /// <summary>Standard deviation of the approximate coordinates' offset from the truth, m. Default 0.05 m.</summary>
    public double ApproximateOffset { get; init; } = 0.05;

    /// <summary>A title; null for a generated one.</summary>
    public string? Name { get; init; }
}
