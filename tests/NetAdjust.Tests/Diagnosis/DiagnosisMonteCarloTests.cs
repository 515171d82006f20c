using NetAdjust.Diagnosis;

namespace NetAdjust.Tests.Diagnosis;

public class DiagnosisMonteCarloProbe
{
    [Theory]
    [InlineData(BlunderKind.UnexplainedBias)]
    [InlineData(BlunderKind.TargetHeight)]
    [InlineData(BlunderKind.InstrumentHeight)]
    [InlineData(BlunderKind.PrismConstant)]
    [InlineData(BlunderKind.FeetForMetres)]
    [InlineData(BlunderKind.FaceMixUp)]
    [InlineData(BlunderKind.Transposition)]
    [InlineData(BlunderKind.WrongPoint)]
    [InlineData(BlunderKind.SetBacksight)]
    public void Probe(BlunderKind kind)
    {
        int n = int.Parse(Environment.GetEnvironmentVariable("DIAG_PROBE_RUNS") ?? "20",
            System.Globalization.CultureInfo.InvariantCulture);
        var sw = System.Diagnostics.Stopwatch.StartNew();
        var outs = Enumerable.Range(1, n).Select(s => DiagnosisMonteCarlo.Run(kind, 1000 + s)).OfType<DiagnosisMonteCarlo.Outcome>().ToList();
        var sizes = outs.Select(o => o.TrueHypothesis).Where(h => h?.Size is not null).Zip(outs.Where(o =>
            o.TrueHypothesis?.Size is not null)).Select(x => Math.Abs(x.First!.Size!.Value - x.Second.Planted.Size!.Value)
            <= x.First.SizeSd!.Value).ToList();
        var wrong = outs.Where(o => !o.FirstIsTrue).Take(4).Select(o => $"found={o.Found} top={o.Top?.Kind} " +
            $"{o.Top?.Candidate} fits={o.Top?.FitsAfter} p={o.Top?.FitAfter:F3} true={o.TrueHypothesis?.FitsAfter}" +
            $"/{o.TrueHypothesis?.FitAfter:F3}/{o.TrueHypothesis?.MaxAbsWAfter:F2} " +
            $"indist={string.Join(",", o.Suspect?.Indistinguishable ?? [])}");
        Assert.Fail($"{kind}: runs {outs.Count}, first {outs.Count(o => o.FirstIsTrue)}/{n}, flagged {outs.Count(o => o.FirstOrFlagged)}" +
            $", found {outs.Count(o => o.Found)}, explained {outs.Count(o => o.Suspect?.Explained == true)}, " +
            $"size within sd {sizes.Count(x => x)}/{sizes.Count}, {sw.Elapsed.TotalSeconds:F1} s\n" +
            string.Join("\n", wrong));
    }
}
