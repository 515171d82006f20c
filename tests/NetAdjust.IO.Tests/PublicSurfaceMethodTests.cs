using System.Reflection;
using System.Runtime.CompilerServices;
using System.Xml.Linq;

namespace NetAdjust.IO.Tests;

/// <summary>
/// The public methods and constructors of both packages: no parameter or return value is a bare double in radians
/// (read from the parameter's name and from its <c>param</c> or <c>returns</c> documentation), except the short
/// list below, each with its reason. Found by walking the assemblies, so a new method is checked without being
/// listed here.
/// </summary>
public sealed partial class PublicSurfaceTests
{
    /// <summary>
    /// Public method parameters and returns (<c>Type.Method(parameter)</c>, <c>Type.Method → return</c>) that are
    /// doubles in radians on purpose, with the reason. Everything else takes and gives <c>Angle</c> or
    /// <c>Quantity</c>.
    /// </summary>
    private static readonly Dictionary<string, string> AllowedRadianArguments = new(StringComparer.Ordinal)
    {
        ["NetAdjust.Units.Angle.FromRadians(radians)"] = "the unit-named constructor of the typed angle itself",
        ["NetAdjust.IO.Project.AngleSdUnits.RadiansPerUnit → return"] =
            "a conversion factor (radians in one unit of the project), not an angle, like Angle.ArcsecondsPerRadian",
        ["NetAdjust.Geodesy.IMapProjection.Forward(latitude)"] = ProjectionSeam,
        ["NetAdjust.Geodesy.IMapProjection.Forward(longitude)"] = ProjectionSeam,
        ["NetAdjust.Geodesy.IMapProjection.Inverse → return"] = ProjectionSeam,
        ["NetAdjust.Observations.ObservationKindRegistry.Difference → return"] = EvaluationSeam,
        ["NetAdjust.Geometry.PlaneGeometry.Direction(orientation)"] = EvaluationSeam,
        ["NetAdjust.Geometry.SpatialGeometry.ZenithByRefraction → return"] = EvaluationSeam
            + "; ∂z/∂k is a coefficient of the design matrix (radians per unit of k), not an angle",
        ["NetAdjust.Adjustment.ParameterState.Orientation → return"] = EvaluationSeam,
        ["NetAdjust.Adjustment.ParameterState.Frame → return"] = EvaluationSeam
            + "; the current frame rotation or scale difference of a GNSS frame, as the baseline equation takes it",
        ["NetAdjust.Observations.ICoordinates.Frame → return"] = EvaluationSeam
            + "; the current frame rotation or scale difference of a GNSS frame, as the baseline equation takes it",
    };

    /// <summary>The reason shared by the seam a projection library is wrapped behind.</summary>
    private const string ProjectionSeam = "the seam a projection library is wrapped behind (NetAdjust.IO wraps "
        + "ProjNET): such libraries take and give plain radians, so implementers write this; callers use the typed "
        + "MapProjections.GridOf / GeodeticOf";

    /// <summary>The reason shared by the evaluation seam of observation kinds.</summary>
    private const string EvaluationSeam = "the evaluation seam of observation kinds (IObservationKind, ICoordinates, "
        + "ParameterState, PlaneGeometry, SpatialGeometry): observation equations and their partial derivatives "
        + "are computed in SI doubles as the design matrix holds them; public so a kind can be written against it, "
        + "never needed to adjust a network or read its results";

    [Fact]
    public void NoPublicMethodTakesOrGivesABareAngleInRadians()
    {
        var docs = Documentation();
        var offenders = new List<string>();
        foreach (var (name, doc) in DoubleArguments(docs))
        {
            // The parameter's name, or for a return the method's name.
            string leaf = name.EndsWith(" → return", StringComparison.Ordinal)
                ? name[(name.LastIndexOf('.') + 1)..]
                : name[name.LastIndexOf('(')..];
            bool radians = leaf.Contains("radian", StringComparison.OrdinalIgnoreCase) || SaysRadians().IsMatch(doc);
            if (radians && !AllowedRadianArguments.ContainsKey(name)) offenders.Add($"{name}: {doc}");
        }
        Assert.True(offenders.Count == 0,
            "public method parameters or returns that are doubles in radians (take or give Angle or Quantity, or "
            + "allow them here with a reason):" + Environment.NewLine + string.Join(Environment.NewLine, offenders));
    }

    [Fact]
    public void TheAllowedRadianArgumentsExistAndSayRadians()
    {
        // Common practice: an exception list is kept as short as the facts allow, so an entry whose method is gone
        // or typed fails here.
        var found = DoubleArguments(Documentation()).GroupBy(a => a.Name, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => string.Join(" | ", g.Select(a => a.Doc)), StringComparer.Ordinal);
        foreach (var name in AllowedRadianArguments.Keys)
        {
            Assert.True(found.TryGetValue(name, out var doc), $"{name} is not a public double argument");
            Assert.True(name.Contains("adian", StringComparison.Ordinal) || SaysRadians().IsMatch(doc!), name);
        }
    }

    [Fact]
    public void TheMethodWalkFindsTheDocumentationOfEveryArgument()
    {
        // The walk itself: every public member is documented (missing documentation is a build error), so an
        // argument without text would mean a documentation id built wrong and a check that cannot fail.
        var args = DoubleArguments(Documentation()).ToList();
        Assert.True(args.Count > 50, $"the walk found only {args.Count} double arguments");
        Assert.Contains(args, a => a.Name == "NetAdjust.Units.Angle.FromDegrees(degrees)");
        var blank = args.Where(a => a.Doc.Length == 0).Select(a => a.Name).ToList();
        Assert.True(blank.Count == 0, "arguments whose documentation was not found:" + Environment.NewLine
            + string.Join(Environment.NewLine, blank));
    }

    /// <summary>
    /// Every double (or nullable double, array, reference or tuple of doubles) parameter and return of a public
    /// method or constructor of a public type, named <c>Type.Method(parameter)</c> or <c>Type.Method → return</c>
    /// (overloads share a name), with its documentation text; implementations documented by <c>inheritdoc</c> are
    /// checked at the member they implement. Property accessors and compiler-made members (records' <c>Deconstruct</c>,
    /// operators of equality) are not methods here: the properties are checked by
    /// <see cref="NoPublicDoublePropertyOrFieldIsAnAngleInRadians"/>.
    /// </summary>
    private static IEnumerable<(string Name, string Doc)> DoubleArguments(Dictionary<string, string> docs)
    {
        const BindingFlags Flags = BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static
            | BindingFlags.DeclaredOnly;
        foreach (var type in Packages.SelectMany(a => a.GetExportedTypes()))
        {
            var methods = type.GetMethods(Flags).Where(m => !m.IsSpecialName && !IsMadeByCompiler(m))
                .Cast<MethodBase>().Concat(type.GetConstructors(Flags & ~BindingFlags.Static));
            foreach (var m in methods)
            {
                string name = $"{type.FullName!.Replace('+', '.')}.{(m is ConstructorInfo ? type.Name : m.Name)}";
                string id = DocId(type, m);
                docs.TryGetValue(id, out var own);
                // An implementation documented as its interface member or base method is checked where declared.
                if (own is not null && own.Contains("<inheritdoc", StringComparison.Ordinal)) continue;
                foreach (var p in m.GetParameters().Where(p => IsDoubleLike(p.ParameterType)))
                {
                    string doc = own is not null ? Text(own, p.Name) : "";
                    // A positional record's constructor is documented on the type.
                    if (doc.Length == 0 && m is ConstructorInfo
                        && docs.TryGetValue($"T:{type.FullName!.Replace('+', '.')}", out var t)) doc = Text(t, p.Name);
                    yield return ($"{name}({p.Name})", doc);
                }
                if (m is MethodInfo mi && IsDoubleLike(mi.ReturnType))
                    yield return ($"{name} → return", own is null ? "" : Returns(own));
            }
        }
    }

    /// <summary>A double, a nullable double, an array of or a reference to doubles, or a tuple of doubles.</summary>
    private static bool IsDoubleLike(Type t) =>
        IsDouble(t) || (t.IsArray && IsDouble(t.GetElementType()!)) || (t.IsByRef && IsDouble(t.GetElementType()!))
        || (t.IsGenericType && t.Namespace == "System" && t.Name.StartsWith("ValueTuple`", StringComparison.Ordinal)
            && t.GetGenericArguments().All(IsDouble));

    private static bool IsMadeByCompiler(MethodInfo m) =>
        m.IsDefined(typeof(CompilerGeneratedAttribute)) || m.Name is "Deconstruct" or "<Clone>$";

    /// <summary>The <c>returns</c> text, or the summary when the method documents no return on its own.</summary>
    private static string Returns(string xml)
    {
        var e = XElement.Parse(xml);
        var node = e.Element("returns") ?? e.Element("summary");
        return node is null ? "" : System.Text.RegularExpressions.Regex.Replace(node.Value, @"\s+", " ").Trim();
    }

    /// <summary>The documentation id of a method or constructor (ECMA-334 annex D: <c>M:Type.Name(Param,...)</c>).
    /// </summary>
    private static string DocId(Type type, MethodBase m)
    {
        string name = m is ConstructorInfo ? "#ctor" : m.Name;
        if (m.IsGenericMethod) name += "``" + m.GetGenericArguments().Length;
        var ps = m.GetParameters();
        string args = ps.Length == 0 ? "" : "(" + string.Join(",", ps.Select(p => DocType(p.ParameterType))) + ")";
        string id = $"M:{DocType(type)}.{name}{args}";
        if (m.Name is "op_Implicit" or "op_Explicit") id += "~" + DocType(((MethodInfo)m).ReturnType);
        return id;
    }

    private static string DocType(Type t)
    {
        if (t.IsByRef) return DocType(t.GetElementType()!) + "@";
        if (t.IsArray) return DocType(t.GetElementType()!) + "[" + new string(',', t.GetArrayRank() - 1) + "]";
        if (t.IsGenericMethodParameter) return "``" + t.GenericParameterPosition;
        if (t.IsGenericParameter) return "`" + t.GenericParameterPosition;
        if (t.IsGenericType && !t.IsGenericTypeDefinition)
        {
            string def = DocType(t.GetGenericTypeDefinition());
            return def[..def.IndexOf('`')] + "{" + string.Join(",", t.GetGenericArguments().Select(DocType)) + "}";
        }
        return (t.DeclaringType is { } outer && !t.IsGenericParameter
            ? DocType(outer) + "." + t.Name
            : t.Namespace + "." + t.Name);
    }
}
