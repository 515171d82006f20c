namespace NetAdjust.Network;

/// <summary>How one levelling section was run: the number of instrument setups in one run, and how many runs are
/// meaned.</summary>
public sealed record LevellingProcedure
{
    /// <summary>Creates a procedure.</summary>
    /// <param name="setups">Instrument setups in one run of the section (1..100000); each gives a backsight and a
    /// foresight reading.</param>
    /// <param name="runs">Independent runs meaned (1 = single run, 2 = double run; 1..100).</param>
    /// <exception cref="InvalidInputException">When a count is out of range.</exception>
    public LevellingProcedure(int setups, int runs)
    {
        if (setups is < 1 or > 100000)
            throw new InvalidInputException(
                $"the number of level setups must be a whole number from 1 to 100000, not {setups}");
        if (runs is < 1 or > 100)
            throw new InvalidInputException(
                $"the number of levelling runs must be a whole number from 1 to 100, not {runs}");
        Setups = setups;
        Runs = runs;
    }

    /// <summary>Setups in one run.</summary>
    public int Setups { get; }

    /// <summary>Runs meaned.</summary>
    public int Runs { get; }

    /// <summary>Rod readings in one run: a backsight and a foresight per setup.</summary>
    public int Readings => 2 * Setups;
}
