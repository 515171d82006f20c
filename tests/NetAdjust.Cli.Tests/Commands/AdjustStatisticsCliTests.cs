using System.Text.Json;
using NetAdjust.Cli;

namespace NetAdjust.Cli.Tests.Commands;

public class AdjustStatisticsCliTests
{
    [Fact]
    public void TheBlunderDemoIsHuntedAndTheJsonCarriesTheStatistics()
    {
        string dir = Path.Combine(Path.GetTempPath(), "netadjust-stat-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string json = Path.Combine(dir, "r.json");
            var (code, text, err) =
                CliHarness.Run("adjust", CliHarness.DataFile("harrowfield-blunder.yaml"), "--date", "2026-12-01",
                "--snoop", "--robust", "danish", "--components", "--json", json);
            Assert.True(code == 0, err);
            foreach (var section in new[] { "TESTS OF THE OBSERVATIONS", "ERROR ELLIPSES", "RELATIVE ERROR ELLIPSES",
                "BLUNDER HUNT", "ROBUST ESTIMATION", "VARIANCE COMPONENTS" })
                Assert.Contains(section, text);

            using var doc = JsonDocument.Parse(File.ReadAllText(json));
            var root = doc.RootElement;
            var obs = root.GetProperty("observations");
            foreach (var o in obs.EnumerateArray())
                foreach (var key in new[] { "redundancy", "w", "tau", "mdb", "external_reliability", "flag" })
                    Assert.True(o.TryGetProperty(key, out _), $"observation lacks '{key}'");
            // The planted blunder (distance H3→H4, observation index 25) is set aside, still reported, flagged.
            var hunt = root.GetProperty("blunder_hunt");
            Assert.Equal(25, hunt.GetProperty("set_aside")[0].GetInt32());
            var planted = obs[25];
            Assert.Equal("excluded", planted.GetProperty("flag").GetString());
            Assert.True(Math.Abs(planted.GetProperty("residual").GetDouble()) > 0.03);
            foreach (var p in root.GetProperty("points").EnumerateArray())
            {
                var e = p.GetProperty("ellipse");
                foreach (var key in new[] { "a", "b", "azimuth", "a95", "b95" })
                    Assert.True(e.TryGetProperty(key, out _));
                Assert.InRange(e.GetProperty("azimuth").GetDouble(), 0, 180);
            }
            var rel = root.GetProperty("relative");
            Assert.Contains(rel.EnumerateArray(), r => r.GetProperty("from").GetString() == "H1" &&
                r.GetProperty("to").GetString() == "H4");
            foreach (var r in rel.EnumerateArray())
                foreach (var key in new[] { "from", "to", "a", "b", "azimuth", "a95", "b95", "distance",
                    "sd_distance" })
                    Assert.True(r.TryGetProperty(key, out _));
            Assert.Equal("known", root.GetProperty("testing").GetProperty("variance_factor_basis").GetString());
            Assert.Contains(root.GetProperty("robust").GetProperty("suspected").EnumerateArray(), x =>
                x.GetInt32() == 25);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Theory]
    [InlineData("--robust", "median", "--robust: 'median' is not a robust method: use huber or danish")]
    [InlineData("--variance-factor", "guessed",
        "--variance-factor: 'guessed' is not a variance-factor basis: use known")]
    [InlineData("--snoop-limit", "0", "--snoop-limit 0 must be at least 1")]
    public void BadStatisticsOptionsAreInvalidInput(string option, string value, string message)
    {
        var (code, _, err) = CliHarness.Run("adjust", CliHarness.DataFile("harrowfield-blunder.yaml"), option, value);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains(message, err);
    }

    [Fact]
    public void EstimatedVarianceFactorSwitchesToTheTauTestAndTheFScale()
    {
        var (code, text, _) =
            CliHarness.Run("adjust", CliHarness.DataFile("harrowfield-blunder.yaml"), "--date", "2026-12-01",
            "--variance-factor", "estimated");
        Assert.Equal(0, code);
        Assert.Contains("Deciding test: tau test (Pope)", text);
        Assert.Contains("sqrt(2 F(2, 15))", text);
    }
}
