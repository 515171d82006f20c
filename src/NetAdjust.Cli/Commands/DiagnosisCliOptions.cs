using System.CommandLine;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Text;

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
            "explained one. With --snoop, the suspects of the hunt's first round are diagnosed. NetAdjust never " +
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
    /// Diagnoses the suspects when <c>--diagnose</c> is given and returns the context carrying the diagnosis: of
    /// <paramref name="result"/>, or, after a blunder hunt, of the first round (the network as booked, adjusted
    /// again with the result's options).
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
        var options = DiagnosisOptions.Default with
        {
            Enabled = Enabled(skipText), Alpha = result.Options.Analysis.WTestAlpha,
        };
        project.Options.Progress?.Report(new AdjustmentProgress("diagnosing the suspects", null));
        var diagnosed = context.Hunt is null ? result : Adjuster.Adjust(project.Network, result.Options);
        return context with { Diagnosis = BlunderDiagnosis.Diagnose(diagnosed, options) };
    }

    /// <summary>Every kind but those named in the skip list (null: all).</summary>
    internal static HashSet<BlunderKind> Enabled(string? skipText)
    {
        var enabled = new HashSet<BlunderKind>(Enum.GetValues<BlunderKind>());
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
