using System.CommandLine;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;
using NetAdjust.IO.Results;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// The statistics options of <c>adjust</c>: <c>--snoop</c>, <c>--snoop-limit N</c>, <c>--robust huber|danish</c>,
/// <c>--components</c>, <c>--variance-factor known|estimated</c>.
/// </summary>
internal sealed class StatisticsCliOptions
{
    private readonly Option<bool> _snoop = new("--snoop")
    {
        Description =
            "Hunt for blunders by iterative data snooping: set aside the worst failing observation and re-adjust, " +
            "round by round. The report logs each round.",
    };

    private readonly Option<int> _limit = new("--snoop-limit")
    {
        Description = "Largest number of observations the blunder hunt may set aside (default 10).",
        HelpName = "N",
        DefaultValueFactory = _ => 10,
        CustomParser = r => // a plain message instead of "as expected type 'System.Int32'"
        {
            string t = r.Tokens.Count == 1 ? r.Tokens[0].Value : string.Join(" ", r.Tokens.Select(k => k.Value));
            if (int.TryParse(t, System.Globalization.NumberStyles.Integer,
                System.Globalization.CultureInfo.InvariantCulture, out int v))
                return v;
            r.AddError(
                $"--snoop-limit '{t}' must be a whole number: the most observations the blunder hunt may set aside");
            return 0;
        },
    };

    private readonly Option<string?> _robust = new("--robust")
    {
        Description =
            "Also run a robust re-weighted adjustment to locate several blunders at once: huber or danish. The main " +
            "result stays the ordinary adjustment.",
        HelpName = "huber|danish",
    };

    private readonly Option<bool> _components = new("--components")
    {
        Description =
            "Estimate a variance factor per observation group (variance component estimation) and report the " +
            "specification each group implies.",
    };

    private readonly Option<string?> _basis = new("--variance-factor")
    {
        Description =
            "Take the a-priori variance factor as known (w-test, chi-square ellipse scale) or estimated (tau test, F " +
            "scale); overrides the project file.",
        HelpName = "known|estimated",
    };

    public void AddTo(Command cmd)
    {
        cmd.Options.Add(_snoop);
        cmd.Options.Add(_limit);
        cmd.Options.Add(_robust);
        cmd.Options.Add(_components);
        cmd.Options.Add(_basis);
    }

    /// <summary>True when the result <see cref="Run"/> returns is the ordinary adjustment of the project's network
    /// (no blunder hunt, whose result is that of its last round).</summary>
    public bool AdjustsOnce(ParseResult parse) => !parse.GetValue(_snoop);

    /// <summary>Adjusts the project with the chosen statistics and returns the result to report and the context
    /// carrying the extra sections.</summary>
    public (AdjustmentResult, ReportContext) Run(ParseResult parse, SurveyProject project, ReportContext context)
    {
        var options = project.Options;
        if (parse.GetValue(_basis) is string basis)
        {
            var b = CliChoice.Parse(basis, "--variance-factor", OptionGrammars.VarianceFactorBasis);
            options = options with { Analysis = options.Analysis with { VarianceFactor = b } };
        }
        RobustMethod? robust = parse.GetValue(_robust) is string rm
            ? CliChoice.Parse(rm, "--robust", OptionGrammars.RobustMethods) : null;
        int limit = parse.GetValue(_limit);
        if (limit < 1) throw new InvalidInputException($"--snoop-limit {limit} must be at least 1");

        AdjustmentResult result;
        if (parse.GetValue(_snoop))
        {
            var hunt = DataSnooping.Run(project.Network, options, limit);
            result = hunt.Final;
            context = context with { Hunt = hunt };
        }
        else result = Adjuster.Adjust(project.Network, options);

        // The robust run sees the data as given (it is a second opinion beside the hunt); the variance components use
        // the network after the hunt, so that set-aside blunders do not inflate their group's factor.
        if (robust is RobustMethod m)
            context = context with { Robust = Extra("--robust", "robust re-weighting", () =>
                RobustEstimation.Run(project.Network, m, options)) };
        if (parse.GetValue(_components))
            context = context with { Components = Extra("--components", "variance component estimation", () =>
                VarianceComponents.Estimate(result.Network, options)) };
        return (result, context);
    }

    /// <summary>Runs an optional analysis; its failure is reported as that option's, not as the ordinary
    /// adjustment's.</summary>
    private static T Extra<T>(string option, string what, Func<T> run)
    {
        try { return run(); }
        catch (AdjustmentFailedException e)
        {
            throw new AdjustmentFailedException(
                $"{option}: a re-adjustment of the {what} failed ({e.Message}) The ordinary adjustment itself " +
                    $"succeeded: run without {option} for its report.", e);
        }
    }
}
