namespace Lookup.Calibration;

/// <summary>
/// The everyday edits that turn a catalogue photo into a copy of itself (common practice in catalogue work: re-saves,
/// exports for the web, crops, colour corrections, mirrored layouts, straightening). Every copy is saved as JPEG.
/// </summary>
public enum CopyEditKind
{
    /// <summary>Saved again as JPEG at quality 25–60.</summary>
    Recompress,

    /// <summary>Shrunk to 20–60 % of its sides (saved at quality 85).</summary>
    Downscale,

    /// <summary>Cut to 60–90 % of its width and of its height at a random place.</summary>
    Crop,

    /// <summary>Brightness × 0.7–1.35 and contrast × 0.75–1.3.</summary>
    Tone,

    /// <summary>A warm or cool cast: red gain 0.85–1.15 and blue gain the opposite way.</summary>
    WhiteBalance,

    /// <summary>Flipped left to right.</summary>
    Mirror,

    /// <summary>Turned 1–6° either way, cut to the largest upright rectangle of the same shape and scaled back.</summary>
    Straighten,

    /// <summary>A web export: cut to 85–95 %, shrunk to 40–80 %, saved at quality 50–75.</summary>
    WebExport,
}
