using FsCheck;
using FsCheck.Fluent;
using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>What the tests of reading CSV observation files in pieces and in halves share: random texts of
/// characters of every UTF-8 length and every line end, the reader's settings, a hand-made file of every plain kind
/// and the CSV of a simulated network.</summary>
internal static class CsvReading
{
    /// <summary>Characters of 1 to 4 UTF-8 bytes (é 2, € 3, the G clef a surrogate pair of 4), commas, comment marks
    /// and the three line ends.</summary>
    private static readonly string[] Atoms = ["a", "7", ",", " ", "#", "é", "€", "\U0001D11E", "\r", "\n", "\r\n"];

    /// <summary>Texts of up to <paramref name="most"/> of <see cref="Atoms"/>.</summary>
    public static Gen<string> Texts(int most) =>
        from n in Gen.Choose(0, most)
        from atoms in Gen.ArrayOf(Gen.Elements(Atoms), n)
        select string.Concat(atoms);

    public static readonly ProjectUnits Units = new(LengthUnit.Metre, AngleFormat.Degrees, AngleSdUnit.Arcsecond);
    public static readonly LengthPattern Lengths = new(LengthUnit.Metre, 4);
    public static readonly AnglePattern Angles = new(AngleFormat.Degrees, 4);
    public static readonly Dictionary<ObservationKind, double> Defaults = [];

    /// <summary>One weighting for every levelled row (the same instance, so that two reads compare equal).</summary>
    private static readonly ObservationWeighting Levelled = new() { Levelling = new LevellingProcedure(4, 2) };

    public static ObservationWeighting Level(string level, Length? length, int? setups, int? runs) => Levelled;

    /// <summary>Reads a CSV text as the file obs.csv with these settings.</summary>
    public static List<Observation> Read(string text, IReadOnlyCollection<string>? pointIds = null,
        CsvObservationReader.CsvSpecifications? specs = null) =>
        CsvObservationReader.Read(text, "obs.csv", Lengths, Angles, Units, Defaults, Level, specs, pointIds);

    /// <summary>Reads the lines of a CSV file as obs.csv with these settings.</summary>
    public static List<Observation> Read(CsvLines lines, IReadOnlyCollection<string>? pointIds = null,
        CsvObservationReader.CsvSpecifications? specs = null) =>
        CsvObservationReader.Read(lines, "obs.csv", Lengths, Angles, Units, Defaults, Level, specs, pointIds);

    /// <summary>The header and rows of every plain kind the CSV reader takes, with marks and level fields, on points
    /// A, B, C and Dé€.</summary>
    public const string MixedHeader = "kind,at,from,to,value,sd,length,set,level,setups,runs,exclude,sd_factor";

    public static readonly string[] MixedRows =
    [
        "direction,A,,B,10.5,1.0,,1,,,,,", "direction,A,,C,20.25,1.0,,1,,,,yes,",
        "distance,,A,B,100.0100,0.003,,,,,,,2", "angle,A,B,C,45.0000,2,,,,,,,", "azimuth,,C,D,359.99999,5,,,,,,,",
        "height_difference,,A,B,1.2340,,250,,L1,4,2,,", "height_difference,,B,C,-0.5,0.001,120,,,,,,",
        "distance,,C,Dé€,12.5,2mm,,,,,,,",
    ];

    /// <summary>The CSV observation file the demo project writer makes for <paramref name="network"/>.</summary>
    public static string SimulatedCsv(SurveyNetwork network)
    {
        string dir = Directory.CreateTempSubdirectory("netadjust-csv-").FullName;
        try
        {
            ProjectFileWriter.Write(network, Path.Combine(dir, "net.yaml"), "csv reading");
            return File.ReadAllText(Directory.GetFiles(dir, "*.csv").Single());
        }
        finally { Directory.Delete(dir, recursive: true); }
    }
}
