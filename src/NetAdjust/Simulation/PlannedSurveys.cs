using NetAdjust.Network;

namespace NetAdjust.Simulation;

/// <summary>
/// Observations drawn for a planned network: each observation's true value plus Gaussian noise of its standard
/// deviation from the simulations' one seeded noise source (<see cref="SeededNoise"/>, the same as <c>simulate</c>),
/// written with that standard deviation so the drawn project is ready to adjust with the same weights.
/// </summary>
public static class PlannedSurveys
{
    /// <summary>Draws the observations.</summary>
    /// <param name="truth">The network whose observation values are the true ones (e.g. a plan at its design
    /// coordinates).</param>
    /// <param name="sd">One standard deviation per observation (SI), positive.</param>
    /// <param name="seed">The seed; the same seed gives the same draw.</param>
    /// <param name="withValue">Replaces an observation's value (SI) in its record.</param>
    /// <returns>The network with drawn values, each observation carrying its standard deviation.</returns>
    public static SurveyNetwork Draw(SurveyNetwork truth, IReadOnlyList<double> sd, int seed,
        Func<Observation, double, Observation> withValue)
    {
        ArgumentNullException.ThrowIfNull(truth);
        ArgumentNullException.ThrowIfNull(sd);
        ArgumentNullException.ThrowIfNull(withValue);
        if (sd.Count != truth.Observations.Count)
            throw new ArgumentException("one standard deviation per observation is needed", nameof(sd));
        var noise = new SeededNoise(seed);
        var obs = truth.Observations.Select((o, i) =>
            withValue(o, o.Value + noise.Gauss(sd[i])) with { StandardDeviation = sd[i], Weighting = null });
        return new SurveyNetwork(truth.Name, truth.Points, obs.ToList());
    }
}
