namespace NetAdjust.IO.Project;

/// <summary>
/// The survey's particulars from the optional <c>survey</c> section of the project file (docs/input-format.md,
/// "Survey particulars"): who surveyed what, when, for whom, and with which equipment. Printed at the top of the
/// text and HTML reports and written in the JSON result; they take no part in the adjustment. Every item is
/// optional: null (or empty lists) when not given.
/// </summary>
/// <param name="Client">The client the survey is for.</param>
/// <param name="Site">The site.</param>
/// <param name="Reference">The client's or the firm's job reference.</param>
/// <param name="Surveyor">The surveyor in charge.</param>
/// <param name="Firm">The firm.</param>
/// <param name="Observed">The dates of observation, in the order given.</param>
/// <param name="Equipment">The equipment used, in the order given.</param>
/// <param name="Weather">Weather notes.</param>
/// <param name="Note">A free note.</param>
public sealed record SurveyParticulars(string? Client, string? Site, string? Reference, string? Surveyor, string? Firm,
    IReadOnlyList<DateOnly> Observed, IReadOnlyList<SurveyEquipment> Equipment, string? Weather, string? Note)
{
    /// <summary>The particulars as (label, text) pairs in report order, leaving out those not given.</summary>
    public IReadOnlyList<(string Label, string Text)> Lines()
    {
        var lines = new List<(string, string)>();
        void Add(string label, string? text)
        {
            if (!string.IsNullOrWhiteSpace(text)) lines.Add((label, text.Trim()));
        }
        Add("Client", Client);
        Add("Site", Site);
        Add("Job ref.", Reference);
        Add("Surveyor", Surveyor);
        Add("Firm", Firm);
        if (Observed.Count > 0)
            Add("Observed", string.Join(", ", Observed.Select(d => d.ToString("yyyy-MM-dd",
                System.Globalization.CultureInfo.InvariantCulture))));
        foreach (var e in Equipment) Add("Equipment", e.Describe());
        Add("Weather", Weather);
        Add("Note", Note);
        return lines;
    }
}

/// <summary>One item of equipment of the survey's particulars.</summary>
/// <param name="Item">What it is (e.g. <c>total station, 1" class</c>).</param>
/// <param name="Serial">Its serial number, or null.</param>
/// <param name="Calibrated">The date of its last calibration, or null.</param>
public sealed record SurveyEquipment(string Item, string? Serial, DateOnly? Calibrated)
{
    /// <summary>"item, serial S, calibrated YYYY-MM-DD".</summary>
    public string Describe() => Item + (Serial is null ? "" : $", serial {Serial}") +
        (Calibrated is DateOnly d
            ? $", calibrated {d.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture)}" : "");
}
