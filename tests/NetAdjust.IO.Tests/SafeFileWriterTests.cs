using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Results;
using NetAdjust.Simulation;

namespace NetAdjust.IO.Tests;

/// <summary>
/// The writers of several files run side by side (<see cref="SafeFileWriter.WriteAll(IReadOnlyList{ValueTuple{
/// string, Action{Stream}}}, int)"/>): the files hold the bytes a write one after the other gives, and a failure
/// replaces no file, leaves no temporary file and surfaces as the write one after the other would surface it.
/// </summary>
public sealed class SafeFileWriterTests
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(30);

    [Fact]
    public void WritersSideBySideGiveTheBytesOfAWriteOneAfterTheOther()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 1000, Seed: 5));
        var report = ResultReport.Build(Adjuster.Adjust(network),
            new ReportContext("net1k.yaml", TestProjects.RunDate, ProjectUnits.Default));
        static StreamWriter Utf8(Stream s) => new(s, new System.Text.UTF8Encoding(false), 1 << 16, leaveOpen: true);
        (string, Action<Stream>)[] Files(string dir) =>
        [
            (Path.Combine(dir, "o.json"), s => JsonResultWriter.Write(s, report)),
            (Path.Combine(dir, "o.geojson"), s => GeoJsonWriter.Write(s, report)),
            (Path.Combine(dir, "o.xml"), s => LandXmlWriter.Write(s, report)),
            (Path.Combine(dir, "o.csv"), s => { using var w = Utf8(s); CoordinateCsvWriter.Write(w, report); }),
            (Path.Combine(dir, "o.txt"), s => { using var w = Utf8(s); TextReportWriter.Write(w, report); }),
        ];
        string one = Directory.CreateTempSubdirectory("netadjust-one-").FullName;
        string two = Directory.CreateTempSubdirectory("netadjust-two-").FullName;
        try
        {
            SafeFileWriter.WriteAll(Files(one));
            SafeFileWriter.WriteAll(Files(two), concurrency: 2);
            foreach (var name in new[] { "o.json", "o.geojson", "o.xml", "o.csv", "o.txt" })
            {
                byte[] expected = File.ReadAllBytes(Path.Combine(one, name));
                Assert.True(expected.Length > 1000, $"{name}: only {expected.Length} bytes; test too small");
                Assert.Equal(expected, File.ReadAllBytes(Path.Combine(two, name)));
            }
            Assert.Equal(5, Directory.GetFiles(two).Length);
        }
        finally
        {
            Directory.Delete(one, recursive: true);
            Directory.Delete(two, recursive: true);
        }
    }

    [Fact]
    public void TwoWritersRunAtTheSameTime()
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-both-").FullName;
        try
        {
            // each writer waits for the other to start: one after the other, the first would wait in vain
            using var both = new Barrier(2);
            SafeFileWriter.WriteAll(new (string, Action<Stream>)[]
            {
                (Path.Combine(dir, "a.txt"), s => { Assert.True(both.SignalAndWait(Patience)); s.Write("a"u8); }),
                (Path.Combine(dir, "b.txt"), s => { Assert.True(both.SignalAndWait(Patience)); s.Write("b"u8); }),
            }, concurrency: 2);
            Assert.Equal("a", File.ReadAllText(Path.Combine(dir, "a.txt")));
            Assert.Equal("b", File.ReadAllText(Path.Combine(dir, "b.txt")));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void AFailingWriterReplacesNoFileAndLeavesNoTemporaryFile()
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-fail-").FullName;
        try
        {
            string a = Path.Combine(dir, "a.json"), b = Path.Combine(dir, "b.txt"), c = Path.Combine(dir, "c.csv");
            File.WriteAllText(a, "earlier a");
            File.WriteAllText(c, "earlier c");
            using var failed = new ManualResetEventSlim();
            var e = Assert.Throws<OutputException>(() => SafeFileWriter.WriteAll(new (string, Action<Stream>)[]
            {
                // a is still being written when b fails, and finishes afterwards
                (a, s => { s.Write("new a"u8); Assert.True(failed.Wait(Patience)); s.Write(new byte[100_000]); }),
                (b, s => { s.Write(new byte[100_000]); failed.Set(); throw new IOException("disk full"); }),
                (c, s => s.Write("new c"u8)),
            }, concurrency: 2));
            Assert.Contains("b.txt", e.Message);
            Assert.Equal("earlier a", File.ReadAllText(a));
            Assert.Equal("earlier c", File.ReadAllText(c));
            Assert.False(File.Exists(b));
            Assert.Equal(["a.json", "c.csv"], Directory.GetFiles(dir).Select(Path.GetFileName).Order());
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void TheFirstFailureInTheFilesOrderSurfacesWhicheverFailsFirst()
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-order-").FullName;
        try
        {
            using var bFailing = new ManualResetEventSlim();
            // b fails first in time; a, before it in order, fails later with an error of another type, which is the
            // one a write one after the other would have thrown
            var e = Assert.Throws<InvalidOperationException>(() => SafeFileWriter.WriteAll(
                new (string, Action<Stream>)[]
                {
                    (Path.Combine(dir, "a.json"), s =>
                    {
                        Assert.True(bFailing.Wait(Patience));
                        Thread.Sleep(50);
                        throw new InvalidOperationException("a broke");
                    }),
                    (Path.Combine(dir, "b.txt"), s => { bFailing.Set(); throw new IOException("b broke"); }),
                }, concurrency: 2));
            Assert.Equal("a broke", e.Message);
            Assert.Empty(Directory.GetFiles(dir));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    [Fact]
    public void ConcurrencyBelowOneIsRefused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() =>
            SafeFileWriter.WriteAll(Array.Empty<(string, Action<Stream>)>(), concurrency: 0));
}
