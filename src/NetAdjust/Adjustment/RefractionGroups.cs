using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// The groups of zenith angles whose refraction coefficient k is an unknown (docs/methods.md, "Refraction
/// coefficient as an unknown"): one unknown per group, started at the group's assumed k.
/// </summary>
internal static class RefractionGroups
{
    /// <summary>
    /// The estimated groups in order of first appearance with their start values, and whether each has an
    /// observation that is not set aside (only those get an unknown).
    /// </summary>
    /// <exception cref="InvalidInputException">When an estimated zenith angle names no group, or the zenith angles
    /// of one group disagree on k or on whether it is estimated.</exception>
    public static List<(string Group, double Start, bool Active)> Estimated(SurveyNetwork network)
    {
        var seen = new Dictionary<string, (ZenithObservation First, int At)>(StringComparer.Ordinal);
        var list = new List<(string Group, double Start, bool Active)>();
        foreach (var z in network.Observations.OfType<ZenithObservation>())
        {
            if (z.RefractionGroup is not string g)
            {
                if (z.RefractionEstimated)
                    throw new InvalidInputException(
                        $"{z.Describe()}: its refraction coefficient is to be estimated but it names no group");
                continue;
            }
            if (seen.TryGetValue(g, out var first))
            {
                if (first.First.RefractionEstimated != z.RefractionEstimated
                    || (!z.RefractionEstimated && first.First.Refraction != z.Refraction))
                    throw new InvalidInputException(
                        $"{z.Describe()}: refraction group {g} must have one coefficient, estimated or not, for all " +
                        $"its zenith angles ({first.First.Describe()} differs)");
                if (first.At >= 0 && !z.Excluded) list[first.At] = list[first.At] with { Active = true };
                continue;
            }
            int at = -1;
            if (z.RefractionEstimated)
            {
                at = list.Count;
                list.Add((g, z.Refraction, !z.Excluded));
            }
            seen[g] = (z, at);
        }
        return list;
    }
}
