namespace NetAdjust;

/// <summary>
/// Two parts of one computation run at once, one on the calling thread and one on another core, for the large
/// networks where the second core pays. Each part writes only its own slots, so the numbers do not depend on the
/// schedule. A failure of the first part is the one reported (it comes first in the data, as it would one part after
/// the other), once the second part has finished; otherwise the second part's failure is thrown as it was raised.
/// </summary>
internal static class SideBySide
{
    /// <summary>Runs <paramref name="first"/> here and <paramref name="second"/> (when given) on another core, and
    /// returns when both are done.</summary>
    public static void Run(Action first, Action? second)
    {
        var other = second is null ? null : Task.Run(second);
        try { first(); }
        catch
        {
            try { other?.Wait(); }
            catch (AggregateException) { }
            throw;
        }
        other?.GetAwaiter().GetResult();
    }

    /// <summary>Where a run of <paramref name="count"/> items splits: at its middle when it has at least
    /// <paramref name="atLeast"/> items and the machine more than one core, else at its end (all on one thread).
    /// </summary>
    public static int Half(int count, int atLeast) =>
        count >= atLeast && Environment.ProcessorCount > 1 ? count / 2 : count;
}
