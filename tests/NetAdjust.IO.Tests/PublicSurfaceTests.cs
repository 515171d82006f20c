using System.Reflection;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Misclosures;
using NetAdjust.Procedures;
using NetAdjust.Reduction;
using NetAdjust.Standards;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests;

/// <summary>
/// The public surface of both packages (NetAdjust and NetAdjust.IO), read by reflection and from the XML
/// documentation the packages ship: no public number is a bare angle in radians, and results are made by the library
/// only. Found by walking the assemblies, so a new member or result type is checked without being listed here.
/// </summary>
public sealed partial class PublicSurfaceTests
{
    private static readonly Assembly[] Packages = [typeof(Adjuster).Assembly, typeof(ProjectReader).Assembly];

    /// <summary>
    /// Public double properties and fields whose documentation says radians and that stay so on purpose, with the
    /// reason. Everything else that is an angle is typed (<c>Angle</c>, or <c>Quantity</c> when the kind decides).
    /// </summary>
    private static readonly Dictionary<string, string> AllowedRadians = new(StringComparer.Ordinal)
    {
        ["NetAdjust.Units.Angle.Radians"] = "the unit-named reading of the typed angle itself",
        ["NetAdjust.Units.Angle.ArcsecondsPerRadian"] = "a conversion constant (648000/π), not an angle",
        ["NetAdjust.Network.Observation.Value"] = "the generic SI value every observation kind overrides (an override "
            + "cannot narrow the access, and new kinds are written against it); each kind shows its value typed "
            + "(Distance, Reading, Zenith, ...) and every observation as ObservedValue",
        ["NetAdjust.Network.ZenithObservation.RefractionSd"] =
            "σ of the dimensionless refraction coefficient k; its documentation names radians for its effect on z",
    };

    [Fact]
    public void NoPublicDoublePropertyOrFieldIsAnAngleInRadians()
    {
        var docs = Documentation();
        var offenders = new List<string>();
        foreach (var type in Packages.SelectMany(a => a.GetExportedTypes()))
        {
            const BindingFlags Flags = BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static
                | BindingFlags.DeclaredOnly;
            var members = type.GetProperties(Flags)
                .Where(p => IsDouble(p.PropertyType) && p.GetMethod is { IsPublic: true })
                .Select(p => (MemberInfo)p)
                .Concat(type.GetFields(Flags).Where(f => IsDouble(f.FieldType)));
            foreach (var m in members)
            {
                string name = $"{type.FullName}.{m.Name}";
                string doc = DocOf(docs, type, m);
                bool radians = m.Name.Contains("Radian", StringComparison.OrdinalIgnoreCase)
                    || SaysRadians().IsMatch(doc);
                if (radians && !AllowedRadians.ContainsKey(name)) offenders.Add($"{name}: {doc}");
            }
        }
        Assert.True(offenders.Count == 0,
            "public doubles in radians (type them as Angle or Quantity, or allow them here with a reason):"
            + Environment.NewLine + string.Join(Environment.NewLine, offenders));
    }

    [Fact]
    public void TheAllowedRadiansExistAndSayRadians()
    {
        // The list must not keep entries for members that are gone or that no longer say radians (common practice:
        // an exception list is kept as short as the facts allow).
        var docs = Documentation();
        foreach (var name in AllowedRadians.Keys)
        {
            int dot = name.LastIndexOf('.');
            var type = Packages.Select(a => a.GetType(name[..dot])).Single(t => t is not null)!;
            var member = type.GetMember(name[(dot + 1)..]).Single();
            Assert.True(member.Name.Contains("Radian", StringComparison.Ordinal)
                || SaysRadians().IsMatch(DocOf(docs, type, member)), name);
        }
    }

    [Fact]
    public void TheChecksFindBareUnitsInTheDocumentation()
    {
        // The detectors themselves: phrases the library's documentation uses for radians and metres are caught;
        // degrees, square metres and words that merely contain the letters are not.
        Assert.Matches(SaysRadians(), "Azimuth of the semi-major axis, radians clockwise from north, in [0, π).");
        Assert.Matches(SaysRadians(), "Its standard deviation (rad).");
        Assert.Matches(SaysRadians(), "Values in SI (m or rad).");
        Assert.Matches(SaysRadians(), "The adjusted value (for angular kinds in [0, 2π)).");
        Assert.DoesNotMatch(SaysRadians(), "The azimuth of the semi-major axis in degrees, in [0, 180).");
        Assert.DoesNotMatch(SaysRadians(), "Radial offset of the mark.");
        Assert.Matches(SaysMetres(), "Easting discrepancy (m).");
        Assert.Matches(SaysMetres(), "The mean ellipsoidal height of the line in metres; null when not used.");
        Assert.Matches(SaysMetres(), "The 95% value or the misclosure's size, m.");
        Assert.DoesNotMatch(SaysMetres(), "Covariance of easting and northing, m² (0 when held).");
        Assert.DoesNotMatch(SaysMetres(), "Σ rᵢ over all weighted rows (equals the degrees of freedom).");
    }

    /// <summary>
    /// Results are made by the library: no type reachable through the public properties of a result (adjustment,
    /// analysis, sequence, blunder hunt, robust and variance-component runs, checks before the adjustment, standards,
    /// grid reduction, rounds, procedure recommendation) has a public constructor, except the inputs and options a
    /// result carries back (listed with their reason).
    /// </summary>
    [Fact]
    public void NoResultTypeHasAPublicConstructor()
    {
        var made = ResultTypes();
        Assert.Contains(typeof(ErrorEllipse), made);
        Assert.True(made.Count > 30, $"the walk reached only {made.Count} result types");
        var open = made.Where(t => t.GetConstructors().Any(c => !IsParameterlessStruct(t, c)))
            .Select(t => t.FullName).Order(StringComparer.Ordinal).ToList();
        Assert.True(open.Count == 0, "result types with a public constructor:" + Environment.NewLine
            + string.Join(Environment.NewLine, open));
    }

    [Fact]
    public void NoResultHasAPublicDoubleInMetres()
    {
        // Lengths of results are typed (Length, or Quantity by the kind); dimensionless numbers stay doubles.
        var docs = Documentation();
        var offenders = new List<string>();
        foreach (var t in ResultTypes())
            foreach (var p in t.GetProperties(BindingFlags.Public | BindingFlags.Instance | BindingFlags.DeclaredOnly)
                .Where(p => IsDouble(p.PropertyType)))
            {
                string doc = DocOf(docs, t, p);
                if (SaysMetres().IsMatch(doc) && !AllowedMetres.ContainsKey($"{t.FullName}.{p.Name}"))
                    offenders.Add($"{t.FullName}.{p.Name}: {doc}");
            }
        Assert.True(offenders.Count == 0, "public doubles in metres in results (type them as Length):"
            + Environment.NewLine + string.Join(Environment.NewLine, offenders));
    }

    /// <summary>Result doubles whose documentation names metres and that stay doubles, with the reason.</summary>
    private static readonly Dictionary<string, string> AllowedMetres = new(StringComparer.Ordinal)
    {
        ["NetAdjust.Adjustment.AdjustedPoint.CovEN"] = "a covariance, m², not a length",
    };

    /// <summary>"m" as a unit, "metre(s)".</summary>
    [GeneratedRegex(@"\(m\)|\bm\b(?![²-])|metre", RegexOptions.IgnoreCase)]
    private static partial Regex SaysMetres();

    /// <summary>
    /// The types reachable through the public properties of the results (adjustment, analysis, sequence, blunder
    /// hunt, robust and variance-component runs, checks before the adjustment, standards, grid reduction, rounds,
    /// procedure recommendation), without the inputs they carry back.
    /// </summary>
    private static List<Type> ResultTypes()
    {
        Type[] roots =
        [
            typeof(AdjustmentResult), typeof(NetworkAnalysis), typeof(SequenceResult), typeof(BlunderHunt),
            typeof(RobustEstimate), typeof(VarianceComponentEstimate), typeof(MisclosureReport),
            typeof(StandardsReport), typeof(GridReductionResult), typeof(ReducedRounds),
            typeof(ProcedureRecommendation),
        ];
        var seen = new HashSet<Type>();
        var queue = new Queue<Type>(roots);
        while (queue.Count > 0)
        {
            var t = queue.Dequeue();
            if (!seen.Add(t) || IsInput(t)) continue;
            foreach (var p in t.GetProperties(BindingFlags.Public | BindingFlags.Instance))
                foreach (var inner in Unwrap(p.PropertyType))
                    if (inner.Assembly == typeof(Adjuster).Assembly && !inner.IsEnum) queue.Enqueue(inner);
        }
        return seen.Where(t => !IsInput(t) && !t.IsInterface && !t.IsAbstract).ToList();
    }

    /// <summary>
    /// Inputs a result carries back, which callers make themselves: the network layer (points, observations,
    /// specifications: data only, with guarded constructors), the quantities of the units layer, and the options
    /// and declarations listed by name with why.
    /// </summary>
    private static bool IsInput(Type t) => t.Namespace is "NetAdjust.Network" or "NetAdjust.Units"
        || InputTypes.ContainsKey(t.Name);

    private static readonly Dictionary<string, string> InputTypes = new(StringComparer.Ordinal)
    {
        ["AdjustmentOptions"] = "options the caller sets",
        ["AnalysisOptions"] = "options the caller sets",
        ["MisclosureOptions"] = "options the caller sets",
        ["RoundsOptions"] = "options the caller sets",
        ["AccuracyStandard"] = "a standard the caller may define",
        ["GridSystem"] = "the grid declaration the caller gives",
        ["Ellipsoid"] = "a reference ellipsoid the caller may define",
        ["ErrorBudget"] = "a budget a caller may give an observation (guarded constructor)",
        ["ErrorContribution"] = "a named part of a budget (guarded constructor)",
        ["Unknown"] = "a plain value naming one unknown",
    };

    private static bool IsParameterlessStruct(Type t, ConstructorInfo c) =>
        t.IsValueType && c.GetParameters().Length == 0;

    private static IEnumerable<Type> Unwrap(Type t)
    {
        if (t.IsArray) return Unwrap(t.GetElementType()!);
        if (t.IsGenericType) return t.GetGenericArguments().SelectMany(Unwrap);
        return [t];
    }

    private static bool IsDouble(Type t) => t == typeof(double) || t == typeof(double?);

    /// <summary>"rad", "radian(s)", or an interval of whole turns written with π.</summary>
    [GeneratedRegex(@"\brad\b|radian|\[0, 2?π\)|\(−π, π\]", RegexOptions.IgnoreCase)]
    private static partial Regex SaysRadians();

    /// <summary>Member id → its documentation text, from the XML files beside the assemblies.</summary>
    private static Dictionary<string, string> Documentation()
    {
        var docs = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var a in Packages)
        {
            string file = Path.ChangeExtension(a.Location, ".xml");
            Assert.True(File.Exists(file), $"no XML documentation beside {a.Location}");
            foreach (var m in XDocument.Load(file).Descendants("member"))
                docs[(string)m.Attribute("name")!] = m.ToString(SaveOptions.DisableFormatting);
        }
        return docs;
    }

    /// <summary>The member's own documentation, or its positional record parameter's on the declaring type.</summary>
    private static string DocOf(Dictionary<string, string> docs, Type type, MemberInfo m)
    {
        string prefix = m is FieldInfo ? "F:" : "P:";
        string id = $"{prefix}{type.FullName!.Replace('+', '.')}.{m.Name}";
        if (docs.TryGetValue(id, out var own)) return Text(own, null);
        return docs.TryGetValue($"T:{type.FullName!.Replace('+', '.')}", out var t) ? Text(t, m.Name) : "";
    }

    private static string Text(string xml, string? param)
    {
        var e = XElement.Parse(xml);
        var node = param is null ? e : e.Elements("param").FirstOrDefault(p => (string?)p.Attribute("name") == param);
        return node is null ? "" : Regex.Replace(node.Value, @"\s+", " ").Trim();
    }
}
