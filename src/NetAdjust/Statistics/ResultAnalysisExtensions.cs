using System.Runtime.CompilerServices;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.Statistics;

/// <summary>
/// The post-adjustment statistics of a result, as a property of <see cref="AdjustmentResult"/> that the
/// statistics layer adds (the adjustment does not depend on the statistics).
/// </summary>
public static class ResultAnalysisExtensions
{
    private static readonly ConditionalWeakTable<AdjustmentResult, NetworkAnalysis> Cache = new();

    extension(AdjustmentResult result)
    {
        /// <summary>
        /// The post-adjustment statistics (redundancy numbers, w and tau tests, MDB, external reliability, absolute
        /// and relative ellipses) with <see cref="AdjustmentOptions.Analysis"/>; computed on first use, then kept.
        /// </summary>
        public NetworkAnalysis Analysis => Cache.GetValue(result, r => ResultAnalysis.Analyse(r, r.Options.Analysis));
    }
}
