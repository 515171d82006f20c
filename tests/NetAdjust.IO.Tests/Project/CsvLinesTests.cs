using System.Text;
using System.Text.RegularExpressions;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// A CSV observation file is read a piece at a time from its UTF-8 bytes (CsvLines). The pieces must not show:
/// whatever the piece size, the lines are those of the whole text split at its line ends (CR LF, CR or LF: the
/// reference split here is .NET's regular expressions, not the reader's scan), with a byte-order mark skipped and
/// line ends, multi-byte characters and surrogate pairs cut across pieces; an invalid byte gets the same refusal as
/// the whole-file decoder's (InputText.Decode) after the lines before it; and the observations read from a file in
/// pieces are those read from its text.
/// </summary>
public class CsvLinesTests
{
    private static readonly Gen<string> Texts = CsvReading.Texts(60);

    private static List<string> ReferenceLines(string text) => [.. Regex.Split(text, "\r\n|\r|\n")];

    private static List<string> LinesOf(CsvLines lines)
    {
        var result = new List<string>();
        while (lines.Next())
        {
            Assert.Equal(result.Count + 1, lines.LineNumber);
            result.Add(new string(lines.Buffer, lines.LineStart, lines.LineEnd - lines.LineStart));
        }
        Assert.False(lines.Next()); // and stays at the end
        return result;
    }

    private static CsvLines OfBytes(byte[] bytes, int piece, long limit = long.MaxValue) =>
        CsvLines.OfUtf8(new MemoryStream(bytes), "obs.csv", limit, piece);

    [Property(MaxTest = 2000)]
    public Property AnyTextGivesTheSameLinesWhateverThePieces() =>
        Prop.ForAll(Texts.ToArbitrary(), Gen.Choose(4, 12).ToArbitrary(), Gen.Elements(false, true).ToArbitrary(),
            (text, piece, bom) =>
            {
                byte[] bytes = [.. (bom ? new byte[] { 0xEF, 0xBB, 0xBF } : []), .. Encoding.UTF8.GetBytes(text)];
                var expected = ReferenceLines(text);
                using var fromBytes = OfBytes(bytes, piece);
                using var fromText = CsvLines.OfText(text, piece);
                return LinesOf(fromBytes).SequenceEqual(expected) && LinesOf(fromText).SequenceEqual(expected);
            });

    [Property(MaxTest = 1000)]
    public Property AnInvalidByteIsRefusedAsTheWholeFileDecoderRefusesItAfterTheLinesBeforeIt() =>
        Prop.ForAll((from before in Texts
                     from after in Texts
                     from bad in Gen.Elements<byte>(0xFF, 0xC0, 0x80, 0xED)
                     from piece in Gen.Choose(4, 12)
                     select (before, after, bad, piece)).ToArbitrary(), c =>
            {
                var (before, after, bad, piece) = c;
                // 0xFF and 0xC0 are never UTF-8, 0x80 cannot start a sequence, 0xED then an ASCII byte or the end
                // is a sequence cut short
                byte[] bytes = [.. Encoding.UTF8.GetBytes(before), bad, .. Encoding.UTF8.GetBytes("x" + after)];
                var whole = Assert.Throws<ProjectFileException>(() => InputText.Decode(bytes, "obs.csv"));
                var expectedLines = ReferenceLines(before);
                expectedLines.RemoveAt(expectedLines.Count - 1); // the line the bad byte stands on is not given
                using var lines = OfBytes(bytes, piece);
                var given = new List<string>();
                var refused = Assert.Throws<ProjectFileException>(() =>
                {
                    while (lines.Next())
                        given.Add(new string(lines.Buffer, lines.LineStart, lines.LineEnd - lines.LineStart));
                });
                return refused.Message == whole.Message && refused.Line == whole.Line &&
                    given.SequenceEqual(expectedLines);
            });

    [Fact]
    public void AStreamLongerThanTheLimitIsRefusedAtOnceWhenItsLengthIsKnownElseWhenPassed()
    {
        byte[] bytes = Encoding.UTF8.GetBytes(string.Concat(Enumerable.Repeat("kind,value\n", 100)));
        var atOnce = Assert.Throws<ProjectFileException>(() => OfBytes(bytes, 16, limit: bytes.Length - 1));
        Assert.Contains("larger than the limit", atOnce.Message);
        Assert.Equal(0, atOnce.Line);
        using var exact = OfBytes(bytes, 16, limit: bytes.Length);
        Assert.Equal(101, LinesOf(exact).Count);
        using var unknownLength = CsvLines.OfUtf8(new ForwardOnly(bytes), "obs.csv", bytes.Length - 1, 16);
        var passed = Assert.Throws<ProjectFileException>(() => LinesOf(unknownLength));
        Assert.Contains("larger than the limit", passed.Message);
    }

    /// <summary>The CSV of a simulated network (directions in sets, distances) and a hand-made one of every plain
    /// kind the CSV reader takes, with marks and level fields; then a bad row far into the file: read from their bytes
    /// in small pieces and from their text, the same observations (records: kind, points, values, standard
    /// deviations, sources, booked texts) or the same error.</summary>
    [Fact]
    public void ObservationsReadInPiecesAreThoseReadFromTheText()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 60));
        string simulated = CsvReading.SimulatedCsv(network);
        {
            Assert.True(simulated.Length > 4 * 1024, "several pieces of 1 KiB");
            string mixed = string.Join("\r\n",
                ["# every kind read from CSV", CsvReading.MixedHeader, .. CsvReading.MixedRows]) + "\r\n";
            foreach (var (text, ids) in new[] { (simulated, network.Points.Select(p => p.Id).ToArray()),
                (mixed, ["A", "B", "C", "D"]) })
                foreach (int piece in new[] { 7, 64, 1024 })
                {
                    var fromText = CsvReading.Read(text, pointIds: ids);
                    using var lines = OfBytes(Encoding.UTF8.GetBytes(text), piece);
                    var fromBytes = CsvReading.Read(lines, pointIds: ids);
                    Assert.Equal(fromText, fromBytes);
                }
            // a bad row far into the file: the same error (file, line, item) either way
            string bad = simulated.Replace(",1.0000,", ",-1,") + "distance,,Q000001,Q000002,abc,0.002,,\n";
            var textError = Assert.ThrowsAny<Exception>(() => CsvReading.Read(bad));
            using var badLines = OfBytes(Encoding.UTF8.GetBytes(bad), 64);
            var bytesError = Assert.ThrowsAny<Exception>(() => CsvReading.Read(badLines));
            Assert.Equal(textError.GetType(), bytesError.GetType());
            Assert.Equal(textError.Message, bytesError.Message);
        }
    }

    /// <summary>A stream that cannot seek (its length unknown, as a pipe's).</summary>
    private sealed class ForwardOnly(byte[] bytes) : MemoryStream(bytes)
    {
        public override bool CanSeek => false;
        public override long Length => throw new NotSupportedException();
    }
}
