namespace Lookup.Sweeps;

/// <summary>JPEG bytes of a small preview of a photo for the HTML report; null when there is none.</summary>
public delegate byte[]? ReportThumbnailSource(FindingMember member);
