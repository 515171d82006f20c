using NetAdjust.IO.Project;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Project;

/// <summary>
/// The CSV observation reader carries some things from one row to the next (the kind and the point ids of the row
/// before, the set id of a run of directions, the place file:line kept as the two): a file read whole gives what
/// each of its rows gives when read alone (the same file with the other rows as comment lines, so that every line
/// keeps its number), both for good rows (the same observations, sources and booked texts) and for bad ones (the
/// same error, naming the same file, line and item).
/// </summary>
public class CsvRowByRowTests
{
    private const string Header = "kind,at,from,to,value,sd,length,set";

    private static readonly ProjectUnits Units = new(LengthUnit.Metre, AngleFormat.Degrees, AngleSdUnit.Arcsecond);

    private static List<Observation> Read(string text) =>
        CsvObservationReader.Read(text, "obs.csv", new LengthPattern(LengthUnit.Metre, 4),
            new AnglePattern(AngleFormat.Degrees, 4), Units, new Dictionary<ObservationKind, double>(),
            pointIds: ["A", "B", "C", "D"]);

    /// <summary>The file with only row <paramref name="keep"/> (0-based among <paramref name="rows"/>) left as it
    /// is: the others become comment lines.</summary>
    private static string Alone(string[] rows, int keep) =>
        string.Join("\n", [Header, .. rows.Select((r, i) => i == keep ? r : "# " + r)]) + "\n";

    private static readonly string[] GoodRows =
    [
        "direction,A,,B,10.5,1.0,,1",
        "direction,A,,C,20.25,1.0,,1",
        "direction,A,,D,30.125,1.5,,",
        "direction,A,,B,10.5,1.0,,2",
        "direction,B,,A,190.5,1.0,,2",
        "direction,B,,C,200.5,1.0,,2",
        "distance,,A,B,100.0100,0.003,,",
        "distance,,A,C,141.4200,0.003,,",
        "distance,,E,B,12.5,0.002,,",
        "distance,,E,B,12.5,2mm,,",
        "angle,A,B,C,45.0000,2,,",
        "angle,A,B,D,46.0000,2,,",
        "azimuth,,C,D,359.99999,5,,",
        "height_difference,,A,B,1.2340,0.001,,",
        "height_difference,,A,B,-0.5,0.001,250,",
        "distance,,A,B,100.01,0.003,,",
    ];

    [Fact]
    public void AFileReadWholeGivesWhatEachRowGivesAlone()
    {
        string whole = string.Join("\n", [Header, .. GoodRows]) + "\n";
        var all = Read(whole);
        Assert.Equal(GoodRows.Length, all.Count);
        for (int i = 0; i < GoodRows.Length; i++)
        {
            var alone = Assert.Single(Read(Alone(GoodRows, i)));
            // records: kind, points, value, standard deviation, set, source (file:line) and booked text alike
            Assert.Equal(alone, all[i]);
            Assert.Equal(alone.GetHashCode(), all[i].GetHashCode());
            Assert.Equal($"obs.csv:{i + 2}", all[i].Source);
            Assert.Equal(alone.ToString(), all[i].ToString());
        }
        // the ids of a file are the project's strings; a new id is one string for the whole file
        Assert.Same(all[6].From, all[7].From);
        Assert.Same(all[8].From, all[9].From);
        Assert.Equal("E", all[8].From);
        Assert.Equal("10.5", all[0].BookedText);
        Assert.Equal("100.0100", all[6].BookedText);
        Assert.Equal("A/obs.csv#1", ((DirectionObservation)all[0]).SetId);
        Assert.Equal("A/obs.csv#1", ((DirectionObservation)all[2]).SetId); // an empty set is set 1
        Assert.Equal("A/obs.csv#2", ((DirectionObservation)all[3]).SetId);
        Assert.Equal("B/obs.csv#2", ((DirectionObservation)all[4]).SetId);
    }

    [Theory]
    [InlineData(",A,,B,10.5,1.0,,1")] // an empty kind after rows of a kind
    [InlineData("directions,A,,B,10.5,1.0,,1")]
    [InlineData("Direction,A,,B,10.5,1.0,,1")]
    [InlineData("direction,,,B,10.5,1.0,,1")]
    [InlineData("direction,A,,,10.5,1.0,,1")]
    [InlineData("direction,A,,B,x,1.0,,1")]
    [InlineData("direction,A,,B,10.5,0,,1")]
    [InlineData("direction,A,,B,10.5,,,1")]
    [InlineData("direction,A,,B,10.5,1.0,,1,9")]
    [InlineData("distance,,A,B,-3,0.003,,")]
    [InlineData("distance,,A,B,3,x,,")]
    [InlineData("distance,,A,,3,0.003,,")]
    [InlineData("angle,A,B,C,45.0000,-2,,")]
    [InlineData("height_difference,,A,B,1.2340,0.001,x,")]
    [InlineData("height_difference,,A,B,,0.001,,")]
    [InlineData("baseline,,A,B,1,0.001,,")]
    public void ABadRowGivesTheSameErrorAfterOtherRowsAsAlone(string bad)
    {
        string[] rows = [.. GoodRows, bad];
        string whole = string.Join("\n", [Header, .. rows]) + "\n";
        var inWhole = Record.Exception(() => Read(whole));
        var alone = Record.Exception(() => Read(Alone(rows, rows.Length - 1)));
        Assert.NotNull(alone);
        Assert.IsType(alone.GetType(), inWhole);
        Assert.Equal(alone.Message, inWhole!.Message);
        if (alone is ProjectFileException a)
        {
            var w = (ProjectFileException)inWhole;
            Assert.Equal((a.File, a.Line, a.Item), (w.File, w.Line, w.Item));
            Assert.Equal(rows.Length + 1, w.Line);
        }
    }

    /// <summary>A σ of a linear kind given as a plain number is read without a string: the same metres, or the same
    /// refusal, as the general reading of a σ text (ProjectReader.ParseSd, through LengthPattern) in every length
    /// unit.</summary>
    [Theory]
    [InlineData("0.0028")]
    [InlineData("2.5e-3")]
    [InlineData("+0.004")]
    [InlineData("1")]
    [InlineData("0")]
    [InlineData("-0.002")]
    [InlineData("3mm")]
    [InlineData("0.01ft")]
    public void APlainLinearSdIsReadAsTheGeneralReadingReadsIt(string sd)
    {
        foreach (var unit in LengthUnit.All)
        {
            var units = new ProjectUnits(unit, AngleFormat.Degrees, AngleSdUnit.Arcsecond);
            double expected = ProjectReader.ParseSd(sd, ObservationKind.Distance, units, out string? error);
            List<Observation>? all = null;
            var refused = Record.Exception(() => all = CsvObservationReader.Read(
                $"{Header}\ndistance,,A,B,100.0,{sd},,\nheight_difference,,A,B,1.5,{sd},,\n", "obs.csv",
                new LengthPattern(unit, 4), new AnglePattern(AngleFormat.Degrees, 4), units,
                new Dictionary<ObservationKind, double>(), pointIds: ["A", "B"]));
            if (error is null)
            {
                Assert.Null(refused);
                Assert.All(all!, o => Assert.Equal(expected, o.StandardDeviation));
            }
            else
                Assert.Equal($"obs.csv:2: distance A→B: {error}", Assert.IsType<ProjectFileException>(refused).Message);
        }
    }

    [Fact]
    public void IdsThatShareASlotOfTheRecentIdsAreToldApart()
    {
        // ids that differ only before their last four characters fall in one slot of CsvRow's table of ids met lately
        string[] ids = ["PA0001", "QA0001", "RA0001", "PA0001", "QA0001", "A", "PA0001"];
        var rows = ids.Select((id, i) => $"distance,,{id},Z{i % 2},10.0,0.002,,");
        var read = Read(Header + "\n" + string.Join("\n", rows) + "\n");
        Assert.Equal(ids, read.Select(o => o.From));
        Assert.Same(read[0].From, read[3].From);
        Assert.Same(read[0].From, read[6].From);
        Assert.Same(read[1].From, read[4].From);
        Assert.Same(read[1].To, read[3].To);
    }

    [Fact]
    public void ACompactSourceEqualsItsText()
    {
        var read = Read(Header + "\ndistance,,A,B,100.0100,0.003,,\n")[0];
        var written = new DistanceObservation("A", "B", Length.FromMetres(100.01))
        {
            Sd = Length.FromMetres(0.003), Source = "obs.csv:2", BookedText = "100.0100",
        };
        Assert.Equal(written, read);
        Assert.Equal(read, written);
        Assert.Equal(written.GetHashCode(), read.GetHashCode());
        Assert.Equal(written.ToString(), read.ToString());
        Assert.Equal("distance A→B (obs.csv:2)", read.Describe());
        Assert.NotEqual(written with { Source = "obs.csv:20" }, read);
        Assert.NotEqual(written with { Source = "obs.csv:" }, read);
        Assert.NotEqual(written with { Source = "obs.cs:2" }, read);
        Assert.NotEqual(written with { Source = null }, read);
        Assert.Equal(written with { Source = "x:1" }, read with { Source = "x:1" });
        Assert.Equal(read, read with { });
        Assert.Null((read with { Source = null }).Source);
    }
}

/// <summary>
/// A booked value kept as its digits (<see cref="BookedValueText"/>) gives back its text character for character, and
/// is equal to (with the hash code of) the same text kept as a string; texts that are not plain decimals are kept as
/// they are.
/// </summary>
public class BookedValueTextTests
{
    [Theory]
    [InlineData("182.929550247")]
    [InlineData("100.0100")]
    [InlineData("-0.5")]
    [InlineData("-0")]
    [InlineData("0")]
    [InlineData("007")]
    [InlineData("007.000")]
    [InlineData("123456789012345")] // 15 digits: the most kept as a number
    [InlineData("9999999999999999")] // 16 digits: kept as a string (beyond the 52 bits)
    [InlineData("-99999.9999999999")] // 15 digits, 10 places
    [InlineData("0.00000000000000")] // 15 digits, 14 places
    [InlineData("999999999999999")]
    [InlineData("1234567890123456789")]
    [InlineData("9999999999.999999999")]
    [InlineData("12345678901234567890")] // 20 digits: kept as a string
    [InlineData("1.")]
    [InlineData(".5")]
    [InlineData("+1")]
    [InlineData("1e3")]
    [InlineData("1.2.3")]
    [InlineData("--1")]
    [InlineData("-")]
    [InlineData("")]
    [InlineData("123-45-12.3")]
    [InlineData("12 .5")]
    [InlineData("١٢")] // Arabic-Indic digits: not plain decimal digits
    public void ATextComesBackAsBooked(string text)
    {
        var kept = BookedValueText.Of(text);
        var asString = new BookedValueText(text);
        Assert.Equal(text, kept.Text);
        Assert.True(kept.Equals(asString));
        Assert.True(asString.Equals(kept));
        Assert.Equal(text.GetHashCode(StringComparison.Ordinal), kept.GetHashCode());
        Assert.Equal(asString.GetHashCode(), kept.GetHashCode());
        Assert.False(kept.Equals(new BookedValueText(text + "0")));
        Assert.False(kept.Equals(BookedValueText.Of(text + "1")));
        Assert.False(kept.Equals(new BookedValueText(null)));
    }

    [Fact]
    public void DifferentTextsOfOneNumberStayDifferent()
    {
        // 1.50 and 1.5 are one number and two bookings (the diagnosis reads the booked digits)
        Assert.NotEqual(BookedValueText.Of("1.50"), BookedValueText.Of("1.5"));
        Assert.NotEqual(BookedValueText.Of("01.5"), BookedValueText.Of("1.5"));
        Assert.NotEqual(BookedValueText.Of("-1.5"), BookedValueText.Of("1.5"));
        Assert.NotEqual(BookedValueText.Of("15"), BookedValueText.Of("1.5"));
        Assert.Equal(BookedValueText.Of("1.5"), BookedValueText.Of("1.5"));
        Assert.Null(default(BookedValueText).Text);
    }
}
