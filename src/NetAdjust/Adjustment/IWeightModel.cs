using NetAdjust.LinearAlgebra;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// Builds the weight matrix P of an adjustment from the network's stochastic model. Without one, the adjuster
/// uses the diagonal weights σ0²/σᵢ² (uncorrelated observations).
/// </summary>
public interface IWeightModel
{
    /// <summary>A short description for reports, e.g. "diagonal" or "setup centering correlated".</summary>
    string Description { get; }

    /// <summary>Builds P.</summary>
    /// <param name="network">The network; its observations are rows 0..m−1 of P.</param>
    /// <param name="diagonalWeights">The diagonal weights σ0²/σᵢ² of every row: the network's observations, then
    /// weighted-control rows (which a model must keep as they are).</param>
    /// <param name="aprioriVarianceFactor">σ0².</param>
    /// <returns>A weight matrix with <paramref name="diagonalWeights"/>.Length rows.</returns>
    /// <exception cref="InvalidInputException">When the model cannot build positive-definite weights for the network.</exception>
    WeightMatrix Build(SurveyNetwork network, IReadOnlyList<double> diagonalWeights, double aprioriVarianceFactor);
}
