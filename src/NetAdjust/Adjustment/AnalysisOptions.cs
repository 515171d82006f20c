namespace NetAdjust.Adjustment;

/// <summary>Which variance factor the tests and confidence regions take as true.</summary>
public enum VarianceFactorBasis
{
    /// <summary>
    /// The a-priori variance factor σ0² is taken as known (the stochastic model is trusted): w-test decides,
    /// covariances are σ0² Qxx, the 95% ellipse scale is √χ²₂(0.95) = 2.4477.
    /// </summary>
    Known,

    /// <summary>
    /// The variance factor is estimated from the residuals (σ̂0² = vᵀPv / r): tau test decides, covariances are
    /// σ̂0² Qxx, the 95% ellipse scale is √(2 F(0.95; 2, r)).
    /// </summary>
    Estimated,
}

/// <summary>How the per-observation significance level of the tau test is derived from the overall level α for n
/// tests.</summary>
public enum MultipleTestAdjustment
{
    /// <summary>Šidák: α′ = 1 − (1 − α)^(1/n) (exact for independent tests). The default.</summary>
    Sidak,

    /// <summary>Bonferroni: α′ = α / n (slightly more conservative).</summary>
    Bonferroni,
}

/// <summary>When the external reliability (coordinate shifts caused by an undetected MDB) is computed: it needs one
/// solve per observation.</summary>
public enum ExternalReliabilityMode
{
    /// <summary>Computed when the network has at most <see cref="AnalysisOptions.ExternalReliabilityUnknownLimit"/>
    /// unknowns.</summary>
    Auto,

    /// <summary>Always computed.</summary>
    Always,

    /// <summary>Never computed (the cheap bias-to-noise ratio is still given).</summary>
    Never,
}

/// <summary>Options of the post-adjustment statistics. Immutable; use <c>with</c> to change one.</summary>
public sealed record AnalysisOptions
{
    /// <summary>The default options: α0 = 0.001, β = 0.20, variance factor known, 95% regions.</summary>
    public static AnalysisOptions Default { get; } = new();

    /// <summary>Significance level α0 of the two-sided w-test of one observation, in (0, 1). Default 0.001 (critical
    /// value 3.29; Baarda 1968).</summary>
    public double WTestAlpha { get; init; } = 0.001;

    /// <summary>
    /// Probability β of a Type II error (missing a bias of MDB size) in (0, 1). Default 0.20, i.e. a test power of 0.80
    /// (Baarda's β0 denotes the power); with α0 = 0.001 this gives the non-centrality δ0 = 4.13.
    /// </summary>
    public double TypeIIError { get; init; } = 0.20;

    /// <summary>Overall significance level α of the tau test over all n observations, in (0, 1). Default
    /// 0.05.</summary>
    public double TauAlpha { get; init; } = 0.05;

    /// <summary>How α is split over the n observations for the tau test. Default Šidák.</summary>
    public MultipleTestAdjustment TauAdjustment { get; init; } = MultipleTestAdjustment.Sidak;

    /// <summary>Whether the a-priori variance factor is taken as known or estimated. Default known.</summary>
    public VarianceFactorBasis VarianceFactor { get; init; } = VarianceFactorBasis.Known;

    /// <summary>Confidence level of the confidence ellipses and 1D intervals, in (0, 1). Default 0.95.</summary>
    public double ConfidenceLevel { get; init; } = 0.95;

    /// <summary>Below this redundancy number an observation is uncontrolled: no test is possible (default 0.01; MDB
    /// would exceed 41 σ).</summary>
    public double UncontrolledRedundancy { get; init; } = 0.01;

    /// <summary>Below this redundancy number an observation is flagged as weakly controlled (default 0.1; common
    /// practice).</summary>
    public double WeakRedundancy { get; init; } = 0.1;

    /// <summary>When external reliability is computed. Default <see cref="ExternalReliabilityMode.Auto"/>.</summary>
    public ExternalReliabilityMode ExternalReliability { get; init; } = ExternalReliabilityMode.Auto;

    /// <summary>In <see cref="ExternalReliabilityMode.Auto"/>, the largest number of unknowns for which it is computed.
    /// Default 1000.</summary>
    public int ExternalReliabilityUnknownLimit { get; init; } = 1000;

    /// <summary>Give relative ellipses for every pair of points joined by a horizontal observation. Default
    /// true.</summary>
    public bool RelativeForObservedPairs { get; init; } = true;

    /// <summary>Further pairs of points (ids) for relative ellipses, in the order given.</summary>
    public IReadOnlyList<(string From, string To)> RelativePairs
    {
        get;
        init => field = ReadOnlyCopies.ListOrNull(value)!; // null is refused by Validate
    } = ReadOnlyCopies.List<(string, string)>([]);

    /// <summary>Checks the options.</summary>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public void Validate()
    {
        static bool Open01(double x) => x > 0 && x < 1;
        if (!Open01(WTestAlpha))
            throw new InvalidInputException(
                "the significance level of the w-test must be between 0 and 1 (e.g. 0.001)");
        if (!Open01(TypeIIError))
            throw new InvalidInputException("the Type II error probability must be between 0 and 1 (e.g. 0.20)");
        if (!Open01(TauAlpha))
            throw new InvalidInputException(
                "the significance level of the tau test must be between 0 and 1 (e.g. 0.05)");
        if (!Open01(ConfidenceLevel))
            throw new InvalidInputException("the confidence level must be between 0 and 1 (e.g. 0.95)");
        if (!(UncontrolledRedundancy >= 0 && UncontrolledRedundancy < 1))
            throw new InvalidInputException("the redundancy threshold for uncontrolled observations must be in [0, 1)");
        if (!(WeakRedundancy >= 0 && WeakRedundancy < 1))
            throw new InvalidInputException(
                "the redundancy threshold for weakly controlled observations must be in [0, 1)");
        if (ExternalReliabilityUnknownLimit < 0)
            throw new InvalidInputException("the unknown limit for external reliability must not be negative");
        if (RelativePairs is null) throw new InvalidInputException("the list of relative pairs must not be null");
    }
}
