namespace NetAdjust.Diagnosis;

/// <summary>Which blunder kinds the diagnosis tries, its test level and the candidate lists (docs/diagnosis.md).
/// Immutable.</summary>
public sealed record DiagnosisOptions
{
    /// <summary>The kinds tried; default: all. <see cref="BlunderKind.UnexplainedBias"/> is always in the list of
    /// hypotheses, enabled or not, as the reference.</summary>
    public IReadOnlySet<BlunderKind> Enabled
    {
        get;
        init => field = new HashSet<BlunderKind>(value ?? throw new ArgumentNullException(nameof(Enabled)))
            .AsReadOnly();
    } = new HashSet<BlunderKind>(Enum.GetValues<BlunderKind>()).AsReadOnly();

    /// <summary>Significance level α of the tests, in (0, 1): the w-test of one observation (the same level as the
    /// blunder hunt, 0.001 by default) and the χ² test of a group of q biases.</summary>
    public double Alpha { get; init; } = 0.001;

    /// <summary>How many observations with the largest |w| are diagnosed when no w-test fails but the global test
    /// does (≥ 0; 3 by default).</summary>
    public int WorstWhenGlobalFails { get; init; } = 3;

    /// <summary>The largest number of suspects diagnosed (≥ 1; 10 by default), largest |w| first: one large blunder
    /// makes many w-tests fail, and each suspect costs a few re-adjustments.</summary>
    public int MaxSuspects { get; init; } = 10;

    /// <summary>Round amounts (m, positive; each tried with both signs) by which an instrument or target height may
    /// have been booked wrong. Default 0.1, 0.2, 0.5, 1.0, 1.5, 2.0 m (common practice).</summary>
    public IReadOnlyList<double> RoundHeightsMetres
    {
        get;
        init => field = ReadOnlyCopies.List(value ?? throw new ArgumentNullException(nameof(RoundHeightsMetres)));
    } = ReadOnlyCopies.List([0.1, 0.2, 0.5, 1.0, 1.5, 2.0]);

    /// <summary>The usual prism constants (m); the candidates of <see cref="BlunderKind.PrismConstant"/> are the
    /// differences of any two of them, both signs. Default 0, −17.5 mm, −30 mm, −34.4 mm (common
    /// practice).</summary>
    public IReadOnlyList<double> PrismConstantsMetres
    {
        get;
        init => field = ReadOnlyCopies.List(value ?? throw new ArgumentNullException(nameof(PrismConstantsMetres)));
    } = ReadOnlyCopies.List([0.0, -0.0175, -0.030, -0.0344]);

    /// <summary>A point is a candidate of <see cref="BlunderKind.WrongPoint"/> when its plane position is within
    /// this distance (m, positive) of the booked point; default 1000 m. Height-only sightings (levelling) take
    /// every point with a height.</summary>
    public double ReachMetres { get; init; } = 1000.0;

    /// <summary>|cos| of the angle between two alternative vectors (in the metric of P Qvv P) above which the two
    /// hypotheses cannot be told apart from the data; default 0.95.</summary>
    public double ParallelCosine { get; init; } = 0.95;

    /// <summary>The defaults.</summary>
    public static DiagnosisOptions Default { get; } = new();

    /// <summary>Checks the options.</summary>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    internal void Validate()
    {
        if (!(Alpha > 0 && Alpha < 1))
            throw new InvalidInputException($"the diagnosis test level α must be between 0 and 1, not {Alpha}");
        if (WorstWhenGlobalFails < 0)
            throw new InvalidInputException("the number of worst observations to diagnose must be 0 or more");
        if (MaxSuspects < 1) throw new InvalidInputException("the diagnosis needs to diagnose at least 1 suspect");
        if (RoundHeightsMetres.Any(h => !(h > 0) || !double.IsFinite(h)))
            throw new InvalidInputException("the round height amounts must be positive numbers of metres");
        if (PrismConstantsMetres.Any(h => !double.IsFinite(h)))
            throw new InvalidInputException("the prism constants must be finite numbers of metres");
        if (!(ReachMetres > 0) || !double.IsFinite(ReachMetres))
            throw new InvalidInputException("the reach of wrong-point candidates must be a positive distance");
        if (!(ParallelCosine > 0 && ParallelCosine <= 1))
            throw new InvalidInputException("the parallel cosine must be in (0, 1]");
    }
}
