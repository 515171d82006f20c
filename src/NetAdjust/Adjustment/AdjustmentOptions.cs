using NetAdjust.Adjustment.Datum;

namespace NetAdjust.Adjustment;

/// <summary>Options of an adjustment. Immutable; use <c>with</c> to change one.</summary>
public sealed record AdjustmentOptions
{
    /// <summary>The default options.</summary>
    public static AdjustmentOptions Default { get; } = new();

    /// <summary>Largest number of Gauss-Newton iterations (1..1000). Default 20.</summary>
    public int MaxIterations { get; init; } = 20;

    /// <summary>Convergence: every coordinate correction of the last iteration is below this (m). Default 1e−6
    /// m.</summary>
    internal double LengthTolerance { get; init; } = 1e-6;

    /// <summary>Convergence: every coordinate correction of the last iteration is below this. Default 0.001 mm.
    /// </summary>
    public Units.Length CoordinateTolerance
    {
        get => Units.Length.FromMetres(LengthTolerance);
        init => LengthTolerance = value.Metres;
    }

    /// <summary>Convergence: every orientation correction of the last iteration is below this (rad). Default 1e−8 rad
    /// (0.002″).</summary>
    internal double AngleTolerance { get; init; } = 1e-8;

    /// <summary>Convergence: every orientation correction of the last iteration is below this. Default 0.002″.
    /// </summary>
    public Units.Angle OrientationTolerance
    {
        get => Units.Angle.FromRadians(AngleTolerance);
        init => AngleTolerance = value.Radians;
    }

    /// <summary>The a-priori variance factor σ0² (positive). Default 1.</summary>
    public double AprioriVarianceFactor { get; init; } = 1.0;

    /// <summary>Significance level α of the two-tailed global test, in (0, 1). Default 0.05.</summary>
    public double GlobalTestAlpha { get; init; } = 0.05;

    /// <summary>How the datum is defined: by the control (default), by minimal constraints, or by inner constraints
    /// (free network).</summary>
    public DatumDefinition Datum { get; init; } = DatumDefinition.ByControl;

    /// <summary>Options of the post-adjustment statistics (tests, reliability, ellipses); see
    /// <c>AdjustmentResult.Analysis</c> (NetAdjust.Statistics).</summary>
    public AnalysisOptions Analysis { get; init; } = AnalysisOptions.Default;

    /// <summary>The linear solver; null chooses automatically.</summary>
    public LinearAlgebra.INormalEquationsSolver? Solver { get; init; }

    /// <summary>
    /// How instrument centering enters the weights: independent (diagonal weights σ0²/σᵢ², the default) or
    /// correlated within each setup (see <see cref="Stochastic.StochasticModel"/>).
    /// </summary>
    public Stochastic.CenteringModel Centering { get; init; } = Stochastic.CenteringModel.Independent;

    /// <summary>Receives progress reports (phase and percent) during the adjustment; null for none. Called on the
    /// adjusting thread.</summary>
    public IProgress<AdjustmentProgress>? Progress { get; init; }

    /// <summary>Checks the options.</summary>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public void Validate()
    {
        if (MaxIterations is < 1 or > 1000)
            throw new InvalidInputException($"the iteration limit must be 1..1000, not {MaxIterations}");
        if (!(LengthTolerance > 0))
            throw new InvalidInputException("the convergence tolerance for lengths must be positive");
        if (!(AngleTolerance > 0))
            throw new InvalidInputException("the convergence tolerance for angles must be positive");
        if (!(AprioriVarianceFactor > 0))
            throw new InvalidInputException("the a-priori variance factor must be positive");
        if (!(GlobalTestAlpha > 0 && GlobalTestAlpha < 1))
            throw new InvalidInputException("the significance level of the global test must be between 0 and 1");
        (Analysis ?? throw new InvalidInputException("the statistics options must not be null")).Validate();
    }
}
