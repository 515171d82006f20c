using NetAdjust.Procedures;
using NetAdjust.Statistics;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Results;

/// <summary>
/// The report model: everything the text, HTML, JSON, CSV, LandXML and GeoJSON writers show, built once from an
/// adjustment result and its run details (with the blunder hunt, robust estimation and variance components of the
/// context when run). Writers render it and do no arithmetic of their own beyond unit conversion and rounding.
/// </summary>
public sealed class ResultReport
{
    private ResultReport(AdjustmentResult result, ReportContext context, IReadOnlyList<double?>? w)
    {
        Result = result;
        Context = context;
        Basis = SdBasis.Of(result);
        W = w;
        Points = new ReportTable<PointRow>(PointRow.Columns,
            result.Points.Select(p => PointRow.Of(result, p, Basis)).ToList());
        Observations = new ReportTable<ObservationRow>(ObservationRow.Columns, ObservationRow.Of(result, W));
        Sections = [.. StatisticsReport.Build(result, context), .. RoundsReport.Sections(context),
            .. GridReport.Build(result, context), .. CheckSections.Build(context, result.Network)];
    }

    /// <summary>Builds the model.</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details (input file, run date, units, and the extra procedures run).</param>
    public static ResultReport Build(AdjustmentResult result, ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(context);
        return new ResultReport(result, context, ReportFigures.StandardisedResiduals(result));
    }

    /// <summary>
    /// Builds the model of one solution of a datum sequence: that solution's tables, led by the sections that
    /// compare the two (solutions, test of the added constraints, control discrepancies, coordinate shifts) and the
    /// coordinates of the other solution. The context's <see cref="ReportContext.Solution"/> is set to say which
    /// solution the outputs hold.
    /// </summary>
    /// <param name="sequence">The sequence result.</param>
    /// <param name="context">Run details.</param>
    /// <param name="minimal">True for the minimally-constrained solution, false for the constrained one.</param>
    public static ResultReport Build(SequenceResult sequence, ReportContext context, bool minimal)
    {
        ArgumentNullException.ThrowIfNull(sequence);
        ArgumentNullException.ThrowIfNull(context);
        var (shown, other) = minimal
            ? (sequence.Minimal, sequence.Constrained) : (sequence.Constrained, sequence.Minimal);
        var c = context with { Solution = minimal ? ReportContext.MinimalSolution : ReportContext.ConstrainedSolution };
        var leading = SequenceSections.Build(sequence, context).ToList();
        leading.Add(SequenceSections.Coordinates(ResultReport.Build(other, context),
            minimal ? ReportContext.ConstrainedSolution : ReportContext.MinimalSolution));
        return new ResultReport(shown, c, ReportFigures.StandardisedResiduals(shown)) { Leading = leading };
    }

    /// <summary>The result the model shows.</summary>
    public AdjustmentResult Result { get; }

    /// <summary>The run details.</summary>
    public ReportContext Context { get; }

    /// <summary>The one variance factor of the point table's standard deviations and ellipses.</summary>
    internal SdBasis Basis { get; }

    /// <summary>The point table: coordinates, standard deviations and ellipses at <see cref="Basis"/>, roles.</summary>
    internal ReportTable<PointRow> Points { get; }

    /// <summary>The observation table: observed and adjusted values, residuals, tests, in input order.</summary>
    internal ReportTable<ObservationRow> Observations { get; }

    /// <summary>
    /// The table sections after the observations: tests of the observations and of the weighted control, error
    /// ellipses, relative precision, and the blunder hunt, robust estimation and variance components when run.
    /// </summary>
    internal IReadOnlyList<ReportSection> Sections { get; }

    /// <summary>Sections shown before the model's own tables (the comparison of a datum sequence); empty for none.
    /// </summary>
    internal IReadOnlyList<ReportSection> Leading { get; private init; } = [];

    /// <summary>
    /// Standardised residuals w by observation index (null where an observation cannot be tested or is set aside);
    /// null when the outputs are to show none.
    /// </summary>
    internal IReadOnlyList<double?>? W { get; }

    /// <summary>The same model with other standardised residuals (null: none), e.g. for the no-w layout.</summary>
    internal ResultReport WithStandardisedResiduals(IReadOnlyList<double?>? w) =>
        new(Result, Context, w) { Leading = Leading };

    /// <summary>The critical value of the w-test.</summary>
    internal double WCritical => Result.Analysis.WCritical;

    /// <summary>
    /// The error budget an observation's standard deviation was built from, or null for a stated one. The one place
    /// where the report reads budgets, so that their home can move without touching the writers.
    /// </summary>
    internal static ErrorBudget? BudgetOf(AdjustedObservation o) => o.Budget;
}
