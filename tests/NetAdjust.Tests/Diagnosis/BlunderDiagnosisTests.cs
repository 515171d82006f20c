using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.Network;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Tests.Diagnosis;

public class BlunderDiagnosisTests
{
    private static AdjustmentResult Adjust(SurveyNetwork net) => Adjuster.Adjust(net, DiagnosisMonteCarlo.Quick);

    private static int IndexOf(SurveyNetwork net, ObservationKind kind, string from, string to) =>
        net.Observations.Select((o, i) => (o, i)).First(x => x.o.Kind == kind && x.o.From == from && x.o.To == to).i;

    [Fact]
    public void ASightingBookedToTheWrongPointIsDiagnosedWithTheRightPoint()
    {
        // The direction Q2→Q3 booked to Q5 (450 m from Q3, within reach): the only bias that puts the network back
        // in order is the direction to Q3 (common practice: a wrong point id in the field book).
        var net = DiagnosisNetworks.Draw(21);
        int i = IndexOf(net, ObservationKind.Direction, "Q2", "Q3");
        var booked = DiagnosisNetworks.Replace(net, i, ObservationEdits.Retarget(net.Observations[i], "Q5", false));
        var d = BlunderDiagnosis.Diagnose(Adjust(booked));
        var s = d.Suspects.First(x => x.Observation == i);
        var top = s.Ranked[0];
        Assert.Equal(BlunderKind.WrongPoint, top.Kind);
        Assert.Equal("Q3", top.Candidate);
        Assert.True(top.FitsAfter);
        Assert.True(s.Explained);
        Assert.Equal(new SuggestedEdit(net.Observations[i].Source, "to", "Q5", "Q3"), top.Edit);
        Assert.Contains(s.Ranked, h => h.Kind == BlunderKind.UnexplainedBias);
    }

    [Fact]
    public void TwoTransposedDegreeDigitsAreSwappedBack()
    {
        // 27° of blunder from swapping the tens and units of the degrees: the set-aside adjustment sees it whole and
        // the transposition back to the booked digits fits (hand-worked: 247 ↔ 274).
        var net = DiagnosisNetworks.Draw(7);
        int i = IndexOf(net, ObservationKind.Direction, "RV1", "Q1");
        var o = net.Observations[i];
        string text = o.BookedText!;
        Assert.Equal("247-11-57.9", text);
        var bad = DiagnosisNetworks.WithValue(o, AnglePattern.Dms.Parse("274-11-57.9").Value.Radians, "274-11-57.9");
        var d = BlunderDiagnosis.Diagnose(Adjust(DiagnosisNetworks.Replace(net, i, bad)));
        var s = d.Suspects.First(x => x.Observation == i);
        Assert.Equal(BlunderKind.Transposition, s.Ranked[0].Kind);
        Assert.Equal(new SuggestedEdit(o.Source, "value", "274-11-57.9", "247-11-57.9"), s.Ranked[0].Edit);
        Assert.True(s.Explained);
    }

    [Fact]
    public void ATargetHeightBookedHalfAMetreTooHighIsFoundWithItsAmount()
    {
        var net = DiagnosisNetworks.Draw(8);
        var obs = net.Observations.ToArray();
        for (int j = 0; j < obs.Length; j++)
            if (obs[j].SetupId == "S-RV2" && obs[j].To == "Q3") obs[j] = ObservationEdits.WithHeight(obs[j], 0.5, true);
        var d = BlunderDiagnosis.Diagnose(Adjust(new SurveyNetwork(net.Name, net.Points, obs)));
        var s = d.Suspects.First(x => obs[x.Observation].SetupId == "S-RV2" && obs[x.Observation].To == "Q3");
        var top = s.Ranked[0];
        Assert.Equal(BlunderKind.TargetHeight, top.Kind);
        Assert.Equal("+0.5 m", top.Candidate);
        Assert.InRange(top.Size!.Value, 0.5 - (4 * top.SizeSd!.Value), 0.5 + (4 * top.SizeSd.Value));
        // the typed view: a wrong height is a length even though the biased zenith angles are angles
        Assert.Equal(top.Size.Value, top.EstimatedSize!.Value.AsLength!.Value.Metres);
        Assert.Equal("target_height", top.Edit!.Item);
        double booked = double.Parse(top.Edit.Booked!, System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal((booked - 0.5).ToString("F3", System.Globalization.CultureInfo.InvariantCulture),
            top.Edit.Suggested);
    }

    [Fact]
    public void ASwitchedOffKindIsNotTriedButTheUnexplainedBiasAlwaysIs()
    {
        var net = DiagnosisNetworks.Draw(21);
        int i = IndexOf(net, ObservationKind.Direction, "Q2", "Q3");
        var result = Adjust(DiagnosisNetworks.Replace(net, i, ObservationEdits.Retarget(net.Observations[i], "Q5",
            false)));
        var options = DiagnosisOptions.Default with { Enabled = new HashSet<BlunderKind> { BlunderKind.FaceMixUp } };
        var s = BlunderDiagnosis.Diagnose(result, options).Suspects.First(x => x.Observation == i);
        Assert.Equal([BlunderKind.UnexplainedBias, BlunderKind.FaceMixUp], s.Ranked.Select(h => h.Kind).Order());
        Assert.False(s.Explained);
    }

    [Fact]
    public void ACleanNetworkThatPassesHasNoSuspects()
    {
        var result = Adjust(DiagnosisNetworks.Draw(7));
        Assert.True(result.Statistics.GlobalTest.Passed);
        Assert.Empty(BlunderDiagnosis.Diagnose(result).Suspects);
    }

    [Fact]
    public void OptionsOutOfRangeAreInvalidInput()
    {
        var result = Adjust(DiagnosisNetworks.Draw(7));
        Assert.Throws<InvalidInputException>(() =>
            BlunderDiagnosis.Diagnose(result, DiagnosisOptions.Default with { Alpha = 0 }));
        Assert.Throws<InvalidInputException>(() =>
            BlunderDiagnosis.Diagnose(result, DiagnosisOptions.Default with { ReachMetres = -1 }));
        Assert.Throws<InvalidInputException>(() =>
            BlunderDiagnosis.Diagnose(result, DiagnosisOptions.Default with { RoundHeightsMetres = [0.1, 0] }));
        Assert.Throws<InvalidInputException>(() =>
            BlunderDiagnosis.Diagnose(result, DiagnosisOptions.Default with { MaxSuspects = 0 }));
    }

    [Fact]
    [Trait("Category", "MonteCarlo")]
    public void WithoutABlunderExplainedDiagnosesStayNearAlpha()
    {
        // Without a blunder a suspect arises only from a false w-test alarm, at rate α per observation (Baarda 1968);
        // an explained diagnosis needs such a suspect, so the count over n·N observations is Binomial(nN, ≤ α). The
        // bound is its 0.999 quantile (MathNet's binomial distribution): 23 of 11,100 observations. Measured: 14
        // false w-test alarms (α·n = 11.1), 23 suspects with the worst three of failing global tests, none explained.
        const int runs = 150;
        int explained = 0, observations = 0;
        for (int seed = 5001; seed < 5001 + runs; seed++)
        {
            var result = Adjust(DiagnosisNetworks.Draw(seed));
            observations += result.Observations.Count;
            explained += BlunderDiagnosis.Diagnose(result).Suspects.Count(s => s.Explained);
        }
        int bound = 0;
        while (Binomial.CDF(0.001, observations, bound) < 0.999) bound++;
        Assert.InRange(explained, 0, bound);
    }
}

public class BlunderDiagnosisSuspectTests
{
    [Fact]
    public void WhenOnlyTheGlobalTestFailsTheWorstThreeAreDiagnosedAndNoneIsExplained()
    {
        // Noise 1.6 times the stated σ: the χ² global test fails while no single w exceeds 3.29;
        // the suspects are then the three largest |w|, and none is significant, so none can be explained.
        var found = false;
        for (int seed = 1; seed <= 60 && !found; seed++)
        {
            var (net, _) = NetAdjust.Simulation.BracedNetworks.Horizontal(seed, 4, noise: 1.6);
            var result = Adjuster.Adjust(net, DiagnosisMonteCarlo.Quick);
            var ws = result.Analysis.Observations.Where(t => t.W is not null).ToList();
            if (result.Statistics.GlobalTest.Passed != false || ws.Any(t => Math.Abs(t.W!.Value) > 3.29)) continue;
            found = true;
            var d = BlunderDiagnosis.Diagnose(result);
            var worst = ws.OrderByDescending(t => Math.Abs(t.W!.Value)).Take(3).Select(t => t.Index);
            Assert.Equal(worst, d.Suspects.Select(s => s.Observation));
            Assert.All(d.Suspects, s => Assert.False(s.Explained));
            Assert.All(d.Suspects, s => Assert.Contains(s.Ranked, h => h.Kind == BlunderKind.UnexplainedBias));
        }
        Assert.True(found, "no draw with only the global test failing");
    }
}

public class DemoDiagnosisTests
{
    [Fact]
    public void ThePlantedBlunderOfTheBlunderDemoIsTheSuspectWithItsSize()
    {
        // data/harrowfield-blunder.yaml's scenario: +40 mm planted on the distance H3→H4 (3 mm). Its diagnosis
        // estimates the bias within three standard deviations of 40 mm.
        var s = NetAdjust.Simulation.DemoScenarios.Draw(NetAdjust.Simulation.DemoScenario.Harrowfield,
            NetAdjust.Simulation.DemoScenarios.DefaultSeed(NetAdjust.Simulation.DemoScenario.Harrowfield));
        var net = new SurveyNetwork("harrowfield", s.Points, s.Setups.SelectMany(x => x.Observations));
        var result = Adjuster.Adjust(net, DiagnosisMonteCarlo.Quick);
        var d = BlunderDiagnosis.Diagnose(result);
        var first = d.Suspects[0];
        var o = net.Observations[first.Observation];
        Assert.Equal(("H3", "H4"), (o.From, o.To));
        var bias = first.Ranked.Single(h => h.Kind == BlunderKind.UnexplainedBias);
        Assert.InRange(bias.Size!.Value, 0.040 - (3 * bias.SizeSd!.Value), 0.040 + (3 * bias.SizeSd.Value));
        Assert.Equal(bias.SizeSd.Value, bias.EstimatedSizeSd!.Value.AsLength!.Value.Metres);
        Assert.True(bias.FitsAfter);
        // a free bias of a direction suspect is an angle (the outputs print it in arcseconds)
        var direction = d.Suspects.First(x => net.Observations[x.Observation].Kind == ObservationKind.Direction);
        Assert.True(direction.Ranked.Single(h => h.Kind == BlunderKind.UnexplainedBias).EstimatedSize!.Value.IsAngle);
    }
}
