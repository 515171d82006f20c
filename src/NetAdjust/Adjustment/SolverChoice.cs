using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// Chooses the linear solver of an adjustment when the options leave it open: the dense solver up to
/// <see cref="DenseUnknownLimit"/> unknowns, the sparse engine above (crossover measured in docs/performance.md);
/// and hands the unknowns' positions to a solver that can order by them.
/// </summary>
internal static class SolverChoice
{
    /// <summary>The largest number of unknowns solved densely by default.</summary>
    public const int DenseUnknownLimit = 200;

    /// <summary>The solver for an adjustment.</summary>
    public static INormalEquationsSolver For(AdjustmentOptions options, SurveyNetwork network, UnknownIndex index)
    {
        var solver = options.Solver switch
        {
            null => Automatic(index.Count),
            ReusableSolver reusable => reusable.For(index.Count),
            var given => given,
        };
        return solver is IGeometryAwareSolver aware ? new WithGeometry(aware, GeometryOf(network, index)) : solver;
    }

    private static INormalEquationsSolver Automatic(int unknowns) =>
        unknowns <= DenseUnknownLimit ? new DenseNormalEquationsSolver() : new SparseNormalEquationsSolver();

    /// <summary>
    /// The options with one automatic solver shared by the adjustments of a procedure (blunder-hunt rounds, robust
    /// re-weighting, variance-component rounds), so that the sparse engine's symbolic analysis is made once for
    /// them all; the options as they are when the caller chose a solver.
    /// </summary>
    public static AdjustmentOptions Reusable(AdjustmentOptions options) =>
        options.Solver is null ? options with { Solver = new ReusableSolver() } : options;

    /// <summary>
    /// Groups the unknowns by point (E, N, H of a point; a direction set's orientation with its station) and
    /// places each group at the point's given or approximate plane position (NaN when it has none).
    /// </summary>
    public static UnknownGeometry GeometryOf(SurveyNetwork network, UnknownIndex index)
    {
        var stationOfSet = new Dictionary<string, string>(StringComparer.Ordinal);
        var stationOfGroup = new Dictionary<string, string>(StringComparer.Ordinal);
        string? lastSet = null; // the directions of a set usually follow one another: a repeat adds nothing
        foreach (var o in network.Observations)
            if (o is DirectionObservation d)
            {
                if (d.SetId != lastSet) stationOfSet.TryAdd(lastSet = d.SetId, d.Station);
            }
            else if (o is ZenithObservation { RefractionGroup: string g } z) stationOfGroup.TryAdd(g, z.From);
            else if (o is BaselineObservation { Frame: { } f } b) stationOfGroup.TryAdd("\u0001frame " + f.Id, b.From);
        var groupOf = new int[index.Count];
        var x = new double[network.Points.Count];
        var y = new double[network.Points.Count];
        for (int i = 0; i < network.Points.Count; i++)
        {
            x[i] = network.Points[i].E ?? double.NaN;
            y[i] = network.Points[i].N ?? double.NaN;
        }
        for (int j = 0; j < index.Count; j++)
        {
            var u = index.Unknowns[j];
            string owner = u.Parameter switch
            {
                Geometry.Parameter.Orientation => stationOfSet[u.Owner],
                Geometry.Parameter.Refraction => stationOfGroup[u.Owner], // placed with its group's first station
                _ when FrameParameters.IsFrame(u.Parameter) => stationOfGroup["\u0001frame " + u.Owner], // 1st baseline
                _ => u.Owner,
            };
            groupOf[j] = network.IndexOf(owner);
        }
        return new UnknownGeometry(groupOf, x, y);
    }

    private sealed class WithGeometry(IGeometryAwareSolver inner, UnknownGeometry geometry) : INormalEquationsSolver
    {
        public string Name => inner.Name;

        public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights) =>
            inner.Factorize(unknownCount, rows, weights, geometry);
    }
}

/// <summary>
/// The automatic choice of solver (dense up to <see cref="SolverChoice.DenseUnknownLimit"/> unknowns, the sparse engine
/// above), keeping one sparse solver, and with it its symbolic analysis, for every adjustment it serves.
/// </summary>
internal sealed class ReusableSolver : INormalEquationsSolver
{
    private SparseNormalEquationsSolver? _sparse;

    /// <summary>Symbolic analyses made by the shared sparse solver.</summary>
    public int SparseAnalyses => _sparse?.AnalysisCount ?? 0;

    /// <inheritdoc />
    public string Name => "automatic";

    /// <summary>The solver for an adjustment with this many unknowns.</summary>
    public INormalEquationsSolver For(int unknowns) => unknowns <= SolverChoice.DenseUnknownLimit
        ? new DenseNormalEquationsSolver() : _sparse ??= new SparseNormalEquationsSolver();

    /// <inheritdoc />
    public INormalFactor Factorize(int unknownCount, IReadOnlyList<SparseRow> rows, WeightMatrix weights) =>
        For(unknownCount).Factorize(unknownCount, rows, weights);
}
