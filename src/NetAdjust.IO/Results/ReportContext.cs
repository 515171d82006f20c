using NetAdjust.IO.Project;
using NetAdjust.Procedures;

namespace NetAdjust.IO.Results;

/// <summary>Run details shown in reports: which input, when, and in which units.</summary>
/// <param name="InputName">The project file as the user named it.</param>
/// <param name="RunDate">The stated run date (the only date in any output; fix it for reproducible reports).</param>
/// <param name="Units">The units of the text report.</param>
public sealed record ReportContext(string InputName, DateOnly RunDate, ProjectUnits Units)
{
    /// <summary>When true, the text report lists every observation's error budget, not only the summary per
    /// group.</summary>
    public bool ObservationBudgets { get; init; }

    /// <summary>The project's coordinate reference system (<c>EPSG:code</c>), or null for local coordinates.</summary>
    public string? Crs { get; init; }

    /// <summary>The reduction of the observations to the grid (docs/methods.md, "Grid and ground"), or null when the
    /// project declares no grid system.</summary>
    public GridReductionResult? Grid { get; init; }

    /// <summary>The reference height H0 of the plane coordinates in metres (<see cref="SurveyProject.PlaneHeight"/>),
    /// stated in the header's grid line; null when the report does not state it (no slope distances or zenith
    /// angles).</summary>
    public double? PlaneHeight { get; init; }

    /// <summary>How <see cref="PlaneHeight"/> was chosen (<see cref="SurveyProject.PlaneHeightBasis"/>).</summary>
    public PlaneHeightBasis PlaneHeightBasis { get; init; }

    /// <summary>Warnings about legal but suspicious data (<see cref="Project.SurveyProject.Warnings"/>); empty
    /// for none.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>The survey's particulars (<see cref="SurveyProject.Particulars"/>), or null when none are given.
    /// </summary>
    public SurveyParticulars? Particulars { get; init; }

    /// <summary>The frame of the GNSS baselines as the project names it (<see cref="SurveyProject.GnssFrame"/>), or
    /// null.</summary>
    public string? GnssFrame { get; init; }

    /// <summary>The rounds of the project, reduced before the adjustment (<see cref="SurveyProject.Rounds"/>);
    /// empty for none.</summary>
    public IReadOnlyList<SetupRounds> Rounds { get; init; } = [];

    /// <summary>The words for the constrained solution of a datum sequence.</summary>
    public const string ConstrainedSolution = "constrained";

    /// <summary>The words for the minimally-constrained solution of a datum sequence.</summary>
    public const string MinimalSolution = "minimally constrained";

    /// <summary>
    /// Which solution of a datum sequence the outputs hold (<see cref="ConstrainedSolution"/> or
    /// <see cref="MinimalSolution"/>), named in every output; null outside a sequence.
    /// </summary>
    public string? Solution { get; init; }

    /// <summary>The blunder hunt that produced the result, when one was run (its log is reported).</summary>
    public BlunderHunt? Hunt { get; init; }

    /// <summary>The blunder diagnosis (docs/diagnosis.md), when one was run: of the reported adjustment, or, when
    /// <see cref="Hunt"/> set observations aside, of each of them in the round it was set aside (the outputs say
    /// which); indices are those of the observation list.</summary>
    public global::NetAdjust.Diagnosis.Diagnosis? Diagnosis { get; init; }

    /// <summary>The robust estimation run beside the result, when one was run.</summary>
    public RobustEstimate? Robust { get; init; }

    /// <summary>The variance component estimation run beside the result, when one was run.</summary>
    public VarianceComponentEstimate? Components { get; init; }

    /// <summary>The checks before the adjustment (level closures, traverses), when run; reported when they found
    /// something.</summary>
    public Misclosures.MisclosureReport? Misclosures { get; init; }

    /// <summary>The accuracy standards applied to the result, when any were.</summary>
    public Standards.StandardsReport? Standards { get; init; }
}
