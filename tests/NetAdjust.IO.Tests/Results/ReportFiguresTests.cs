using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The largest standardised residuals of the summary: largest |w| first, ties by input order.</summary>
public sealed class ReportFiguresTests
{
    [Fact]
    public void TheWorstAreThoseOfASortByAbsoluteWThenByInputOrder()
    {
        var (r, _) = TestProjects.Demo();
        int n = r.Observations.Count;
        Assert.True(n > 10, $"only {n} observations");
        var random = new Random(11);
        for (int trial = 0; trial < 200; trial++)
        {
            // few distinct values, both signs, so that ties in |w| are common; some missing or not finite
            var w = Enumerable.Range(0, n).Select(_ => random.Next(6) switch
            {
                0 => (double?)null,
                1 => double.NaN,
                _ => random.Next(-4, 5) * 0.5,
            }).ToList();
            int count = random.Next(0, 8);
            // the reference: a full stable sort (LINQ), as the summary listed them before
            var expected = r.Observations.Where(o => w[o.Index] is double x && double.IsFinite(x))
                .Select(o => (o.Index, w[o.Index]!.Value))
                .OrderByDescending(t => Math.Abs(t.Value)).ThenBy(t => t.Index).Take(count).ToList();
            var actual = ReportFigures.Worst(r, w, count).Select(t => (t.Observation.Index, t.W)).ToList();
            Assert.Equal(expected, actual);
        }
        Assert.Empty(ReportFigures.Worst(r, null, 5));
    }
}
