using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Stochastic;

namespace NetAdjust.Adjustment.Datum;

/// <summary>
/// Prepares one adjustment's unknowns and datum: checks the datum (<see cref="DatumDiagnosis"/>), computes
/// approximate coordinates (<see cref="ApproximateCoordinates"/>), numbers the unknowns, and, for minimal or
/// inner constraints, supplies the null-space basis G, the datum conditions Bᵀx = c and the held unknowns of
/// the internal minimal-constraint solve (<see cref="DatumFactor"/>).
/// </summary>
internal sealed partial class DatumPlan
{
    private readonly List<DatumDefect> _defects = [];
    private readonly int[] _held = [];
    private readonly string? _p0, _p1, _hp;
    private readonly HashSet<string>? _subset;
    private readonly HashSet<string> _heldPoints = [];
    private readonly List<SightLineHold> _alongLine = [];
    private readonly List<string> _planePoints;
    private readonly Dictionary<string, double> _e0, _n0, _h0;

    public DatumDefinition Definition { get; }

    public UnknownIndex Index { get; }

    public ParameterState State { get; }

    /// <summary>True when control points are held and weighted as given (datum by control).</summary>
    public bool UsesControl => Definition.Mode == DatumMode.Control;

    /// <summary>The number of datum conditions d (the datum defect removed by minimal or inner constraints).</summary>
    public int ConditionCount => _defects.Count;

    private DatumPlan(DatumDefinition definition, UnknownIndex index, ParameterState state,
        List<string> planePoints, Dictionary<string, double> e0, Dictionary<string, double> n0,
        Dictionary<string, double> h0, Selection sel)
    {
        Definition = definition; Index = index; State = state;
        _planePoints = planePoints; _e0 = e0; _n0 = n0; _h0 = h0;
        if (UsesControl) return;
        _defects = sel.Defects;
        (_p0, _p1, _hp, _subset, FullHold, _heldPoints) =
            (sel.P0, sel.P1, sel.Hp, sel.Subset, sel.FullHold, sel.HeldPoints);
        _alongLine = sel.AlongLine;

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
                    held.Add(index.IndexOf(_p1!,
                        Math.Abs(n0[_p1!] - n0[_p0!]) >= Math.Abs(e0[_p1!] - e0[_p0!]) ? Parameter.E : Parameter.N));
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

    /// <summary>Checks the datum, computes approximate values and numbers the unknowns.</summary>
    /// <exception cref="DatumDefectException">When the datum is not defined.</exception>
    /// <exception cref="InvalidInputException">When a point cannot be given approximate coordinates, or the datum names
    /// unknown points.</exception>
    public static DatumPlan Create(SurveyNetwork network, DatumDefinition definition)
    {
        var ids = new ObservationPoints(network);
        DatumDiagnosis.Check(network, ids, definition);
        // What each point takes part in, by its index in the network: plane or height observations, and whether any
        // of them is not set aside. Points and direction sets reached only by set-aside observations get no unknowns
        // (they carry no weight); they keep their given or approximate values so that those observations are still
        // reported. A kind may use both (slope distance, zenith angle): its points get plane and height unknowns.
        const byte InPlane = 1, InHeight = 2, ActivePlane = 4, ActiveHeight = 8;
        var points = network.Points;
        var use = new byte[points.Count];
        for (int i = 0; i < ids.Count; i++)
        {
            var o = network.Observations[i];
            var axes = ObservationKindRegistry.Of(o.Kind).Axes;
            int flags = ((axes & CoordinateAxes.Plane) != 0 ? InPlane | (o.Excluded ? 0 : ActivePlane) : 0)
                | ((axes & CoordinateAxes.Height) != 0 ? InHeight | (o.Excluded ? 0 : ActiveHeight) : 0);
            foreach (int p in ids.Of(i)) use[p] |= (byte)flags;
        }

        int inPlane = use.Count(u => (u & InPlane) != 0), inHeight = use.Count(u => (u & InHeight) != 0);
        var e = new Dictionary<string, double>(inPlane, StringComparer.Ordinal);
        var nn = new Dictionary<string, double>(inPlane, StringComparer.Ordinal);
        var h = new Dictionary<string, double>(inHeight, StringComparer.Ordinal);
        bool planeMissing = false, anyHeight = false;
        for (int i = 0; i < points.Count; i++)
        {
            var p = points[i];
            if ((use[i] & InPlane) != 0)
            {
                if (p.E is double pe && p.N is double pn) { e[p.Id] = pe; nn[p.Id] = pn; }
                else planeMissing = true;
            }
            if ((use[i] & InHeight) != 0)
            {
                anyHeight = true;
                if (p.H is double ph) h[p.Id] = ph;
            }
        }
        // When every plane point has coordinates there is nothing to locate (the constructions would leave them as
        // they are); likewise heights with no height observation.
        if (planeMissing)
        {
            // Constructions are judged in units of σ, which for observations weighted from specifications need sight
            // lengths: provisional ones until the adjustment weights at its own coordinates.
            ApproximateCoordinates.Plane(StochasticModel.WithProvisionalDeviations(network),
                PointsIn(network, CoordinateAxes.Plane), e, nn,
                seedWhenNothingKnown: definition.Mode != DatumMode.Control);
        }
        if (anyHeight) ApproximateCoordinates.Heights(network, PointsIn(network, CoordinateAxes.Height), h, e, nn);
        var (pe0, pn0, located) = CoordinateCheck.Check(network, ids, e, nn);

        bool control = definition.Mode == DatumMode.Control;
        var planePoints = new List<string>();
        var heightPoints = new List<string>();
        for (int i = 0; i < points.Count; i++)
        {
            if ((use[i] & ActivePlane) != 0) planePoints.Add(points[i].Id);
            if ((use[i] & ActiveHeight) != 0) heightPoints.Add(points[i].Id);
        }
        var sel = Select(network, definition, planePoints, heightPoints, e, nn);
        var index = new UnknownIndex();
        index.EnsureCapacity((2 * planePoints.Count) + heightPoints.Count);
        for (int i = 0; i < points.Count; i++)
        {
            var p = points[i];
            bool heldInFull = sel.HeldPoints.Contains(p.Id);
            var alongLine = sel.AlongLine.Count == 0 ? null : sel.AlongLine.FirstOrDefault(x => x.Id == p.Id);
            if ((use[i] & ActivePlane) != 0)
            {
                if (heldInFull && (p.E is null || p.N is null))
                    throw new InvalidInputException(
                        $"datum: point {p.Id} is held for the minimal constraints but has no given easting and " +
                        $"northing");
                if (!heldInFull && alongLine?.Held != Parameter.E && (!control || !p.IsFixed(Fixity.E)))
                    index.Add(new Unknown(p.Id, Parameter.E));
                if (!heldInFull && alongLine?.Held != Parameter.N && (!control || !p.IsFixed(Fixity.N)))
                    index.Add(new Unknown(p.Id, Parameter.N));
            }
            if ((use[i] & ActiveHeight) != 0)
            {
                if (!control || !p.IsFixed(Fixity.H)) index.Add(new Unknown(p.Id, Parameter.H));
            }
        }

        // Orientation unknowns: start from the mean of (azimuth − reading) over the set, taken circularly.
        var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
        var sets = new Dictionary<string, List<int>>(StringComparer.Ordinal);
        var setOrder = new List<List<int>>();
        (string? Id, List<int>? Directions) last = (null, null); // a set's directions mostly follow each other
        for (int i = 0; i < ids.Count; i++)
            if (network.Observations[i] is DirectionObservation d)
            {
                if (last.Id != d.SetId && !sets.TryGetValue(d.SetId, out last.Directions))
                {
                    sets[d.SetId] = last.Directions = [];
                    setOrder.Add(last.Directions);
                }
                last.Id = d.SetId;
                last.Directions!.Add(i);
            }
        var values = new List<double>();
        index.EnsureCapacity(index.Count + setOrder.Count);
        foreach (var set in setOrder)
        {
            values.Clear();
            bool used = false;
            foreach (int i in set)
            {
                var d = (DirectionObservation)network.Observations[i];
                var of = ids.Of(i); // station, target
                int s = of[0], t = of[1];
                if (!located[s] || !located[t])
                    throw new KeyNotFoundException($"point {(located[s] ? d.Target : d.Station)} has no plane " +
                        "coordinates");
                values.Add(SetOrientation.Azimuth(pe0[s], pn0[s], pe0[t], pn0[t]) - d.Reading.Radians);
                used |= !d.Excluded;
            }
            string setId = ((DirectionObservation)network.Observations[set[0]]).SetId;
            orientation[setId] = SetOrientation.Mean(values)!.Value;
            if (used) index.Add(new Unknown(setId, Parameter.Orientation));
        }
        // Refraction unknowns: one per group of zenith angles whose k is estimated, started at its assumed k.
        var refraction = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var (group, start, used) in RefractionGroups.Estimated(network))
        {
            refraction[group] = start;
            if (used) index.Add(new Unknown(group, Parameter.Refraction));
        }
        var state = new ParameterState(e, nn, h, orientation, refraction);
        // Frame parameters of GNSS baselines: rotations (and a scale) per frame, started at zero.
        foreach (var (frame, used) in FrameParameters.Frames(network))
        {
            state.AddFrame(frame.Id, frame.HasScale);
            if (!used) continue;
            foreach (var par in FrameParameters.Of(frame)) index.Add(new Unknown(frame.Id, par));
        }
        return new DatumPlan(definition, index, state, planePoints,
            new Dictionary<string, double>(e, StringComparer.Ordinal), new Dictionary<string,
                double>(nn, StringComparer.Ordinal),
            new Dictionary<string, double>(h, StringComparer.Ordinal), sel);
    }

    /// <summary>The ids of the points that observations of <paramref name="axes"/> involve, in the order those
    /// observations first name them (as <see cref="Observation.Points"/> lists them).</summary>
    private static HashSet<string> PointsIn(SurveyNetwork network, CoordinateAxes axes)
    {
        var set = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in network.Observations)
            if (ObservationKindRegistry.Of(o).Axes.HasFlag(axes))
                foreach (var id in o.Points) set.Add(id);
        return set;
    }

    /// <summary>
    /// The point as this adjustment used it: with minimal or inner constraints the control is set aside, so the point
    /// is reported neither fixed nor weighted (except reference objects held in position).
    /// </summary>
    public Point AsUsed(Point p) => UsesControl ? p : p with
    {
        Fixed = _heldPoints.Contains(p.Id) ? Fixity.EN
            : _alongLine.FirstOrDefault(x => x.Id == p.Id) is { } a ? (a.Held == Parameter.E ? Fixity.E : Fixity.N)
            : Fixity.None,
        SdE = null, SdN = null, SdH = null,
    };

    /// <summary>The datum as applied, with the points chosen by default filled in.</summary>
    public DatumDefinition Resolved => Definition.Mode switch
    {
        DatumMode.MinimalConstraints => Definition with
        {
            HoldPoint = _p0, AzimuthTo = _defects.Contains(DatumDefect.Rotation) ||
                _defects.Contains(DatumDefect.Scale) || FullHold ? _p1 : null, HoldHeight = _hp,
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
            FullHold ? $"{string.Join(", ", _heldPoints)} held in position (reference objects placed by a sight line " +
                $"only are held with {_p0})" : null,
            _p0 is null || FullHold ? null : $"position of {_p0} held",
            _p1 is null || FullHold ? null :
                $"{(_defects.Contains(DatumDefect.Rotation) ? "azimuth" : "")}" +
                $"{(_defects.Contains(DatumDefect.Rotation) && _defects.Contains(DatumDefect.Scale) ? " and " : "")}" +
                $"{(_defects.Contains(DatumDefect.Scale) ? "distance" : "")} {_p0}→{_p1} held",
            _hp is null ? null : $"height of {_hp} held",
        }.OfType<string>()),
        _ => Definition.Describe(),
    };
}
