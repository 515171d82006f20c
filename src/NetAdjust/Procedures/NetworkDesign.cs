using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Misclosures;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Standards;
using NetAdjust.Units;

namespace NetAdjust.Procedures;

/// <summary>
/// Design of a network before the field (pre-analysis): a planned network, whose points carry design coordinates
/// and whose observations are planned sightings, is adjusted without measurements. Each planned observation is
/// given the value its equation takes at the design coordinates (directions with a zero orientation), so the
/// adjustment converges at once with zero residuals, and the same engine and stochastic model as any adjustment
/// give the expected standard deviations, absolute and relative ellipses, redundancy numbers, MDBs and external
/// reliability; these depend on the geometry and the weights only (docs/methods.md, "Design before the field").
/// </summary>
public static class NetworkDesign
{
    private sealed class DesignCoordinates(SurveyNetwork network) : ICoordinates
    {
        public PlanePoint Plane(string id)
        {
            var p = network[id];
            return p.E is double e && p.N is double n ? new PlanePoint(e, n)
                : throw new InvalidInputException($"{Where(p)}point {id} needs design coordinates (easting and " +
                    "northing) for a planned observation");
        }

        public double Height(string id)
        {
            var p = network[id];
            return p.H ?? throw new InvalidInputException(
                $"{Where(p)}point {id} needs a design height for a planned observation");
        }

        public double Orientation(string setId) => 0;

        private static string Where(Point p) => p.Source is null ? "" : $"{p.Source}: ";
    }

    /// <summary>
    /// The plan with every observation's value replaced by the value at the design coordinates (the given values,
    /// if any, are ignored): directions with a zero orientation, so the readings are the azimuths.
    /// </summary>
    /// <param name="plan">The planned network; every point an observation reaches needs design coordinates.</param>
    /// <exception cref="InvalidInputException">When a point lacks the coordinates a planned observation
    /// needs.</exception>
    public static SurveyNetwork AtDesign(SurveyNetwork plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var at = new DesignCoordinates(plan);
        var obs = plan.Observations.Select(o => WithValue(o, ObservationKindRegistry.Evaluate(o, at).Value));
        return new SurveyNetwork(plan.Name, plan.Points, obs.ToList());
    }

    /// <summary>
    /// Adjusts the plan without measurements (<see cref="AtDesign"/>); the variance factor is the a-priori one
    /// (known), since there are no residuals to estimate it from.
    /// </summary>
    /// <param name="plan">The planned network.</param>
    /// <param name="options">The adjustment options (datum, stochastic model, analysis); null for the default.</param>
    /// <returns>The result: its precision, redundancy numbers, MDBs and external reliability are the
    /// design's.</returns>
    public static AdjustmentResult Analyse(SurveyNetwork plan, AdjustmentOptions? options = null)
    {
        var o = options ?? AdjustmentOptions.Default;
        o = o with { Analysis = o.Analysis with { VarianceFactor = VarianceFactorBasis.Known } };
        return Adjuster.Adjust(AtDesign(plan), o);
    }

    /// <summary>
    /// Simulation from a plan: observations drawn from the plan's stochastic model at the design coordinates (the
    /// chosen truth), seeded, each with the standard deviation it was drawn with (<see
    /// cref="Simulation.PlannedSurveys"/>), ready to adjust.
    /// </summary>
    /// <param name="plan">The planned network; its design coordinates are the truth.</param>
    /// <param name="seed">The seed.</param>
    /// <param name="options">Options (centering model, a-priori variance factor); null for the default.</param>
    public static SurveyNetwork Simulate(SurveyNetwork plan, int seed, AdjustmentOptions? options = null)
    {
        var o = options ?? AdjustmentOptions.Default;
        var truth = AtDesign(plan);
        var model = Stochastic.StochasticModel.Build(truth, new DesignCoordinates(truth), o.Centering,
            o.AprioriVarianceFactor);
        return Simulation.PlannedSurveys.Draw(truth, model.StandardDeviations, seed, WithValue);
    }

    /// <summary>The value of an observation replaced (the record's kind and everything else kept).</summary>
    /// <param name="o">The observation.</param>
    /// <param name="value">The new value in SI units (m or rad).</param>
    internal static Observation WithValue(Observation o, double value)
    {
        ArgumentNullException.ThrowIfNull(o);
        return o switch
        {
            DistanceObservation d => d with { Distance = Units.Length.FromMetres(value) },
            DirectionObservation d => d with { Reading = Units.Angle.FromRadians(Normalise(value)) },
            AngleObservation a => a with { Measured = Units.Angle.FromRadians(Normalise(value)) },
            AzimuthObservation a => a with { Azimuth = Units.Angle.FromRadians(Normalise(value)) },
            HeightDifferenceObservation h => h with { Difference = Units.Length.FromMetres(value) },
            SlopeDistanceObservation s => s with { Distance = Units.Length.FromMetres(value) },
            ZenithObservation z => z with { Zenith = Units.Angle.FromRadians(value) },
            _ => throw new ArgumentException($"unknown observation type {o.GetType().Name}", nameof(o)),
        };
    }

    private static double Normalise(double a)
    {
        double r = a % (2 * Math.PI);
        return r < 0 ? r + (2 * Math.PI) : r;
    }

    /// <summary>
    /// The plan observed with another number of sets, and optionally another total station: every angular
    /// observation weighted from an instrument gets the procedure <paramref name="sets"/> (faces kept) and the
    /// instrument; an angular observation with a stated standard deviation (taken as that of one set) gets
    /// σ/√sets (error of redundant measurement).
    /// </summary>
    /// <param name="plan">The planned network.</param>
    /// <param name="sets">Number of sets, 1..1000.</param>
    /// <param name="instrument">The total station to weight with instead of the plan's; null to keep them.</param>
    public static SurveyNetwork WithSets(SurveyNetwork plan, int sets, TotalStationSpecification? instrument = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        var obs = plan.Observations.Select(o =>
        {
            if (!o.Kind.IsAngular()) return instrument is null || o.Weighting?.Instrument is null ? o
                : o with { Weighting = o.Weighting with { Instrument = instrument } };
            if (o.Weighting is { Instrument: not null } w)
                return o with
                {
                    Weighting = w with
                    {
                        Procedure = new ObservingProcedure(sets, w.Procedure.Faces),
                        Instrument = instrument ?? w.Instrument,
                    },
                };
            return double.IsNaN(o.StandardDeviation) ? o
                : o with { StandardDeviation = o.StandardDeviation / Math.Sqrt(sets) };
        });
        return new SurveyNetwork(plan.Name, plan.Points, obs.ToList());
    }
}

/// <summary>The worst ratio of a plan observed with a number of sets against a standard. Made by the procedure
/// recommendation only (the constructor is internal).</summary>
public sealed record SetsTrial
{
    /// <summary>Made by the procedure recommendation.</summary>
    internal SetsTrial(int Sets, double WorstRatio, string? WorstItem)
    {
        this.Sets = Sets; this.WorstRatio = WorstRatio; this.WorstItem = WorstItem;
    }

    /// <summary>Number of sets.</summary>
    public int Sets { get; internal init; }

    /// <summary>The largest value / allowance over the standard's items (≤ 1 meets it); NaN when the standard has no
    /// item with an allowance.</summary>
    public double WorstRatio { get; internal init; }

    /// <summary>The item with that ratio, or null.</summary>
    public string? WorstItem { get; internal init; }
}

/// <summary>The recommendation for one instrument: its trials for 1..N sets and the smallest number that meets the
/// standard. Made by the procedure recommendation only (the constructor is internal).</summary>
public sealed record InstrumentTrials
{
    /// <summary>Made by the procedure recommendation.</summary>
    internal InstrumentTrials(string Instrument, double DirectionSd, IReadOnlyList<SetsTrial> Trials, int? SmallestSets)
    {
        this.Instrument = Instrument; this.DirectionSd = DirectionSd; this.Trials = Trials;
        this.SmallestSets = SmallestSets;
    }

    /// <summary>The instrument's id (or <c>plan</c> for the plan's own weights).</summary>
    public string Instrument { get; internal init; }

    /// <summary>Its ISO 17123-3 direction standard deviation (rad); NaN for the plan's own.</summary>
    internal double DirectionSd { get; init; }

    /// <summary>One trial per number of sets, 1..N.</summary>
    public IReadOnlyList<SetsTrial> Trials { get; internal init; }

    /// <summary>The smallest number of sets that meets the standard everywhere; null when none of 1..N does.</summary>
    public int? SmallestSets { get; internal init; }

    /// <summary>Its ISO 17123-3 direction standard deviation; NaN for the plan's own.</summary>
    public Angle DirectionSdAngle => Lengths.Radians(DirectionSd);
}

/// <summary>The procedure recommendation for a plan and a standard. Made by the procedure recommendation only (the
/// constructor is internal).</summary>
public sealed record ProcedureRecommendation
{
    /// <summary>Made by the procedure recommendation.</summary>
    internal ProcedureRecommendation(AccuracyStandard Standard, IReadOnlyList<InstrumentTrials> Instruments,
        InstrumentTrials? Recommended)
    {
        this.Standard = Standard; this.Instruments = Instruments; this.Recommended = Recommended;
    }

    /// <summary>The standard.</summary>
    public AccuracyStandard Standard { get; internal init; }

    /// <summary>One entry per candidate (the least precise first), or the plan's own weights.</summary>
    public IReadOnlyList<InstrumentTrials> Instruments { get; internal init; }

    /// <summary>The least precise instrument that meets the standard within the sets tried (with its smallest number of
    /// sets), or null when none does.</summary>
    public InstrumentTrials? Recommended { get; internal init; }
}

/// <summary>
/// Recommends a procedure for a plan: the smallest number of sets (and, from candidate total stations, the least
/// precise one) with which the planned network meets an accuracy standard everywhere, with the worst ratio for 1 to
/// N sets, which shows the diminishing returns of more sets (docs/methods.md, "Procedure recommendation").
/// </summary>
public static class ProcedureAdvisor
{
    /// <summary>Tries 1..<paramref name="maxSets"/> sets with each candidate instrument.</summary>
    /// <param name="plan">The planned network.</param>
    /// <param name="options">Adjustment options; null for the default.</param>
    /// <param name="standard">The standard to meet (relative precision or geodetic accuracy with a class).</param>
    /// <param name="maxSets">The most sets to try, 1..100.</param>
    /// <param name="candidates">Candidate total stations; empty to keep the plan's own weights.</param>
    public static ProcedureRecommendation Recommend(SurveyNetwork plan, AdjustmentOptions? options,
        AccuracyStandard standard, int maxSets, IReadOnlyList<TotalStationSpecification>? candidates = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(standard);
        ArgumentOutOfRangeException.ThrowIfLessThan(maxSets, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(maxSets, 100);
        var list = candidates is { Count: > 0 }
            ? candidates.OrderByDescending(c => c.DirectionSd).Select(c => (TotalStationSpecification?)c).ToList()
            : [null];
        var all = new List<InstrumentTrials>();
        foreach (var instrument in list)
        {
            var trials = new List<SetsTrial>();
            int? smallest = null;
            for (int n = 1; n <= maxSets; n++)
            {
                var result = NetworkDesign.Analyse(NetworkDesign.WithSets(plan, n, instrument), options);
                var closures = standard.Kind == StandardKind.Levelling ? MisclosureCheck.Run(result.Network) : null;
                var items = StandardsCheck.Apply(result, [standard], closures).Items.Where(i => i.Ratio.HasValue)
                    .ToList();
                var worst = items.Count == 0 ? null : items.MaxBy(i => i.Ratio!.Value);
                double ratio = worst?.Ratio ?? double.NaN;
                trials.Add(new SetsTrial(n, ratio, worst?.Item));
                if (smallest is null && ratio <= 1) smallest = n;
            }
            all.Add(new InstrumentTrials(instrument?.Id ?? "plan", instrument?.DirectionSd ?? double.NaN, trials,
                smallest));
        }
        var meeting = all.Where(t => t.SmallestSets.HasValue).ToList();
        var recommended = meeting.FirstOrDefault(); // the least precise instrument that meets it
        return new ProcedureRecommendation(standard, all, recommended);
    }
}
