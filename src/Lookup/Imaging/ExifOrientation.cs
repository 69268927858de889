using SixLabors.ImageSharp;
using SixLabors.ImageSharp.Metadata.Profiles.Exif;
using SixLabors.ImageSharp.Processing;

namespace Lookup.Imaging;

/// <summary>
/// The EXIF/TIFF orientation tag (TIFF 6.0 tag 274; EXIF 2.3 section 4.6.4): where row 0 and column 0 of the
/// stored pixels belong on screen. Values outside 1–8 (seen in the wild as 0 and 9) are treated as 1.
/// </summary>
internal static class ExifOrientation
{
    public const int Upright = 1;

    public static int Read(Image image)
    {
        var profile = image.Metadata.ExifProfile ?? image.Frames.RootFrame.Metadata.ExifProfile;
        var value = profile?.GetValue(ExifTag.Orientation)?.Value ?? Upright;
        return value is >= 1 and <= 8 ? value : Upright;
    }

    /// <summary>Turns stored pixels upright for orientation <paramref name="orientation"/> and clears the tag.</summary>
    public static void Apply(Image image, int orientation)
    {
        switch (orientation)
        {
            case 2: image.Mutate(x => x.Flip(FlipMode.Horizontal)); break;
            case 3: image.Mutate(x => x.Rotate(RotateMode.Rotate180)); break;
            case 4: image.Mutate(x => x.Flip(FlipMode.Vertical)); break;
            case 5: image.Mutate(x => x.Rotate(RotateMode.Rotate90).Flip(FlipMode.Horizontal)); break;
            case 6: image.Mutate(x => x.Rotate(RotateMode.Rotate90)); break;
            case 7: image.Mutate(x => x.Rotate(RotateMode.Rotate90).Flip(FlipMode.Vertical)); break;
            case 8: image.Mutate(x => x.Rotate(RotateMode.Rotate270)); break;
            default: break;
        }

        image.Metadata.ExifProfile?.RemoveValue(ExifTag.Orientation);
    }
}
