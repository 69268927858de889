using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>
/// How a rendered frame is turned into a photo: blur passes (a [1 2 1] kernel each), exposure and white balance,
/// darkening towards the corners, and sensor noise in 8-bit levels drawn from <c>NoiseSeed</c>.
/// </summary>
internal sealed record FilmLook(int BlurPasses, double Exposure, Vec3 WhiteBalance, double Vignette, double NoiseLevels, uint NoiseSeed)
{
    /// <summary>A clean catalogue photo: no blur, no noise, a trace of vignette.</summary>
    public static FilmLook Studio { get; } = new(0, 1.0, new Vec3(1, 1, 1), 0.06, 0, 0);
}
