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
/// A large CSV observation file is read in two halves on two cores (CsvLines.SplitOff, CsvObservationReader.Read).
/// The halves must not show: the lines of the two halves, numbered, are those of the whole text split at its line ends
/// (the reference split is .NET's regular expressions), wherever the middle falls (in a CR LF, on a CR alone, at the
/// end of the bytes looked at); an invalid byte in either half gets the whole-file decoder's refusal; the observations
/// are those read from the text in one pass, in the same order, and a problem is the first of the file.
/// </summary>
public class CsvHalvesTests
{
    private static readonly Gen<string> Texts = CsvReading.Texts(120);

    private static List<(int Number, string Text)> ReferenceLines(string text) =>
        [.. Regex.Split(text, "\r\n|\r|\n").Select((line, i) => (i + 1, line))];

    private static List<(int Number, string Text)> Numbered(CsvLines lines)
    {
        var result = new List<(int, string)>();
        while (lines.Next())
            result.Add((lines.LineNumber, new string(lines.Buffer, lines.LineStart, lines.LineEnd - lines.LineStart)));
        return result;
    }

    /// <summary>A reader of the bytes that may split them from <paramref name="splitBytes"/> on (each half reads
    /// its own stream of the same bytes, as a file opened twice).</summary>
    private static CsvLines Splittable(byte[] bytes, int piece, long splitBytes = 0) =>
        CsvLines.OfUtf8(new MemoryStream(bytes), "obs.csv", long.MaxValue, piece, () => new MemoryStream(bytes),
            splitBytes);

    /// <summary>The lines of both halves, the first half's last one left out: it ends with the line end it was split
    /// after, so its last line is empty and numbered as the second half's first (a blank line, which the reader
    /// skips).</summary>
    private static List<(int Number, string Text)> LinesOfHalves(CsvLines first, CsvLines second)
    {
        var a = Numbered(first);
        var b = Numbered(second);
        Assert.Equal((b[0].Number, ""), a[^1]);
        return [.. a.SkipLast(1), .. b];
    }

    [Property(MaxTest = 2000)]
    public Property TheHalvesGiveTheLinesOfTheWholeTextNumberedAsInIt() =>
        Prop.ForAll(Texts.ToArbitrary(), Gen.Choose(4, 12).ToArbitrary(), Gen.Elements(false, true).ToArbitrary(),
            (text, piece, bom) =>
            {
                byte[] bytes = [.. (bom ? new byte[] { 0xEF, 0xBB, 0xBF } : []), .. Encoding.UTF8.GetBytes(text)];
                var expected = ReferenceLines(text);
                using var first = Splittable(bytes, piece);
                using var second = first.SplitOff();
                // split after the first line end from the middle on (a CR LF whole), unless the file is under two
                // pieces or nothing follows that line end
                int middle = bytes.Length / 2;
                int k = bytes.AsSpan(middle).IndexOfAny((byte)'\r', (byte)'\n');
                int start = k < 0 ? -1 : middle + k + (bytes[middle + k] == '\r' && middle + k + 1 < bytes.Length &&
                    bytes[middle + k + 1] == '\n' ? 2 : 1);
                bool splits = bytes.Length >= 2 * piece && k >= 0 && start < bytes.Length;
                var given = second is null ? Numbered(first) : LinesOfHalves(first, second);
                return (second is not null) == splits && given.SequenceEqual(expected);
            });

    /// <summary>The middle on each kind of line end: the split falls after the whole line end, a CR LF never cut.
    /// </summary>
    [Theory]
    [InlineData("\n")]
    [InlineData("\r\n")]
    [InlineData("\r")]
    public void TheMiddleFallsInEveryKindOfLineEnd(string end)
    {
        foreach (int shift in Enumerable.Range(0, 12))
            foreach (int piece in new[] { 4, 5, 7, 64 })
            {
                string text = new string('x', 40 + shift) + end + string.Concat(Enumerable.Repeat("ab" + end, 40));
                byte[] bytes = Encoding.UTF8.GetBytes(text);
                using var first = Splittable(bytes, piece);
                using var second = first.SplitOff();
                Assert.NotNull(second);
                Assert.Equal(ReferenceLines(text), LinesOfHalves(first, second));
            }
    }

    [Fact]
    public void AFileIsNotSplitUnderItsSplitLengthNorWhenItCannotBeOpenedAgainNorAfterReadingPastTheMiddle()
    {
        byte[] bytes = Encoding.UTF8.GetBytes(string.Concat(Enumerable.Repeat("kind,value\n", 100)));
        using (var shorter = Splittable(bytes, 16, splitBytes: bytes.Length + 1)) Assert.Null(shorter.SplitOff());
        using (var once = CsvLines.OfUtf8(new MemoryStream(bytes), "obs.csv", long.MaxValue, 16))
            Assert.Null(once.SplitOff());
        using (var text = CsvLines.OfText(Encoding.UTF8.GetString(bytes), 16)) Assert.Null(text.SplitOff());
        using var read = Splittable(bytes, 16);
        while (read.LineNumber < 60) read.Next();
        Assert.Null(read.SplitOff());
        Assert.Equal(41, Numbered(read).Count); // the lines after line 60, the last empty
        using var split = Splittable(bytes, 16);
        using var second = split.SplitOff();
        Assert.NotNull(second);
        Assert.Null(split.SplitOff()); // once
        Assert.Null(second.SplitOff());
    }

    /// <summary>The second opening fails (the file moved or lost its permission since the first): no split, and the
    /// stream already open reads the whole file; a problem other than the file's reach is not hidden.</summary>
    [Fact]
    public void AFileThatCannotBeOpenedAgainIsReadInOnePass()
    {
        byte[] bytes = Encoding.UTF8.GetBytes(string.Concat(Enumerable.Repeat("kind,value\n", 100)));
        foreach (var failure in new Exception[] { new FileNotFoundException("gone"),
                     new UnauthorizedAccessException("denied") })
        {
            using var lines = CsvLines.OfUtf8(new MemoryStream(bytes), "obs.csv", long.MaxValue, 16,
                () => throw failure, splitBytes: 0);
            Assert.Null(lines.SplitOff());
            var read = Numbered(lines);
            Assert.Equal(101, read.Count); // the 100 rows and the empty line after the last line end
            Assert.Equal((100, "kind,value"), read[99]);
        }
        using var broken = CsvLines.OfUtf8(new MemoryStream(bytes), "obs.csv", long.MaxValue, 16,
            () => throw new InvalidOperationException("a defect"), splitBytes: 0);
        Assert.Throws<InvalidOperationException>(() => broken.SplitOff());
    }

    [Property(MaxTest = 1000)]
    public Property AnInvalidByteInEitherHalfIsRefusedAsTheWholeFileDecoderRefusesIt() =>
        Prop.ForAll((from before in Texts
                     from after in Texts
                     from bad in Gen.Elements<byte>(0xFF, 0xC0, 0x80, 0xED)
                     from piece in Gen.Choose(4, 12)
                     select (before, after, bad, piece)).ToArbitrary(), c =>
            {
                var (before, after, bad, piece) = c;
                byte[] bytes = [.. Encoding.UTF8.GetBytes(before), bad, .. Encoding.UTF8.GetBytes("x" + after)];
                var whole = Assert.Throws<ProjectFileException>(() => InputText.Decode(bytes, "obs.csv"));
                using var first = Splittable(bytes, piece);
                using var second = first.SplitOff();
                var refused = Assert.Throws<ProjectFileException>(() =>
                {
                    Numbered(first);
                    if (second is not null) Numbered(second);
                });
                return refused.Message == whole.Message && refused.Line == whole.Line;
            });

    /// <summary>The CSV of a simulated network (directions in sets, distances; 300 points, about 190 KiB) and a
    /// hand-made file of every plain kind repeated, read in halves: the observations read from the text in one pass
    /// (records: kind, points, values, standard deviations, sources with their lines, booked texts), in order.
    /// </summary>
    [Fact]
    public void ObservationsReadInHalvesAreThoseReadInOnePass()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 300));
        string simulated = CsvReading.SimulatedCsv(network);
        string mixed = string.Join("\r\n", [
            "# every kind read from CSV", CsvReading.MixedHeader,
            .. Enumerable.Repeat(CsvReading.MixedRows, 40).SelectMany(r => r)]) + "\r\n";
        foreach (var (text, ids) in new[] { (simulated, network.Points.Select(p => p.Id).ToArray()),
                     (mixed, ["A", "B", "C", "D"]) })
            foreach (int piece in new[] { 64, 1024 })
            {
                var oneCore = CsvReading.Read(text, pointIds: ids);
                byte[] bytes = Encoding.UTF8.GetBytes(text);
                using (var probe = Splittable(bytes, piece)) Assert.NotNull(probe.SplitOff()); // it is split
                using var lines = Splittable(bytes, piece);
                var halves = CsvReading.Read(lines, pointIds: ids);
                Assert.Equal(oneCore, halves);
                Assert.Equal(oneCore.Select(o => o.Source), halves.Select(o => o.Source));
            }
    }

    /// <summary>A problem in each half: the first half's is the one given (the first of the file); one in the second
    /// half alone: the one-core pass's, its line that of the whole file.</summary>
    [Fact]
    public void AProblemIsTheFirstOfTheFileWhicheverHalfItIsIn()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 300));
        string[] lines = CsvReading.SimulatedCsv(network).Split('\n');
        int early = lines.Length / 5, late = 4 * lines.Length / 5;
        string Spoilt(params int[] at) => string.Join('\n', lines.Select((l, i) => at.Contains(i)
            ? Regex.Replace(l, "^(distance|direction),([^,]*),([^,]*),([^,]*),([^,]*)", "$1,$2,$3,$4,abc") : l));
        foreach (var (text, line) in new[] { (Spoilt(early, late), early + 1), (Spoilt(late), late + 1) })
        {
            var oneCore = Assert.Throws<ProjectFileException>(() => CsvReading.Read(text));
            using var halves = Splittable(Encoding.UTF8.GetBytes(text), 256);
            var split = Assert.Throws<ProjectFileException>(() => CsvReading.Read(halves));
            Assert.Equal(line, oneCore.Line);
            Assert.Equal((oneCore.Line, oneCore.Message), (split.Line, split.Message));
        }
    }

    /// <summary>A header after a long comment (in the second half): the halves are read one after the other, the same
    /// rows. A slope distance in the first half and its zenith angle in the second: accepted, as in one pass (the
    /// check runs over the whole file).</summary>
    [Fact]
    public void AHeaderInTheSecondHalfAndASlopeDistanceWhoseZenithIsInTheOtherHalfReadAsInOnePass()
    {
        string late = string.Concat(Enumerable.Repeat("# a long note before the header\n", 40)) +
            "kind,at,from,to,value,sd,length,set\n" +
            string.Concat(Enumerable.Repeat("distance,,A,B,100.0100,0.003,,\n", 10));
        const string header =
            "kind,from,to,value,sd,instrument_height,target_height,instrument,target,sets,faces,refraction_group\n";
        string trig = header + "slope_distance,A,B,500.1234,0.003,1.550,1.700,,,,,\n" +
            string.Concat(Enumerable.Repeat("slope_distance,A,C,300.5,0.003,1.550,1.700,,,,,\n" +
                "zenith,A,C,88.5,2,1.550,1.700,,,,,\n", 30)) + "zenith,A,B,88.85,2,1.550,1.700,,,,,\n";
        var specs = new CsvObservationReader.CsvSpecifications(_ => null, _ => null,
            _ => new CsvObservationReader.RefractionChoice(0.13, 0.04, null, false), _ => false);
        foreach (string text in new[] { late, trig })
        {
            var oneCore = CsvReading.Read(text, specs: specs);
            using var halves = Splittable(Encoding.UTF8.GetBytes(text), 16);
            var split = CsvReading.Read(halves, specs: specs);
            Assert.Equal(oneCore, split);
        }
        // without its zenith angle the slope distance is refused either way, on its own line
        string alone = trig.Replace("zenith,A,B,88.85,2,1.550,1.700,,,,,\n", "");
        using var aloneHalves = Splittable(Encoding.UTF8.GetBytes(alone), 16);
        var refused = Assert.Throws<ProjectFileException>(() => CsvReading.Read(aloneHalves, specs: specs));
        Assert.Equal(2, refused.Line);
        Assert.Contains("needs a zenith angle", refused.Message);
        // and one in the second half, on its line of the whole file
        string lateAlone = trig + "slope_distance,A,D,200.0,0.003,1.550,1.700,,,,,\n";
        using var lateHalves = Splittable(Encoding.UTF8.GetBytes(lateAlone), 16);
        var lateRefused = Assert.Throws<ProjectFileException>(() => CsvReading.Read(lateHalves, specs: specs));
        Assert.Equal(lateAlone.Count(c => c == '\n'), lateRefused.Line);
        Assert.Contains("needs a zenith angle", lateRefused.Message);
    }

    /// <summary>Through the project reader: a simulated project whose observation file is over the split length
    /// (read from disk in halves) gives the network read from its text in one pass.</summary>
    [Fact]
    public void AProjectWithALargeObservationFileReadsAsFromItsText()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 40_000));
        string dir = Directory.CreateTempSubdirectory("netadjust-halves-").FullName;
        try
        {
            string path = Path.Combine(dir, "net.yaml");
            ProjectFileWriter.Write(network, path, "halves");
            Assert.True(new FileInfo(Directory.GetFiles(dir, "*.csv").Single()).Length >= CsvLines.DefaultSplitBytes);
            var fromDisk = ProjectReader.Read(path).Network;
            var fromText = ProjectReader.Parse(File.ReadAllText(path), "net.yaml", dir, File.ReadAllText).Network;
            Assert.Equal(fromText.Observations.Count, fromDisk.Observations.Count);
            Assert.Equal(fromText.Observations, fromDisk.Observations);
        }
        finally { Directory.Delete(dir, recursive: true); }
    }
}
