using System.CommandLine;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// The blunder diagnosis options of <c>adjust</c>: <c>--diagnose</c> names what probably went wrong in the field for
/// each suspect observation (docs/diagnosis.md), <c>--diagnose-skip KIND,...</c> leaves kinds of blunder untried.
/// </summary>
internal sealed class DiagnosisCliOptions
{
    private readonly Option<bool> _diagnose = new("--diagnose")
    {
        Description =
            "Say what probably went wrong in the field for each suspect observation (w-test failure): test each " +
            "kind of field blunder, rank them and print the edit of the project file that would correct an " +
            "explained one. With --snoop, each observation the hunt set aside is diagnosed in the round it was set " +
            "aside. NetAdjust never " +
            "changes the input.",
    };

    private readonly Option<string?> _skip = new("--diagnose-skip")
    {
        Description = "With --diagnose: kinds of blunder not to try, separated by commas (" +
                      OptionGrammars.BlunderKinds.Legal.Replace(" or ", ", ", StringComparison.Ordinal) +
                      "; unexplained_bias cannot be skipped).",
        HelpName = "KIND,...",
    };

    /// <summary>The option names, for the check of options that do not combine.</summary>
    public static readonly string[] Names = ["--diagnose", "--diagnose-skip"];

    public void AddTo(Command cmd)
    {
        cmd.Options.Add(_diagnose);
        cmd.Options.Add(_skip);
    }

    /// <summary>
    /// Diagnoses the suspects when <c>--diagnose</c> is given and returns the context carrying the diagnosis: the
    /// suspects of <paramref name="result"/>; after a blunder hunt that set observations aside, each of them in the
    /// round it was set aside (the network with the observations set aside before it left out), in the order found.
    /// </summary>
    /// <exception cref="InvalidInputException">When a kind name is unknown, or the skip list is given without
    /// <c>--diagnose</c>.</exception>
    public ReportContext Run(ParseResult parse, SurveyProject project, AdjustmentResult result, ReportContext context)
    {
        string? skipText = parse.GetValue(_skip);
        if (!parse.GetValue(_diagnose))
        {
            if (skipText is not null) throw new InvalidInputException("--diagnose-skip applies only with --diagnose");
            return context;
        }
        // the project's diagnosis section (kinds skipped there, candidate lists), then the command line's skip list
        var options = project.Diagnosis with
        {
            Enabled = Enabled(project.Diagnosis.Enabled, skipText), Alpha = result.Options.Analysis.WTestAlpha,
        };
        project.Options.Progress?.Report(new AdjustmentProgress("diagnosing the suspects", null));
        if (context.Hunt is not { SetAside.Count: > 0 } hunt)
            return context with { Diagnosis = BlunderDiagnosis.Diagnose(result, options) };
        return context with { Diagnosis = HuntRounds(project.Network, hunt.SetAside, result.Options, options) };
    }

    /// <summary>The diagnosis of each observation a hunt set aside, in the round it was set aside; an observation
    /// that is no suspect there (set aside by the tau test, but within the w-test) is left out.</summary>
    private static NetAdjust.Diagnosis.Diagnosis HuntRounds(SurveyNetwork network, IReadOnlyList<int> setAside,
        AdjustmentOptions adjustment, DiagnosisOptions options)
    {
        // the w of a round needs no external reliability or relative precision (as in the hunt's own rounds)
        var quick = adjustment with { Analysis = adjustment.Analysis with { ExternalReliability =
            ExternalReliabilityMode.Never, RelativeForObservedPairs = false, RelativePairs = [] } };
        var suspects = new List<SuspectDiagnosis>();
        foreach (int k in setAside)
        {
            var round = BlunderDiagnosis.Diagnose(Adjuster.Adjust(network, quick), options);
            if (round.Suspects.FirstOrDefault(s => s.Observation == k) is SuspectDiagnosis found) suspects.Add(found);
            var obs = network.Observations.ToArray();
            obs[k] = obs[k] with { Excluded = true };
            network = new SurveyNetwork(network.Name, network.Points, obs);
        }
        return new NetAdjust.Diagnosis.Diagnosis(suspects, options);
    }

    /// <summary>The kinds enabled (by the project) but those named in the skip list (null: none).</summary>
    internal static HashSet<BlunderKind> Enabled(IEnumerable<BlunderKind> project, string? skipText)
    {
        var enabled = new HashSet<BlunderKind>(project);
        if (skipText is null) return enabled;
        var words = skipText.Split(',', StringSplitOptions.TrimEntries);
        if (words.All(w => w.Length == 0))
            throw new InvalidInputException("--diagnose-skip: name at least one kind of blunder: use " +
                OptionGrammars.BlunderKinds.Legal);
        foreach (var word in words)
        {
            if (word.Length == 0)
                throw new InvalidInputException($"--diagnose-skip '{skipText}': an empty kind between commas");
            var kind = CliChoice.Parse(word, "--diagnose-skip", OptionGrammars.BlunderKinds);
            if (kind == BlunderKind.UnexplainedBias)
                throw new InvalidInputException("--diagnose-skip: unexplained_bias cannot be skipped: it is the " +
                    "reference every named kind is compared with");
            enabled.Remove(kind);
        }
        return enabled;
    }
}
