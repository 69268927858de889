namespace Lookup.Sweeps;

/// <summary>The edits that turn one photo of a copy pair into the other, as far as the evidence shows.</summary>
[Flags]
public enum CopyEdits
{
    /// <summary>No change of geometry: re-encoded, re-saved or changed in tone only.</summary>
    None = 0,

    /// <summary>Scaled to another pixel size.</summary>
    Resized = 1,

    /// <summary>Part of the frame cut away.</summary>
    Cropped = 2,

    /// <summary>Mirrored left to right.</summary>
    Mirrored = 4,

    /// <summary>Turned by a few degrees.</summary>
    Rotated = 8,
}
