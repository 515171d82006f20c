namespace NetAdjust.Network;

/// <summary>How directions are observed at a setup: the number of sets averaged and the faces.</summary>
public sealed record ObservingProcedure
{
    /// <summary>One set in both faces.</summary>
    public static ObservingProcedure Default { get; } = new(1, Faces.Both);

    /// <summary>Creates a procedure.</summary>
    /// <param name="sets">Number of sets averaged (1..1000).</param>
    /// <param name="faces">Faces observed in each set.</param>
    /// <exception cref="InvalidInputException">When sets is out of range.</exception>
    public ObservingProcedure(int sets, Faces faces)
    {
        if (sets is < 1 or > 1000)
            throw new InvalidInputException($"the number of sets must be a whole number from 1 to 1000, not {sets}");
        Sets = sets;
        Faces = faces;
    }

    /// <summary>Number of sets averaged.</summary>
    public int Sets { get; }

    /// <summary>Faces observed in each set.</summary>
    public Faces Faces { get; }
}
