using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Tests.Diagnosis;

/// <summary>Plants one field blunder of a chosen kind in a drawn Ravelstone network and diagnoses it.</summary>
internal static class DiagnosisMonteCarlo
{
    public static readonly AdjustmentOptions Quick = AdjustmentOptions.Default with
    {
        Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Never },
    };

    /// <summary>Redundancy numbers and MDBs of the geometry (the same for every draw up to the approximations).
    /// </summary>
    private static readonly Lazy<NetworkAnalysis> Geometry = new(() => Adjuster.Adjust(DiagnosisNetworks.Draw(1),
        Quick).Analysis);

    /// <summary>One planted blunder: the network, the observations it touched, its kind, its true size in the
    /// units of the kind's ∇ (m or rad; null for discrete-only kinds) and the true point of a wrong sighting.</summary>
    public sealed record Planted(SurveyNetwork Network, int[] Touched, BlunderKind Kind, double? Size, string? Point);

    public sealed record Outcome(Planted Planted, SuspectDiagnosis? Suspect)
    {
        /// <summary>The diagnosed suspect is one of the touched observations.</summary>
        public bool Found => Suspect is not null && Planted.Touched.Contains(Suspect.Observation);

        public BlunderHypothesis? Top => Suspect?.Ranked[0];

        public bool FirstIsTrue => Found && Top!.Kind == Planted.Kind
            && (Planted.Point is null || Top.Candidate == Planted.Point);

        public bool FirstOrFlagged => FirstIsTrue || (Found && Suspect!.Indistinguishable.Any(p =>
            (p.First == Top!.Kind && p.Second == Planted.Kind) || (p.Second == Top!.Kind && p.First == Planted.Kind)));

        public BlunderHypothesis? TrueHypothesis => Found ? Suspect!.Ranked.FirstOrDefault(h => h.Kind == Planted.Kind)
            : null;
    }

    /// <summary>Plants and diagnoses (the three largest |w|); the outcome is the diagnosis of the first suspect
    /// the blunder touched, or of the first suspect when it touched none; null when the blundered network cannot
    /// be adjusted.</summary>
    public static Outcome? Run(BlunderKind kind, int seed)
    {
        var planted = Plant(kind, seed);
        AdjustmentResult result;
        try { result = Adjuster.Adjust(planted.Network, Quick); }
        catch (NetAdjustException) { return null; }
        var d = BlunderDiagnosis.Diagnose(result, DiagnosisOptions.Default with { MaxSuspects = 3 });
        var s = d.Suspects.FirstOrDefault(x => planted.Touched.Contains(x.Observation)) ?? d.Suspects.FirstOrDefault();
        return new Outcome(planted, s);
    }

    private static double Mdb(int i) => Geometry.Value.Observations[i].Mdb ?? double.NaN;

    private static double Redundancy(int i) => Geometry.Value.Observations[i].Redundancy;

    public static Planted Plant(BlunderKind kind, int seed)
    {
        var net = DiagnosisNetworks.Draw(seed);
        var rng = new Random((seed * 31) + (int)kind);
        var obs = net.Observations.ToArray();
        int Pick(Func<Observation, bool> which) =>
            Enumerable.Range(0, obs.Length).Where(i => which(obs[i]) && Redundancy(i) > 0.3).OrderBy(_ => rng.Next())
                .First();
        double Sign() => rng.Next(2) == 0 ? -1 : 1;
        SurveyNetwork With(Observation[] o) => new(net.Name, net.Points, o);
        string occupation(Observation o) => o.SetupId!;
        double[] round = [0.1, 0.2, 0.5];
        switch (kind)
        {
            case BlunderKind.UnexplainedBias:
            {
                int i = Pick(o => o.Kind is ObservationKind.Direction or ObservationKind.SlopeDistance
                    or ObservationKind.Zenith);
                double b = Sign() * 2 * Mdb(i);
                obs[i] = Rebook(obs[i], obs[i].Value + b);
                return new Planted(With(obs), [i], kind, b, null);
            }
            case BlunderKind.TargetHeight:
            {
                int i = Pick(o => o is SlopeDistanceObservation);
                var s = obs[i];
                double d = Sign() * round[rng.Next(round.Length)];
                var group = Enumerable.Range(0, obs.Length).Where(j => obs[j].Kind is ObservationKind.SlopeDistance
                    or ObservationKind.Zenith && occupation(obs[j]) == occupation(s) && obs[j].To == s.To).ToArray();
                foreach (int j in group) obs[j] = ObservationEdits.WithHeight(obs[j], d, target: true);
                return new Planted(With(obs), group, kind, d, null);
            }
            case BlunderKind.InstrumentHeight:
            {
                int i = Pick(o => o is SlopeDistanceObservation);
                double d = Sign() * round[rng.Next(round.Length)];
                var group = Enumerable.Range(0, obs.Length).Where(j => obs[j].Kind is ObservationKind.SlopeDistance
                    or ObservationKind.Zenith && occupation(obs[j]) == occupation(obs[i])).ToArray();
                foreach (int j in group) obs[j] = ObservationEdits.WithHeight(obs[j], d, target: false);
                return new Planted(With(obs), group, kind, d, null);
            }
            case BlunderKind.PrismConstant:
            {
                int i = Pick(o => o is SlopeDistanceObservation);
                double[] diffs = [0.0175, 0.030, 0.0344];
                double d = Sign() * diffs[rng.Next(diffs.Length)];
                obs[i] = Rebook(obs[i], obs[i].Value + d);
                return new Planted(With(obs), [i], kind, d, null);
            }
            case BlunderKind.FeetForMetres:
            {
                int i = Pick(o => o is SlopeDistanceObservation);
                obs[i] = Rebook(obs[i], obs[i].Value / 0.3048); // the number of feet read as metres
                return new Planted(With(obs), [i], kind, null, null);
            }
            case BlunderKind.FaceMixUp:
            {
                int i = Pick(o => o.Kind is ObservationKind.Direction or ObservationKind.Zenith);
                double v = obs[i].Kind == ObservationKind.Direction ? obs[i].Value + Math.PI
                    : (2 * Math.PI) - obs[i].Value;
                obs[i] = Rebook(obs[i], v);
                return new Planted(With(obs), [i], kind, null, null);
            }
            case BlunderKind.Transposition:
            {
                while (true)
                {
                    int i = Pick(o => o.Kind is ObservationKind.Direction or ObservationKind.SlopeDistance);
                    var o = obs[i];
                    string text = o.BookedText!;
                    var swaps = BlunderDiagnosis.Transpositions(text)
                        .Select(t => (Text: t, Value: ValueOf(o, t)))
                        .Where(x => x.Value is double v && Math.Abs(Difference(o, v)) >= 2 * Mdb(i))
                        .OrderBy(x => Math.Abs(Difference(o, x.Value!.Value))).ToList();
                    if (swaps.Count == 0) continue;
                    obs[i] = DiagnosisNetworks.WithValue(o, swaps[0].Value!.Value, swaps[0].Text);
                    return new Planted(With(obs), [i], kind, null, null);
                }
            }
            case BlunderKind.WrongPoint:
            {
                int i = Pick(o => o is DirectionObservation);
                var o = obs[i];
                var others = DiagnosisNetworks.Truth.Keys.Where(p => p != o.To && p != o.From).Order().ToList();
                string booked = others[rng.Next(others.Count)];
                obs[i] = ObservationEdits.Retarget(o, booked, backsight: false);
                return new Planted(With(obs), [i], kind, null, o.To);
            }
            case BlunderKind.SetBacksight:
            {
                var group = Enumerable.Range(0, obs.Length).Where(j => obs[j] is AngleObservation).ToArray();
                double b = Sign() * 2 * group.Max(Mdb);
                foreach (int j in group) obs[j] = Rebook(obs[j], obs[j].Value + b);
                return new Planted(With(obs), group, kind, b, null);
            }
            default:
                throw new ArgumentOutOfRangeException(nameof(kind), kind, "not simulated");
        }
    }

    private static Observation Rebook(Observation o, double value)
    {
        var x = DiagnosisNetworks.WithValue(o, value);
        // the value is what the booked text says, as a reader would give it
        return DiagnosisNetworks.WithValue(o, ValueOf(x, x.BookedText!)!.Value, x.BookedText);
    }

    private static double? ValueOf(Observation o, string text)
    {
        if (ObservationKinds.ValueIsAngle(o.Kind))
            return AnglePattern.Dms.Parse(text) is { Success: true } p ? p.Value.Radians : null;
        return double.Parse(text, CultureInfo.InvariantCulture);
    }

    private static double Difference(Observation o, double v) =>
        ObservationKinds.ValueIsAngle(o.Kind) ? Angle.ReduceSigned(v - o.Value) : v - o.Value;
}
