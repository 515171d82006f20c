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
        var (_, (rows, _, _)) = DesignPattern.Resolve(network, index, state, control);
        var diagonal = new double[rows.Length];
        for (int i = 0; i < network.Observations.Count; i++)
            diagonal[i] = 1 / Sq(network.Observations[i].StandardDeviation);
        for (int k = 0; k < control.Count; k++) diagonal[network.Observations.Count + k] = 1 / Sq(control[k].Sd);
        return (index.Count, rows, WeightMatrix.Diagonal(diagonal), SolverChoice.GeometryOf(network, index));
    }

    /// <summary>Arrays of coefficients of A made on this thread (for the tests of their reuse).</summary>
    [ThreadStatic] internal static int CoefficientArrayCount;

    /// <summary>Design patterns resolved on this thread (for the tests of their reuse).</summary>
    [ThreadStatic] internal static int PatternCount;

    /// <summary>
    /// The pattern of A, resolved once per adjustment: the unknowns an observation's equation reaches do not change
    /// between iterations, so each row's columns (in order of first appearance among its partial derivatives, held
    /// parameters left out) and the place of each partial derivative in its row are found once, by the unknowns'
    /// names; every later linearisation only computes values. The columns of all rows are one array (compressed
    /// rows, read-only), shared by every linearisation of the adjustment; each linearisation writes its coefficients
    /// into one array of the same layout, so no row is an object of its own.
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

        // The columns of row i (observations, then control rows): _columns[_rowStart[i] .. _rowStart[i + 1]).
        private readonly int[] _columns, _rowStart;

        private DesignPattern(int[] columns, int[] rowStart, int[] partialStart, int[] target, int mostPartials,
            int[] slots, byte[] slotCount)
        {
            _columns = columns;
            _rowStart = rowStart;
            _partialStart = partialStart;
            _target = target;
            MostPartials = mostPartials;
            _slots = slots;
            _slotCount = slotCount;
        }

        /// <summary>The slots of observation <paramref name="row"/>'s points (and set) in the state.</summary>
        public ReadOnlySpan<int> Slots(int row) =>
            _slots.AsSpan(ObservationKindRegistry.MostSlots * row, _slotCount[row]);

        // Linearisations no longer in use (their arrays serve the next linearisation instead of new ones: a
        // million-point network would otherwise allocate about 0.6 GB of large arrays per linearisation). Rented and
        // returned by the adjusting thread only.
        private readonly Stack<Linearisation> _spare = new();

        /// <summary>Arrays for a linearisation: those of one handed back by <see cref="Return"/>, else new ones.
        /// </summary>
        public Linearisation Rent()
        {
            if (_spare.TryPop(out var spare)) return spare;
            CoefficientArrayCount++;
            return new Linearisation(new SparseRow[RowCount], new double[RowCount], new double[CoefficientCount]);
        }

        /// <summary>Hands back a linearisation that nothing uses any more; the next <see cref="Rent"/> overwrites
        /// it.</summary>
        public void Return(Linearisation linearisation) => _spare.Push(linearisation);

        /// <summary>The rows: the observations', then the control rows'.</summary>
        public int RowCount => _rowStart.Length - 1;

        /// <summary>The number of coefficients of all rows (the length of a linearisation's array of them).</summary>
        public int CoefficientCount => _columns.Length;

        /// <summary>Row <paramref name="row"/> over <paramref name="coefficients"/>, an array of
        /// <see cref="CoefficientCount"/> in this pattern's layout.</summary>
        public SparseRow Row(double[] coefficients, int row) =>
            new(_columns, coefficients, _rowStart[row], _rowStart[row + 1] - _rowStart[row]);

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
            var rowStart = new int[m + control.Count + 1];
            var l = new double[m + control.Count];
            var partialStart = new int[m + 1];
            const int stride = ObservationKindRegistry.MostSlots;
            var slots = new int[stride * m];
            var slotCount = new byte[m];
            var (pointColumn, setColumn) = ColumnsBySlot(index, state);
            // On a large network the second half of the observations is resolved on another core into lists of its
            // own (its row and partial starts counted from the half's start, shifted below): each row alone, so the
            // pattern does not depend on the schedule; a failure of the first half is the one reported, as it would
            // be one row after the other.
            int half = SideBySide.Half(m, SideBySideObservations);
            var first = new Piece(half);
            var second = half < m ? new Piece(m - half) : null;
            SideBySide.Run(() => Observations(0, half, first),
                second is null ? null : () => Observations(half, m, second));
            int firstCount = first.Columns.Count, total = firstCount + (second?.Columns.Count ?? 0);
            if (second is not null)
                for (int i = half; i < m; i++)
                {
                    rowStart[i + 1] += firstCount;
                    partialStart[i + 1] += first.Target.Count;
                }
            var columns = new int[total + control.Count];
            var coefficients = new double[total + control.Count];
            first.Columns.CopyTo(columns);
            first.Values.CopyTo(coefficients);
            second?.Columns.CopyTo(columns, firstCount);
            second?.Values.CopyTo(coefficients, firstCount);
            int[] target = [.. first.Target, .. second?.Target ?? []];
            for (int k = 0; k < control.Count; k++)
            {
                var c = control[k];
                columns[total + k] = index.IndexOf(c.PointId, c.Parameter);
                coefficients[total + k] = 1.0;
                rowStart[m + k + 1] = total + k + 1;
                state.TryGet(c.PointId, c.Parameter, out double current);
                l[m + k] = c.Given - current;
            }
            var pattern = new DesignPattern(columns, rowStart, partialStart, target,
                Math.Max(first.Most, second?.Most ?? 0), slots, slotCount);
            CoefficientArrayCount++;
            var rows = new SparseRow[l.Length];
            for (int i = 0; i < rows.Length; i++) rows[i] = pattern.Row(coefficients, i);
            return (pattern, new Linearisation(rows, l, coefficients));

            // Observations from .. to: their slots, columns, first coefficients and l, into the piece's lists.
            void Observations(int from, int to, Piece piece)
            {
                var cols = new List<int>();
                var vals = new List<double>();
                var d = new double[8];
                for (int i = from; i < to; i++)
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
                    piece.Most = Math.Max(piece.Most, count);
                    partialStart[i + 1] = piece.Target.Count;
                    piece.Columns.AddRange(cols);
                    piece.Values.AddRange(vals);
                    rowStart[i + 1] = piece.Columns.Count;
                }

                // One partial derivative into the row: a new column, added to a repeated one, or left out (held).
                void Place(int j, double derivative)
                {
                    if (j < 0) { piece.Target.Add(Held); return; }
                    int at = cols.IndexOf(j);
                    if (at >= 0) { vals[at] += derivative; piece.Target.Add(-2 - at); }
                    else { piece.Target.Add(cols.Count); cols.Add(j); vals.Add(derivative); }
                }
            }
        }

        /// <summary>The pattern of a run of observations as <see cref="Resolve"/> builds it.</summary>
        private sealed class Piece(int observations)
        {
            public List<int> Target { get; } = new(observations * 5);
            public List<int> Columns { get; } = new(observations * 5);
            public List<double> Values { get; } = new(observations * 5);
            public int Most { get; set; }
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

        /// <summary>Writes the coefficient of control row <paramref name="row"/> (one column: 1).</summary>
        public void Unit(int row, double[] coefficients) => coefficients[_rowStart[row]] = 1.0;

        /// <summary>Writes the coefficients of observation <paramref name="row"/>'s row of A into its place of
        /// <paramref name="coefficients"/> from its equation's partial derivatives (in the order of its partials),
        /// summed in the order the first linearisation summed them.</summary>
        /// <exception cref="InvalidOperationException">When the equation has another number of partial derivatives
        /// than when the pattern was resolved.</exception>
        public void Values(int row, ReadOnlySpan<double> partials, double[] coefficients)
        {
            int start = _partialStart[row];
            if (partials.Length != _partialStart[row + 1] - start)
                throw new InvalidOperationException(
                    $"The equation of observation {row + 1} changed its partial derivatives between iterations.");
            var values = coefficients.AsSpan(_rowStart[row], _rowStart[row + 1] - _rowStart[row]);
            values.Clear();
            for (int k = 0; k < partials.Length; k++)
            {
                int t = _target[start + k];
                if (t >= 0) values[t] = partials[k];
                else if (t != Held) values[-2 - t] += partials[k];
            }
        }
    }
}
