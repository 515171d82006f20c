using NetAdjust.Network;

namespace NetAdjust.Simulation;

/// <summary>One drawn demonstration survey: what its project file holds, and the truth it was drawn from.</summary>
/// <param name="Scenario">The scenario.</param>
/// <param name="Seed">The seed of the draw.</param>
/// <param name="Points">The points as the project file gives them (control values, approximations or none).</param>
/// <param name="Setups">Each instrument setup, in order: its station and its observations in the order written.</param>
/// <param name="Levelling">The levelled height differences (with their section lengths), in order.</param>
/// <param name="Truth">The chosen true coordinates (E, N or H, metres; NaN where the scenario has none), by id.</param>
/// <param name="Blunders">Blunders planted on purpose: the distance from a station to a point and its size (m).</param>
public sealed record DemoSurvey(
    DemoScenario Scenario,
    int Seed,
    IReadOnlyList<Point> Points,
    IReadOnlyList<(string At, IReadOnlyList<Observation> Observations)> Setups,
    IReadOnlyList<HeightDifferenceObservation> Levelling,
    IReadOnlyDictionary<string, (double E, double N, double H)> Truth,
    IReadOnlyList<(string At, string To, double Size)> Blunders)
{
    /// <summary>Setups booked as raw rounds in both faces (their observations are not in <see cref="Setups"/>);
    /// empty for the scenarios without them.</summary>
    public IReadOnlyList<DemoRoundsSetup> Rounds { get; init; } = [];

    /// <summary>GNSS baselines, in the order the sessions listed them; empty for the scenarios without them.
    /// </summary>
    public IReadOnlyList<DemoBaseline> Baselines { get; init; } = [];
}
