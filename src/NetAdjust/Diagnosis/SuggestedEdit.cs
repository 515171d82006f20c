namespace NetAdjust.Diagnosis;

/// <summary>
/// A suggested edit of the project file for an explained blunder, printed for the surveyor to apply; NetAdjust never
/// changes its input.
/// </summary>
/// <param name="Source">Where the observation was read (<c>file:line</c>, <see cref="Network.Observation.Source"/>),
/// or null.</param>
/// <param name="Item">The key to change: <c>value</c>, <c>target_height</c>, <c>instrument_height</c>, <c>to</c>,
/// <c>from</c>, or <c>exclude</c>.</param>
/// <param name="Booked">The booked text or value as it is in the file, when known.</param>
/// <param name="Suggested">The corrected text (e.g. <c>123.4657</c>, <c>B12</c>, or <c>true</c> for
/// <c>exclude</c>).</param>
public sealed record SuggestedEdit(string? Source, string Item, string? Booked, string Suggested);
