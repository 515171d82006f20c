using NetAdjust.Adjustment;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Network;

namespace NetAdjust.Procedures;

/// <summary>
/// Whether the observations can check a control mark of a datum sequence: the mark's plan position (or height) is
/// set free, the other control kept as given, and the network adjusted again. When the observations alone then
/// fix the mark, its given coordinates are checked by them (testable); when they do not (e.g. a reference mark that
/// only one sight line reaches, or a mark without which the rest of the control no longer fixes the datum), its
/// given coordinates cannot be checked: an error in them goes unseen or is blamed on another mark. The marks it is
/// joined to by observations are the ones it cannot be told apart from. docs/methods.md, "Datum".
/// </summary>
/// <param name="Id">The control mark.</param>
/// <param name="Part"><c>plan</c> or <c>height</c>.</param>
/// <param name="Testable">True when the observations fix the mark without its given coordinates, false when they
/// do not, null when the trial adjustment failed for another reason (e.g. it did not converge).</param>
/// <param name="Neighbours">The points joined to the mark by an observation, in input order.</param>
public sealed record ControlTestability(string Id, string Part, bool? Testable, IReadOnlyList<string> Neighbours)
{
    /// <summary>The points joined to the mark by an observation, in input order.</summary>
    public IReadOnlyList<string> Neighbours
    {
        get;
        init => field = ReadOnlyCopies.List(value);
    } = ReadOnlyCopies.List(Neighbours);

    /// <summary>One entry per controlled part (plan, height) of each control mark, in input order: one trial
    /// adjustment each.</summary>
    /// <param name="constrained">The constrained solution of the sequence.</param>
    /// <param name="discrepancies">The control discrepancies of the sequence (which marks and parts are
    /// control).</param>
    public static IReadOnlyList<ControlTestability> Of(AdjustmentResult constrained,
        IReadOnlyList<ControlDiscrepancy> discrepancies)
    {
        ArgumentNullException.ThrowIfNull(constrained);
        ArgumentNullException.ThrowIfNull(discrepancies);
        var network = constrained.Network;
        var options = constrained.Options with { Datum = DatumDefinition.ByControl, Progress = null };
        var list = new List<ControlTestability>();
        foreach (var d in discrepancies)
        {
            var p = network[d.Id];
            var neighbours = network.Observations.Where(o => o.Points.Contains(p.Id))
                .SelectMany(o => o.Points).Where(id => id != p.Id).Distinct(StringComparer.Ordinal).ToList();
            if (d.DE is not null || d.DN is not null)
                list.Add(new(p.Id, "plan", Fixes(network, options,
                    p with { Fixed = p.Fixed & ~Fixity.EN, SdE = null, SdN = null }), neighbours));
            if (d.DH is not null)
                list.Add(new(p.Id, "height", Fixes(network, options,
                    p with { Fixed = p.Fixed & ~Fixity.H, SdH = null }), neighbours));
        }
        return list;
    }

    /// <summary>True when the network with the given point set free in place of its own still adjusts.</summary>
    private static bool? Fixes(SurveyNetwork network, AdjustmentOptions options, Point freed)
    {
        var points = network.Points.Select(q => q.Id == freed.Id ? freed : q);
        try
        {
            Adjuster.Adjust(new SurveyNetwork(network.Name, points, network.Observations), options);
            return true;
        }
        catch (DatumDefectException)
        {
            return false;
        }
        catch (AdjustmentFailedException)
        {
            return null;
        }
    }
}
