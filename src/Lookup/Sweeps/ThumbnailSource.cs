namespace Lookup.Sweeps;

/// <summary>Makes the grey thumbnail of a photo on demand (e.g. by decoding its file); null when it cannot.</summary>
public delegate GreyThumbnail? ThumbnailSource(SweepPhoto photo);
