// TEMPORARY copy of the contract between the diagnosis engine and its outputs (issue 18). It is replaced by the
// engine's own files when that branch is merged; nothing here may reach main.
using NetAdjust.Adjustment;

namespace NetAdjust.Diagnosis;

/// <summary>The kinds of field blunder NetAdjust can recognise (docs/diagnosis.md).</summary>
public enum BlunderKind
{
    /// <summary>One observation biased by a free amount (Baarda's alternative).</summary>
    UnexplainedBias,

    /// <summary>A target height booked wrong.</summary>
    TargetHeight,

    /// <summary>A wrong instrument height at one occupation.</summary>
    InstrumentHeight,

    /// <summary>A distance with a wrong prism constant.</summary>
    PrismConstant,

    /// <summary>A distance booked in feet.</summary>
    FeetForMetres,

    /// <summary>International foot and US survey foot mixed up.</summary>
    SurveyFootForFoot,

    /// <summary>A direction or angle off by half a turn; a zenith booked as a full turn minus z.</summary>
    FaceMixUp,

    /// <summary>Two adjacent digits of the booked text swapped.</summary>
    Transposition,

    /// <summary>A sighting booked to the wrong point id.</summary>
    WrongPoint,

    /// <summary>A whole set of directions rotated (wrong backsight).</summary>
    SetBacksight,
}

/// <summary>Which kinds to try and their candidate lists.</summary>
public sealed record DiagnosisOptions
{
    /// <summary>The kinds tried.</summary>
    public IReadOnlySet<BlunderKind> Enabled { get; init; } = new HashSet<BlunderKind>(Enum.GetValues<BlunderKind>());

    /// <summary>The w-test level.</summary>
    public double Alpha { get; init; } = 0.001;

    /// <summary>Suspects when no w fails but the global test does.</summary>
    public int WorstWhenGlobalFails { get; init; } = 3;

    /// <summary>Round target heights tried (m).</summary>
    public IReadOnlyList<double> RoundHeightsMetres { get; init; } = [0.1, 0.2, 0.5, 1.0, 1.5, 2.0];

    /// <summary>Prism constants tried (m).</summary>
    public IReadOnlyList<double> PrismConstantsMetres { get; init; } = [0, -0.0175, -0.030, -0.0344];

    /// <summary>Reach of wrong-point candidates (m).</summary>
    public double ReachMetres { get; init; } = 50;

    /// <summary>|cos| above which two hypotheses cannot be told apart.</summary>
    public double ParallelCosine { get; init; } = 0.95;

    /// <summary>The defaults.</summary>
    public static DiagnosisOptions Default { get; } = new();
}

/// <summary>A suggested edit of the project file; NetAdjust never changes the input.</summary>
/// <param name="Source">"file:line" of the observation.</param>
/// <param name="Item">The key to change.</param>
/// <param name="Booked">The booked text.</param>
/// <param name="Suggested">The corrected text.</param>
public sealed record SuggestedEdit(string? Source, string Item, string? Booked, string Suggested);

/// <summary>One tested hypothesis for one suspect.</summary>
/// <param name="Kind">The kind.</param>
/// <param name="Description">Plain words.</param>
/// <param name="Observations">Indices of the observations it biases.</param>
/// <param name="Dimension">q.</param>
/// <param name="Statistic">w or T_q.</param>
/// <param name="CriticalValue">Its critical value.</param>
/// <param name="Size">Estimated size in SI.</param>
/// <param name="SizeSd">Its sd.</param>
/// <param name="Candidate">The discrete candidate chosen.</param>
/// <param name="MaxAbsWAfter">max |w| after the correction.</param>
/// <param name="FitsAfter">True when the network then fits.</param>
/// <param name="Edit">The suggested edit.</param>
public sealed record BlunderHypothesis(BlunderKind Kind, string Description, IReadOnlyList<int> Observations,
    int Dimension, double Statistic, double CriticalValue, double? Size, double? SizeSd, string? Candidate,
    double MaxAbsWAfter, bool FitsAfter, SuggestedEdit? Edit);

/// <summary>The diagnosis of one suspect observation.</summary>
/// <param name="Observation">The suspect's index.</param>
/// <param name="W">Its w in the null model.</param>
/// <param name="Ranked">Best first.</param>
/// <param name="Indistinguishable">Pairs whose alternative vectors are parallel.</param>
/// <param name="Explained">True when a named kind explains it.</param>
public sealed record SuspectDiagnosis(int Observation, double W, IReadOnlyList<BlunderHypothesis> Ranked,
    IReadOnlyList<(BlunderKind First, BlunderKind Second)> Indistinguishable, bool Explained);

/// <summary>The whole diagnosis.</summary>
/// <param name="Suspects">The suspects.</param>
/// <param name="Options">The options used.</param>
public sealed record Diagnosis(IReadOnlyList<SuspectDiagnosis> Suspects, DiagnosisOptions Options);

/// <summary>The diagnosis engine.</summary>
public static class BlunderDiagnosis
{
    /// <summary>Diagnoses the suspects of an adjustment.</summary>
    /// <param name="result">The result.</param>
    /// <param name="options">The options.</param>
    public static Diagnosis Diagnose(AdjustmentResult result, DiagnosisOptions? options = null) =>
        throw new NotImplementedException("the diagnosis engine is not merged yet");

    /// <summary>The transposition candidates of a booked value.</summary>
    /// <param name="bookedText">The booked text.</param>
    public static IReadOnlyList<string> Transpositions(string bookedText)
    {
        var list = new List<string>();
        for (int i = 0; i + 1 < bookedText.Length; i++)
            if (char.IsAsciiDigit(bookedText[i]) && char.IsAsciiDigit(bookedText[i + 1])
                && bookedText[i] != bookedText[i + 1])
                list.Add(string.Concat(bookedText.AsSpan(0, i), bookedText[i + 1].ToString(),
                    bookedText[i].ToString(), bookedText.AsSpan(i + 2)));
        return list;
    }
}
