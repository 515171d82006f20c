using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.Diagnosis;

public static partial class BlunderDiagnosis
{
    /// <summary>A discrete candidate: the amount ∇ along the trial's vector c that it means, with its words and
    /// edit.</summary>
    private sealed record Candidate(string Label, double Nabla, string Description, SuggestedEdit? Edit)
    {
        /// <summary>The point a wrong-point candidate names, or null.</summary>
        public string? Point { get; init; }

        /// <summary>True when a wrong-point candidate replaces an angle's backsight.</summary>
        public bool Backsight { get; init; }
    }

    /// <summary>One kind's bias model for one suspect: its vector c (row → entry; the bias of the booked
    /// observations per unit ∇), whether ∇ is free, and its discrete candidates.</summary>
    private sealed record Trial(BlunderKind Kind, IReadOnlyDictionary<int, double> C, IReadOnlyList<int> Observations,
        IReadOnlyList<Candidate> Candidates, bool Free, Func<double, double, string> FreeDescription,
        Func<double, SuggestedEdit?> FreeEdit)
    {
        /// <summary>How the correction is applied to a copy of the observations: the values less c∇ (default),
        /// the heights less ∇, or the target replaced.</summary>
        public Correction Applies { get; init; } = Correction.Values;

        /// <summary>Applies the correction by ∇ (or the candidate) to a copy of the network's observations.</summary>
        public void Apply(Observation[] obs, double nabla, Candidate? candidate)
        {
            foreach (var (j, c) in C)
                obs[j] = Applies switch
                {
                    Correction.TargetHeight => ObservationEdits.WithHeight(obs[j], -nabla, target: true),
                    Correction.InstrumentHeight => ObservationEdits.WithHeight(obs[j], -nabla, target: false),
                    Correction.Target when candidate?.Point is string p =>
                        ObservationEdits.Retarget(obs[j], p, candidate.Backsight),
                    _ => ObservationEdits.WithValue(obs[j], obs[j].Value - (c * nabla)),
                };
        }
    }

    /// <summary>How a trial's correction is applied.</summary>
    private enum Correction { Values, TargetHeight, InstrumentHeight, Target }

    private const double HeightStep = 0.001; // m, for ∂f/∂(height) by a forward difference
    private const double InternationalFoot = 0.3048;          // m, exact by definition (common practice)
    private const double SurveyFoot = 1200.0 / 3937.0;        // m, exact by definition (common practice)

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The trials of one suspect. Candidate biases and vectors are evaluated at <paramref name="at"/>:
    /// the adjustment with the suspect set aside, which its blunder does not distort.</summary>
    private static IEnumerable<Trial> Catalogue(AdjustmentResult result, AdjustmentResult at, int s,
        DiagnosisOptions options) => Catalogue(result, new AdjustedCoordinates(at), s, options);

    private static IEnumerable<Trial> Catalogue(AdjustmentResult result, ICoordinates at, int s,
        DiagnosisOptions options)
    {
        var all = result.Observations;
        var o = all[s].Input;
        bool On(BlunderKind k) => options.Enabled.Contains(k);
        string booked = BookedOrFormatted(o);
        var unit = new Dictionary<int, double> { [s] = 1.0 };

        yield return new Trial(BlunderKind.UnexplainedBias, unit, [s], [], true,
            (x, sd) => $"{o.Describe()} biased by {Amount(o, x)} (sd {Amount(o, sd)}), cause not named",
            _ => new SuggestedEdit(o.Source, "exclude", null, "true"));

        bool trig = o.Kind is ObservationKind.SlopeDistance or ObservationKind.Zenith;
        bool distance = o.Kind is ObservationKind.Distance or ObservationKind.SlopeDistance;
        bool horizontalAngle = o.Kind is ObservationKind.Direction or ObservationKind.Angle or ObservationKind.Azimuth;
        string occupation = Occupation(o);
        var live = Enumerable.Range(0, all.Count).Where(j => !all[j].Input.Excluded).ToList();

        if (trig && On(BlunderKind.TargetHeight))
        {
            var group = live.Where(j => all[j].Input.Kind is ObservationKind.SlopeDistance or ObservationKind.Zenith
                && Occupation(all[j].Input) == occupation && all[j].Input.To == o.To).ToList();
            double th = TargetHeightOf(o);
            var c = group.ToDictionary(j => j, j => HeightSensitivity(all[j].Input, at, target: true));
            var cands = new List<Candidate>();
            foreach (double d in Signed(options.RoundHeightsMetres))
                cands.Add(new Candidate($"{d.ToString("+0.0##;-0.0##", Inv)} m", d,
                    $"target height at {o.To} ({occupation}) booked {Math.Abs(d).ToString("F3", Inv)} m too " +
                    (d > 0 ? "high" : "low"),
                    new SuggestedEdit(o.Source, "target_height", th.ToString("F3", Inv),
                        (th - d).ToString("F3", Inv))));
            yield return new Trial(BlunderKind.TargetHeight, c, group, cands, group.Count > 1,
                (x, sd) => $"target height at {o.To} ({occupation}) booked {x.ToString("F3", Inv)} m too high " +
                    $"(sd {sd.ToString("F3", Inv)} m)",
                x => new SuggestedEdit(o.Source, "target_height", th.ToString("F3", Inv), (th - x).ToString("F3", Inv)))
                { Applies = Correction.TargetHeight };
        }

        if (trig && On(BlunderKind.InstrumentHeight))
        {
            var group = live.Where(j => all[j].Input.Kind is ObservationKind.SlopeDistance or ObservationKind.Zenith
                && Occupation(all[j].Input) == occupation).ToList();
            double ih = InstrumentHeightOf(o);
            var c = group.ToDictionary(j => j, j => HeightSensitivity(all[j].Input, at, target: false));
            var cands = new List<Candidate>();
            foreach (double d in Signed(options.RoundHeightsMetres).Where(d => ih - d >= 0))
                cands.Add(new Candidate($"{d.ToString("+0.0##;-0.0##", Inv)} m", d,
                    $"instrument height at {o.From} ({occupation}) booked {Math.Abs(d).ToString("F3", Inv)} m too " +
                    (d > 0 ? "high" : "low"),
                    new SuggestedEdit(o.Source, "instrument_height", ih.ToString("F3", Inv),
                        (ih - d).ToString("F3", Inv))));
            yield return new Trial(BlunderKind.InstrumentHeight, c, group, cands, group.Count > 1,
                (x, sd) => $"instrument height at {o.From} ({occupation}) booked {x.ToString("F3", Inv)} m too high " +
                    $"(sd {sd.ToString("F3", Inv)} m)",
                x => ih - x >= 0
                    ? new SuggestedEdit(o.Source, "instrument_height", ih.ToString("F3", Inv),
                        (ih - x).ToString("F3", Inv))
                    : null)
                { Applies = Correction.InstrumentHeight };
        }

        if (distance && On(BlunderKind.PrismConstant))
        {
            var group = live.Where(j => all[j].Input.Kind is ObservationKind.Distance or ObservationKind.SlopeDistance
                && Occupation(all[j].Input) == occupation && all[j].Input.To == o.To).ToList();
            var c = group.ToDictionary(j => j, _ => 1.0);
            var ks = options.PrismConstantsMetres;
            var diffs = new SortedSet<double>();
            foreach (double a in ks) foreach (double b in ks)
                if (Math.Abs(a - b) > 1e-6) diffs.Add(Math.Round(a - b, 6));
            var cands = diffs.Select(d => new Candidate($"{(d * 1000).ToString("+0.0;-0.0", Inv)} mm", d,
                $"distances to {o.To} ({occupation}) reduced with a prism constant {(Math.Abs(d) * 1000)
                    .ToString("F1", Inv)} mm too {(d > 0 ? "large" : "small")}",
                ValueEdit(o, booked, o.Value - d))).ToList();
            yield return new Trial(BlunderKind.PrismConstant, c, group, cands, group.Count > 1,
                (x, sd) => $"distances to {o.To} ({occupation}) offset by {Amount(o, x)} (sd {Amount(o, sd)})",
                x => ValueEdit(o, booked, o.Value - x));
        }

        if (distance && On(BlunderKind.FeetForMetres))
        {
            var cands = new (double F, string Label, string Words)[]
            {
                (InternationalFoot, "ft", "booked in international feet in a metre project"),
                (SurveyFoot, "US ft", "booked in US survey feet in a metre project"),
                (1 / InternationalFoot, "m for ft", "booked in metres in an international-foot project"),
                (1 / SurveyFoot, "m for US ft", "booked in metres in a US-survey-foot project"),
            }.Select(x => new Candidate(x.Label, o.Value - (x.F * o.Value), $"{o.Describe()} {x.Words}",
                ValueEdit(o, booked, x.F * o.Value))).ToList();
            yield return new Trial(BlunderKind.FeetForMetres, unit, [s], cands, false, (_, _) => "", _ => null);
        }

        if (distance && On(BlunderKind.SurveyFootForFoot))
        {
            double f = SurveyFoot / InternationalFoot; // 1.000002
            var cands = new (double F, string Label, string Words)[]
            {
                (f, "US ft for ft", "booked in US survey feet where international feet were meant"),
                (1 / f, "ft for US ft", "booked in international feet where US survey feet were meant"),
            }.Select(x => new Candidate(x.Label, o.Value - (x.F * o.Value), $"{o.Describe()} {x.Words}",
                ValueEdit(o, booked, x.F * o.Value))).ToList();
            yield return new Trial(BlunderKind.SurveyFootForFoot, unit, [s], cands, false, (_, _) => "", _ => null);
        }

        if ((horizontalAngle || o.Kind == ObservationKind.Zenith) && On(BlunderKind.FaceMixUp))
        {
            var cands = new List<Candidate>();
            if (horizontalAngle)
            {
                double corrected = Angle.Reduce0To2Pi(o.Value + Math.PI);
                foreach (double sign in new[] { 1.0, -1.0 })
                    cands.Add(new Candidate("180°", sign * Math.PI, $"{o.Describe()} off by 180° (face mix-up)",
                        ValueEdit(o, booked, corrected)));
            }
            else
            {
                double corrected = (2 * Math.PI) - o.Value;
                cands.Add(new Candidate("360° − z", Angle.ReduceSigned(o.Value - corrected),
                    $"{o.Describe()} booked in the other face (360° − z)", ValueEdit(o, booked, corrected)));
            }
            yield return new Trial(BlunderKind.FaceMixUp, unit, [s], cands, false, (_, _) => "", _ => null);
        }

        if (On(BlunderKind.Transposition))
        {
            var cands = new List<Candidate>();
            foreach (var text in Transpositions(booked))
            {
                if (ValueOfText(o, booked, text) is not double value) continue;
                double nabla = ObservationKinds.ValueIsAngle(o.Kind) ? Angle.ReduceSigned(o.Value - value)
                    : o.Value - value;
                if (nabla == 0) continue;
                cands.Add(new Candidate(text, nabla, $"{o.Describe()}: digits transposed, booked {booked}, " +
                    $"probably {text}", new SuggestedEdit(o.Source, "value", booked, text)));
            }
            if (cands.Count > 0)
                yield return new Trial(BlunderKind.Transposition, unit, [s], cands, false, (_, _) => "", _ => null);
        }

        if (On(BlunderKind.WrongPoint) && ObservationEdits.CanRetarget(o))
        {
            var cands = WrongPoints(result, o, at, options, backsight: false)
                .Concat(o.Kind == ObservationKind.Angle ? WrongPoints(result, o, at, options, backsight: true) : [])
                .ToList();
            if (cands.Count > 0)
                yield return new Trial(BlunderKind.WrongPoint, unit, [s], cands, false, (_, _) => "", _ => null)
                    { Applies = Correction.Target };
        }

        if (On(BlunderKind.SetBacksight) && o is DirectionObservation dir)
        {
            int first = live.FirstOrDefault(j => all[j].Input is DirectionObservation d && d.SetId == dir.SetId, -1);
            if (first >= 0 && first != s)
            {
                var bo = all[first].Input;
                string bBooked = BookedOrFormatted(bo);
                yield return new Trial(BlunderKind.SetBacksight, new Dictionary<int, double> { [first] = 1.0 },
                    [first], [], true,
                    (x, sd) => $"wrong backsight in set {dir.SetId}: the backsight reading to {bo.To} is off by " +
                        $"{Amount(bo, x)} (sd {Amount(bo, sd)}), so the set's foresights look rotated",
                    x => ValueEdit(bo, bBooked, Angle.Reduce0To2Pi(bo.Value - x)));
            }
        }
        else if (On(BlunderKind.SetBacksight) && o is AngleObservation ang)
        {
            var group = live.Where(j => all[j].Input is AngleObservation a && a.Backsight == ang.Backsight
                && Occupation(a) == occupation).ToList();
            if (group.Count > 1)
                yield return new Trial(BlunderKind.SetBacksight, group.ToDictionary(j => j, _ => 1.0), group, [],
                    true,
                    (x, sd) => $"wrong backsight on {ang.Backsight} at {occupation}: every angle turned from it is " +
                        "off " +
                        $"by {Amount(o, x)} (sd {Amount(o, sd)})",
                    _ => null);
        }
    }

    private static IEnumerable<Candidate> WrongPoints(AdjustmentResult result, Observation o, ICoordinates at,
        DiagnosisOptions options, bool backsight)
    {
        string booked = backsight ? o.From : o.To;
        string station = o.At ?? o.From;
        var byId = result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        var kind = ObservationKindRegistry.Of(o);
        bool plane = (kind.Axes & CoordinateAxes.Plane) != 0, height = (kind.Axes & CoordinateAxes.Height) != 0;
        if (!byId.TryGetValue(booked, out var bp)) yield break;
        double f0 = ObservationKindRegistry.Evaluate(o, at).Value;
        foreach (var p in result.Points)
        {
            if (p.Id == booked || p.Id == station
                || (o.Kind == ObservationKind.Angle && (p.Id == o.From || p.Id == o.To)))
                continue;
            if (plane && (p.E is null || p.N is null)) continue;
            if (height && p.H is null) continue;
            if (plane && bp.E is double be && bp.N is double bn
                && Math.Sqrt(((p.E!.Value - be) * (p.E.Value - be)) + ((p.N!.Value - bn) * (p.N.Value - bn)))
                    > options.ReachMetres)
                continue;
            var moved = ObservationEdits.Retarget(o, p.Id, backsight);
            double f1 = ObservationKindRegistry.Evaluate(moved, at).Value;
            double nabla = ObservationKinds.ValueIsAngle(o.Kind) ? Angle.ReduceSigned(f1 - f0) : f1 - f0;
            yield return new Candidate(p.Id, nabla,
                $"{o.Describe()} booked to {booked}, probably sighted to {p.Id}",
                new SuggestedEdit(o.Source, backsight ? "from" : "to", booked, p.Id))
            {
                Point = p.Id, Backsight = backsight,
            };
        }
    }

    /// <summary>The bias of the booked observation per metre of height booked too high: −∂f/∂(height), by a forward
    /// difference of the equation at the adjusted coordinates.</summary>
    private static double HeightSensitivity(Observation o, ICoordinates at, bool target)
    {
        var moved = ObservationEdits.WithHeight(o, HeightStep, target);
        double f0 = ObservationKindRegistry.Evaluate(o, at).Value;
        double f1 = ObservationKindRegistry.Evaluate(moved, at).Value;
        double df = ObservationKinds.ValueIsAngle(o.Kind) ? Angle.ReduceSigned(f1 - f0) : f1 - f0;
        return -df / HeightStep;
    }

    private static double TargetHeightOf(Observation o) => o switch
    {
        SlopeDistanceObservation sd => sd.TargetHeight.Metres,
        ZenithObservation z => z.TargetHeight.Metres,
        _ => 0,
    };

    private static double InstrumentHeightOf(Observation o) => o switch
    {
        SlopeDistanceObservation sd => sd.InstrumentHeight.Metres,
        ZenithObservation z => z.InstrumentHeight.Metres,
        _ => 0,
    };

    /// <summary>The occupation of an observation: its setup id, or its instrument point.</summary>
    private static string Occupation(Observation o) => o.SetupId is { } id ? $"setup {id}" : $"at {o.At ?? o.From}";

    private static IEnumerable<double> Signed(IEnumerable<double> amounts) =>
        amounts.SelectMany(a => new[] { a, -a });

    private static SuggestedEdit ValueEdit(Observation o, string booked, double corrected) =>
        new(o.Source, "value", booked, TextOfValue(o, booked, corrected));

    /// <summary>An amount in the observation's usual unit for words: ″ for angles, mm or m for lengths.</summary>
    private static string Amount(Observation o, double x) =>
        ObservationKinds.ValueIsAngle(o.Kind) ? $"{(x * Angle.ArcsecondsPerRadian).ToString("F1", Inv)}″"
        : Math.Abs(x) < 1 ? $"{(x * 1000).ToString("F1", Inv)} mm" : $"{x.ToString("F3", Inv)} m";

    /// <summary>The adjusted coordinates, orientations and refraction coefficients of a result.</summary>
    private sealed class AdjustedCoordinates(AdjustmentResult result) : ICoordinates
    {
        private readonly Dictionary<string, AdjustedPoint> _points =
            result.Points.ToDictionary(p => p.Id, StringComparer.Ordinal);
        private readonly Dictionary<string, double> _orientations =
            result.Orientations.ToDictionary(o => o.SetId, o => o.Orientation, StringComparer.Ordinal);
        private readonly Dictionary<string, double> _refraction =
            result.Refractions.ToDictionary(r => r.Group, r => r.Coefficient, StringComparer.Ordinal);

        public PlanePoint Plane(string id) =>
            _points[id] is var p && p.E is double e && p.N is double n ? new PlanePoint(e, n)
                : new PlanePoint(p.Input.E ?? 0, p.Input.N ?? 0);

        public double Height(string id) => _points[id].H ?? _points[id].Input.H ?? 0;

        public double Orientation(string setId) => _orientations.TryGetValue(setId, out double v) ? v : 0;

        public double Refraction(string group, double assumed) =>
            _refraction.TryGetValue(group, out double k) ? k : assumed;
    }
}
