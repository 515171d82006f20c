using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Statistics;

/// <summary>
/// Computes the statistics of an adjustment result (docs/methods.md): redundancy numbers, w and tau tests, minimal
/// detectable biases, external reliability, absolute and relative error ellipses.
/// </summary>
/// <remarks>
/// Access pattern (kept so that a sparse factor with a selected inverse suffices): entries of Qxx are asked only for
/// unknowns that share a design row or a weight block, or that belong to one point. Everything else (external
/// reliability, relative ellipses of pairs not joined by an observation) is computed by solves with the factor.
/// </remarks>
public static class ResultAnalysis
{
    /// <summary>Design rows from which the relative precisions are computed on a second core beside the tests (below
    /// it, the thread would cost more than it saves).</summary>
    internal const int SideBySideRows = 4096;

    /// <summary>Analyses a result.</summary>
    /// <param name="result">The adjustment result.</param>
    /// <param name="options">The options; null for <see cref="AnalysisOptions.Default"/>.</param>
    /// <returns>The analysis.</returns>
    /// <exception cref="InvalidInputException">When an option is out of range or a listed pair names an unknown
    /// point.</exception>
    public static NetworkAnalysis Analyse(AdjustmentResult result, AnalysisOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(result);
        return Run(result, options,
            Environment.ProcessorCount > 1 && result.DesignRows.Count >= SideBySideRows);
    }

    /// <summary>Analyses a result, with the relative precisions computed on a second core when
    /// <paramref name="beside"/> is true (the same numbers either way).</summary>
    internal static NetworkAnalysis Run(AdjustmentResult result, AnalysisOptions? options, bool beside)
    {
        options ??= AnalysisOptions.Default;
        options.Validate();
        var st = result.Statistics;
        int dof = st.DegreesOfFreedom;
        double s0sq = st.AprioriVarianceFactor;
        var basis = options.VarianceFactor == VarianceFactorBasis.Estimated && dof > 0 && st.VarianceFactor > 0
            ? VarianceFactorBasis.Estimated : VarianceFactorBasis.Known;
        double vf = basis == VarianceFactorBasis.Estimated ? st.VarianceFactor!.Value : s0sq;
        double wCrit = CriticalValues.WTest(options.WTestAlpha);
        double delta0 = CriticalValues.NonCentrality(options.WTestAlpha, options.TypeIIError);
        double? tauCrit = CriticalValues.Tau(dof, st.Observations, options.TauAlpha, options.TauAdjustment);
        double? sigmaHat = st.Sigma0 is double sh && sh > 0 ? sh : null;

        var rows = result.DesignRows;
        var weights = result.Weights;
        int m = rows.Count, nObs = result.Observations.Count;
        var control = ControlComponents(result);
        if (nObs + control.Count != m)
            throw new InvalidOperationException(
                $"the result has {m} design rows for {nObs} observations and {control.Count} control components");
        var v = new double[m];
        for (int i = 0; i < nObs; i++) v[i] = result.Observations[i].Residual;
        for (int k = 0; k < control.Count; k++) v[nObs + k] = control[k].Residual;

        bool hasFactor = result.HasFactor;
        double Q(int i, int j) => hasFactor ? result.Cofactor(i, j) : 0.0;
        var pointCols = PointColumns(result);
        double kEllipse = CriticalValues.Ellipse(options.ConfidenceLevel, basis, Math.Max(1, dof));
        double kInterval = CriticalValues.Interval(options.ConfidenceLevel, basis, Math.Max(1, dof));
        // The relative precisions read only the factor and the coordinates: on a large network they are computed on
        // another core while this thread tests the observations and the points. Each part is computed as it would be
        // alone (same operations in the same order), so the numbers do not depend on the thread schedule.
        (List<RelativePrecision>, List<RelativeHeightPrecision>) Relatives() =>
            (Relative(result, options, vf, kEllipse, pointCols, Q),
                RelativeHeights(result, options, vf, kInterval, pointCols, Q));
        var other = beside ? Task.Run(Relatives) : null;
        try
        {
            double AQA(SparseRow a, SparseRow b)
            {
                double s = 0;
                for (int p = 0; p < a.Columns.Length; p++)
                    for (int q = 0; q < b.Columns.Length; q++)
                        s += a.Values[p] * b.Values[q] * Q(a.Columns[p], b.Columns[q]);
                return s;
            }

            var rowCofactors = result.RowCofactors;
            var red = new double[m];
            var pqp = new double[m];   // (P Qvv P)ᵢᵢ
            var pv = new double[m];    // (P v)ᵢ
            var weighted = new bool[m];
            foreach (var blk in weights.Blocks)
            {
                if (blk.Size == 1)
                {
                    // one observation: the arithmetic of the general case below without its small matrices
                    double p1 = blk[0, 0];
                    if (p1 == 0) continue;
                    int row1 = blk.Rows[0];
                    // a Qxx aᵀ as the adjuster computed it (same products in the same order as AQA), else computed
                    double aqa1 = hasFactor && rowCofactors is not null && row1 < rowCofactors.Length &&
                        !double.IsNaN(rowCofactors[row1]) ? rowCofactors[row1] : AQA(rows[row1], rows[row1]);
                    double q1 = (1 / p1) - aqa1;
                    weighted[row1] = true;
                    double r1 = 0, s1 = 0, y1 = 0;
                    r1 += q1 * p1;
                    y1 += p1 * v[row1];
                    s1 += p1 * q1 * p1;
                    red[row1] = r1; pqp[row1] = s1; pv[row1] = y1;
                    continue;
                }
                var kept = Enumerable.Range(0, blk.Size).Where(a => Enumerable.Range(0, blk.Size).Any(b => blk[a,
                    b] != 0)).ToArray();
                int k = kept.Length;
                if (k == 0) continue;
                var pk = new double[k, k];
                var qvv = new double[k, k];
                for (int a = 0; a < k; a++)
                    for (int b = 0; b < k; b++) pk[a, b] = blk[kept[a], kept[b]];
                var pinv = Invert(pk);
                for (int a = 0; a < k; a++)
                    for (int b = 0; b <= a; b++)
                    {
                        // Qvv = P⁻¹ − A Qxx Aᵀ on this block (Qxx entries of unknowns sharing one weight block only)
                        double q = pinv[a, b] - AQA(rows[blk.Rows[kept[a]]], rows[blk.Rows[kept[b]]]);
                        qvv[a, b] = q; qvv[b, a] = q;
                    }
                for (int a = 0; a < k; a++)
                {
                    int row = blk.Rows[kept[a]];
                    weighted[row] = true;
                    double r = 0, s = 0, y = 0;
                    for (int b = 0; b < k; b++)
                    {
                        r += qvv[a, b] * pk[b, a];                         // (Qvv P)ᵢᵢ
                        y += pk[a, b] * v[blk.Rows[kept[b]]];              // (P v)ᵢ
                        for (int c = 0; c < k; c++) s += pk[a, b] * qvv[b, c] * pk[c, a]; // (P Qvv P)ᵢᵢ
                    }
                    red[row] = r; pqp[row] = s; pv[row] = y;
                }
            }

            bool external = hasFactor && options.ExternalReliability switch
            {
                ExternalReliabilityMode.Always => true,
                ExternalReliabilityMode.Never => false,
                _ => result.Unknowns.Count <= options.ExternalReliabilityUnknownLimit,
            };

            ObservationTest TestRow(int row, int index, bool excluded, double sd, bool isAngle = false)
            {
                if (excluded || !weighted[row])
                {
                    // Standardised misclosure of a set-aside row: the w it would get if put back (diagonal weight).
                    // a Qxx aᵀ by a solve: a set-aside row's unknowns need not share any weighted row
                    double aqa = hasFactor ? rows[row].Dot(result.Solve(Dense(rows[row], result.Unknowns.Count))) : 0;
                    double denom = Math.Sqrt((sd * sd) + (s0sq * aqa));
                    double? wx = denom > 0 ? v[row] / denom : null;
                    return new ObservationTest(index, 0, wx, null, null, null, null, null, null, null,
                        ObservationFlag.Excluded) { IsAngle = isAngle };
                }
                double ri = Math.Clamp(red[row], 0, 1);
                if (ri < options.UncontrolledRedundancy || !(pqp[row] > 0))
                    return new ObservationTest(index, ri, null, null, null, null, null, null, null, null,
                        ObservationFlag.Uncontrolled) { IsAngle = isAngle };
                double w = pv[row] / (Math.Sqrt(s0sq) * Math.Sqrt(pqp[row]));
                double? tau = sigmaHat is double s ? pv[row] / (s * Math.Sqrt(pqp[row])) : null;
                double mdb = delta0 * Math.Sqrt(s0sq) / Math.Sqrt(pqp[row]);
                double bnr = delta0 * Math.Sqrt(Math.Max(0, 1 - ri) / ri);
                bool wPassed = Math.Abs(w) <= wCrit;
                bool? tauPassed = tau is double t && tauCrit is double tc ? Math.Abs(t) <= tc : null;
                bool rejected = basis == VarianceFactorBasis.Known ? !wPassed : tauPassed == false;
                var flag = rejected ? ObservationFlag.Rejected
                    : ri < options.WeakRedundancy ? ObservationFlag.Weak
                    : ObservationFlag.None;
                double? ext = null; string? extPoint = null;
                if (external) (ext, extPoint) = ExternalShift(result, rows, weights, row, mdb, pointCols);
                return new ObservationTest(index, ri, w, tau, mdb, ext, extPoint, bnr, wPassed, tauPassed, flag)
                    { IsAngle = isAngle };
            }

            var obsTests = new ObservationTest[nObs];
            for (int i = 0; i < nObs; i++)
            {
                var o = result.Observations[i].Input;
                obsTests[i] = TestRow(i, i, o.Excluded, o.StandardDeviation, ObservationKinds.ValueIsAngle(o.Kind));
            }
            // Weighted frame parameters are rows of the model too (after the points' control) but not control points:
            // they are tested with the rest and left out of the control list.
            int pointControl = control.Count(c => !FrameParameters.IsFrame(c.Component));
            var controlTests = new ControlTest[pointControl];
            for (int k = 0; k < pointControl; k++)
                controlTests[k] = new ControlTest(control[k].PointId, control[k].Component, control[k].Residual,
                    TestRow(nObs + k, k, false, control[k].Sd));

            var points = new PointPrecision[result.Points.Count];
            for (int p = 0; p < points.Length; p++)
            {
                var ap = result.Points[p];
                var (ie, inn, ih) = pointCols[ap.Id];
                ErrorEllipse? ell = null, conf = null;
                if (ap.SdE is not null && ap.SdN is not null)
                {
                    var e = ErrorEllipse.FromCovariance(vf * Qs(ie, ie), vf * Qs(inn, inn), vf * Qs(ie, inn));
                    ell = e; conf = e.Scaled(kEllipse);
                }
                double? sdh = ih >= 0 ? Math.Sqrt(Math.Max(0, vf * Q(ih, ih))) : ap.SdH is not null ? 0.0 : null;
                points[p] = new PointPrecision(ap.Id, ell, conf, sdh, sdh * kInterval);
            }

            double Qs(int i, int j) => i >= 0 && j >= 0 ? Q(i, j) : 0.0;

            var (relative, relativeHeights) = other is null ? Relatives() : other.GetAwaiter().GetResult();

            double sumR = 0;
            for (int i = 0; i < m; i++) if (weighted[i]) sumR += red[i];
            return new NetworkAnalysis
            {
                Options = options, Basis = basis, VarianceFactor = vf, WCritical = wCrit, Delta0 = delta0, TauCritical =
                    tauCrit,
                EllipseScale = kEllipse, IntervalScale = kInterval, ExternalReliabilityComputed = external,
                Observations = obsTests, Control = controlTests, Points = points, Relative = relative, RelativeHeights =
                    relativeHeights,
                RedundancySum = sumR,
            };
        }
        catch
        {
            // an error here surfaces as it would without the other core, once that core has finished its part
            try { other?.Wait(); }
            catch (AggregateException) { }
            throw;
        }
    }

    /// <summary>∇x = Qxx Aᵀ P eᵢ ∇ᵢ by one solve; the largest point shift (horizontal or height) and its
    /// point.</summary>
    private static (double?, string?) ExternalShift(AdjustmentResult result, IReadOnlyList<SparseRow> rows,
        WeightMatrix weights, int row,
        double bias, Dictionary<string, (int E, int N, int H)> pointCols)
    {
        var rhs = new double[result.Unknowns.Count];
        var (blk, pos) = weights.BlockOf(row);
        for (int b = 0; b < blk.Size; b++)
        {
            double pki = blk[b, pos];
            if (pki == 0) continue;
            var a = rows[blk.Rows[b]];
            for (int c = 0; c < a.Columns.Length; c++) rhs[a.Columns[c]] += a.Values[c] * pki * bias; // Aᵀ P eᵢ ∇ᵢ
        }
        var dx = result.Solve(rhs); // ∇x = N⁻¹ Aᵀ P eᵢ ∇ᵢ
        double best = 0; string? at = null;
        foreach (var ap in result.Points)
        {
            var (ie, inn, ih) = pointCols[ap.Id];
            double de = ie >= 0 ? dx[ie] : 0, dn = inn >= 0 ? dx[inn] : 0, dh = ih >= 0 ? dx[ih] : 0;
            double s = Math.Max(Math.Sqrt((de * de) + (dn * dn)), Math.Abs(dh));
            if (s > best) { best = s; at = ap.Id; }
        }
        return (best, at);
    }

    private static double[] Dense(SparseRow a, int size)
    {
        var x = new double[size];
        for (int p = 0; p < a.Columns.Length; p++) x[a.Columns[p]] += a.Values[p];
        return x;
    }

    private static Dictionary<string, (int E, int N, int H)> PointColumns(AdjustmentResult result)
    {
        var d = new Dictionary<string, (int, int, int)>(StringComparer.Ordinal);
        foreach (var p in result.Points)
            d[p.Id] = (result.Unknowns.IndexOf(p.Id, Parameter.E), result.Unknowns.IndexOf(p.Id, Parameter.N),
                result.Unknowns.IndexOf(p.Id, Parameter.H));
        return d;
    }

    private sealed record ControlComponent(string PointId, Parameter Component, double Residual, double Sd);

    /// <summary>The weighted-control rows in the adjuster's order (each point in input order: E, N, H when weighted and
    /// free).</summary>
    private static List<ControlComponent> ControlComponents(AdjustmentResult result)
    {
        var list = new List<ControlComponent>();
        foreach (var ap in result.Points)
        {
            var p = ap.Input;
            if (p.SdE is double se && result.Unknowns.IndexOf(p.Id, Parameter.E) >= 0)
                list.Add(new(p.Id, Parameter.E, ap.E!.Value - p.E!.Value, se));
            if (p.SdN is double sn && result.Unknowns.IndexOf(p.Id, Parameter.N) >= 0)
                list.Add(new(p.Id, Parameter.N, ap.N!.Value - p.N!.Value, sn));
            if (p.SdH is double sv && result.Unknowns.IndexOf(p.Id, Parameter.H) >= 0)
                list.Add(new(p.Id, Parameter.H, ap.H!.Value - p.H!.Value, sv));
        }
        if (result.Options.Datum.Mode != Adjustment.Datum.DatumMode.Control) return list; // as the adjuster did
        foreach (var (owner, par, sd) in FrameParameters.Weighted(result.Network, result.Unknowns))
            list.Add(new(owner, par, result.FrameParameters.Single(f => f.Frame == owner && f.Parameter == par).Value,
                sd));
        return list;
    }

    /// <summary>Point pairs to report, each unordered pair once, in the order first met (keyed by the points'
    /// positions in the network).</summary>
    private sealed class PointPairs(SurveyNetwork network)
    {
        private readonly Dictionary<long, int> _index = new();

        public List<(string From, string To, bool Observed)> List { get; } = [];

        public void Add(string a, string b, bool observed)
        {
            if (a != b && _index.TryAdd(Key(network.IndexOf(a), network.IndexOf(b)), List.Count))
                List.Add((a, b, observed));
        }

        /// <summary>The position in <see cref="List"/> of the pair of two points given by position, or -1.</summary>
        public int Find(int x, int y) => _index.TryGetValue(Key(x, y), out int p) ? p : -1;

        private long Key(int x, int y) =>
            x < y ? ((long)x * network.Points.Count) + y : ((long)y * network.Points.Count) + x;
    }

    /// <summary>For each pair, whether its two points have unknowns selected by <paramref name="counts"/> that meet
    /// in one weighted design row or weight block: their Qxx entries then lie on the pattern of N.</summary>
    private static bool[] OnPattern(AdjustmentResult result, PointPairs pairs, Func<Parameter, bool> counts)
    {
        var network = result.Network;
        // the owner of each counted unknown as its position in the network, -1 for other unknowns
        var unknowns = result.Unknowns.Unknowns;
        var ownerOf = new int[unknowns.Count];
        for (int j = 0; j < ownerOf.Length; j++)
            ownerOf[j] = counts(unknowns[j].Parameter) && network.Contains(unknowns[j].Owner)
                ? network.IndexOf(unknowns[j].Owner) : -1;
        var onPattern = new bool[pairs.List.Count];
        var owners = new List<int>();
        ForEachWeightedBlock(result.Weights, rows =>
        {
            owners.Clear();
            foreach (int r in rows)
                foreach (int c in result.DesignRows[r].Columns)
                    if (ownerOf[c] >= 0 && !owners.Contains(ownerOf[c])) owners.Add(ownerOf[c]);
            for (int i = 0; i < owners.Count; i++)
                for (int j = i + 1; j < owners.Count; j++)
                    if (pairs.Find(owners[i], owners[j]) is int p and >= 0) onPattern[p] = true;
        });
        return onPattern;
    }

    /// <summary>Calls <paramref name="visit"/> once per weight block with the block's rows that carry weight (a
    /// nonzero entry in the block's row); a diagonal weight matrix is read row by row, without a block object.
    /// </summary>
    private static void ForEachWeightedBlock(WeightMatrix weights, Action<List<int>> visit)
    {
        var rows = new List<int>();
        if (weights.IsDiagonal)
        {
            for (int r = 0; r < weights.RowCount; r++)
            {
                if (weights.DiagonalEntry(r) == 0) continue; // no weighted row: nothing to visit
                rows.Clear();
                rows.Add(r);
                visit(rows);
            }
            return;
        }
        foreach (var blk in weights.Blocks)
        {
            rows.Clear();
            for (int a = 0; a < blk.Size; a++)
            {
                bool any = false;
                for (int b = 0; b < blk.Size && !any; b++) any = blk[a, b] != 0;
                if (any) rows.Add(blk.Rows[a]);
            }
            visit(rows);
        }
    }

    private static List<RelativePrecision> Relative(AdjustmentResult result, AnalysisOptions options, double vf,
        double k,
        Dictionary<string, (int E, int N, int H)> cols, Func<int, int, double> q)
    {
        var network = result.Network;
        var wanted = new PointPairs(network);
        void Add(string a, string b, bool observed) => wanted.Add(a, b, observed);
        if (options.RelativeForObservedPairs)
            foreach (var o in network.Observations)
            {
                var kind = ObservationKindRegistry.Of(o);
                if (!kind.Axes.HasFlag(CoordinateAxes.Plane)) continue;
                if (kind.Instrument(o) is string station)
                    foreach (var target in kind.Targets(o)) Add(station, target, true);
                else Add(o.From, o.To, true);
            }
        foreach (var (a, b) in options.RelativePairs)
        {
            foreach (var id in new[] { a, b })
                if (!network.Contains(id))
                    throw new InvalidInputException(
                        $"the relative-precision pair {a}–{b} names point {id}, which is not in the network");
            Add(a, b, false);
        }

        // Pairs of points whose unknowns meet in one weighted design row or weight block: their Qxx block lies on the
        // pattern of N. Other pairs are computed by solves.
        var onPattern = OnPattern(result, wanted, p => p is Parameter.E or Parameter.N or Parameter.H);
        var pairs = wanted.List;

        var byId = result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        var list = new List<RelativePrecision>();
        for (int pair = 0; pair < pairs.Count; pair++)
        {
            var (from, to, observed) = pairs[pair];
            var pa = byId[from]; var pb = byId[to];
            if (pa.E is null || pa.N is null || pb.E is null || pb.N is null || pa.SdE is null || pb.SdE is null)
                continue;
            var ca = cols[from]; var cb = cols[to];
            int ia0 = ca.E, ia1 = ca.N, ib0 = cb.E, ib1 = cb.N;
            bool aHeld = ia0 < 0 && ia1 < 0;
            if (aHeld && ib0 < 0 && ib1 < 0) continue; // both held: nothing to report
            double Own(int i, int j) => i >= 0 && j >= 0 ? q(i, j) : 0.0;
            double c00 = 0, c01 = 0, c10 = 0, c11 = 0; // Qxx(from-component, to-component)
            if (onPattern[pair])
            {
                c00 = Own(ia0, ib0); c01 = Own(ia0, ib1); c10 = Own(ia1, ib0); c11 = Own(ia1, ib1);
            }
            else if (result.HasFactor && !aHeld)
            {
                int size = result.Unknowns.Count;
                if (ib0 >= 0)
                {
                    var col = result.Solve(UnitVector(ib0, size)); // column ib0 of Qxx = N⁻¹ e
                    c00 = ia0 >= 0 ? col[ia0] : 0; c10 = ia1 >= 0 ? col[ia1] : 0;
                }
                if (ib1 >= 0)
                {
                    var col = result.Solve(UnitVector(ib1, size));
                    c01 = ia0 >= 0 ? col[ia0] : 0; c11 = ia1 >= 0 ? col[ia1] : 0;
                }
            }
            // D = Q_bb + Q_aa − Q_ab − Q_ba for Δ = to − from
            double dee = Own(ib0, ib0) + Own(ia0, ia0) - (2 * c00);
            double dnn = Own(ib1, ib1) + Own(ia1, ia1) - (2 * c11);
            double den = Own(ib0, ib1) + Own(ia0, ia1) - c01 - c10;
            dee *= vf; dnn *= vf; den *= vf;
            var ell = ErrorEllipse.FromCovariance(dee, dnn, den);
            double de = pb.E.Value - pa.E.Value, dn = pb.N.Value - pa.N.Value;
            double d = Math.Sqrt((de * de) + (dn * dn));
            double sdD = 0, sdAz = 0;
            if (d > 0)
            {
                double ue = de / d, un = dn / d;
                sdD = Math.Sqrt(Math.Max(0, (ue * ue * dee) + (un * un * dnn) + (2 * ue * un * den)));
                // azimuth = atan2(ΔE, ΔN): gradient (ΔN, −ΔE)/d²
                double te = un, tn = -ue;
                sdAz = Math.Sqrt(Math.Max(0, (te * te * dee) + (tn * tn * dnn) + (2 * te * tn * den))) / d;
            }
            list.Add(new RelativePrecision(from, to, ell, ell.Scaled(k), d, sdD, sdAz, observed));
        }
        return list;
    }

    private static List<RelativeHeightPrecision> RelativeHeights(AdjustmentResult result, AnalysisOptions options,
        double vf, double k,
        Dictionary<string, (int E, int N, int H)> cols, Func<int, int, double> q)
    {
        var wanted = new PointPairs(result.Network);
        void Add(string a, string b, bool observed) => wanted.Add(a, b, observed);
        if (options.RelativeForObservedPairs)
            foreach (var o in result.Network.Observations)
                if (ObservationKindRegistry.Of(o).Axes.HasFlag(CoordinateAxes.Height)) Add(o.From, o.To, true);
        foreach (var (a, b) in options.RelativePairs) Add(a, b, false);

        var pairs = wanted.List;
        var list = new List<RelativeHeightPrecision>();
        if (pairs.Count == 0) return list;

        // Pairs joined by a weighted height-difference row have their Qxx entry on the pattern of N.
        var onPattern = OnPattern(result, wanted, p => p == Parameter.H);
        var byId = result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        for (int pair = 0; pair < pairs.Count; pair++)
        {
            var (from, to, observed) = pairs[pair];
            var pa = byId[from]; var pb = byId[to];
            if (pa.H is null || pb.H is null || pa.SdH is null || pb.SdH is null) continue;
            int ia = cols[from].H, ib = cols[to].H;
            if (ia < 0 && ib < 0) continue;
            double cross = 0;
            if (ia >= 0 && ib >= 0)
                cross = onPattern[pair] ? q(ia, ib) :
                    result.Solve(UnitVector(ib, result.Unknowns.Count))[ia];
            double var = vf * ((ia >= 0 ? q(ia, ia) : 0) + (ib >= 0 ? q(ib, ib) : 0) - (2 * cross));
            double sd = Math.Sqrt(Math.Max(0, var));
            list.Add(new RelativeHeightPrecision(from, to, pb.H.Value - pa.H.Value, sd, k * sd, observed));
        }
        return list;
    }

    private static double[] UnitVector(int i, int size)
    {
        var e = new double[size];
        e[i] = 1;
        return e;
    }

    private static double[,] Invert(double[,] a)
    {
        int n = a.GetLength(0);
        var m = (double[,])a.Clone();
        var inv = new double[n, n];
        for (int i = 0; i < n; i++) inv[i, i] = 1;
        for (int c = 0; c < n; c++)
        {
            int p = c;
            for (int r = c + 1; r < n; r++) if (Math.Abs(m[r, c]) > Math.Abs(m[p, c])) p = r;
            if (m[p, c] == 0) throw new InvalidOperationException("a weight block is singular");
            if (p != c)
                for (int j = 0; j < n; j++)
                {
                    (m[p, j], m[c, j]) = (m[c, j], m[p, j]); (inv[p, j], inv[c, j]) = (inv[c, j], inv[p, j]);
                }
            double piv = m[c, c];
            for (int j = 0; j < n; j++) { m[c, j] /= piv; inv[c, j] /= piv; }
            for (int r = 0; r < n; r++)
            {
                if (r == c || m[r, c] == 0) continue;
                double f = m[r, c];
                for (int j = 0; j < n; j++) { m[r, j] -= f * m[c, j]; inv[r, j] -= f * inv[c, j]; }
            }
        }
        return inv;
    }
}
