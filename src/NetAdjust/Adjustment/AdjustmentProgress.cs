namespace NetAdjust.Adjustment;

/// <summary>A progress report of a running adjustment, for feedback on long runs.</summary>
/// <param name="Phase">What is being done, e.g. "Gauss-Newton iteration 2" or "statistics".</param>
/// <param name="Percent">How far that phase has got, 0..100; null when the phase cannot tell (an iteration's length is
/// not known in advance).</param>
public readonly record struct AdjustmentProgress(string Phase, double? Percent);
