using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// Computes approximate coordinates for points given none, from the observations and the points that have
/// coordinates (given control or approximate values), in the order a surveyor would (docs/methods.md):
/// <list type="number">
/// <item>orient direction sets whose station and at least one target are located (<see cref="SetOrientation"/>);</item>
/// <item>polar point: a ray (azimuth, oriented direction, or angle from a located backsight) and a distance from
/// the same located station;</item>
/// <item>intersection: rays from two located stations (cut angle at least 5°);</item>
/// <item>resection: directions or angles at the point to three or more located points;</item>
/// <item>ray–distance and distance–distance intersection: a unique solution, or of two solutions the one that fits
/// the other observations better; when nothing tells them apart, the choice is deferred until no other step makes
/// progress.</item>
/// </list>
/// The strengths are named by <see cref="ConstructionStrength"/>; the constructions are the pure functions of
/// <see cref="Constructions"/>; what each observation kind offers is mapped in <see cref="ApproximationOffers"/>.
/// Heights follow a breadth-first spanning tree of height differences (levelled, or reduced from zenith angles and
/// slope distances) from points with heights.
/// </summary>
internal static class ApproximateCoordinates
{
    /// <summary>
    /// Fills in plane coordinates of every point in <paramref name="plane"/> that lacks them.
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="plane">Points taking part in horizontal observations.</param>
    /// <param name="e">Eastings known so far (given or approximate), completed in place.</param>
    /// <param name="n">Northings, completed in place.</param>
    /// <param name="seedWhenNothingKnown">When no point has coordinates, start a local frame at the first point
    /// (free networks).</param>
    /// <exception cref="InvalidInputException">Naming each point that cannot be reached and what it lacks.</exception>
    public static void Plane(SurveyNetwork network, IReadOnlyCollection<string> plane, Dictionary<string, double> e,
        Dictionary<string, double> n, bool seedWhenNothingKnown)
    {
        LocateByBaselines(network, plane, e, n);
        // Observations set aside (e.g. by the blunder hunt) are used only for points nothing else reaches.
        if (network.Observations.Any(o => o.Excluded))
        {
            var kept = new ObservationIndex(
                new SurveyNetwork(network.Name, network.Points, network.Observations.Where(o => !o.Excluded)));
            var keptPlane = plane.Where(id => kept.ObservationsOf(id).Count > 0).ToHashSet(StringComparer.Ordinal);
            new PlaneLocator(kept).Locate(keptPlane, e, n, seedWhenNothingKnown, throwWhenMissing: false);
        }
        new PlaneLocator(new ObservationIndex(network))
            .Locate(plane, e, n, seedWhenNothingKnown, throwWhenMissing: true);
    }

    /// <summary>Trees of height differences built on this thread by <see cref="Heights"/> (for the tests of its
    /// shortcut).</summary>
    [ThreadStatic] internal static int HeightTreesBuilt;

    /// <summary>
    /// Fills in heights of points in <paramref name="height"/> that lack them by a breadth-first spanning tree of
    /// height differences from the points with heights (<see cref="Constructions.LevellingTree"/>): levelled ones
    /// first, then those reduced from zenith angles and slope distances
    /// (<see cref="ApproximationOffers.TrigonometricEdges"/>). A part of the network with no height at all starts
    /// from 0 at its first point (the datum diagnosis decides whether that is allowed).
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="height">Points taking part in height differences, zenith angles or slope distances.</param>
    /// <param name="h">Heights known so far, completed in place.</param>
    /// <param name="e">Eastings located so far (for zenith angles without a slope distance); null for none.</param>
    /// <param name="n">Northings located so far.</param>
    public static void Heights(SurveyNetwork network, IReadOnlyCollection<string> height,
        Dictionary<string, double> h, IReadOnlyDictionary<string, double>? e = null,
        IReadOnlyDictionary<string, double>? n = null)
    {
        // every point has its height already: the tree fills in only points without one, so no edge is made (the
        // height differences of a large GNSS network's baselines, each through the projection, would be for nothing)
        if (network.Points.All(p => h.ContainsKey(p.Id))) return;
        HeightTreesBuilt++;
        PlanePoint? At(string id) => e is not null && n is not null && e.TryGetValue(id, out double pe)
            && n.TryGetValue(id, out double pn) ? new PlanePoint(pe, pn) : null;
        Constructions.LevellingTree(network.Points.Select(p => p.Id).Where(height.Contains).ToList(),
            [.. ApproximationOffers.LevellingEdges(network), .. ApproximationOffers.BaselineEdges(network, At),
                .. ApproximationOffers.TrigonometricEdges(network, At)],
            h);
    }

    /// <summary>
    /// GNSS baselines place a point directly from a located end (<see cref="ApproximationOffers.BaselineStep"/>):
    /// repeated until no baseline reaches a further point, before the plane constructions.
    /// </summary>
    private static void LocateByBaselines(SurveyNetwork network, IReadOnlyCollection<string> plane,
        Dictionary<string, double> e, Dictionary<string, double> n)
    {
        var baselines = ApproximationOffers.Baselines(network).ToList();
        for (bool progress = baselines.Count > 0; progress;)
        {
            progress = false;
            foreach (var b in baselines)
            {
                bool fromKnown = e.ContainsKey(b.From), toKnown = e.ContainsKey(b.To);
                if (fromKnown == toKnown) continue;
                string other = fromKnown ? b.To : b.From;
                if (!plane.Contains(other)) continue;
                var (pe, pn, _) = fromKnown ? ApproximationOffers.BaselineStep(b, true, e[b.From], n[b.From])
                    : ApproximationOffers.BaselineStep(b, false, e[b.To], n[b.To]);
                if (!double.IsFinite(pe) || !double.IsFinite(pn)) continue;
                e[other] = pe; n[other] = pn;
                progress = true;
            }
        }
    }
}
