using NetAdjust.IO.Project;

namespace NetAdjust.IO.Results;

/// <summary>Run details shown in reports: which input, when, and in which units.</summary>
/// <param name="InputName">The project file as the user named it.</param>
/// <param name="RunDate">The stated run date (the only date in any output; fix it for reproducible reports).</param>
/// <param name="Units">The units of the text report.</param>
public sealed record ReportContext(string InputName, DateOnly RunDate, ProjectUnits Units)
{
    /// <summary>When true, the text report lists every observation's error budget, not only the summary per group.</summary>
    public bool ObservationBudgets { get; init; }
}
