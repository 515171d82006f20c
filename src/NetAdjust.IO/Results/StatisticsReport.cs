using System.Globalization;
using System.Text;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// The statistics sections of the text report: observation tests and reliability, control tests, absolute and
/// relative error ellipses, and (when run) the blunder-hunt log, the robust estimation and the variance components.
/// Lines at most 100 columns; culture-invariant.
/// </summary>
internal static class StatisticsReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static void Append(StringBuilder sb, AdjustmentResult r, ReportContext c)
    {
        void Line(string s = "") => sb.Append(s.TrimEnd()).Append('\n');
        var u = c.Units;
        var a = r.Analysis;
        string lu = u.Length.Symbol, au = u.AngleSd.Symbol();
        double radPerSd = u.AngleSd.RadiansPerUnit();
        var units = new ReportUnits(u);
        string Len(double? m, int w) => units.Length(m).PadLeft(w);
        string Small(Observation o, double? si, int w) =>
            (si is double x && double.IsFinite(x) ? units.ObservationSmall(o.Kind, x) : "-").PadLeft(w);
        string Num(double? v, int d, int w) => v is double x && double.IsFinite(x) ? x.ToString("F" + d, Inv).PadLeft(w) : "-".PadLeft(w);
        bool gons = u.Angle == AngleFormat.Gons;
        string azUnit = gons ? "gon" : "deg";
        string Az(double rad, int w)
        {
            // [0, half turn) also after rounding: 179.997° prints as 0.00, never as 180.00
            double half = gons ? 200 : 180, x = Math.Round(rad * half / Math.PI, 2, MidpointRounding.AwayFromZero);
            return (x >= half ? x - half : x).ToString("F2", Inv).PadLeft(w);
        }
        string Basis() => a.Basis == VarianceFactorBasis.Known
            ? $"variance factor known (a priori {F(a.VarianceFactor, 4)})"
            : $"variance factor estimated ({F(a.VarianceFactor, 4)})";

        Line("TESTS OF THE OBSERVATIONS (redundancy numbers, w-test, tau test, internal and external reliability)");
        Line($"  Deciding test: {(a.Basis == VarianceFactorBasis.Known ? "w-test (Baarda)" : "tau test (Pope)")}; {Basis()}");
        Line($"  w-test: alpha0 {F(a.Options.WTestAlpha, 4)} two-sided, critical value {F(a.WCritical, 3)}; " +
             $"MDB for power {F(1 - a.Options.TypeIIError, 2)}: delta0 {F(a.Delta0, 3)}");
        Line($"  Tau test: overall alpha {F(a.Options.TauAlpha, 3)}, {(a.Options.TauAdjustment == MultipleTestAdjustment.Sidak ? "Sidak" : "Bonferroni")} " +
             $"split over {r.Statistics.Observations} observations, critical value {(a.TauCritical is double tc ? F(tc, 3) : "n/a (r < 2)")}");
        Line($"  Sum of redundancy numbers {F(Math.Round(a.RedundancySum, 3) + 0.0, 3)} (degrees of freedom {r.Statistics.DegreesOfFreedom})");
        Line($"  Residuals and MDB in {lu} or {au}; ext. rel. = largest point shift ({lu}) from an undetected MDB" +
             (a.ExternalReliabilityComputed ? "" : " (not computed)"));
        Line($"  {"#",4} {"Kind",-9} {"At",-6} {"From",-6} {"To",-6} {"Residual",9} {"r",5} {"w",6} {"tau",6} {"MDB",8} {"Ext.rel.",8} Flag");
        int rejected = 0, uncontrolled = 0, weak = 0, excluded = 0;
        foreach (var o in r.Observations)
        {
            var i = o.Input;
            var t = a.Observations[o.Index];
            switch (t.Flag)
            {
                case ObservationFlag.Rejected: rejected++; break;
                case ObservationFlag.Uncontrolled: uncontrolled++; break;
                case ObservationFlag.Weak: weak++; break;
                case ObservationFlag.Excluded: excluded++; break;
            }
            string flag = t.Flag switch
            {
                ObservationFlag.Rejected => "REJECTED",
                ObservationFlag.Uncontrolled => "uncontrolled",
                ObservationFlag.Weak => "weak",
                ObservationFlag.Excluded => "set aside",
                _ => "",
            };
            if (i.SdFactor != 1.0) flag += (flag.Length > 0 ? " " : "") + $"sd x{i.SdFactor.ToString("0.###", Inv)}";
            Line($"  {o.Index + 1,4} {ObservationLabels.Short(i.Kind),-9} {TextReportWriter.Clip(i.At ?? "", 6),-6} {TextReportWriter.Clip(i.Kind == ObservationKind.Direction ? "" : i.From, 6),-6} {TextReportWriter.Clip(i.To, 6),-6} " +
                 $"{Small(i, o.Residual, 9)} {Num(t.Flag == ObservationFlag.Excluded ? null : t.Redundancy, 2, 5)} {Num(t.W, 2, 6)} {Num(t.Tau, 2, 6)} " +
                 $"{Small(i, t.Mdb, 8)} {Len(t.ExternalReliability, 8)} {flag}");
        }
        Line($"  Rejected: {rejected}; uncontrolled (r < {F(a.Options.UncontrolledRedundancy, 2)}): {uncontrolled}; " +
             $"weakly controlled (r < {F(a.Options.WeakRedundancy, 2)}): {weak}; set aside: {excluded}");
        if (excluded > 0)
        {
            Line("  Set-aside observations carry no weight: their residual is the misclosure against the adjusted");
            Line("  coordinates, and w its standardised value.");
        }
        Line();

        if (a.Control.Count > 0)
        {
            Line($"TESTS OF THE WEIGHTED CONTROL ({lu})");
            Line($"  {"Point",-12} {"Comp.",5} {"Residual",9} {"r",5} {"w",7} {"tau",7} {"MDB",9} Flag");
            foreach (var ct in a.Control)
                Line($"  {TextReportWriter.Clip(ct.PointId, 12),-12} {ct.Component,5} {Len(ct.Residual, 9)} {Num(ct.Test.Redundancy, 2, 5)} {Num(ct.Test.W, 2, 7)} " +
                     $"{Num(ct.Test.Tau, 2, 7)} {Len(ct.Test.Mdb, 9)} {ct.Test.Flag.Name() ?? ""}");
            Line();
        }

        string level = (a.Options.ConfidenceLevel * 100).ToString("0.#", Inv) + "%";
        if (a.Points.Any(p => p.Ellipse is not null || p.SdHeight is not null))
        {
            Line($"ERROR ELLIPSES ({lu}; azimuth of the semi-major axis in {azUnit} from north)");
            Line($"  {char.ToUpperInvariant(Basis()[0])}{Basis()[1..]}");
            Line($"  Confidence scale for {level}: {F(a.EllipseScale, 4)} " +
                 (a.Basis == VarianceFactorBasis.Known ? "(sqrt of chi-square, 2 dof)" : $"(sqrt(2 F(2, {r.Statistics.DegreesOfFreedom})))") +
                 $"; heights {F(a.IntervalScale, 4)}");
            Line($"  {"Point",-12} {"a",9} {"b",9} {"Azimuth",8} {"a " + level,9} {"b " + level,9} {"sd H",9} {"H " + level,9}");
            foreach (var p in a.Points)
            {
                if (p.Ellipse is null && p.SdHeight is null) continue;
                var e = p.Ellipse; var k = p.Confidence;
                var input = r.Network[p.Id];
                if ((e is null || input.IsFixed(Fixity.EN)) && (p.SdHeight is null || input.IsFixed(Fixity.H)))
                {
                    Line($"  {TextReportWriter.Clip(p.Id, 12),-12} {"held",9}");
                    continue;
                }
                Line($"  {TextReportWriter.Clip(p.Id, 12),-12} {Len(e?.A, 9)} {Len(e?.B, 9)} {(e is ErrorEllipse ee ? Az(ee.Azimuth, 8) : "-".PadLeft(8))} " +
                     $"{Len(k?.A, 9)} {Len(k?.B, 9)} {Len(p.SdHeight, 9)} {Len(p.HeightConfidence, 9)}");
            }
            Line();
        }

        if (a.Relative.Count > 0)
        {
            Line($"RELATIVE ERROR ELLIPSES ({lu}; azimuth in {azUnit}; relative distance precision 1:k; azimuth sd in {au})");
            Line($"  {"From",-8} {"To",-8} {"a",8} {"b",8} {"Azimuth",8} {"a " + level,8} {"Distance",11} {"sd dist",8} {"1:k",9} {"sd az",7}");
            foreach (var rel in a.Relative)
                Line($"  {TextReportWriter.Clip(rel.From, 8),-8} {TextReportWriter.Clip(rel.To, 8),-8} {Len(rel.Ellipse.A, 8)} {Len(rel.Ellipse.B, 8)} {Az(rel.Ellipse.Azimuth, 8)} " +
                     $"{Len(rel.Confidence.A, 8)} {Len(rel.Distance, 11)} {Len(rel.SdDistance, 8)} {(double.IsFinite(rel.Ratio) ? rel.Ratio.ToString("F0", Inv) : "exact"),9} " +
                     $"{units.SmallAngle(rel.SdAzimuth),7}{(rel.Observed ? "" : " *")}");
            if (a.Relative.Any(x => !x.Observed)) Line("  * pair listed in the project file (not joined by an observation)");
            Line();
        }

        if (a.RelativeHeights.Count > 0)
        {
            Line($"RELATIVE HEIGHT PRECISION ({lu}; standard deviation of the height difference and its {level} half-width)");
            Line($"  {"From",-10} {"To",-10} {"dH",11} {"sd dH",9} {"dH " + level,9}");
            foreach (var rh in a.RelativeHeights)
                Line($"  {TextReportWriter.Clip(rh.From, 10),-10} {TextReportWriter.Clip(rh.To, 10),-10} {Len(rh.Difference, 11)} {Len(rh.SdDifference, 9)} {Len(rh.Confidence, 9)}{(rh.Observed ? "" : " *")}");
            if (a.RelativeHeights.Any(x => !x.Observed)) Line("  * pair listed in the project file (not joined by an observation)");
            Line();
        }

        if (c.Hunt is BlunderHunt h)
        {
            Line("BLUNDER HUNT (iterative data snooping: one observation set aside per round)");
            Line($"  {"Round",5} {"r",5} {"Var.factor",10} {"Global",7} {"Worst observation",-34} {"Statistic",9} {"Critical",8}  Action");
            foreach (var round in h.Rounds)
            {
                // without its source, so that the kind and points fit the column; the sources are listed below
                string worst = round.WorstIndex is int wi ? $"#{wi + 1} {(r.Network.Observations[wi] with { Source = null }).Describe()}" : "-";
                Line($"  {round.Round,5} {round.DegreesOfFreedom,5} {Num(round.VarianceFactor, 4, 10)} {(round.GlobalTestPassed is bool g ? (g ? "passed" : "FAILED") : "n/a"),7} " +
                     $"{TextReportWriter.Clip(worst, 34),-34} {Num(round.WorstStatistic, 2, 9)} {Num(round.Critical, 2, 8)}  {(round.SetAside ? "set aside" : "-")}");
            }
            Line($"  Stopped: {h.StopReason}.");
            if (h.SetAside.Count > 0)
            {
                Line("  Set aside, in the order found:");
                foreach (int i in h.SetAside)
                    foreach (var part in Wrap($"#{i + 1} {r.Network.Observations[i].Describe()}", 94)) Line("    " + part);
                Line("  To keep these decisions, mark the observations 'exclude: true' (or re-weight them with");
                Line("  'sd_factor') in the project file, or re-measure.");
            }
            Line();
        }

        if (c.Robust is RobustEstimate rb)
        {
            Line($"ROBUST ESTIMATION ({(rb.Method == RobustMethod.Huber ? "Huber" : "Danish method")}, c = {F(rb.Tuning, 2)}; " +
                 $"{rb.Iterations} re-weightings, {(rb.Converged ? "converged" : "NOT converged")})");
            Line("  Observations down-weighted (weight factor below 1), with |u| = the |w| each would get at full");
            Line("  weight against the others as re-weighted (docs/methods.md):");
            int shown = 0;
            for (int i = 0; i < rb.WeightFactors.Count; i++)
            {
                if (rb.WeightFactors[i] >= 1) continue;
                shown++;
                bool sus = rb.Suspected.Contains(i);
                Line($"  #{i + 1,-4} {TextReportWriter.Clip((r.Network.Observations[i] with { Source = null }).Describe(), 34),-34} factor {rb.WeightFactors[i].ToString("0.0000", Inv)}  " +
                     $"|u| {Num(rb.Standardised[i], 2, 6)}{(sus ? "  SUSPECTED" : "")}");
            }
            if (shown == 0) Line("  none");
            Line($"  Suspected blunders (|u| above {F(a.WCritical, 2)}): {(rb.Suspected.Count == 0 ? "none" : string.Join(", ", rb.Suspected.Select(i => "#" + (i + 1))))}");
            foreach (int i in rb.Suspected)
                foreach (var part in Wrap($"#{i + 1} {r.Network.Observations[i].Describe()}", 94)) Line("    " + part);
            Line("  The robust solution only locates suspects: exclude or re-measure them, then adjust as usual.");
            Line();
        }

        if (c.Components is VarianceComponentEstimate vc)
        {
            Line($"VARIANCE COMPONENTS PER OBSERVATION GROUP (Foerstner; {vc.Iterations} iterations, {(vc.Converged ? "converged" : "NOT converged")})");
            Line($"  {"Group",-18} {"n",5} {"Redund.",8} {"Var.factor",10} {"sd scale",9}  Implied specification");
            foreach (var g in vc.Groups)
            {
                string spec = g.ConstantPart is double ca && g.PpmPart is double pb
                    ? (u.Length == LengthUnit.Metre ? (ca * 1000).ToString("0.0", Inv) + " mm" : Length.FromMetres(ca).In(u.Length).ToString("0.0000", Inv) + " " + lu) + " + " + pb.ToString("0.0", Inv) + " ppm"
                    : g.ScaledSd is double sd && double.IsFinite(sd) ? (g.Kind.IsAngular() ? $"sd {(sd / radPerSd).ToString("0.00", Inv)} {au}" : $"sd {Length.FromMetres(sd).In(u.Length).ToString("0.0000", Inv)} {lu}")
                    : double.IsFinite(g.SdScale) ? $"given sd x {g.SdScale.ToString("0.000", Inv)}" : "not estimable";
                Line($"  {ObservationLabels.Short(g.Kind),-18} {g.Count,5} {Num(g.Redundancy, 2, 8)} {Num(g.VarianceFactor, 3, 10)} {Num(g.SdScale, 3, 9)}  {spec}");
                if (g.Note is not null) foreach (var part in Wrap("note: " + g.Note, 94)) Line("    " + part);
            }
            Line("  A variance factor of 1 means the group's given standard deviations fit its residuals.");
            Line();
        }
    }

    private static string F(double v, int d) => v.ToString("F" + d, Inv);

    private static IEnumerable<string> Wrap(string text, int width)
    {
        var line = new StringBuilder();
        foreach (var word in text.Split(' '))
        {
            if (line.Length > 0 && line.Length + 1 + word.Length > width) { yield return line.ToString(); line.Clear().Append("  "); }
            if (line.Length > 0 && line.ToString() != "  ") line.Append(' ');
            line.Append(word);
        }
        if (line.Length > 0) yield return line.ToString();
    }
}
