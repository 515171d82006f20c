namespace NetAdjust.Network;

/// <summary>How the rounding of a rod reading to its resolution d is counted.</summary>
public enum RoundingTreatment
{
    /// <summary>As a uniform distribution: σ = d/√12 (GUM, JCGM 100:2008 §4.3.7 and §F.2.2.1).</summary>
    Uniform,

    /// <summary>As the conservative maximum error: σ = d/2.</summary>
    HalfResolution,
}
