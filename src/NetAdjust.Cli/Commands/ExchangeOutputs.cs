using System.CommandLine;
using NetAdjust.Adjustment;
using NetAdjust.IO;
using NetAdjust.IO.Results;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// The report and exchange outputs of <c>adjust</c>: <c>--html</c>, <c>--svg</c>, <c>--csv</c>, <c>--landxml</c>,
/// <c>--geojson</c>. They are written with the other outputs through <see cref="SafeFileWriter.WriteAll"/>, all or none
/// (docs/cli.md, docs/output-format.md).
/// </summary>
internal sealed class ExchangeOutputs
{
    private readonly (Option<string?> Option, Func<ResultReport, string> Render)[] _outputs;

    private ExchangeOutputs((Option<string?>, Func<ResultReport, string>)[] outputs) => _outputs = outputs;

    public static ExchangeOutputs Create()
    {
        static Option<string?> Opt(string name, string description) =>
            new(name) { Description = description, HelpName = "PATH" };
        return new ExchangeOutputs(
        [
            (Opt("--html",
                "Write the report as one self-contained HTML file (summary, network plot, tables) to this path."),
                HtmlReportWriter.Write),
            (Opt("--svg", "Write the network plot alone as an SVG file to this path."),
                NetworkPlotWriter.WriteDocument),
            (Opt("--csv",
                "Write the adjusted coordinates, standard deviations and error ellipses as CSV to this path."),
                CoordinateCsvWriter.Write),
            (Opt("--landxml", "Write the adjusted points as LandXML 1.2 (CgPoints) to this path, for CAD."),
                LandXmlWriter.Write),
            (Opt("--geojson", "Write points, observation lines and error ellipses as GeoJSON to this path, for GIS."),
                GeoJsonWriter.Write),
        ]);
    }

    /// <summary>Adds the options to the command.</summary>
    public void AddTo(Command cmd)
    {
        foreach (var (o, _) in _outputs) cmd.Options.Add(o);
    }

    /// <summary>The output paths given on the command line.</summary>
    public IEnumerable<string> Paths(ParseResult parse) =>
        _outputs.Select(t => parse.GetValue(t.Option)).OfType<string>();

    /// <summary>Renders every requested output from one report model: (path, text) in option order.</summary>
    public IEnumerable<(string Path, string Text)> Render(ParseResult parse, ResultReport report)
    {
        foreach (var (o, render) in _outputs)
            if (parse.GetValue(o) is string path) yield return (path, render(report));
    }
}
