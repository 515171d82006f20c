namespace NetAdjust.Cli;

/// <summary>The writers a command prints to: injectable so that tests capture the output.</summary>
/// <param name="Out">Standard output (reports).</param>
/// <param name="Error">Standard error (messages).</param>
public sealed record CliConsole(TextWriter Out, TextWriter Error);
