using NetAdjust.Procedures;

namespace NetAdjust.IO.Results;

/// <summary>
/// The verdict on one control mark's discrepancy in a datum sequence: a component the observations cannot test
/// (<see cref="ControlTestability"/>) gets no pass or fail, since its standardised value may carry another mark's
/// error or none of its own; the others are judged by the w-test's critical value (docs/methods.md, "Datum").
/// </summary>
internal static class DiscrepancyVerdict
{
    /// <summary>The verdict written for a mark whose standardised discrepancies are all of untestable
    /// components.</summary>
    public const string NotTestableVerdict = "not testable";

    /// <summary>The mark's controlled components (E, N, H) that the observations cannot test, in that
    /// order.</summary>
    public static IReadOnlyList<string> NotTestable(SequenceResult s, ControlDiscrepancy d) =>
        s.Testability.Where(x => x.Id == d.Id && x.Testable == false).Select(x => x.Component.ToString()).ToList();

    /// <summary>The largest |w| over the components that can be tested; null when there is none.</summary>
    public static double? TestedMaxAbsW(SequenceResult s, ControlDiscrepancy d)
    {
        var skip = NotTestable(s, d);
        var w = new[] { ("E", d.WE), ("N", d.WN), ("H", d.WH) }
            .Where(x => x.Item2.HasValue && !skip.Contains(x.Item1)).Select(x => Math.Abs(x.Item2!.Value)).ToList();
        return w.Count > 0 ? w.Max() : null;
    }

    /// <summary>"fails" or "passes" by the components that can be tested, "not testable" when none can, null when no
    /// standardised value is formed (a component held by the minimal step).</summary>
    public static string? Of(SequenceResult s, ControlDiscrepancy d, double critical)
    {
        if (TestedMaxAbsW(s, d) is double m) return m > critical ? "fails" : "passes";
        return d.MaxAbsW.HasValue || NotTestable(s, d).Count > 0 ? NotTestableVerdict : null;
    }
}
