using NetAdjust.Diagnosis;
using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.IO.Project;

/// <summary>A project as read from its file: the network, the declared units, the adjustment options, and the files
/// read.</summary>
/// <param name="Network">The network.</param>
/// <param name="Units">The declared units.</param>
/// <param name="Options">Adjustment options from the file.</param>
/// <param name="InputFiles">Full paths of every file read (the project file first), so that no output overwrites
/// one.</param>
public sealed record SurveyProject(SurveyNetwork Network, ProjectUnits Units, AdjustmentOptions Options,
    IReadOnlyList<string> InputFiles)
{
    /// <summary>The coordinate reference system the coordinates are in, as <c>EPSG:code</c> (key <c>crs</c>); null when
    /// the project declares none (local coordinates) or gives it as WKT.</summary>
    public string? Crs { get; init; }

    /// <summary>The grid system (keys <c>crs</c> and <c>grid</c>: projection or project scale, ground or grid
    /// distances, heights): null when the project has no <c>grid</c> section, which leaves the observations as they
    /// are (docs/input-format.md, "Grid and ground").</summary>
    public Geodesy.GridSystem? Grid { get; init; }

    /// <summary>The reference height H0 of the plane coordinates in metres: the height at which plane distances are
    /// true horizontal distances (docs/methods.md, "Spatial model"); given to every slope distance and zenith angle.
    /// </summary>
    public double PlaneHeight { get; init; }

    /// <summary>How <see cref="PlaneHeight"/> was chosen.</summary>
    public PlaneHeightBasis PlaneHeightBasis { get; init; }

    /// <summary>The survey's particulars (key <c>survey</c>), or null when the project gives none.</summary>
    public SurveyParticulars? Particulars { get; init; }

    /// <summary>Warnings about legal but suspicious data (docs/input-format.md, "Warnings"); empty when there
    /// are none.</summary>
    public IReadOnlyList<string> Warnings { get; init; } = [];

    /// <summary>The rounds of the setups that book them (key <c>setups[].rounds</c>), reduced before the
    /// adjustment; empty when there are none.</summary>
    public IReadOnlyList<SetupRounds> Rounds { get; init; } = [];

    /// <summary>The options of the checks before the adjustment (key <c>checks</c>).</summary>
    public Misclosures.MisclosureOptions Checks { get; init; } = Misclosures.MisclosureOptions.Default;

    /// <summary>The accuracy standards to apply (key <c>standards</c>), in the order given; empty for none.</summary>
    public IReadOnlyList<Standards.AccuracyStandard> Standards { get; init; } = [];

    /// <summary>The total stations the project specifies (key <c>instruments</c>), in file order; the candidates of
    /// a procedure recommendation.</summary>
    public IReadOnlyList<TotalStationSpecification> Instruments { get; init; } = [];

    /// <summary>The frame the GNSS baselines are given in, as the project names it (key <c>gnss.frame</c>, e.g.
    /// <c>ITRF2014 @ 2026.9</c>), for reports; null when not given.</summary>
    public string? GnssFrame { get; init; }

    /// <summary>The options of the blunder diagnosis (key <c>diagnosis</c>: the kinds not tried, the round heights
    /// and prism constants tried); <see cref="DiagnosisOptions.Default"/> without the key.</summary>
    public DiagnosisOptions Diagnosis { get; init; } = DiagnosisOptions.Default;
}
