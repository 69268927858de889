namespace Lookup.Catalogue;

/// <summary>A photo that could not be indexed: its relative path, a short reason and the full message.</summary>
internal sealed record IngestFailure(string Path, string Reason, string Message);
