namespace NetAdjust.Simulation;

/// <summary>Which kind of synthetic network to make.</summary>
public enum SyntheticNetworkKind
{
    /// <summary>A horizontal network: one direction set per station to its nearest neighbours, distances to
    /// them.</summary>
    Plane,

    /// <summary>A level network: height differences between nearest neighbours.</summary>
    Levels,
}
