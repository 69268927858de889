using Lookup.DemoGenerator.Rendering;
using SixLabors.ImageSharp;
using SixLabors.ImageSharp.PixelFormats;

namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Renders one planned shot to pixels. Same <see cref="ShotSpec"/>, same pixels, on any number of cores.</summary>
internal static class ShotRenderer
{
    public static Image<Rgb24> Render(ShotSpec shot)
    {
        ArgumentNullException.ThrowIfNull(shot);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(shot.Width);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(shot.Height);
        var (scene, camera, look) = shot.Style == ShotStyle.Studio ? StudioStage.Build(shot) : FieldStage.Build(shot);
        var linear = Raymarcher.Render(scene, camera, shot.Width, shot.Height, smoothEdges: shot.Style == ShotStyle.Studio);
        return Darkroom.Develop(linear, look);
    }
}
