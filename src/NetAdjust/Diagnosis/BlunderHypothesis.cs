using NetAdjust.Units;

namespace NetAdjust.Diagnosis;

/// <summary>One tested hypothesis (a blunder kind with its best candidate) for one suspect observation. Made by
/// the diagnosis only (the constructor is internal).</summary>
public sealed record BlunderHypothesis
{
    /// <summary>Made by the diagnosis.</summary>
    internal BlunderHypothesis(
        BlunderKind Kind,
        string Description,
        IReadOnlyList<int> Observations,
        int Dimension,
        double Statistic,
        double CriticalValue,
        double? Size,
        double? SizeSd,
        string? Candidate,
        double MaxAbsWAfter,
        bool FitsAfter,
        SuggestedEdit? Edit)
    {
        this.Kind = Kind;
        this.Description = Description;
        this.Observations = Observations;
        this.Dimension = Dimension;
        this.Statistic = Statistic;
        this.CriticalValue = CriticalValue;
        this.Size = Size;
        this.SizeSd = SizeSd;
        this.Candidate = Candidate;
        this.MaxAbsWAfter = MaxAbsWAfter;
        this.FitsAfter = FitsAfter;
        this.Edit = Edit;
    }

    /// <summary>The blunder kind.</summary>
    public BlunderKind Kind { get; internal init; }

    /// <summary>Plain words, e.g. <c>target height at B7 booked 0.500 m too high</c>.</summary>
    public string Description { get; internal init; }

    /// <summary>q, the number of bias parameters (1: one amount, spread over one or more observations by
    /// the alternative vector c; more than 1: a matrix C, tested by the generalised likelihood ratio
    /// statistic).</summary>
    public int Dimension { get; internal init; }

    /// <summary>q = 1: the w statistic along c, wc = cᵀPv / (σ0 √(cᵀP Qvv P c)), signed as the
    /// w-test of the analysis (v = adjusted − observed), which is Baarda's w of the observation when c is its unit
    /// vector; q &gt; 1: T_q = ŵᵀ(CᵀP Qvv P C)⁻¹ŵ / σ0² with ŵ = CᵀPv (Teunissen 2000).</summary>
    public double Statistic { get; internal init; }

    /// <summary>The critical value at α: z(1 − α/2) for |w|, χ²(1 − α; q) for T_q.</summary>
    public double CriticalValue { get; internal init; }

    /// <summary>The discrete candidate chosen, in words (<c>0.5 m</c>, <c>ft</c>, <c>B12</c>,
    /// <c>123.4657</c>), or null when the free size is used.</summary>
    public string? Candidate { get; internal init; }

    /// <summary>The largest |w| over the network after applying this correction.</summary>
    public double MaxAbsWAfter { get; internal init; }

    /// <summary>True when <see cref="MaxAbsWAfter"/> is within the critical |w| and the global test
    /// then passes.</summary>
    public bool FitsAfter { get; internal init; }

    /// <summary>The edit of the project file that applies the correction, when there is one.</summary>
    public SuggestedEdit? Edit { get; internal init; }

    /// <summary>The estimated bias ∇̂ in SI units, for the library and its writers; the public, typed view is
    /// <see cref="EstimatedSize"/>.</summary>
    internal double? Size { get; init; }

    /// <summary>Its standard deviation in SI units; the public, typed view is <see cref="EstimatedSizeSd"/>.
    /// </summary>
    internal double? SizeSd { get; init; }

    /// <summary>True when <see cref="Size"/> is an angle (a bias of the values of angular observations).</summary>
    internal bool SizeIsAngle { get; init; }

    /// <summary>The estimated bias ∇̂, typed: an angle for a bias of directions, angles, azimuths or zenith
    /// angles, a length otherwise (distances, height differences, and the wrong height of the height kinds); null
    /// for kinds with discrete candidates only.</summary>
    public Quantity? EstimatedSize => Size is double s ? Quantity.FromSi(s, SizeIsAngle) : null;

    /// <summary>The standard deviation of <see cref="EstimatedSize"/>, typed like it.</summary>
    public Quantity? EstimatedSizeSd => SizeSd is double s ? Quantity.FromSi(s, SizeIsAngle) : null;

    /// <summary>Indices of the observations the hypothesis biases.</summary>
    public IReadOnlyList<int> Observations
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>True when the statistic exceeds its critical value: the data reject the null model in favour of
    /// this alternative.</summary>
    public bool Significant => Dimension == 1 ? Math.Abs(Statistic) > CriticalValue : Statistic > CriticalValue;

    /// <summary>The p-value of the global test after the correction, P(χ²(r′) ≥ vᵀPv′/σ0²) with r′ = r − q for a
    /// free size and r′ = r for a discrete candidate; the ranking prefers the larger (docs/diagnosis.md).</summary>
    public double FitAfter { get; internal init; }
}
