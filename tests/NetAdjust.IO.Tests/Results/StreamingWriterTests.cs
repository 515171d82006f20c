using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Simulation;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// The writers write as they render: on a 1,000-point simulated network (megabytes of output) every writer hands its
/// output on in pieces far smaller than the whole document, and the pieces make the same bytes as the text overload.
/// The byte-for-byte comparison with the writers of before is GoldenSimulatedNetworkTests (Cli.Tests).
/// </summary>
public sealed class StreamingWriterTests
{
    private static readonly Lazy<ResultReport> Report = new(() =>
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 1000, Seed: 3));
        var result = Adjuster.Adjust(network);
        return ResultReport.Build(result,
            new ReportContext("net1k.yaml", TestProjects.RunDate, ProjectUnits.Default));
    });

    // Largest single piece allowed: the stream writers pass on at most about 64 KiB at a time, the text writers 32k
    // characters (a row or feature may overshoot a little).
    private const int LargestPiece = 72 * 1024, LargestText = 40 * 1024;

    public static TheoryData<string> StreamWriters() => new() { "json", "geojson", "landxml" };

    [Theory]
    [MemberData(nameof(StreamWriters))]
    public void AStreamWriterWritesInPiecesTheBytesOfItsTextOverload(string format)
    {
        var report = Report.Value;
        var recording = new RecordingStream();
        string text;
        switch (format)
        {
            case "json": JsonResultWriter.Write(recording, report); text = JsonResultWriter.Write(report); break;
            case "geojson": GeoJsonWriter.Write(recording, report); text = GeoJsonWriter.Write(report); break;
            default: LandXmlWriter.Write(recording, report); text = LandXmlWriter.Write(report); break;
        }
        byte[] expected = new UTF8Encoding(false).GetBytes(text);
        Assert.True(expected.Length > 2 * LargestPiece, $"{format}: only {expected.Length} bytes; test too small");
        Assert.Equal(expected, recording.ToArray());
        Assert.True(recording.Largest <= LargestPiece, $"{format}: a piece of {recording.Largest} bytes");
    }

    public static TheoryData<string> TextWriters() => new() { "report", "csv" };

    [Theory]
    [MemberData(nameof(TextWriters))]
    public void ATextWriterWritesInPiecesTheTextOfItsStringOverload(string format)
    {
        var report = Report.Value;
        var recording = new RecordingWriter();
        string text;
        if (format == "report") { TextReportWriter.Write(recording, report); text = TextReportWriter.Write(report); }
        else { CoordinateCsvWriter.Write(recording, report); text = CoordinateCsvWriter.Write(report); }
        Assert.True(text.Length > 2 * LargestText, $"{format}: only {text.Length} characters; test too small");
        Assert.Equal(text, recording.ToString());
        Assert.True(recording.Largest <= LargestText, $"{format}: a piece of {recording.Largest} characters");
    }

    [Fact]
    public void AWriterThatFailsLeavesNoFileAndTheEarlierOutputsUntouched()
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-stream-").FullName;
        try
        {
            string first = Path.Combine(dir, "a.json"), second = Path.Combine(dir, "b.txt");
            File.WriteAllText(first, "earlier a");
            var e = Assert.Throws<OutputException>(() => SafeFileWriter.WriteAll(new (string, Action<Stream>)[]
            {
                (first, s => s.Write("new a"u8)),
                (second, s => { s.Write(new byte[100_000]); throw new IOException("disk full"); }),
            }));
            Assert.Contains("b.txt", e.Message);
            Assert.Equal("earlier a", File.ReadAllText(first));
            Assert.False(File.Exists(second));
            Assert.Equal(["a.json"], Directory.GetFiles(dir).Select(Path.GetFileName));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void StreamedFilesAreWrittenWholeAndReplaceTheEarlierOnes()
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-stream-").FullName;
        try
        {
            string first = Path.Combine(dir, "a.json"), second = Path.Combine(dir, "b.txt");
            File.WriteAllText(first, "earlier a");
            SafeFileWriter.WriteAll(new (string, Action<Stream>)[]
            {
                (first, s => s.Write("new a"u8)),
                (second, s => { for (int i = 0; i < 1000; i++) s.Write("0123456789"u8); }),
            });
            Assert.Equal("new a", File.ReadAllText(first));
            Assert.Equal(10_000, new FileInfo(second).Length);
            Assert.Equal(["a.json", "b.txt"], Directory.GetFiles(dir).Select(Path.GetFileName).Order());
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    /// <summary>A stream that keeps what is written and the size of the largest single write.</summary>
    private sealed class RecordingStream : MemoryStream
    {
        public int Largest { get; private set; }

        public override void Write(byte[] buffer, int offset, int count)
        {
            Largest = Math.Max(Largest, count);
            base.Write(buffer, offset, count);
        }

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            Largest = Math.Max(Largest, buffer.Length);
            base.Write(buffer);
        }

        public override void WriteByte(byte value)
        {
            Largest = Math.Max(Largest, 1);
            base.WriteByte(value);
        }
    }

    /// <summary>A text writer that keeps what is written and the length of the largest single write.</summary>
    private sealed class RecordingWriter : StringWriter
    {
        public RecordingWriter() : base(System.Globalization.CultureInfo.InvariantCulture) { }

        public int Largest { get; private set; }

        public override void Write(char value)
        {
            Largest = Math.Max(Largest, 1);
            base.Write(value);
        }

        public override void Write(char[] buffer, int index, int count)
        {
            Largest = Math.Max(Largest, count);
            base.Write(buffer, index, count);
        }

        public override void Write(ReadOnlySpan<char> buffer)
        {
            Largest = Math.Max(Largest, buffer.Length);
            base.Write(buffer);
        }

        public override void Write(string? value)
        {
            Largest = Math.Max(Largest, value?.Length ?? 0);
            base.Write(value);
        }

        public override void Write(StringBuilder? value)
        {
            Largest = Math.Max(Largest, value?.Length ?? 0);
            base.Write(value);
        }
    }
}
