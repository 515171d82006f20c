using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment;

public static partial class Adjuster
{
    /// <summary>The first linearisation of a network (A, P with σ0² = 1, unknowns' geometry), for benchmarks of the
    /// linear algebra alone.</summary>
    internal static (int Unknowns, SparseRow[] Rows, WeightMatrix Weights,
        UnknownGeometry Geometry) LineariseForBenchmark(SurveyNetwork network)
    {
        var (index, state) = Setup(network);
        var control = ControlRows(network, index);
        var (_, (rows, _)) = DesignPattern.Resolve(network, index, state, control);
        var diagonal = new double[rows.Length];
        for (int i = 0; i < network.Observations.Count; i++)
            diagonal[i] = 1 / Sq(network.Observations[i].StandardDeviation);
        for (int k = 0; k < control.Count; k++) diagonal[network.Observations.Count + k] = 1 / Sq(control[k].Sd);
        return (index.Count, rows, WeightMatrix.Diagonal(diagonal), SolverChoice.GeometryOf(network, index));
    }

    /// <summary>Design patterns resolved on this thread (for the tests of their reuse).</summary>
    [ThreadStatic] internal static int PatternCount;

    /// <summary>
    /// The pattern of A, resolved once per adjustment: the unknowns an observation's equation reaches do not change
    /// between iterations, so each row's columns (in order of first appearance among its partial derivatives, held
    /// parameters left out) and the place of each partial derivative in its row are found once, by the unknowns'
    /// names; every later linearisation only computes values. Row i's <see cref="Columns"/> array is shared by all
    /// the linearisations of the adjustment (read-only).
    /// </summary>
    private sealed class DesignPattern
    {
        /// <summary>The target of a partial derivative of a held parameter (no column).</summary>
        private const int Held = -1;

        // Per observation, its partial derivatives' targets _target[_partialStart[i] .. _partialStart[i + 1]): the
        // position in the row that the derivative sets, Held, or −2 − position when the column repeats (added).
        private readonly int[] _partialStart, _target;

        // Per observation, the slots of its points and set in the state, _slots[MostSlots i ..] (_slotCount[i] of
        // them; none for a kind evaluated by names).
        private readonly int[] _slots;
        private readonly byte[] _slotCount;

        private DesignPattern(int[][] columns, int[] partialStart, int[] target, int mostPartials, int[] slots,
            byte[] slotCount)
        {
            Columns = columns;
            _partialStart = partialStart;
            _target = target;
            MostPartials = mostPartials;
            _slots = slots;
            _slotCount = slotCount;
        }

        /// <summary>The slots of observation <paramref name="row"/>'s points (and set) in the state.</summary>
        public ReadOnlySpan<int> Slots(int row) =>
            _slots.AsSpan(ObservationKindRegistry.MostSlots * row, _slotCount[row]);

        /// <summary>The columns of each row: the observations', then the control rows'.</summary>
        public int[][] Columns { get; }

        /// <summary>The largest number of partial derivatives of one observation's equation.</summary>
        public int MostPartials { get; }

        /// <summary>Resolves the pattern at the current state, and gives the linearisation there. The unknowns of
        /// a kind evaluated by slots are found through its points' and set's slots, the others' by their
        /// names.</summary>
        public static (DesignPattern Pattern, Linearisation First) Resolve(SurveyNetwork network, UnknownIndex index,
            ParameterState state, List<ControlRow> control)
        {
            LinearisationCount++;
            PatternCount++;
            int m = network.Observations.Count;
            var columns = new int[m + control.Count][];
            var rows = new SparseRow[columns.Length];
            var l = new double[rows.Length];
            var partialStart = new int[m + 1];
            var target = new List<int>(m * 5);
            var cols = new List<int>();
            var vals = new List<double>();
            int most = 0;
            const int stride = ObservationKindRegistry.MostSlots;
            var slots = new int[stride * m];
            var slotCount = new byte[m];
            var (pointColumn, setColumn) = ColumnsBySlot(index, state);
            var d = new double[8];
            for (int i = 0; i < m; i++)
            {
                var o = network.Observations[i];
                var mine = slots.AsSpan(stride * i, stride);
                int ns = ObservationKindRegistry.Slots(o, state, mine);
                slotCount[i] = (byte)ns;
                double value;
                int count;
                cols.Clear();
                vals.Clear();
                if (ns > 0)
                {
                    value = ObservationKindRegistry.EvaluateInto(o, state, mine[..ns], d, out count);
                    var by = ObservationKindRegistry.PartialsBySlot(o.Kind);
                    for (int k = 0; k < count; k++)
                    {
                        var (slot, parameter) = by[k];
                        int j = parameter == Parameter.Orientation ? setColumn[mine[slot]]
                            : pointColumn[(3 * mine[slot]) + (int)parameter];
                        Place(j, d[k]);
                    }
                }
                else
                {
                    var eq = ObservationKindRegistry.Evaluate(o, state);
                    (value, count) = (eq.Value, eq.Partials.Length);
                    foreach (var p in eq.Partials) Place(index.IndexOf(p.Owner, p.Parameter), p.Derivative);
                }
                l[i] = -ObservationKindRegistry.Difference(o.Kind, value, o.Value);
                most = Math.Max(most, count);
                partialStart[i + 1] = target.Count;
                columns[i] = cols.ToArray();
                rows[i] = new SparseRow(columns[i], vals.ToArray());
            }
            for (int k = 0; k < control.Count; k++)
            {
                var c = control[k];
                columns[m + k] = [index.IndexOf(c.PointId, c.Parameter)];
                state.TryGet(c.PointId, c.Parameter, out double current);
                rows[m + k] = new SparseRow(columns[m + k], [1.0]);
                l[m + k] = c.Given - current;
            }
            return (new DesignPattern(columns, partialStart, target.ToArray(), most, slots, slotCount),
                new Linearisation(rows, l));

            // One partial derivative into the row: a new column, added to a repeated one, or left out (held).
            void Place(int j, double derivative)
            {
                if (j < 0) { target.Add(Held); return; }
                int at = cols.IndexOf(j);
                if (at >= 0) { vals[at] += derivative; target.Add(-2 - at); }
                else { target.Add(cols.Count); cols.Add(j); vals.Add(derivative); }
            }
        }

        /// <summary>The unknown of each coordinate of each point slot (3 slot + E, N or H) and of each set slot's
        /// orientation; −1 for a held one.</summary>
        private static (int[] Points, int[] Sets) ColumnsBySlot(UnknownIndex index, ParameterState state)
        {
            var points = new int[3 * state.PointSlots];
            var sets = new int[state.SetSlots];
            Array.Fill(points, -1);
            Array.Fill(sets, -1);
            for (int j = 0; j < index.Count; j++)
            {
                var u = index.Unknowns[j];
                if (u.Parameter is Parameter.E or Parameter.N or Parameter.H
                    && state.PointSlotOrNone(u.Owner) is int p and >= 0)
                    points[(3 * p) + (int)u.Parameter] = j;
                else if (u.Parameter == Parameter.Orientation && state.SetSlotOrNone(u.Owner) is int s and >= 0)
                    sets[s] = j;
            }
            return (points, sets);
        }

        /// <summary>The values of observation <paramref name="row"/>'s row of A from its equation's partial
        /// derivatives (in the order of its partials), summed in the order the first linearisation summed
        /// them.</summary>
        /// <exception cref="InvalidOperationException">When the equation has another number of partial derivatives
        /// than when the pattern was resolved.</exception>
        public double[] Values(int row, ReadOnlySpan<double> partials)
        {
            int start = _partialStart[row];
            if (partials.Length != _partialStart[row + 1] - start)
                throw new InvalidOperationException(
                    $"The equation of observation {row + 1} changed its partial derivatives between iterations.");
            var values = Columns[row].Length == 0 ? [] : new double[Columns[row].Length];
            for (int k = 0; k < partials.Length; k++)
            {
                int t = _target[start + k];
                if (t >= 0) values[t] = partials[k];
                else if (t != Held) values[-2 - t] += partials[k];
            }
            return values;
        }
    }
}
