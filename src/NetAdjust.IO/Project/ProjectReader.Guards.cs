using NetAdjust.Network;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// The public constructors of points and observations refuse impossible values (an empty id, a distance or section
/// length that is not positive, a value that is not finite) with an <see cref="ArgumentException"/> naming the
/// parameter. The reader turns that refusal into a <see cref="ProjectFileException"/> naming file, line and item.
/// </summary>
public static partial class ProjectReader
{
    /// <summary>Reads one list entry (a point, a setup, a levelling section) through <paramref name="read"/>.</summary>
    private static T Guarded<T>(Context ctx, YamlNode node, string item, Func<T> read)
    {
        try { return read(); }
        catch (ArgumentException e) { throw ctx.Error(node, item, GuardProblem(e)); }
    }

    /// <summary>Reads one list entry that adds what it reads itself (a setup).</summary>
    private static void Guarded(Context ctx, YamlNode node, string item, Action read) =>
        Guarded(ctx, node, item, () => { read(); return true; });

    /// <summary>A point id under <paramref name="key"/>: present, and not empty or white space.</summary>
    private static string RequiredId(Context ctx, YamlMappingNode m, string key, string item)
    {
        string id = ctx.RequiredString(m, key, item);
        return string.IsNullOrWhiteSpace(id)
            ? throw ctx.Error(ctx.Child(m, key) ?? m, item, $"'{key}' is empty: a point id needs a name")
            : id;
    }

    /// <summary>A measured distance: positive (zero or less is no measurement).</summary>
    private static Length PositiveDistance(Context ctx, YamlNode node, Length d, string item) =>
        d.Metres > 0 ? d
            : throw ctx.Error(node, item, $"a distance must be positive, not {d.Metres.ToString("R",
                System.Globalization.CultureInfo.InvariantCulture)} m");

    /// <summary>The problem a constructor's guard names, without .NET's parameter suffix.</summary>
    internal static string GuardProblem(ArgumentException e)
    {
        string m = e.Message;
        int cut = m.IndexOf(" (Parameter '", StringComparison.Ordinal);
        if (cut >= 0) m = m[..cut];
        return m.TrimEnd('.');
    }
}
