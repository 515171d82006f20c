using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Observations;

namespace NetAdjust.Procedures;

/// <summary>
/// Whether the observations can check one component (E, N or H) of a control mark in a datum sequence, from its
/// redundancy number in the constrained step. The observations fix the shape of the network up to the directions of
/// the null space of their design matrix (the datum, and whatever else they leave free, e.g. the distance to a mark
/// that only one direction reaches). Taken as equally weighted observations of the control, the given coordinates
/// add Δr = n_c − rank(G_c) to the degrees of freedom, G_c the null-space basis at the n_c control components, and
/// component i gets the share r_i = (I − H)_ii, H = G_c G_c⁺ (Σ r_i = Δr): the part of an error in its given value
/// that shows in its own control discrepancy. With r_i below the uncontrolled limit of the statistics options
/// (0.01) an error in it shows nowhere. Two components whose discrepancies are fully correlated (|ρ_ij| ≥
/// <see cref="SeparabilityLimit"/>, ρ from I − H) cannot be told apart: the data sees an error, not in which of them
/// it lies. A component is testable when r_i reaches the limit and no other component of the same mark is
/// inseparable from it. docs/methods.md, "Datum" (control testability).
/// Made by the adjustment sequence only (the constructor is internal).
/// </summary>
public sealed record ControlTestability
{
    /// <summary>Made by the adjustment sequence.</summary>
    internal ControlTestability(string Id, Parameter Component, double? Redundancy, bool? Testable,
        IReadOnlyList<string> CannotBeToldApartFrom)
    {
        this.Id = Id; this.Component = Component; this.Redundancy = Redundancy; this.Testable = Testable;
        this.CannotBeToldApartFrom = CannotBeToldApartFrom;
    }

    /// <summary>The control mark.</summary>
    public string Id { get; internal init; }

    /// <summary>The controlled coordinate: <see cref="Parameter.E"/>, <see cref="Parameter.N"/> or <see
    /// cref="Parameter.H"/>.</summary>
    public Parameter Component { get; internal init; }

    /// <summary>r_i in [0, 1]; null when not computed (more than <see cref="MaxUnknowns"/> unknowns).</summary>
    public double? Redundancy { get; internal init; }

    /// <summary>True when an error in the component shows in its discrepancy and can be told apart from the mark's
    /// other components; null when not computed.</summary>
    public bool? Testable { get; internal init; }

    /// <summary>The other control components whose discrepancies are fully correlated with this one.</summary>
    public IReadOnlyList<string> CannotBeToldApartFrom
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>|ρ| at or above which two control components cannot be told apart.</summary>
    public const double SeparabilityLimit = 0.99;

    /// <summary>Above this number of unknowns (points' coordinates and orientations) nothing is computed: the null
    /// space is found by a dense singular value decomposition.</summary>
    public const int MaxUnknowns = 800;

    /// <summary>One entry per controlled component (E, N, H) of each control mark, in the order of the
    /// discrepancies.</summary>
    /// <param name="constrained">The constrained solution of the sequence (its network and coordinates).</param>
    /// <param name="discrepancies">The control discrepancies of the sequence (which marks and components are
    /// control).</param>
    public static IReadOnlyList<ControlTestability> Of(AdjustmentResult constrained,
        IReadOnlyList<ControlDiscrepancy> discrepancies)
    {
        ArgumentNullException.ThrowIfNull(constrained);
        ArgumentNullException.ThrowIfNull(discrepancies);
        var control = new List<(string Id, Parameter P)>();
        foreach (var d in discrepancies)
        {
            if (d.DE is not null) control.Add((d.Id, Parameter.E));
            if (d.DN is not null) control.Add((d.Id, Parameter.N));
            if (d.DH is not null) control.Add((d.Id, Parameter.H));
        }
        double limit = constrained.Options.Analysis.UncontrolledRedundancy;
        var r = ResidualProjector(constrained, control);
        var list = new List<ControlTestability>();
        for (int i = 0; i < control.Count; i++)
        {
            var (id, p) = control[i];
            if (r is null)
            {
                list.Add(new(id, p, null, null, []));
                continue;
            }
            double ri = Math.Clamp(r[i, i], 0, 1);
            var apart = new List<string>();
            bool sameMark = false;
            for (int j = 0; j < control.Count && ri >= limit; j++)
            {
                if (j == i || r[j, j] < limit) continue;
                double rho = r[i, j] / Math.Sqrt(r[i, i] * r[j, j]);
                if (Math.Abs(rho) < SeparabilityLimit) continue;
                apart.Add($"{control[j].Id} {control[j].P}");
                sameMark |= control[j].Id == id;
            }
            list.Add(new(id, p, ri, ri >= limit && !sameMark, apart));
        }
        return list;
    }

    /// <summary>I − H over the control components, H = G_c G_c⁺; null when too large to compute.</summary>
    private static Matrix<double>? ResidualProjector(AdjustmentResult result, List<(string Id, Parameter P)> control)
    {
        var columns = new Dictionary<(string, Parameter), int>();
        int Column(string owner, Parameter p)
        {
            if (!columns.TryGetValue((owner, p), out int c)) columns[(owner, p)] = c = columns.Count;
            return c;
        }
        foreach (var (id, p) in control) Column(id, p);
        var at = new AdjustedCoordinates(result);
        var rows = new List<Partial[]>();
        foreach (var o in result.Observations)
        {
            if (o.Input.Excluded) continue;
            var value = ObservationKindRegistry.Evaluate(o.Input, at);
            // weighted rows (1/σ) only for conditioning: the null space of A does not depend on the weights
            double sd = o.Input.StandardDeviation;
            double w = double.IsFinite(sd) && sd > 0 ? 1 / sd : 1;
            rows.Add(value.Partials.Select(x => x with { Derivative = x.Derivative * w }).ToArray());
            foreach (var x in value.Partials) Column(x.Owner, x.Parameter);
        }
        int u = columns.Count;
        if (u > MaxUnknowns) return null;
        var a = Matrix<double>.Build.Dense(Math.Max(rows.Count, 1), u);
        for (int i = 0; i < rows.Count; i++)
            foreach (var x in rows[i]) a[i, columns[(x.Owner, x.Parameter)]] += x.Derivative;
        if (a.Enumerate().Any(x => !double.IsFinite(x))) return null;
        MathNet.Numerics.LinearAlgebra.Factorization.Svd<double> svd;
        try
        {
            // with more rows than columns, the singular values and right vectors of A are those of R in A = QR
            // (thin), which spares the rows × rows left vectors
            var m = a.RowCount > u ? a.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin).R : a;
            svd = m.Svd(computeVectors: true);
        }
        catch (MathNet.Numerics.NonConvergenceException)
        {
            return null;
        }
        var s = svd.S;
        double tol = (s.Count > 0 ? s.Maximum() : 0) * 1e-10;
        int rank = s.Count(x => x > tol);
        var vt = svd.VT;
        int nc = control.Count;
        var g = Matrix<double>.Build.Dense(nc, Math.Max(u - rank, 1));
        for (int k = rank; k < u; k++)
            for (int i = 0; i < nc; i++) g[i, k - rank] = vt[k, columns[control[i]]];
        var gs = g.Svd(computeVectors: true);
        var h = Matrix<double>.Build.Dense(nc, nc);
        for (int k = 0; k < gs.S.Count; k++)
        {
            if (gs.S[k] <= 1e-7) continue;
            var col = gs.U.Column(k);
            h += col.OuterProduct(col);
        }
        return Matrix<double>.Build.DenseIdentity(nc) - h;
    }

    /// <summary>The adjusted coordinates and orientations of a result, for evaluating the design.</summary>
    private sealed class AdjustedCoordinates(AdjustmentResult result) : ICoordinates
    {
        private readonly Dictionary<string, AdjustedPoint> _points =
            result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        private readonly Dictionary<string, double> _orientations =
            result.Orientations.ToDictionary(o => o.SetId, o => o.Orientation, StringComparer.Ordinal);

        public PlanePoint Plane(string id) =>
            _points[id] is var p && p.E is double e && p.N is double n ? new PlanePoint(e, n)
                : new PlanePoint(p.Input.E ?? 0, p.Input.N ?? 0);

        public double Height(string id) => _points[id].H ?? _points[id].Input.H ?? 0;

        public double Orientation(string setId) => _orientations.TryGetValue(setId, out double v) ? v : 0;
    }
}
