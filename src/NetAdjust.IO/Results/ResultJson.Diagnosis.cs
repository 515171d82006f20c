namespace NetAdjust.IO.Results;

/// <summary>The JSON of the blunder diagnosis (key <c>diagnosis</c>, docs/output-format.md).</summary>
internal static partial class ResultJson
{
    /// <summary>Key <c>diagnosis</c>: the w-test level and critical value, which adjustment was diagnosed
    /// (<c>adjustment</c> or <c>hunt_rounds</c>), the kinds tried, the suspects and the note that the input is
    /// never changed.</summary>
    internal sealed record DiagnosisSection(double Alpha, double Critical, string Diagnosed, IEnumerable<string> Kinds,
        IEnumerable<Suspect> Suspects, string Note);

    /// <summary>One suspect: its observation, its w, whether a named kind explains it, the hypotheses best first,
    /// the pairs of kinds this data cannot tell apart and the edit line to apply by hand (null when unexplained).
    /// </summary>
    internal sealed record Suspect(SuspectObservation Observation, double? W, bool Explained,
        IEnumerable<Hypothesis> Ranked, IEnumerable<string[]> Indistinguishable, string? SuggestedEdit);

    /// <summary>The suspect observation: its index in <c>observations</c>, kind, points, where it was read and
    /// the value's text as booked.</summary>
    internal sealed record SuspectObservation(int Index, string Kind, string? At, string From, string To,
        string? Source, string? Booked);

    /// <summary>One hypothesis: sizes in metres or arcseconds (<c>size_unit</c>).</summary>
    internal sealed record Hypothesis(string Kind, string Description, IEnumerable<int> Observations, int Dimension,
        double? Statistic, double? CriticalValue, double? Size, double? SizeSd, string SizeUnit, string? Candidate,
        double? MaxAbsWAfter, bool FitsAfter, Edit? Edit);

    /// <summary>A suggested edit of the project file and the line that states it.</summary>
    internal sealed record Edit(string? Source, string Item, string? Booked, string Suggested, string Line);
}
