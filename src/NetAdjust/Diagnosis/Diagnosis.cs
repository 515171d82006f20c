namespace NetAdjust.Diagnosis;

/// <summary>The blunder diagnosis of an adjustment: one entry per suspect observation, in order of decreasing |w|.
/// </summary>
/// <param name="Suspects">The suspects diagnosed.</param>
/// <param name="Options">The options used.</param>
public sealed record Diagnosis(IReadOnlyList<SuspectDiagnosis> Suspects, DiagnosisOptions Options)
{
    /// <summary>The suspects diagnosed.</summary>
    public IReadOnlyList<SuspectDiagnosis> Suspects { get; init; } = ReadOnlyCopies.List(Suspects);
}
