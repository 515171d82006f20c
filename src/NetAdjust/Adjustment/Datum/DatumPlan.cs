using NetAdjust.Adjustment.Approximation;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment;

/// <summary>
/// Prepares one adjustment's unknowns and datum: checks the datum (<see cref="DatumDiagnosis"/>), computes
/// approximate coordinates (<see cref="ApproximateCoordinates"/>), numbers the unknowns, and, for minimal or
/// inner constraints, supplies the null-space basis G, the datum conditions Bᵀx = c and the held unknowns of
/// the internal minimal-constraint solve (<see cref="DatumFactor"/>).
/// </summary>
internal sealed class DatumPlan
{
    private readonly List<DatumDefect> _defects = [];
    private readonly int[] _held = [];
    private readonly string? _p0, _p1, _hp;
    private readonly HashSet<string>? _subset;
    private readonly HashSet<string> _heldPoints = [];
    private readonly List<string> _planePoints;
    private readonly Dictionary<string, double> _e0, _n0, _h0;

    public DatumDefinition Definition { get; }

    public UnknownIndex Index { get; }

    public ParameterState State { get; }

    /// <summary>True when control points are held and weighted as given (datum by control).</summary>
    public bool UsesControl => Definition.Mode == DatumMode.Control;

    /// <summary>The number of datum conditions d (the datum defect removed by minimal or inner constraints).</summary>
    public int ConditionCount => _defects.Count;

    private DatumPlan(SurveyNetwork network, DatumDefinition definition, UnknownIndex index, ParameterState state,
        List<string> planePoints, List<string> heightPoints, Dictionary<string, double> e0, Dictionary<string, double> n0, Dictionary<string, double> h0,
        Selection sel)
    {
        Definition = definition; Index = index; State = state;
        _planePoints = planePoints; _e0 = e0; _n0 = n0; _h0 = h0;
        if (UsesControl) return;
        _defects = sel.Defects;
        (_p0, _p1, _hp, _subset, FullHold, _heldPoints) = (sel.P0, sel.P1, sel.Hp, sel.Subset, sel.FullHold, sel.HeldPoints);

        // Held unknowns of the internal solve: the translation at p0, rotation and scale at p1, height at hp.
        var held = new List<int>();
        foreach (var d in _defects)
        {
            switch (d)
            {
                case DatumDefect.East: held.Add(index.IndexOf(_p0!, Parameter.E)); break;
                case DatumDefect.North: held.Add(index.IndexOf(_p0!, Parameter.N)); break;
                case DatumDefect.Rotation:
                    // Rotation about p0 moves p1 by δ(ΔN, −ΔE): hold the larger component.
                    held.Add(index.IndexOf(_p1!, Math.Abs(n0[_p1!] - n0[_p0!]) >= Math.Abs(e0[_p1!] - e0[_p0!]) ? Parameter.E : Parameter.N));
                    break;
                case DatumDefect.Scale:
                    var other = _defects.Contains(DatumDefect.Rotation)
                        ? (index.IndexOf(_p1!, Parameter.E) == held[^1] ? Parameter.N : Parameter.E)
                        : (Math.Abs(e0[_p1!] - e0[_p0!]) >= Math.Abs(n0[_p1!] - n0[_p0!]) ? Parameter.E : Parameter.N);
                    held.Add(index.IndexOf(_p1!, other));
                    break;
                case DatumDefect.Height: held.Add(index.IndexOf(_hp!, Parameter.H)); break;
            }
        }
        _held = held.ToArray();
    }

    private static double Sq(double x) => x * x;

    /// <summary>The datum points chosen before the unknowns are numbered.</summary>
    private sealed record Selection(List<DatumDefect> Defects, string? P0, string? P1, string? Hp, HashSet<string>? Subset, bool FullHold, HashSet<string> HeldPoints);

    /// <summary>
    /// True when minimal constraints hold p0 and p1 in full: p1 is a reference object that the observations place
    /// only on a sight line (no distance reaches it, and it is seen from one station only), so holding the azimuth
    /// alone would leave its distance undetermined. Holding both is then the minimal constraint.
    /// </summary>
    public bool FullHold { get; }

    private static Selection Select(SurveyNetwork network, DatumDefinition definition, List<string> planePoints, List<string> heightPoints,
        Dictionary<string, double> e0, Dictionary<string, double> n0)
    {
        var heldPoints = new HashSet<string>(StringComparer.Ordinal);
        if (definition.Mode == DatumMode.Control) return new Selection([], null, null, null, null, false, heldPoints);
        var defects = DatumConditions.Defects(ObservationKindRegistry.FixedBy(network.Observations), planePoints.Count > 0,
            heightPoints.Count > 0);

        bool IsPlaneControl(string id) => network[id] is var p && (p.IsFixed(Fixity.E) || p.IsFixed(Fixity.N) || p.SdE.HasValue || p.SdN.HasValue);
        bool IsHeightControl(string id) => network[id] is var p && (p.IsFixed(Fixity.H) || p.SdH.HasValue);
        bool minimal = definition.Mode == DatumMode.MinimalConstraints;
        string Check(string id, List<string> among, string role) =>
            among.Contains(id) ? id : throw new InvalidInputException(
                $"datum: {role} {id} is not a point of the {(among == heightPoints ? "level" : "plane")} network (no observation of that kind reaches it)");

        string? p0 = null, p1 = null, hp = null;
        HashSet<string>? subset = null;
        bool fullHold = false;
        if (planePoints.Count > 0)
        {
            var placed = planePoints.Where(id => IsPlaced(network, id)).ToList();
            p0 = minimal && definition.HoldPoint is string hp0 ? Check(hp0, planePoints, "the held point")
                : (minimal ? placed.FirstOrDefault(IsPlaneControl) ?? planePoints.FirstOrDefault(IsPlaneControl) : null) ?? placed.FirstOrDefault() ?? planePoints[0];
            bool needSecond = defects.Contains(DatumDefect.Rotation) || defects.Contains(DatumDefect.Scale);
            if (minimal && definition.AzimuthTo is string at)
            {
                if (!needSecond)
                    throw new InvalidInputException($"datum: azimuth_to {at}: the observed azimuths and distances already fix the orientation and scale, so no azimuth may be held as well");
                p1 = Check(at, planePoints, "the azimuth point");
                if (p1 == p0) throw new InvalidInputException($"datum: azimuth_to must name a point other than the held point {p0}");
            }
            else if (needSecond)
            {
                var candidates = planePoints.Where(id => id != p0).ToList();
                var control = candidates.Where(IsPlaneControl).ToList();
                if (minimal && control.Count > 0) candidates = control;
                // Prefer points the observations place; among those, the farthest.
                p1 = candidates.OrderByDescending(id => IsPlaced(network, id)).ThenByDescending(id => Sq(e0[id] - e0[p0]) + Sq(n0[id] - n0[p0])).First();
            }
            // Control points that no observation places but a sight line (reference objects) are held in full, with p0.
            var objects = planePoints.Where(id => IsPlaneControl(id) && !IsPlaced(network, id) && id != p0).ToList();
            if (minimal && p1 is not null && !IsPlaced(network, p1) && !objects.Contains(p1)) objects.Insert(0, p1);
            fullHold = minimal && needSecond && objects.Count > 0;
            if (fullHold)
            {
                if (definition.AzimuthTo is null) p1 = objects[0];
                heldPoints.Add(p0);
                heldPoints.UnionWith(objects);
                defects.RemoveAll(d => d != DatumDefect.Height);
            }
            else if (definition.Mode == DatumMode.InnerConstraints && planePoints.FirstOrDefault(id => !IsPlaced(network, id)) is string loose)
            {
                throw new DatumDefectException(
                    $"The datum is not defined: in a free network point {loose} is placed by no observation but a single sight line " +
                    "(no distance reaches it and it is seen from one station only), so its distance is undetermined once the control is set aside. " +
                    "Use minimal constraints (datum: {mode: minimal}), which hold it as a reference object, or add observations to it.",
                    [$"position of {loose}"]);
            }
        }
        if (heightPoints.Count > 0)
            hp = minimal && definition.HoldHeight is string hh ? Check(hh, heightPoints, "the held height point")
                : (minimal ? heightPoints.FirstOrDefault(IsHeightControl) : null) ?? heightPoints[0];
        if (definition.Mode == DatumMode.InnerConstraints && definition.InnerPoints is { } list)
        {
            foreach (var id in list)
                if (!network.Contains(id)) throw new InvalidInputException($"datum: inner-constraint point {id} is not defined in the points list");
            subset = new HashSet<string>(list, StringComparer.Ordinal);
        }
        return new Selection(defects, p0, p1, hp, subset, fullHold, heldPoints);
    }

    /// <summary>
    /// Whether the observations alone can place a plane point (a structural test, not a proof): a distance reaches it,
    /// or rays from two stations, or it is a station with at least two sightings or angles.
    /// </summary>
    internal static bool IsPlaced(SurveyNetwork network, string id)
    {
        int count = 0;
        var rayStations = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in ApproximateCoordinates.ObservationsOf(network, id))
        {
            if (!ObservationKindRegistry.IsHorizontal(o.Kind) || o.Excluded) continue;
            if (ObservationKindRegistry.Of(o).Fixes.HasFlag(DatumElements.Scale)) count += 2; // a measured length
            else if (o.At == id) count++;
            else rayStations.Add(o.At ?? (o.From == id ? o.To : o.From));
        }
        return count + rayStations.Count >= 2;
    }

    /// <summary>Checks the datum, computes approximate values and numbers the unknowns.</summary>
    /// <exception cref="DatumDefectException">When the datum is not defined.</exception>
    /// <exception cref="InvalidInputException">When a point cannot be given approximate coordinates, or the datum names unknown points.</exception>
    public static DatumPlan Create(SurveyNetwork network, DatumDefinition definition)
    {
        DatumDiagnosis.Check(network, definition);
        var plane = new HashSet<string>(StringComparer.Ordinal);
        var height = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in network.Observations)
            foreach (var id in o.Points)
                (ObservationKindRegistry.IsHorizontal(o.Kind) ? plane : height).Add(id);

        var e = new Dictionary<string, double>(StringComparer.Ordinal);
        var nn = new Dictionary<string, double>(StringComparer.Ordinal);
        var h = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var p in network.Points)
        {
            if (plane.Contains(p.Id) && p.E is double pe && p.N is double pn) { e[p.Id] = pe; nn[p.Id] = pn; }
            if (height.Contains(p.Id) && p.H is double ph) h[p.Id] = ph;
        }
        ApproximateCoordinates.Plane(network, plane, e, nn, seedWhenNothingKnown: definition.Mode != DatumMode.Control);
        ApproximateCoordinates.Heights(network, height, h);

        bool control = definition.Mode == DatumMode.Control;
        var planePoints = network.Points.Select(p => p.Id).Where(plane.Contains).ToList();
        var heightPoints = network.Points.Select(p => p.Id).Where(height.Contains).ToList();
        var sel = Select(network, definition, planePoints, heightPoints, e, nn);
        var index = new UnknownIndex();
        foreach (var p in network.Points)
        {
            bool heldInFull = sel.HeldPoints.Contains(p.Id);
            if (plane.Contains(p.Id))
            {
                if (heldInFull && (p.E is null || p.N is null))
                    throw new InvalidInputException($"datum: point {p.Id} is held for the minimal constraints but has no given easting and northing");
                if (!heldInFull && (!control || !p.IsFixed(Fixity.E))) index.Add(new Unknown(p.Id, Parameter.E));
                if (!heldInFull && (!control || !p.IsFixed(Fixity.N))) index.Add(new Unknown(p.Id, Parameter.N));
            }
            if (height.Contains(p.Id))
            {
                if (!control || !p.IsFixed(Fixity.H)) index.Add(new Unknown(p.Id, Parameter.H));
            }
        }

        // Orientation unknowns: start from the mean of (azimuth − reading) over the set, taken circularly.
        var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var set in network.Observations.OfType<DirectionObservation>().GroupBy(d => d.SetId))
        {
            double first = double.NaN, sum = 0;
            int count = 0;
            foreach (var d in set)
            {
                var az = PlaneGeometry.Azimuth(d.Station, new PlanePoint(e[d.Station], nn[d.Station]), d.Target, new PlanePoint(e[d.Target], nn[d.Target])).Value;
                double w = az - d.Reading.Radians;
                if (count == 0) first = w;
                sum += Units.Angle.ReduceSigned(w - first);
                count++;
            }
            orientation[set.Key] = first + (sum / count);
            index.Add(new Unknown(set.Key, Parameter.Orientation));
        }
        var state = new ParameterState(e, nn, h, orientation);
        return new DatumPlan(network, definition, index, state, planePoints, heightPoints,
            new Dictionary<string, double>(e, StringComparer.Ordinal), new Dictionary<string, double>(nn, StringComparer.Ordinal),
            new Dictionary<string, double>(h, StringComparer.Ordinal), sel);
    }

    /// <summary>
    /// Factorises the normal equations: directly when the control defines the datum, otherwise the reduced
    /// (minimal-constraint) system wrapped in a <see cref="DatumFactor"/> for the chosen datum.
    /// </summary>
    public INormalFactor Factorize(INormalEquationsSolver solver, IReadOnlyList<SparseRow> rows, WeightMatrix weights)
    {
        int u = Index.Count;
        if (ConditionCount == 0) return FactorizeOrExplain(solver, u, rows, weights, j => j);

        // The held unknowns enter as direct observations e_jᵀx (weight w_j of the order of N_jj): M = N + E W Eᵀ is
        // positive definite, has the pattern of N (diagonal entries only are added) and the same unknowns, so any
        // solver — including one that orders by the unknowns' positions — factorises it. For a consistent right-hand
        // side M⁻¹b is exactly the minimal-constraint solution (x_K = 0), and M⁻¹ = Q_m + H_K W⁻¹ H_Kᵀ with
        // H_K = G (E_KᵀG)⁻¹ (DatumFactor removes that term).
        int d = ConditionCount, m0 = rows.Count;
        var diag = new double[u];
        for (int i = 0; i < m0; i++)
        {
            double p = weights.DiagonalEntry(i);
            var r = rows[i];
            for (int k = 0; k < r.Columns.Length; k++) diag[r.Columns[k]] += p * r.Values[k] * r.Values[k];
        }
        var allRows = new List<SparseRow>(rows);
        var blocks = weights.Blocks.ToList();
        var w = new double[d];
        for (int k = 0; k < d; k++)
        {
            int jk = _held[k];
            w[k] = diag[jk] > 0 && double.IsFinite(diag[jk]) ? diag[jk] : 1.0;
            allRows.Add(new SparseRow([jk], [1.0]));
            blocks.Add(new WeightBlock([m0 + k], [w[k]]));
        }
        var inner = FactorizeOrExplain(solver, u, allRows, WeightMatrix.FromBlocks(m0 + d, blocks), j => j);
        var (g, b) = Bases();
        var btg = new double[ConditionCount, ConditionCount];
        for (int k = 0; k < ConditionCount; k++)
            for (int l = 0; l < ConditionCount; l++)
                for (int j = 0; j < u; j++) btg[k, l] += b[k][j] * g[l][j];
        var m = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(btg);
        if (m.ConditionNumber() > 1e12)
            throw new DatumDefectException(
                "The datum is not defined: the points chosen for the inner constraints (" + string.Join(", ", Definition.InnerPoints ?? []) +
                ") do not fix the position, orientation and scale of the network. Choose at least two points of the plane network " +
                "and one of the level network, or use all points.", ["inner-constraint points"]);
        // E_KᵀG: the rows of G at the held unknowns (regular by the choice of K).
        var gk = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(d, d, (k, l) => g[l][_held[k]]);
        return new DatumFactor(inner, g, b, m.Inverse().ToArray(), gk.Inverse().ToArray(), w);
    }

    private INormalFactor FactorizeOrExplain(INormalEquationsSolver solver, int size, IReadOnlyList<SparseRow> rows, WeightMatrix weights, Func<int, int> toFull)
    {
        try
        {
            return solver.Factorize(size, rows, weights);
        }
        catch (SingularNormalMatrixException e)
        {
            var what = Index.Unknowns[toFull(e.Column)];
            throw new DatumDefectException(
                $"The datum is not defined: the observations and control do not determine the {what.Describe()}. " +
                "The network holds its datum, but the geometry there is too weak: a point reached by a single distance or direction, " +
                "points on one straight line, or a direction set with a single target. " +
                "Hold or weight more control, or add observations that connect it to the rest of the network.",
                [what.Describe()]);
        }
    }

    /// <summary>The datum step: the solution of the normal equations that meets the datum conditions at the current state.</summary>
    public double[] Step(INormalFactor factor, double[] rhs)
    {
        if (factor is not DatumFactor df) return factor.Solve(rhs);
        return df.SolveWithConditions(rhs, ConditionValues());
    }

    /// <summary>The null-space basis G and the datum-condition basis B at the current state (d columns of length u).</summary>
    private (double[][] G, double[][] B) Bases()
    {
        int u = Index.Count, d = ConditionCount;
        var g = DatumConditions.NullSpace(Index.Unknowns, _defects, State.Plane, _planePoints);
        if (Definition.Mode == DatumMode.InnerConstraints) return (g, DatumConditions.Inner(g, Index.Unknowns, _subset));
        var b = new double[d][];
        for (int k = 0; k < d; k++)
        {
            b[k] = new double[u];
            foreach (var (owner, par, value) in DatumConditions.MinimalGradient(_defects[k], _p0, _p1, _hp, State.Plane))
                b[k][Index.IndexOf(owner, par)] += value;
        }
        return (g, b);
    }

    /// <summary>c: how far the current state is from meeting each datum condition.</summary>
    private double[] ConditionValues()
    {
        int d = ConditionCount;
        var c = new double[d];
        if (Definition.Mode == DatumMode.InnerConstraints)
        {
            // c = Bᵀ (x0 − x): the free network stays, in the minimum-trace sense, on its approximate coordinates.
            var (_, b) = Bases();
            for (int j = 0; j < Index.Count; j++)
            {
                var unk = Index.Unknowns[j];
                double x0 = unk.Parameter switch
                {
                    Parameter.E => _e0[unk.Owner],
                    Parameter.N => _n0[unk.Owner],
                    Parameter.H => _h0[unk.Owner],
                    _ => State.Get(unk),
                };
                double diff = x0 - State.Get(unk);
                for (int k = 0; k < d; k++) c[k] += b[k][j] * diff;
            }
            return c;
        }
        for (int k = 0; k < d; k++)
        {
            c[k] = _defects[k] switch
            {
                DatumDefect.East => _e0[_p0!] - State.Plane(_p0!).E,
                DatumDefect.North => _n0[_p0!] - State.Plane(_p0!).N,
                DatumDefect.Height => _h0[_hp!] - State.Height(_hp!),
                DatumDefect.Rotation => Units.Angle.ReduceSigned(
                    PlaneGeometry.Azimuth(_p0!, new PlanePoint(_e0[_p0!], _n0[_p0!]), _p1!, new PlanePoint(_e0[_p1!], _n0[_p1!])).Value -
                    PlaneGeometry.Azimuth(_p0!, State.Plane(_p0!), _p1!, State.Plane(_p1!)).Value),
                _ => PlaneGeometry.Distance(_p0!, new PlanePoint(_e0[_p0!], _n0[_p0!]), _p1!, new PlanePoint(_e0[_p1!], _n0[_p1!])).Value -
                     PlaneGeometry.Distance(_p0!, State.Plane(_p0!), _p1!, State.Plane(_p1!)).Value,
            };
        }
        return c;
    }

    /// <summary>
    /// The point as this adjustment used it: with minimal or inner constraints the control is set aside, so the point
    /// is reported neither fixed nor weighted (except reference objects held in position).
    /// </summary>
    public Point AsUsed(Point p) => UsesControl ? p : p with
    {
        Fixed = _heldPoints.Contains(p.Id) ? Fixity.EN : Fixity.None, SdE = null, SdN = null, SdH = null,
    };

    /// <summary>The datum as applied, with the points chosen by default filled in.</summary>
    public DatumDefinition Resolved => Definition.Mode switch
    {
        DatumMode.MinimalConstraints => Definition with
        {
            HoldPoint = _p0, AzimuthTo = _defects.Contains(DatumDefect.Rotation) || _defects.Contains(DatumDefect.Scale) || FullHold ? _p1 : null, HoldHeight = _hp,
            ReferenceObjects = FullHold ? _heldPoints.Where(id => id != _p0).ToList() : null,
        },
        _ => Definition,
    };

    /// <summary>A description of the datum actually applied, naming the points chosen.</summary>
    public string Describe() => Definition.Mode switch
    {
        DatumMode.Control => Definition.Describe(),
        DatumMode.MinimalConstraints => "minimal constraints: " + string.Join(", ", new[]
        {
            FullHold ? $"{string.Join(", ", _heldPoints)} held in position (reference objects placed by a sight line only are held with {_p0})" : null,
            _p0 is null || FullHold ? null : $"position of {_p0} held",
            _p1 is null || FullHold ? null : $"{(_defects.Contains(DatumDefect.Rotation) ? "azimuth" : "")}{(_defects.Contains(DatumDefect.Rotation) && _defects.Contains(DatumDefect.Scale) ? " and " : "")}{(_defects.Contains(DatumDefect.Scale) ? "distance" : "")} {_p0}→{_p1} held",
            _hp is null ? null : $"height of {_hp} held",
        }.OfType<string>()),
        _ => Definition.Describe(),
    };
}
