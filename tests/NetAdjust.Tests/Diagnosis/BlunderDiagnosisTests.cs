using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Diagnosis;

public class BlunderDiagnosisTests
{
    internal static readonly AdjustmentOptions Quick = AdjustmentOptions.Default with
    {
        Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Never },
    };

    [Fact]
    public void SmokeTransposedDirection()
    {
        var net = DiagnosisNetworks.Draw(7);
        var r0 = Adjuster.Adjust(net, Quick);
        var o = net.Observations[1];
        var text = DiagnosisNetworks.Booked(o);
        var cands = BlunderDiagnosis.Transpositions(text);
        var bad = cands.Last(c => NetAdjust.Units.AnglePattern.Dms.Parse(c).Success);
        var val = NetAdjust.Units.AnglePattern.Dms.Parse(bad).Value.Radians;
        var net2 = DiagnosisNetworks.Replace(net, 1, DiagnosisNetworks.WithValue(o, val, bad) with
        {
            StandardDeviation = o.StandardDeviation, Source = o.Source,
        });
        var r = Adjuster.Adjust(net2, Quick);
        var d = BlunderDiagnosis.Diagnose(r);
        Assert.Fail($"clean global {r0.Statistics.GlobalTest.Passed}, {text} -> {bad}\n" + Dump(d));
    }

    internal static string Dump(NetAdjust.Diagnosis.Diagnosis d)
    {
        var sb = new System.Text.StringBuilder();
        foreach (var s in d.Suspects)
        {
            sb.AppendLine($"{s.Observation} w={s.W:F2} expl={s.Explained} indist={string.Join(",", s.Indistinguishable)}");
            foreach (var h in s.Ranked)
                sb.AppendLine($"  {h.Kind} stat={h.Statistic:F2} size={h.Size} cand={h.Candidate} " +
                    $"maxw={h.MaxAbsWAfter:F2} fits={h.FitsAfter} p={h.FitAfter:F3} {h.Description} | {h.Edit}");
        }
        return sb.ToString();
    }
}

public class TimingProbe
{
    [Fact]
    public void AdjustTime()
    {
        var net = DiagnosisNetworks.Draw(7);
        Adjuster.Adjust(net, BlunderDiagnosisTests.Quick);
        var sw = System.Diagnostics.Stopwatch.StartNew();
        for (int i = 0; i < 50; i++) Adjuster.Adjust(net, BlunderDiagnosisTests.Quick);
        var t1 = sw.Elapsed.TotalMilliseconds / 50;
        var r = Adjuster.Adjust(net, BlunderDiagnosisTests.Quick);
        sw.Restart();
        for (int i = 0; i < 50; i++) BlunderDiagnosis.Diagnose(r);
        Assert.Fail($"adjust {t1:F2} ms, n={net.Observations.Count}, global {r.Statistics.GlobalTest.Passed} diag {sw.Elapsed.TotalMilliseconds / 50:F2} ms");
    }
}
