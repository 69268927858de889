namespace Lookup.Matching;

/// <summary>A <c>--like</c> target that is neither an indexed photo nor a SKU of the index; the message says what to give.</summary>
internal sealed class LikeTargetException(string message) : Exception(message);
