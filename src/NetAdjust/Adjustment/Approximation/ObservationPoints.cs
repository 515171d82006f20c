using NetAdjust.Network;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// The points of every observation of a network as their indices in <see cref="SurveyNetwork.Points"/>, looked up
/// once (station, from, to without repeats, as <see cref="Observation.Points"/> lists them), so that the checks before
/// the adjustment work on integers instead of hashing point ids again in each pass.
/// </summary>
internal sealed class ObservationPoints
{
    private readonly int[] _indices;
    private readonly byte[] _counts;

    /// <summary>Looks up the points of each observation of <paramref name="network"/>.</summary>
    public ObservationPoints(SurveyNetwork network)
    {
        var observations = network.Observations;
        _indices = new int[3 * observations.Count];
        _counts = new byte[observations.Count];
        for (int i = 0; i < observations.Count; i++)
            _counts[i] = (byte)ObservationIndex.PointsOf(network, observations[i], _indices.AsSpan(3 * i, 3));
    }

    /// <summary>The number of observations.</summary>
    public int Count => _counts.Length;

    /// <summary>The indices of the points of observation <paramref name="i"/> (its index in the network's
    /// observations).</summary>
    public ReadOnlySpan<int> Of(int i) => _indices.AsSpan(3 * i, _counts[i]);
}
