using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>One element of a datum defect: a direction of the null space of the normal matrix.</summary>
internal enum DatumDefect
{
    /// <summary>Translation in easting.</summary>
    East,

    /// <summary>Translation in northing.</summary>
    North,

    /// <summary>Rotation about the vertical (no observed azimuth).</summary>
    Rotation,

    /// <summary>Scale (no observed distance).</summary>
    Scale,

    /// <summary>Height datum.</summary>
    Height,
}

/// <summary>
/// The datum written once, for the datum plan of the adjustment and for the S-transformation: the datum defect of
/// a network, the null-space basis G of its normal matrix, and the gradients of the minimal-constraint and
/// inner-constraint conditions Bᵀx (see docs/methods.md, "Datum").
/// </summary>
internal static class DatumConditions
{
    /// <summary>The datum defect: translation, plus rotation and scale unless the observations fix them;
    /// height.</summary>
    /// <param name="fixedByObservations">The datum elements the observations fix (<see
    /// cref="ObservationKindRegistry.FixedBy"/>).</param>
    /// <param name="plane">True when the network has plane unknowns.</param>
    /// <param name="height">True when it has height unknowns.</param>
    public static List<DatumDefect> Defects(DatumElements fixedByObservations, bool plane, bool height)
    {
        var d = new List<DatumDefect>();
        if (plane)
        {
            d.Add(DatumDefect.East);
            d.Add(DatumDefect.North);
            if (!fixedByObservations.HasFlag(DatumElements.Orientation)) d.Add(DatumDefect.Rotation);
            if (!fixedByObservations.HasFlag(DatumElements.Scale)) d.Add(DatumDefect.Scale);
        }
        if (height) d.Add(DatumDefect.Height);
        return d;
    }

    /// <summary>
    /// The null-space basis G (one column of length u per defect): translations, a rotation δ (dE = δ ΔN,
    /// dN = −δ ΔE; every orientation unknown turns by δ) and a scale about the centroid of
    /// <paramref name="centroidPoints"/>, reduced by their root-mean-square distance from it (at least 1 m) so that
    /// the columns have comparable size; the height datum.
    /// </summary>
    /// <param name="unknowns">The unknowns in order.</param>
    /// <param name="defects">The defects.</param>
    /// <param name="at">The plane coordinates of a point.</param>
    /// <param name="centroidPoints">The points whose centroid and spread reduce the rotation and scale.</param>
    public static double[][] NullSpace(IReadOnlyList<Unknown> unknowns, IReadOnlyList<DatumDefect> defects,
        Func<string, PlanePoint> at, IReadOnlyList<string> centroidPoints)
    {
        int u = unknowns.Count, d = defects.Count;
        double ce = 0, cn = 0;
        foreach (var id in centroidPoints) { var p = at(id); ce += p.E; cn += p.N; }
        if (centroidPoints.Count > 0) { ce /= centroidPoints.Count; cn /= centroidPoints.Count; }
        double spread = 0;
        foreach (var id in centroidPoints) { var p = at(id); spread += Sq(p.E - ce) + Sq(p.N - cn); }
        double len = centroidPoints.Count > 0 ? Math.Max(1, Math.Sqrt(spread / centroidPoints.Count)) : 1;

        var g = new double[d][];
        for (int k = 0; k < d; k++) g[k] = new double[u];
        for (int j = 0; j < u; j++)
        {
            var unk = unknowns[j];
            for (int k = 0; k < d; k++)
            {
                double v = 0;
                if (unk.Parameter == Parameter.Orientation) v = defects[k] == DatumDefect.Rotation ? 1 / len : 0;
                else if (unk.Parameter == Parameter.H) v = defects[k] == DatumDefect.Height ? 1 : 0;
                else if (unk.Parameter == Parameter.Refraction || FrameParameters.IsFrame(unk.Parameter))
                    v = 0; // k and the frame parameters are not moved by any datum change
                else
                {
                    var p = at(unk.Owner);
                    double de = (p.E - ce) / len, dn = (p.N - cn) / len;
                    bool east = unk.Parameter == Parameter.E;
                    v = defects[k] switch
                    {
                        DatumDefect.East => east ? 1 : 0,
                        DatumDefect.North => east ? 0 : 1,
                        DatumDefect.Rotation => east ? dn : -de,   // azimuths grow by δ: dE = δ ΔN, dN = −δ ΔE
                        DatumDefect.Scale => east ? de : dn,
                        _ => 0,
                    };
                }
                g[k][j] = v;
            }
        }
        return g;
    }

    /// <summary>
    /// Inner constraints B = G restricted to the coordinates of <paramref name="subset"/> (all points when null);
    /// orientation unknowns take no part.
    /// </summary>
    /// <param name="g">The null-space basis.</param>
    /// <param name="unknowns">The unknowns in order.</param>
    /// <param name="subset">The points of the inner constraints, or null for all.</param>
    public static double[][] Inner(double[][] g, IReadOnlyList<Unknown> unknowns, IReadOnlySet<string>? subset)
    {
        var b = new double[g.Length][];
        for (int k = 0; k < g.Length; k++)
        {
            b[k] = new double[unknowns.Count];
            for (int j = 0; j < unknowns.Count; j++)
            {
                var unk = unknowns[j];
                if (unk.Parameter is not (Parameter.Orientation or Parameter.Refraction) && !FrameParameters.IsFrame(
                        unk.Parameter)
                    && (subset is null || subset.Contains(unk.Owner)))
                    b[k][j] = g[k][j];
            }
        }
        return b;
    }

    /// <summary>
    /// The gradient of one minimal-constraint quantity: the easting or northing of <paramref name="p0"/>, the
    /// azimuth (rotation) or distance (scale) from <paramref name="p0"/> to <paramref name="p1"/>, or the height of
    /// <paramref name="hp"/>.
    /// </summary>
    /// <param name="defect">The defect the condition removes.</param>
    /// <param name="p0">The held point.</param>
    /// <param name="p1">The azimuth point (rotation and scale only).</param>
    /// <param name="hp">The held height point (height only).</param>
    /// <param name="at">The plane coordinates of a point.</param>
    public static IEnumerable<(string Owner, Parameter Parameter, double Value)> MinimalGradient(DatumDefect defect,
        string? p0, string? p1, string? hp, Func<string, PlanePoint> at)
    {
        switch (defect)
        {
            case DatumDefect.East: return [(p0!, Parameter.E, 1.0)];
            case DatumDefect.North: return [(p0!, Parameter.N, 1.0)];
            case DatumDefect.Height: return [(hp!, Parameter.H, 1.0)];
            default:
                var eq = defect == DatumDefect.Rotation
                    ? PlaneGeometry.Azimuth(p0!, at(p0!), p1!, at(p1!))
                    : PlaneGeometry.Distance(p0!, at(p0!), p1!, at(p1!));
                return eq.Partials.Select(p => (p.Owner, p.Parameter, p.Derivative));
        }
    }

    private static double Sq(double x) => x * x;
}
