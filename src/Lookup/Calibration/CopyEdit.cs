using System.Globalization;

namespace Lookup.Calibration;

/// <summary>One edit with its drawn parameters; neutral values leave the photo as it is.</summary>
/// <param name="Kind">What kind of edit this is.</param>
public sealed record CopyEdit(CopyEditKind Kind)
{
    /// <summary>JPEG quality the copy is saved at.</summary>
    public int Quality { get; init; } = 90;

    /// <summary>Factor applied to both sides after any crop (1 = unchanged).</summary>
    public float Scale { get; init; } = 1f;

    /// <summary>Kept share of the width (1 = no crop).</summary>
    public float CropWidth { get; init; } = 1f;

    /// <summary>Kept share of the height (1 = no crop).</summary>
    public float CropHeight { get; init; } = 1f;

    /// <summary>Where the crop sits across the free width, 0 = left edge, 1 = right edge.</summary>
    public float CropX { get; init; } = 0.5f;

    /// <summary>Where the crop sits across the free height, 0 = top, 1 = bottom.</summary>
    public float CropY { get; init; } = 0.5f;

    /// <summary>Brightness factor.</summary>
    public float Brightness { get; init; } = 1f;

    /// <summary>Contrast factor.</summary>
    public float Contrast { get; init; } = 1f;

    /// <summary>Gain on the red channel.</summary>
    public float RedGain { get; init; } = 1f;

    /// <summary>Gain on the blue channel.</summary>
    public float BlueGain { get; init; } = 1f;

    /// <summary>Turn in degrees (positive clockwise).</summary>
    public float Degrees { get; init; }

    /// <summary>Whether the copy is flipped left to right.</summary>
    public bool Mirror { get; init; }

    /// <summary>A short description, e.g. "crop 72 × 81 %, q90".</summary>
    public override string ToString() => Kind switch
    {
        CopyEditKind.Recompress => F($"jpeg q{Quality}"),
        CopyEditKind.Downscale => F($"shrink to {Scale * 100:0} %, q{Quality}"),
        CopyEditKind.Crop => F($"crop {CropWidth * 100:0} × {CropHeight * 100:0} %, q{Quality}"),
        CopyEditKind.Tone => F($"brightness × {Brightness:0.00}, contrast × {Contrast:0.00}, q{Quality}"),
        CopyEditKind.WhiteBalance => F($"red × {RedGain:0.00}, blue × {BlueGain:0.00}, q{Quality}"),
        CopyEditKind.Mirror => F($"mirror, q{Quality}"),
        CopyEditKind.Straighten => F($"straighten {Degrees:0.0}°, q{Quality}"),
        _ => F($"crop {CropWidth * 100:0} %, shrink to {Scale * 100:0} %, q{Quality}"),
    };

    private static string F(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
