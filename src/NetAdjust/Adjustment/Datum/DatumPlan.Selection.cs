using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>The datum plan, selection: the defect and the datum points chosen before the unknowns are
/// numbered.</summary>
internal sealed partial class DatumPlan
{
    /// <summary>The datum points chosen before the unknowns are numbered.</summary>
    private sealed record Selection(List<DatumDefect> Defects, string? P0, string? P1, string? Hp,
        HashSet<string>? Subset, bool FullHold, HashSet<string> HeldPoints)
    {
        /// <summary>Reference objects held along their sight line only: the mark, the station at the other end of the
        /// line, and the coordinate held (the one closer to the line's direction).</summary>
        public List<SightLineHold> AlongLine { get; init; } = [];
    }

    /// <summary>
    /// True when minimal constraints hold p0 and p1 in full: p1 is a reference object that the observations place
    /// only on a sight line (no distance reaches it, and it is seen from one station only), so holding the azimuth
    /// alone would leave its distance undetermined. Holding both is then the minimal constraint.
    /// </summary>
    public bool FullHold { get; }

    private static Selection Select(SurveyNetwork network, DatumDefinition definition, List<string> planePoints,
        List<string> heightPoints,
        Dictionary<string, double> e0, Dictionary<string, double> n0)
    {
        var heldPoints = new HashSet<string>(StringComparer.Ordinal);
        if (definition.Mode == DatumMode.Control) return new Selection([], null, null, null, null, false, heldPoints);
        var defects = DatumConditions.Defects(ObservationKindRegistry.FixedBy(network.Observations),
            planePoints.Count > 0,
            heightPoints.Count > 0);

        bool IsPlaneControl(string id) => network[id] is var p &&
            (p.IsFixed(Fixity.E) || p.IsFixed(Fixity.N) || p.SdE.HasValue || p.SdN.HasValue);
        bool IsHeightControl(string id) => network[id] is var p && (p.IsFixed(Fixity.H) || p.SdH.HasValue);
        bool minimal = definition.Mode == DatumMode.MinimalConstraints;
        string Check(string id, List<string> among, string role) =>
            among.Contains(id) ? id : throw new InvalidInputException(
                $"datum: {role} {id} is not a point of the {(among == heightPoints ? "level" : "plane")} network (no " +
                    $"observation of that kind reaches it)");

        string? p0 = null, p1 = null, hp = null;
        HashSet<string>? subset = null;
        bool fullHold = false;
        List<SightLineHold> alongLine = [];
        if (planePoints.Count > 0)
        {
            var links = new ObservationIndex(network);
            var placed = planePoints.Where(id => IsPlaced(links, id)).ToList();
            p0 = minimal && definition.HoldPoint is string hp0 ? Check(hp0, planePoints, "the held point")
                : (minimal ? placed.FirstOrDefault(IsPlaneControl) ?? planePoints.FirstOrDefault(IsPlaneControl) :
                    null) ?? placed.FirstOrDefault() ?? planePoints[0];
            bool needSecond = defects.Contains(DatumDefect.Rotation) || defects.Contains(DatumDefect.Scale);
            if (minimal && definition.AzimuthTo is string at)
            {
                if (!needSecond)
                    throw new InvalidInputException(
                        $"datum: azimuth_to {at}: the observed azimuths and distances already fix the orientation " +
                        $"and scale, so no azimuth may be held as well");
                p1 = Check(at, planePoints, "the azimuth point");
                if (p1 == p0)
                    throw new InvalidInputException(
                        $"datum: azimuth_to must name a point other than the held point {p0}");
            }
            else if (needSecond)
            {
                var candidates = planePoints.Where(id => id != p0).ToList();
                var control = candidates.Where(IsPlaneControl).ToList();
                // Prefer control marks the observations place: a reference object held as the second datum point
                // turns the network with its error. With no such mark, a reference object must carry the rotation
                // (held in full below; the sequence report says so).
                var placedControl = control.Where(id => IsPlaced(links, id)).ToList();
                if (minimal && placedControl.Count > 0) candidates = placedControl;
                else if (minimal && control.Count > 0) candidates = control;
                // Prefer points the observations place; among those, the farthest.
                p1 = candidates.OrderByDescending(id => IsPlaced(links, id)).ThenByDescending(id => Sq(e0[id] -
                    e0[p0]) + Sq(n0[id] - n0[p0])).First();
            }
            // Control points that no observation places but a sight line (reference objects).
            var objects = planePoints.Where(id => IsPlaneControl(id) && !IsPlaced(links, id) && id != p0).ToList();
            if (minimal && p1 is not null && !IsPlaced(links, p1) && !objects.Contains(p1)) objects.Insert(0, p1);
            // Held in full only when the datum itself must rest on a reference object (named by the datum, or no
            // placed point to choose); otherwise each is held along its sight line only and floats across it.
            fullHold = minimal && needSecond && objects.Count > 0 &&
                (!IsPlaced(links, p0) || (p1 is not null && !IsPlaced(links, p1)));
            var along = new List<SightLineHold>();
            if (!fullHold && definition.Mode != DatumMode.Control)
            {
                foreach (var id in objects)
                    if (SightLineHold.Of(links, id, e0, n0) is { } h) along.Add(h);
                alongLine = along;
            }
            if (fullHold)
            {
                if (definition.AzimuthTo is null) p1 = objects[0];
                heldPoints.Add(p0);
                heldPoints.UnionWith(objects);
                defects.RemoveAll(d => d != DatumDefect.Height);
            }
            else if (definition.Mode == DatumMode.InnerConstraints &&
                planePoints.FirstOrDefault(id => !IsPlaced(links, id) && !along.Any(h => h.Id == id)) is string loose)
            {
                throw new DatumDefectException(
                    $"The datum is not defined: in a free network point {loose} is placed by no observation but a " +
                        $"single sight line " +
                    "(no distance reaches it and it is seen from one station only), so its distance is undetermined " +
                        "once the control is set aside. " +
                    "Use minimal constraints (datum: {mode: minimal}), which hold it as a reference object, or add " +
                        "observations to it.",
                    [$"position of {loose}"]);
            }
        }
        if (heightPoints.Count > 0)
            hp = minimal && definition.HoldHeight is string hh ? Check(hh, heightPoints, "the held height point")
                : (minimal ? heightPoints.FirstOrDefault(IsHeightControl) : null) ?? heightPoints[0];
        if (definition.Mode == DatumMode.InnerConstraints && definition.InnerPoints is { } list)
        {
            foreach (var id in list)
                if (!network.Contains(id))
                    throw new InvalidInputException(
                        $"datum: inner-constraint point {id} is not defined in the points list");
            subset = new HashSet<string>(list, StringComparer.Ordinal);
        }
        return new Selection(defects, p0, p1, hp, subset, fullHold, heldPoints) { AlongLine = alongLine };
    }

    /// <summary>
    /// Whether the observations alone can place a plane point (a structural test, not a proof): a distance reaches it,
    /// or rays from two stations, or it is a station with at least two sightings or angles.
    /// </summary>
    internal static bool IsPlaced(ObservationIndex links, string id)
    {
        int count = 0;
        var rayStations = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in links.ObservationsOf(id))
        {
            if (!ObservationKindRegistry.IsHorizontal(o.Kind) || o.Excluded) continue;
            if (ObservationKindRegistry.Of(o).Fixes.HasFlag(DatumElements.Scale)) count += 2; // a measured length
            else if (o.At == id) count++;
            else rayStations.Add(o.At ?? (o.From == id ? o.To : o.From));
        }
        return count + rayStations.Count >= 2;
    }
}
