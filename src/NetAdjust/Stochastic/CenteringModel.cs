namespace NetAdjust.Stochastic;

/// <summary>How instrument centering errors enter the weights.</summary>
public enum CenteringModel
{
    /// <summary>Each observation's centering contribution is independent: diagonal weights σ0²/σᵢ².</summary>
    Independent,

    /// <summary>
    /// The instrument is centred once per setup, so its centering error is common to every observation of the setup:
    /// one covariance block per setup (see <see cref="StochasticModel"/>).
    /// </summary>
    Correlated,
}
