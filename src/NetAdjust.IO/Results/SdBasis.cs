using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>
/// The variance factor at which an output gives point standard deviations and error ellipses: the one the statistics
/// use (the a-priori σ0² unless the project asks for the estimated one and there is redundancy). The result holds
/// standard deviations at the a-priori factor; <see cref="Scale"/> carries them over.
/// </summary>
/// <param name="Basis">Known (a-priori) or estimated.</param>
/// <param name="Scale">√(σ0² used / a-priori σ0²): the factor from a-priori standard deviations to this basis (1 when
/// known).</param>
internal sealed record SdBasis(VarianceFactorBasis Basis, double Scale)
{
    /// <summary>The basis of the result's statistics.</summary>
    public static SdBasis Of(AdjustmentResult r)
    {
        var a = r.Analysis;
        return a.Basis == VarianceFactorBasis.Known
            ? new SdBasis(VarianceFactorBasis.Known, 1.0)
            : new SdBasis(VarianceFactorBasis.Estimated,
                Math.Sqrt(a.VarianceFactor / r.Statistics.AprioriVarianceFactor));
    }

    /// <summary>The keyword, as in the project file and the JSON: <c>known</c> or <c>estimated</c>.</summary>
    public string Keyword => Basis == VarianceFactorBasis.Known ? "known" : "estimated";

    /// <summary>In words: "the a-priori variance factor" or "the estimated variance factor".</summary>
    public string Words =>
        Basis == VarianceFactorBasis.Known ? "the a-priori variance factor" : "the estimated variance factor";

    /// <summary>An a-priori standard deviation (m) at this basis.</summary>
    public double? Sd(double? apriori) => apriori * Scale;
}
