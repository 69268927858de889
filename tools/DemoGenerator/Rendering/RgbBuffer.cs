using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>A linear-light RGB image in row-major doubles.</summary>
internal sealed class RgbBuffer(int width, int height)
{
    public int Width { get; } = width;

    public int Height { get; } = height;

    public double[] Data { get; } = new double[width * height * 3];

    public Vec3 this[int x, int y]
    {
        get
        {
            int i = ((y * Width) + x) * 3;
            return new Vec3(Data[i], Data[i + 1], Data[i + 2]);
        }

        set
        {
            int i = ((y * Width) + x) * 3;
            Data[i] = value.X;
            Data[i + 1] = value.Y;
            Data[i + 2] = value.Z;
        }
    }
}
