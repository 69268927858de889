using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>A pinhole camera orbiting <c>target</c>: yaw about y, elevation above the bench, distance, vertical field of view.</summary>
internal sealed class Camera
{
    private readonly Vec3 _forward;
    private readonly Vec3 _right;
    private readonly Vec3 _up;
    private readonly double _tanHalfFov;

    public Camera(Vec3 target, double yaw, double elevation, double distance, double fovY)
    {
        var (sy, cy) = DetMath.SinCos(yaw);
        var (se, ce) = DetMath.SinCos(elevation);
        Position = target + (new Vec3(ce * sy, se, ce * cy) * distance);
        _forward = (target - Position).Normalized;
        _right = Vec3.Cross(_forward, new Vec3(0, 1, 0)).Normalized;
        _up = Vec3.Cross(_right, _forward);
        var (sh, ch) = DetMath.SinCos(fovY / 2);
        _tanHalfFov = sh / ch;
    }

    public Vec3 Position { get; }

    /// <summary>Ray direction through image point (px, py) in pixels, origin at the top-left corner.</summary>
    public Vec3 Ray(double px, double py, int width, int height)
    {
        double aspect = (double)width / height;
        double u = ((2 * px / width) - 1) * _tanHalfFov * aspect;
        double v = (1 - (2 * py / height)) * _tanHalfFov;
        return (_forward + (_right * u) + (_up * v)).Normalized;
    }

    /// <summary>Distance at which a sphere of <paramref name="radius"/> spans <paramref name="fraction"/> of the frame height.</summary>
    public static double DistanceToFrame(double radius, double fraction, double fovY)
    {
        var (sh, ch) = DetMath.SinCos(fovY / 2);
        return radius / (fraction * (sh / ch));
    }
}
