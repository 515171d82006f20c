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
        DatumDiagnosis.Check(network, definition);
        var plane = new HashSet<string>(StringComparer.Ordinal);
        var height = new HashSet<string>(StringComparer.Ordinal);
        // Points and direction sets reached only by set-aside observations get no unknowns (they carry no weight);
        // they keep their given or approximate values so that those observations are still reported.
        var active = new HashSet<(string, bool)>();
        foreach (var o in network.Observations)
            foreach (var id in o.Points)
            {
                // A kind may use both (slope distance, zenith angle): its points get plane and height unknowns.
                var axes = ObservationKindRegistry.Of(o).Axes;
                if (axes.HasFlag(CoordinateAxes.Plane)) plane.Add(id);
                if (axes.HasFlag(CoordinateAxes.Height)) height.Add(id);
                if (o.Excluded) continue;
                if (axes.HasFlag(CoordinateAxes.Plane)) active.Add((id, true));
                if (axes.HasFlag(CoordinateAxes.Height)) active.Add((id, false));
            }

        var e = new Dictionary<string, double>(StringComparer.Ordinal);
        var nn = new Dictionary<string, double>(StringComparer.Ordinal);
        var h = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var p in network.Points)
        {
            if (plane.Contains(p.Id) && p.E is double pe && p.N is double pn) { e[p.Id] = pe; nn[p.Id] = pn; }
            if (height.Contains(p.Id) && p.H is double ph) h[p.Id] = ph;
        }
        // Constructions are judged in units of σ, which for observations weighted from specifications need sight
        // lengths: provisional ones until the adjustment weights at its own coordinates.
        ApproximateCoordinates.Plane(StochasticModel.WithProvisionalDeviations(network), plane, e, nn,
            seedWhenNothingKnown: definition.Mode != DatumMode.Control);
        ApproximateCoordinates.Heights(network, height, h, e, nn);
        CoordinateCheck.Check(network, e, nn);

        bool control = definition.Mode == DatumMode.Control;
        var planePoints = network.Points.Select(p => p.Id).Where(id => active.Contains((id, true))).ToList();
        var heightPoints = network.Points.Select(p => p.Id).Where(id => active.Contains((id, false))).ToList();
        var sel = Select(network, definition, planePoints, heightPoints, e, nn);
        var index = new UnknownIndex();
        foreach (var p in network.Points)
        {
            bool heldInFull = sel.HeldPoints.Contains(p.Id);
            var alongLine = sel.AlongLine.FirstOrDefault(x => x.Id == p.Id);
            if (active.Contains((p.Id, true)))
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
            if (active.Contains((p.Id, false)))
            {
                if (!control || !p.IsFixed(Fixity.H)) index.Add(new Unknown(p.Id, Parameter.H));
            }
        }

        // Orientation unknowns: start from the mean of (azimuth − reading) over the set, taken circularly.
        var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var set in network.Observations.OfType<DirectionObservation>().GroupBy(d => d.SetId))
        {
            orientation[set.Key] = SetOrientation.Mean(set.Select(d => PlaneGeometry.Azimuth(d.Station,
                new PlanePoint(e[d.Station], nn[d.Station]), d.Target, new PlanePoint(e[d.Target], nn[d.Target])).Value
                - d.Reading.Radians))!.Value;
            if (set.Any(d => !d.Excluded)) index.Add(new Unknown(set.Key, Parameter.Orientation));
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
