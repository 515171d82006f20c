using System.CommandLine;
using NetAdjust.Adjustment;
using NetAdjust.IO;
using NetAdjust.IO.Results;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// The report and exchange outputs of <c>adjust</c>: <c>--html</c>, <c>--svg</c>, <c>--csv</c>, <c>--landxml</c>,
/// <c>--geojson</c>. They are written with the other outputs through
/// <see cref="SafeFileWriter.WriteAll(IReadOnlyList{ValueTuple{string, Action{Stream}}}, int)"/>, all or none
/// (docs/cli.md, docs/output-format.md).
/// </summary>
internal sealed class ExchangeOutputs
{
    private readonly (Option<string?> Option, Action<Stream, ResultReport> Render)[] _outputs;

    private ExchangeOutputs((Option<string?>, Action<Stream, ResultReport>)[] outputs) => _outputs = outputs;

    public static ExchangeOutputs Create()
    {
        static Option<string?> Opt(string name, string description) =>
            new(name) { Description = description, HelpName = "PATH" };
        return new ExchangeOutputs(
        [
            (Opt("--html",
                "Write the report as one self-contained HTML file (summary, network plot, tables) to this path."),
                (s, r) => Text(s, HtmlReportWriter.Write(r))),
            (Opt("--svg", "Write the network plot alone as an SVG file to this path."),
                (s, r) => Text(s, NetworkPlotWriter.WriteDocument(r))),
            (Opt("--csv",
                "Write the adjusted coordinates, standard deviations and error ellipses as CSV to this path."),
                (s, r) => { using var w = Utf8(s); CoordinateCsvWriter.Write(w, r); }),
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

    /// <summary>The writers of every requested output from one report model: (path, writer to the file's stream) in
    /// option order; each writes as it renders.</summary>
    public IEnumerable<(string Path, Action<Stream> Write)> Render(ParseResult parse, ResultReport report)
    {
        foreach (var (o, render) in _outputs)
            if (parse.GetValue(o) is string path) yield return (path, s => render(s, report));
    }

    /// <summary>A UTF-8 text writer (no byte-order mark) over an output stream, leaving the stream open.</summary>
    internal static StreamWriter Utf8(Stream stream) =>
        new(stream, new System.Text.UTF8Encoding(false), 1 << 16, leaveOpen: true);

    private static void Text(Stream stream, string text)
    {
        using var w = Utf8(stream);
        w.Write(text);
    }
}
