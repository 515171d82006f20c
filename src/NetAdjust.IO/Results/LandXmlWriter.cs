using System.Globalization;
using System.Text;
using System.Xml;
using NetAdjust.Adjustment;
using NetAdjust.Units;

namespace NetAdjust.IO.Results;

/// <summary>
/// Writes the adjusted points as LandXML 1.2 (the open LandXML schema, namespace
/// <c>http://www.landxml.org/schema/LandXML-1.2</c>) for CAD: one <c>CgPoint</c> per point with plan coordinates,
/// inside one <c>CgPoints</c> element, with the units declared and the standard deviations as the schema's
/// <c>northingStdError</c>, <c>eastingStdError</c> and <c>elevationStdError</c> attributes, at the variance factor the
/// statistics use, named in the <c>desc</c> of <c>CgPoints</c>.
/// Points with a height only (levelling benchmarks) are left out: a <c>CgPoint</c> needs a plan position.
/// Element by element description: docs/output-format.md.
/// </summary>
public static class LandXmlWriter
{
    /// <summary>The LandXML 1.2 namespace.</summary>
    public const string Namespace = "http://www.landxml.org/schema/LandXML-1.2";

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Decimals written for coordinates and standard deviations (in the length unit).</summary>
    public const int Decimals = 6;

    /// <summary>Renders the LandXML document (UTF-8, LF line ends).</summary>
    /// <param name="result">The result.</param>
    /// <param name="context">Run details: the run date, the length unit and the coordinate reference system.</param>
    public static string Write(AdjustmentResult result, ReportContext context) =>
        Write(ResultReport.Build(result, context));

    /// <summary>Renders the LandXML document of the report model's point table (UTF-8, LF line ends).</summary>
    /// <param name="report">The report model.</param>
    public static string Write(ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return JsonResultWriter.ToText(s => Write(s, report));
    }

    /// <summary>Writes the LandXML document of the report model's point table to a stream as it is rendered (UTF-8,
    /// LF line ends, ending with a line feed).</summary>
    /// <param name="stream">The stream; left open.</param>
    /// <param name="report">The report model.</param>
    public static void Write(Stream stream, ResultReport report)
    {
        ArgumentNullException.ThrowIfNull(stream);
        ArgumentNullException.ThrowIfNull(report);
        var result = report.Result;
        var context = report.Context;
        var unit = context.Units.Length;
        string L(double metres) => (metres / unit.MetresPerUnit).ToString("F" + Decimals, Inv);
        var settings = new XmlWriterSettings
        {
            Indent = true, IndentChars = "  ", NewLineChars = "\n", NewLineHandling = NewLineHandling.Replace,
            Encoding = new UTF8Encoding(false), OmitXmlDeclaration = false,
        };
        using (var w = XmlWriter.Create(stream, settings))
        {
            w.WriteStartDocument();
            w.WriteStartElement("LandXML", Namespace);
            w.WriteAttributeString("version", "1.2");
            w.WriteAttributeString("date", context.RunDate.ToString("yyyy-MM-dd", Inv));
            // The schema requires a time; NetAdjust states only the run date, so the time is midnight.
            w.WriteAttributeString("time", "00:00:00");
            w.WriteAttributeString("language", "English");
            w.WriteAttributeString("readOnly", "false");

            w.WriteStartElement("Units", Namespace);
            if (unit == LengthUnit.Metre)
            {
                w.WriteStartElement("Metric", Namespace);
                w.WriteAttributeString("areaUnit", "squareMeter");
                w.WriteAttributeString("linearUnit", "meter");
                w.WriteAttributeString("volumeUnit", "cubicMeter");
                w.WriteAttributeString("temperatureUnit", "celsius");
                w.WriteAttributeString("pressureUnit", "milliBars");
            }
            else
            {
                w.WriteStartElement("Imperial", Namespace);
                w.WriteAttributeString("areaUnit", "squareFoot");
                w.WriteAttributeString("linearUnit", unit == LengthUnit.UsSurveyFoot ? "USSurveyFoot" : "foot");
                w.WriteAttributeString("volumeUnit", "cubicFeet");
                w.WriteAttributeString("temperatureUnit", "fahrenheit");
                w.WriteAttributeString("pressureUnit", "inHG");
            }
            w.WriteAttributeString("angularUnit", "decimal degrees");
            w.WriteAttributeString("directionUnit", "decimal degrees");
            w.WriteEndElement();
            w.WriteEndElement();

            if (context.Crs is string crs)
            {
                w.WriteStartElement("CoordinateSystem", Namespace);
                w.WriteAttributeString("name", crs);
                w.WriteAttributeString("epsgCode", crs[(crs.IndexOf(':') + 1)..]);
                w.WriteEndElement();
            }

            w.WriteStartElement("Project", Namespace);
            w.WriteAttributeString("name", result.Network.Name);
            w.WriteAttributeString("desc", $"Least-squares adjustment of {context.InputName}" +
                (context.Crs is null ? "; local plane coordinates (no coordinate reference system declared)" : ""));
            w.WriteEndElement();

            w.WriteStartElement("Application", Namespace);
            w.WriteAttributeString("name", "NetAdjust");
            w.WriteAttributeString("desc", "least-squares adjustment of survey networks");
            w.WriteAttributeString("version", Generator.Version);
            w.WriteEndElement();

            w.WriteStartElement("CgPoints", Namespace);
            w.WriteAttributeString("name", "adjusted points");
            w.WriteAttributeString("desc", "standard deviations at " + report.Basis.Words +
                (context.Solution is string solution ? $"; the {solution} solution of the datum sequence" : ""));
            foreach (var row in report.Points.Rows)
            {
                if (!row.HasPlan) continue;
                var p = row.Source;
                var role = row.Role;
                w.WriteStartElement("CgPoint", Namespace);
                w.WriteAttributeString("name", p.Id);
                w.WriteAttributeString("desc", ReportFigures.RoleText(role));
                w.WriteAttributeString("role", role == PointRole.New ? "calculated" : "control point");
                if (row.SdN is double sn) w.WriteAttributeString("northingStdError", L(sn));
                if (row.SdE is double se) w.WriteAttributeString("eastingStdError", L(se));
                if (p.H is not null && row.SdH is double sh) w.WriteAttributeString("elevationStdError", L(sh));
                // LandXML orders a point "northing easting [elevation]".
                string text = L(p.N!.Value) + " " + L(p.E!.Value) + (p.H is double h ? " " + L(h) : "");
                w.WriteString(text);
                w.WriteEndElement();
            }
            w.WriteEndElement();

            w.WriteEndElement();
            w.WriteEndDocument();
        }
        stream.WriteByte((byte)'\n');
    }
}
