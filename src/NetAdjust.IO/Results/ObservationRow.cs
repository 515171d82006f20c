using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Results;

/// <summary>
/// One row of the report model's observation table: the adjusted observation (SI: metres or radians by kind), its
/// tests, its standardised residual w as the outputs show it, and whether it fails the w-test.
/// </summary>
/// <param name="Source">The adjusted observation.</param>
/// <param name="Test">Its statistics (redundancy number, w, tau, MDB, flag).</param>
/// <param name="W">The standardised residual shown: null when the observation cannot be tested or is set aside.</param>
/// <param name="FailsWTest">True when |w| exceeds the w-test's critical value.</param>
internal sealed record ObservationRow(AdjustedObservation Source, ObservationTest Test, double? W, bool FailsWTest)
{
    /// <summary>The observation as given.</summary>
    public Observation Input => Source.Input;

    /// <summary>The observation's number in the outputs (1-based, input order).</summary>
    public int Number => Source.Index + 1;

    /// <summary>The station the observation was measured from, as the tables show it (empty for a levelled height
    /// difference or an observed azimuth).</summary>
    public string AtShown => ObservationLabels.Station(Input) ?? "";

    /// <summary>The "from" point as the tables show it: empty when it is the station (<c>at</c>).</summary>
    public string FromShown => ObservationLabels.FromShown(Input);

    /// <summary>The rows of a result, in input order, each made when a writer reads it (a million-point network has
    /// nine million).</summary>
    public static IReadOnlyList<ObservationRow> Of(AdjustmentResult r, IReadOnlyList<double?>? w)
    {
        var observations = r.Observations;
        var tests = r.Analysis.Observations;
        double critical = r.Analysis.WCritical;
        return new RowsOnDemand<ObservationRow>(observations.Count, i =>
        {
            var o = observations[i];
            double? wi = w is not null && o.Index < w.Count ? w[o.Index] : null;
            return new ObservationRow(o, tests[o.Index], wi, wi is double x && Math.Abs(x) > critical);
        });
    }

    /// <summary>The columns of a full listing; values and precisions take their unit from each row's kind.</summary>
    public static readonly IReadOnlyList<ReportColumn<ObservationRow>> Columns =
    [
        new("number", "#", ColumnUnit.None, ValueKind.Number, r => ReportCell.Of(r.Number)),
        new("kind", "Kind", ColumnUnit.None, ValueKind.Text, r => ReportCell.Of(ObservationLabels.Words(r.Input.Kind))),
        new("at", "At", ColumnUnit.None, ValueKind.PointId, r => ReportCell.Of(r.AtShown)),
        new("from", "From", ColumnUnit.None, ValueKind.PointId, r => ReportCell.Of(r.FromShown)),
        new("to", "To", ColumnUnit.None, ValueKind.PointId, r => ReportCell.Of(r.Input.To)),
        new("observed", "Observed", ColumnUnit.ObservedValue, ValueKind.Number, r => ReportCell.Of(r.Input.Value)),
        new("adjusted", "Adjusted", ColumnUnit.ObservedValue, ValueKind.Number, r => ReportCell.Of(r.Source.Adjusted)),
        new("residual", "Residual", ColumnUnit.ObservedPrecision, ValueKind.Number,
            r => ReportCell.Of(r.Source.Residual)),
        new("sd", "sd", ColumnUnit.ObservedPrecision, ValueKind.Number, r => ReportCell.Of(r.Input.StandardDeviation)),
        new("w", "w", ColumnUnit.Statistic, ValueKind.Number, r => ReportCell.Of(r.W)),
        new("flag", "Flag", ColumnUnit.None, ValueKind.Text, r => ReportCell.Of(r.Test.Flag.Name() ?? "")),
        new("source", "Source", ColumnUnit.None, ValueKind.Reference, r => ReportCell.Of(r.Input.Source ?? "")),
    ];
}
