using System.Collections.Immutable;
using System.Collections.ObjectModel;

namespace NetAdjust;

/// <summary>
/// Copies that the public results and inputs hold, so that a caller can neither change a result through a list it
/// was given (casting it back to an array or a <see cref="List{T}"/>) nor change an input afterwards through the
/// list it passed in.
/// </summary>
internal static class ReadOnlyCopies
{
    /// <summary>An immutable copy of <paramref name="items"/> (the same list when it is already immutable).</summary>
    public static IReadOnlyList<T> List<T>(IEnumerable<T> items) =>
        items is ImmutableArray<T> a ? a : ImmutableArray.CreateRange(items);

    /// <summary>As <see cref="List{T}(IEnumerable{T})"/>, keeping null.</summary>
    public static IReadOnlyList<T>? ListOrNull<T>(IEnumerable<T>? items) => items is null ? null : List(items);

    /// <summary>A read-only copy of <paramref name="items"/>, with the same key comparer when it is a
    /// <see cref="Dictionary{TKey, TValue}"/>.</summary>
    public static IReadOnlyDictionary<TKey, TValue> Dictionary<TKey, TValue>(
        IReadOnlyDictionary<TKey, TValue> items) where TKey : notnull =>
        new ReadOnlyDictionary<TKey, TValue>(new Dictionary<TKey, TValue>(items,
            (items as Dictionary<TKey, TValue>)?.Comparer));
}
