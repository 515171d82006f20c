namespace NetAdjust.Network;

internal static class Checks
{
    public static void Id(string? id, string what)
    {
        if (string.IsNullOrWhiteSpace(id)) throw new InvalidInputException($"{what} needs an id (a name of its own)");
    }

    public static void NonNegative(double v, string what)
    {
        if (!double.IsFinite(v)) throw new InvalidInputException($"{what} must be a finite number");
        if (v < 0) throw new InvalidInputException($"{what} must not be negative");
    }

    public static void Positive(double v, string what)
    {
        if (!double.IsFinite(v)) throw new InvalidInputException($"{what} must be a finite number");
        if (!(v > 0)) throw new InvalidInputException($"{what} must be positive");
    }
}
