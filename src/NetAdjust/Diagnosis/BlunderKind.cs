namespace NetAdjust.Diagnosis;

/// <summary>
/// The kinds of field blunder NetAdjust can recognise. Each kind is a model of how the booked observations would be
/// biased (docs/diagnosis.md gives the bias model of each: the observations it biases, its alternative vector, its
/// free size or discrete candidates).
/// </summary>
public enum BlunderKind
{
    /// <summary>The reference: one observation biased by a free amount ∇ (Baarda's alternative).</summary>
    UnexplainedBias,

    /// <summary>A target height booked wrong: the zenith angles and slope distances to that target at one
    /// occupation; candidates are round amounts (<see cref="DiagnosisOptions.RoundHeightsMetres"/>) or a free
    /// size.</summary>
    TargetHeight,

    /// <summary>A wrong instrument height at one occupation: all its zenith angles and slope distances.</summary>
    InstrumentHeight,

    /// <summary>A distance or slope distance reduced with the wrong prism constant: a constant offset on the
    /// distances to that target at one occupation; candidates are differences of the usual constants
    /// (<see cref="DiagnosisOptions.PrismConstantsMetres"/>).</summary>
    PrismConstant,

    /// <summary>A distance booked in international feet (factor 0.3048) or US survey feet (1200/3937) in a metre
    /// project, or the reverse.</summary>
    FeetForMetres,

    /// <summary>International foot and US survey foot mixed up (factor 1.000002 or its inverse).</summary>
    SurveyFootForFoot,

    /// <summary>A direction or angle off by 180° (200 gon); a zenith angle booked as 360° − z.</summary>
    FaceMixUp,

    /// <summary>Two adjacent digits of the booked text swapped (candidates from
    /// <see cref="BlunderDiagnosis.Transpositions"/>).</summary>
    Transposition,

    /// <summary>A sighting booked to the wrong point id (candidates: other points within
    /// <see cref="DiagnosisOptions.ReachMetres"/> of the booked point).</summary>
    WrongPoint,

    /// <summary>A wrong backsight: the foresights of a set of directions rotated against its first (backsight)
    /// direction, or every angle at one occupation turned from the same backsight off by one amount.</summary>
    SetBacksight,
}
