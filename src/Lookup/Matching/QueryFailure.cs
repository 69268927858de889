namespace Lookup.Matching;

/// <summary>A query photo that could not be used, with a stable reason code and a message naming the file and the fix.</summary>
internal sealed record QueryFailure(string Photo, string Reason, string Message);
