namespace NetAdjust.Diagnosis;

/// <summary>The diagnosis of one suspect observation.</summary>
/// <param name="Observation">The suspect's index (<see cref="Adjustment.AdjustedObservation.Index"/>).</param>
/// <param name="W">Its w in the null model (signed as in the analysis).</param>
/// <param name="Ranked">The hypotheses, best first; always includes <see cref="BlunderKind.UnexplainedBias"/>.</param>
/// <param name="Indistinguishable">Pairs of named kinds that both fit after their correction and whose alternative
/// vectors are nearly parallel (|cos| above <see cref="DiagnosisOptions.ParallelCosine"/>): the data cannot tell them
/// apart.</param>
/// <param name="Explained">True when a named kind (not <see cref="BlunderKind.UnexplainedBias"/>) ranks first, is
/// significant, fits after its correction, and is not indistinguishable from another named kind with a different
/// edit.</param>
public sealed record SuspectDiagnosis(
    int Observation,
    double W,
    IReadOnlyList<BlunderHypothesis> Ranked,
    IReadOnlyList<(BlunderKind First, BlunderKind Second)> Indistinguishable,
    bool Explained)
{
    /// <summary>The hypotheses, best first.</summary>
    public IReadOnlyList<BlunderHypothesis> Ranked { get; init; } = ReadOnlyCopies.List(Ranked);

    /// <summary>Pairs of kinds the data cannot tell apart.</summary>
    public IReadOnlyList<(BlunderKind First, BlunderKind Second)> Indistinguishable { get; init; } =
        ReadOnlyCopies.List(Indistinguishable);
}
