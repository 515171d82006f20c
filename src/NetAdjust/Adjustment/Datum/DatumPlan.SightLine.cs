using NetAdjust.Adjustment.Approximation;
using NetAdjust.Geometry;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>
/// A reference object (a control mark that one sight line places) held along its sight line only in a minimally
/// constrained or free solution: the coordinate closer to the line's direction is held at its given value, the
/// other is estimated from the line. Its position along the line is a freedom of the observations, not of the
/// datum, so this hold changes no residual; an error of the mark across the line shows in its own discrepancy and
/// turns nothing else (docs/methods.md, "Datum").
/// </summary>
/// <param name="Id">The mark.</param>
/// <param name="Station">The point at the other end of its sight line.</param>
/// <param name="Held">The coordinate held: <see cref="Parameter.E"/> or <see cref="Parameter.N"/>.</param>
internal sealed record SightLineHold(string Id, string Station, Parameter Held)
{
    /// <summary>The free coordinate.</summary>
    public Parameter Free => Held == Parameter.E ? Parameter.N : Parameter.E;

    /// <summary>The hold of a mark that one sight line reaches; null when it is not reached by exactly one.</summary>
    public static SightLineHold? Of(ObservationIndex links, string id, Dictionary<string, double> e0,
        Dictionary<string, double> n0)
    {
        var others = new HashSet<string>(StringComparer.Ordinal);
        foreach (var o in links.ObservationsOf(id))
        {
            if (!ObservationKindRegistry.IsHorizontal(o.Kind) || o.Excluded) continue;
            foreach (var p in o.Points) if (p != id) others.Add(p);
        }
        if (others.Count != 1) return null;
        string s = others.First();
        double de = e0[id] - e0[s], dn = n0[id] - n0[s];
        // the azimuth's gradient at the mark is (ΔN, −ΔE)/d²: hold the coordinate it is less sensitive to
        return new SightLineHold(id, s, Math.Abs(dn) <= Math.Abs(de) ? Parameter.E : Parameter.N);
    }
}

/// <summary>The datum plan, reference objects held along their sight line.</summary>
internal sealed partial class DatumPlan
{
    /// <summary>
    /// Completes the null-space columns at the free coordinate of each reference object held along its line: a
    /// datum motion moves the mark rigidly with the network, but its held coordinate stays, so its free coordinate
    /// moves along the (moved) sight line instead: g_free += (a_held / a_free) g_held, a = ∂azimuth/∂coordinate at
    /// the mark, which keeps the azimuth from the station as the rigid motion does (linearised).
    /// </summary>
    private void CompleteNullSpace(double[][] g)
    {
        foreach (var h in _alongLine)
        {
            int j = Index.IndexOf(h.Id, h.Free);
            if (j < 0) continue;
            var rigid = DatumConditions.NullSpace([new Unknown(h.Id, h.Held)], _defects, State.Plane, _planePoints);
            var r = State.Plane(h.Id);
            var s = State.Plane(h.Station);
            double aE = r.N - s.N, aN = -(r.E - s.E);
            double ratio = h.Held == Parameter.E ? aE / aN : aN / aE;
            for (int k = 0; k < g.Length; k++) g[k][j] += ratio * rigid[k][0];
        }
    }
}
