using System.Text;

namespace NetAdjust.IO.Results;

/// <summary>
/// The text writers build their lines in a <see cref="StringBuilder"/> used as a buffer: inside long tables it is
/// passed on to the output writer whenever it holds <see cref="Threshold"/> characters, so no whole report is ever
/// held in memory.
/// </summary>
internal static class TextChunks
{
    /// <summary>Characters gathered before they are passed on.</summary>
    public const int Threshold = 1 << 15;

    /// <summary>Passes the buffer on to <paramref name="output"/> (when given) once it is full.</summary>
    public static void Spill(StringBuilder sb, TextWriter? output)
    {
        if (output is null || sb.Length < Threshold) return;
        output.Write(sb);
        sb.Clear();
    }

    /// <summary>Passes whatever the buffer holds on to <paramref name="output"/>.</summary>
    public static void Drain(StringBuilder sb, TextWriter output)
    {
        output.Write(sb);
        sb.Clear();
    }

    /// <summary>What a writer to a <see cref="TextWriter"/> writes, as one string (LF line ends as written).</summary>
    public static string ToText(Action<TextWriter> write)
    {
        using var w = new StringWriter(System.Globalization.CultureInfo.InvariantCulture) { NewLine = "\n" };
        write(w);
        return w.ToString();
    }
}
