using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Stochastic;

namespace NetAdjust.Adjustment;

/// <summary>
/// Adjusts a network by parametric (Gauss-Markov) least squares with Gauss-Newton iterations:
/// at each iteration the observation equations are linearised at the current parameters, N Δx = AᵀP l is solved
/// (l = observed − computed), and the parameters updated, until every correction is below the tolerances.
/// </summary>
public static partial class Adjuster
{
    /// <summary>Observations from which the standard deviations of the adjusted observations are computed on two
    /// cores (below it, the thread would cost more than it saves).</summary>
    internal const int SideBySideObservations = 4096;

    /// <summary>Adjusts a network.</summary>
    /// <param name="network">The network (validated on construction).</param>
    /// <param name="options">Options; null for <see cref="AdjustmentOptions.Default"/>.</param>
    /// <returns>The result.</returns>
    /// <exception cref="InvalidInputException">When free points lack approximate coordinates or options are
    /// invalid.</exception>
    /// <exception cref="DatumDefectException">When the observations and control leave unknowns
    /// undetermined.</exception>
    /// <exception cref="NoConvergenceException">When the iteration limit is reached.</exception>
    public static AdjustmentResult Adjust(SurveyNetwork network, AdjustmentOptions? options = null)
    {
        options ??= AdjustmentOptions.Default;
        options.Validate();
        var (plan, index, state, control, n, u, solver, pattern, current, model, weights, iterations) =
            Iterations(network, options);
        network = model.Apply(network);

        // Final linearisation at the solution: residuals, covariance.
        options.Progress?.Report(new AdjustmentProgress("final factorisation and covariance", null));
        // (the σ the model filled in do not enter the linearisation, so the one at the last state still holds)
        var (finalRows, finalL, _) = current ?? Linearise(network, pattern, state, control);
        INormalFactor? finalFactor = u > 0 ? plan.Factorize(solver, finalRows, weights) : null;
        double vtpv = weights.Quadratic(finalL); // v = −l at the solution
        int dof = n - u + plan.ConditionCount;
        var stats = new AdjustmentStatistics(n, u, dof, vtpv, options.AprioriVarianceFactor, iterations,
            GlobalTest.Compute(vtpv, options.AprioriVarianceFactor, dof, options.GlobalTestAlpha));

        double s0 = options.AprioriVarianceFactor;
        var points = network.Points.Select(p => AdjustedPointOf(plan.AsUsed(p), index, state, finalFactor,
            s0)).ToArray();
        var observations = new AdjustedObservation[network.Observations.Count];
        var rowCofactors = new double[observations.Length];
        void Progress(int i)
        {
            if (options.Progress is not null && i % 65536 == 0)
                options.Progress.Report(new AdjustmentProgress("statistics of the observations",
                    100.0 * i / observations.Length));
        }
        void Observations(int from, int to, bool progress)
        {
            for (int i = from; i < to; i++)
            {
                if (progress) Progress(i);
                var o = network.Observations[i];
                double v = -finalL[i];
                double adjusted = o.Value + v;
                if (o.Kind.IsAngular()) adjusted = Units.Angle.Reduce0To2Pi(adjusted);
                double qll = finalFactor is null ? 0 : o.Excluded ? QuadraticBySolve(finalRows[i], finalFactor) :
                    Quadratic(finalRows[i], finalFactor);
                rowCofactors[i] = o.Excluded ? double.NaN : qll;
                observations[i] = new AdjustedObservation(o, adjusted, v, Math.Sqrt(Math.Max(0, s0 * qll)), i)
                {
                    Budget = model.Budgets[i],
                };
            }
        }
        // On a large network the second half of the observations is done on another core (each observation is
        // computed alone, into its own slot: the same numbers whatever the schedule); its progress is reported from
        // this thread once it is done, so the lines come in the same order as on one thread.
        int half = SideBySide.Half(observations.Length, SideBySideObservations);
        SideBySide.Run(() => Observations(0, half, progress: true), half < observations.Length
            ? () => Observations(half, observations.Length, progress: false) : null);
        for (int i = half; i < observations.Length; i++) Progress(i);
        var orientations = AdjustedOrientations(network, index, state, finalFactor, s0);

        return new AdjustmentResult(network, options with { Datum = plan.Resolved }, index, finalFactor, points,
            observations, orientations, stats,
            solver.Name, finalRows, weights)
        {
            RowCofactors = finalFactor is null ? null : rowCofactors,
            Refractions = AdjustedRefractions(index, state, finalFactor, s0),
            FrameParameters = FrameParameters.Adjusted(index, state, finalFactor, s0),
        };
    }

    /// <summary>The adjustment up to the solution: the datum plan, the Gauss-Newton iterations and the rounds of the
    /// stochastic model, as <see cref="Adjust"/> runs them (no covariance, no statistics).</summary>
    private static Solution Iterations(SurveyNetwork network, AdjustmentOptions options)
    {
        var plan = DatumPlan.Create(network, options.Datum);
        var (index, state) = (plan.Index, plan.State);
        CoordinateCheck.CheckTolerance(state, network, options.LengthTolerance);
        var control = plan.UsesControl ? ControlRows(network, index) : [];
        int n = network.Observations.Count + control.Count;
        int u = index.Count;
        var solver = SolverChoice.For(options, network, index);
        // The columns of every row are resolved once, with the first linearisation.
        var (pattern, first) = DesignPattern.Resolve(network, index, state, control);

        // The weights come from the stochastic model at the current coordinates (sight lengths and centering
        // sensitivities); once converged it is evaluated again at the adjusted coordinates, and while it changes the
        // iterations continue with the new weights.
        var model = StochasticModel.Build(network, state, options.Centering, options.AprioriVarianceFactor);
        var weights = Weights(network, model, control, options.AprioriVarianceFactor);
        n -= network.Observations.Count(o => o.Excluded); // set aside: no weight, no redundancy

        int iterations = 0;
        // The linearisation at the current state, when the step control has made it (reused, not repeated).
        Linearisation? current = first;
        for (int round = 1; ; round++)
        {
            if (u > 0)
                iterations += Iterate(network, options, plan, solver, pattern, control, weights, iterations,
                    ref current);
            // (a model that no coordinate enters is the same at the new coordinates)
            var next = model.DependsOnCoordinates
                ? StochasticModel.Build(network, state, options.Centering, options.AprioriVarianceFactor) : model;
            if (u == 0 || ReferenceEquals(next, model) || next.LargestChange(model) <= StochasticTolerance)
            {
                model = next;
                break;
            }
            if (round == MaxStochasticRounds)
                throw new NoConvergenceException($"The weights did not settle in {MaxStochasticRounds} rounds: the " +
                    "sight lengths taken from the coordinates keep changing. Check the approximate coordinates and " +
                    "the observations.");
            model = next;
            weights = Weights(network, model, control, options.AprioriVarianceFactor);
        }
        return new Solution(plan, index, state, control, n, u, solver, pattern, current, model, weights, iterations);
    }

    /// <summary>What <see cref="Iterations"/> leaves for the rest of <see cref="Adjust"/>.</summary>
    private sealed record Solution(DatumPlan Plan, UnknownIndex Index, ParameterState State, List<ControlRow> Control,
        int N, int U, INormalEquationsSolver Solver, DesignPattern Pattern, Linearisation? Current,
        StochasticModel Model, WeightMatrix Weights, int Iterations);

    /// <summary>
    /// The adjusted easting, northing and height of every point with plane coordinates (the height the given one where
    /// the adjustment has none), as <see cref="Adjust"/> would give them, from the iterations alone: no covariance, no
    /// statistics (the preliminary adjustments of the grid reduction need only the positions).
    /// </summary>
    /// <exception cref="InvalidInputException">As <see cref="Adjust"/>.</exception>
    /// <exception cref="DatumDefectException">As <see cref="Adjust"/>.</exception>
    /// <exception cref="NoConvergenceException">As <see cref="Adjust"/>.</exception>
    internal static Dictionary<string, (double E, double N, double? H)> AdjustedPositions(SurveyNetwork network,
        AdjustmentOptions options)
    {
        options.Validate();
        var solution = Iterations(network, options);
        var (plan, state) = (solution.Plan, solution.State);
        var positions = new Dictionary<string, (double E, double N, double? H)>(StringComparer.Ordinal);
        foreach (var given in network.Points)
        {
            // the values AdjustedPointOf gives: the state's, else the point's as the datum plan uses it
            var p = plan.AsUsed(given);
            double? e = state.TryGet(p.Id, Parameter.E, out double ve) ? ve : p.E;
            double? no = state.TryGet(p.Id, Parameter.N, out double vn) ? vn : p.N;
            double? h = state.TryGet(p.Id, Parameter.H, out double vh) ? vh : p.H;
            if (e is double x && no is double y) positions[p.Id] = (x, y, h ?? p.H);
        }
        return positions;
    }

    private static double Sq(double x) => x * x;

    /// <summary>One orientation per distinct (set, station) of the directions, in order of first appearance; a set
    /// wholly set aside has no orientation unknown and is left out.</summary>
    private static AdjustedOrientation[] AdjustedOrientations(SurveyNetwork network, UnknownIndex index,
        ParameterState state, INormalFactor? f, double s0)
    {
        var seen = new HashSet<(string, string)>();
        var list = new List<AdjustedOrientation>();
        string? lastSet = null, lastStation = null;
        foreach (var o in network.Observations)
        {
            if (o is not DirectionObservation d) continue;
            // the directions of a set usually follow one another: skip the set look-up for a repeat of the last one
            if (d.SetId == lastSet && d.Station == lastStation) continue;
            (lastSet, lastStation) = (d.SetId, d.Station);
            if (!seen.Add((d.SetId, d.Station))) continue;
            int j = index.IndexOf(d.SetId, Parameter.Orientation);
            if (j < 0) continue;
            double sd = f is null ? 0 : Math.Sqrt(Math.Max(0, s0 * f.InverseEntry(j, j)));
            list.Add(new AdjustedOrientation(d.SetId, d.Station, Units.Angle.Reduce0To2Pi(state.Orientation(d.SetId)),
                sd));
        }
        return list.ToArray();
    }

    /// <summary>The largest correction to an estimated refraction coefficient that counts as converged: it moves a
    /// zenith angle over 1 km by 8e-11 rad.</summary>
    private const double RefractionTolerance = 1e-6;

    private static AdjustedRefraction[] AdjustedRefractions(UnknownIndex index, ParameterState state,
        INormalFactor? f, double s0) =>
        Enumerable.Range(0, index.Count).Where(j => index.Unknowns[j].Parameter == Parameter.Refraction)
            .Select(j => new AdjustedRefraction(index.Unknowns[j].Owner, state.Get(index.Unknowns[j]),
                f is null ? 0 : Math.Sqrt(Math.Max(0, s0 * f.InverseEntry(j, j))))).ToArray();

    /// <summary>Largest relative change of the weights between rounds that counts as settled.</summary>
    private const double StochasticTolerance = 1e-12;

    /// <summary>Rounds of re-weighting at the adjusted coordinates before giving up.</summary>
    private const int MaxStochasticRounds = 20;

    /// <summary>P: the stochastic model's weights; weighted control rows after the observations; set-aside rows zero.
    /// </summary>
    private static WeightMatrix Weights(SurveyNetwork network, StochasticModel model, List<ControlRow> control,
        double s0)
    {
        int m = network.Observations.Count, n = m + control.Count;
        var diagonal = new double[n];
        for (int i = 0; i < m; i++) diagonal[i] = s0 / Sq(model.StandardDeviations[i]);
        for (int k = 0; k < control.Count; k++) diagonal[m + k] = s0 / Sq(control[k].Sd);
        var excluded = Enumerable.Range(0, m).Where(i => network.Observations[i].Excluded).ToArray();
        if (model.Blocks.Count == 0) return WeightMatrix.Diagonal(diagonal).Excluding(excluded);
        var blocks = new List<WeightBlock>();
        var inBlock = new bool[n];
        foreach (var b in model.Blocks)
        {
            blocks.Add(new WeightBlock(b.Rows.ToArray(), b.Weights.ToArray()));
            foreach (int r in b.Rows) inBlock[r] = true;
        }
        for (int i = 0; i < n; i++)
            if (!inBlock[i]) blocks.Add(new WeightBlock([i], [diagonal[i]]));
        blocks.Sort((x, y) => x.Rows[0].CompareTo(y.Rows[0]));
        return WeightMatrix.FromBlocks(n, blocks).Excluding(excluded);
    }

    /// <summary>Gauss-Newton iterations with fixed weights until every correction is below the tolerances.</summary>
    /// <returns>The number of iterations made. <c>current</c>, the linearisation at the current state when known, is
    /// used and then replaced by the one the step control made at the state it leaves (or null).</returns>
    private static int Iterate(SurveyNetwork network, AdjustmentOptions options, DatumPlan plan,
        INormalEquationsSolver solver, DesignPattern pattern, List<ControlRow> control, WeightMatrix weights,
        int before, ref Linearisation? current)
    {
        var (index, state) = (plan.Index, plan.State);
        int u = index.Count, iterations = 0;
        bool converged = false;
        double[] lastDx = [];
        while (!converged)
        {
            if (before + iterations == options.MaxIterations)
                throw new NoConvergenceException(NoConvergenceMessage(options, index, lastDx));
            iterations++;
            options.Progress?.Report(new AdjustmentProgress($"Gauss-Newton iteration {before + iterations}", null));
            var linearisation = current ?? Linearise(network, pattern, state, control);
            var (rows, l, _) = linearisation;
            current = null;
            var factor = plan.Factorize(solver, rows, weights);
            var pl = weights.Multiply(l);
            var rhs = new double[u];
            for (int i = 0; i < rows.Length; i++)
            {
                var r = rows[i];
                for (int k = 0; k < r.Columns.Length; k++) rhs[r.Columns[k]] += r.Values[k] * pl[i]; // AᵀP l
            }
            lastDx = plan.Step(factor, rhs);
            double vtpv = weights.Quadratic(l);
            // the iteration's factor is not used after its step: its storage serves the next factorisation, and the
            // linearisation it was made from (which only a factor of our own may still hold) serves the next one
            if ((factor as IRecyclableFactor)?.Recycle() == true) pattern.Return(linearisation);
            converged = true;
            for (int j = 0; j < u; j++)
            {
                if (!double.IsFinite(lastDx[j]))
                    throw new NoConvergenceException(
                        $"The adjustment diverged: the correction to the {index.Unknowns[j].Describe()} is not a " +
                            $"finite number.");
                double tol = index.Unknowns[j].Parameter switch
                {
                    Parameter.Orientation => options.AngleTolerance,
                    Parameter.Refraction => RefractionTolerance,
                    Parameter.FrameRotationX or Parameter.FrameRotationY or Parameter.FrameRotationZ
                        or Parameter.FrameScale => FrameParameters.Tolerance,
                    _ => options.LengthTolerance,
                };
                if (Math.Abs(lastDx[j]) >= tol) converged = false;
            }
            // Step control: halve the step while vᵀPv grows (see StepControl). Its last trial is linearised at the
            // state it keeps unless it halved once more after that trial; then the next iteration starts from it.
            Linearisation? trial = null;
            int trials = 0;
            double lambda = StepControl.Apply(state, index, lastDx, vtpv, () =>
            {
                trials++;
                if (trial is { } dropped) pattern.Return(dropped); // a shorter step replaces the last trial
                trial = Linearise(network, pattern, state, control);
                return weights.Quadratic(trial.Value.L);
            });
            if (lambda == Math.Pow(0.5, trials - 1)) current = trial;
            else if (trial is { } unused) pattern.Return(unused);
            // A shortened step (λ < 1) does not by itself stop convergence: when every correction is already below
            // its tolerance the state is within the tolerances of the solution whatever λ, and a step that small is
            // halved by rounding alone (an earth-centred baseline, a difference of coordinates near 6.4e6 m, moves by
            // an ulp of 1e-9 m and vᵀPv by more than the step control's 1e-9 relative margin, at every trial).
        }
        return iterations;
    }

    /// <summary>a Qxx aᵀ for one design row.</summary>
    internal static double Quadratic(SparseRow a, INormalFactor f)
    {
        // the sparse factor sums the same products in the same order, locating each pair of unknowns once
        if (f is LinearAlgebra.Sparse.SparseCholeskyFactor sparse) return sparse.QuadraticForm(a.Columns, a.Values);
        double s = 0;
        for (int p = 0; p < a.Columns.Length; p++)
            for (int q = 0; q < a.Columns.Length; q++)
                s += a.Values[p] * a.Values[q] * f.InverseEntry(a.Columns[p], a.Columns[q]);
        return s;
    }

    /// <summary>a Qxx aᵀ by one solve, for a row whose unknowns need not lie on the pattern of N (a set-aside
    /// observation).</summary>
    internal static double QuadraticBySolve(SparseRow a, INormalFactor f)
    {
        var rhs = new double[f.Size];
        for (int p = 0; p < a.Columns.Length; p++) rhs[a.Columns[p]] += a.Values[p];
        return a.Dot(f.Solve(rhs)); // a (N⁻¹ aᵀ)
    }

    private static string NoConvergenceMessage(AdjustmentOptions options, UnknownIndex index, double[] dx)
    {
        var worst = Enumerable.Range(0, dx.Length)
            .Where(j => index.Unknowns[j].Parameter is Parameter.E or Parameter.N or Parameter.H)
            .OrderByDescending(j => Math.Abs(dx[j])).Take(3)
            .Select(j =>
                $"{index.Unknowns[j].Describe()} " +
                $"({dx[j].ToString("G4", System.Globalization.CultureInfo.InvariantCulture)} m)");
        return $"The adjustment did not converge in {options.MaxIterations} iterations. Largest last corrections: " +
            $"{string.Join(", ", worst)}. " +
               "Check the approximate coordinates of those points and the observations that reach them.";
    }

    private sealed record ControlRow(string PointId, Parameter Parameter, double Given, double Sd);

    private static List<ControlRow> ControlRows(SurveyNetwork network, UnknownIndex index)
    {
        var rows = new List<ControlRow>();
        foreach (var p in network.Points)
        {
            if (p.SdE is double se && index.IndexOf(p.Id, Parameter.E) >= 0)
                rows.Add(new(p.Id, Parameter.E, p.E!.Value, se));
            if (p.SdN is double sn && index.IndexOf(p.Id, Parameter.N) >= 0)
                rows.Add(new(p.Id, Parameter.N, p.N!.Value, sn));
            if (p.SdH is double sh && index.IndexOf(p.Id, Parameter.H) >= 0)
                rows.Add(new(p.Id, Parameter.H, p.H!.Value, sh));
        }
        // Frame parameters with a-priori standard deviations: direct observations of zero, after the points.
        foreach (var (owner, par, sd) in FrameParameters.Weighted(network, index))
            rows.Add(new(owner, par, 0.0, sd));
        return rows;
    }

    /// <summary>Rows of A and misclosures l = observed − computed at one state; the rows are views into
    /// <paramref name="Coefficients"/>.</summary>
    private readonly record struct Linearisation(SparseRow[] Rows, double[] L, double[] Coefficients);

    /// <summary>Linearisations made on this thread (for the tests of their reuse).</summary>
    [ThreadStatic] internal static int LinearisationCount;

    /// <summary>Rows of A and misclosures l = observed − computed at the current state, on the pattern resolved
    /// once (<see cref="DesignPattern"/>): only the values are computed, with no lookup of unknowns.</summary>
    private static Linearisation Linearise(SurveyNetwork network, DesignPattern pattern, ParameterState state,
        List<ControlRow> control)
    {
        LinearisationCount++;
        int m = network.Observations.Count;
        // one array of coefficients for all rows, in the pattern's layout (no array per row); the arrays of a
        // linearisation no longer in use when there is one (every value is written again)
        var (rows, l, coefficients) = pattern.Rent();
        void Rows(int from, int to)
        {
            Span<double> d = pattern.MostPartials <= 64 ? stackalloc double[pattern.MostPartials]
                : new double[pattern.MostPartials];
            for (int i = from; i < to; i++)
            {
                var o = network.Observations[i];
                double value = ObservationKindRegistry.EvaluateInto(o, state, pattern.Slots(i), d, out int count);
                l[i] = -ObservationKindRegistry.Difference(o.Kind, value, o.Value);
                pattern.Values(i, d[..count], coefficients);
                rows[i] = pattern.Row(coefficients, i);
            }
        }
        // On a large network the second half of the rows is evaluated on another core: each row alone, into its own
        // slot (the same numbers whatever the schedule); a failure of the first half is the one reported, as it
        // would be one row after the other.
        int half = SideBySide.Half(m, SideBySideObservations);
        SideBySide.Run(() => Rows(0, half), half < m ? () => Rows(half, m) : null);
        for (int k = 0; k < control.Count; k++)
        {
            var c = control[k];
            state.TryGet(c.PointId, c.Parameter, out double current);
            pattern.Unit(m + k, coefficients);
            rows[m + k] = pattern.Row(coefficients, m + k);
            l[m + k] = c.Given - current;
        }
        return new Linearisation(rows, l, coefficients);
    }

    /// <summary>Unknowns and start values with the datum by the control (datum check and approximate coordinates
    /// included).</summary>
    private static (UnknownIndex, ParameterState) Setup(SurveyNetwork network)
    {
        var plan = DatumPlan.Create(network, DatumDefinition.ByControl);
        return (plan.Index, plan.State);
    }

    private static AdjustedPoint AdjustedPointOf(Point p, UnknownIndex index, ParameterState state, INormalFactor? f,
        double s0)
    {
        double? Value(Parameter par, double? given) => state.TryGet(p.Id, par, out double v) ? v : given;
        int ie = index.IndexOf(p.Id, Parameter.E), inn = index.IndexOf(p.Id, Parameter.N), ih =
            index.IndexOf(p.Id, Parameter.H);
        double? Sd(int i, bool inAdjustment) => i >= 0 &&
            f is not null ? Math.Sqrt(Math.Max(0, s0 * f.InverseEntry(i, i))) : inAdjustment ? 0.0 : null;
        // A point reached only by set-aside observations is no unknown and no control: it gets no standard deviation.
        bool inPlane = state.TryGet(p.Id, Parameter.E, out _) && (ie >= 0 || inn >= 0 || p.IsFixed(Fixity.E)
            || p.IsFixed(Fixity.N));
        bool inHeight = state.TryGet(p.Id, Parameter.H, out _) && (ih >= 0 || p.IsFixed(Fixity.H));
        double? cov = ie >= 0 && inn >= 0 && f is not null ? s0 * f.InverseEntry(ie, inn) : inPlane ? 0.0 : null;
        return new AdjustedPoint(p, Value(Parameter.E, p.E), Value(Parameter.N, p.N), Value(Parameter.H, p.H),
            Sd(ie, inPlane), Sd(inn, inPlane), Sd(ih, inHeight), cov);
    }
}
