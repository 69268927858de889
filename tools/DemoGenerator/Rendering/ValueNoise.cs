using Lookup.DemoGenerator.Geometry;

namespace Lookup.DemoGenerator.Rendering;

/// <summary>Smooth 2-D value noise from a hashed integer lattice, in [0, 1]; <see cref="Fbm"/> sums octaves.</summary>
internal sealed class ValueNoise(uint seed)
{
    public double At(double x, double y)
    {
        double fx = Math.Floor(x);
        double fy = Math.Floor(y);
        int ix = (int)fx;
        int iy = (int)fy;
        double tx = x - fx;
        double ty = y - fy;
        tx = tx * tx * (3 - (2 * tx));
        ty = ty * ty * (3 - (2 * ty));
        double a = Lattice(ix, iy);
        double b = Lattice(ix + 1, iy);
        double c = Lattice(ix, iy + 1);
        double d = Lattice(ix + 1, iy + 1);
        double top = a + ((b - a) * tx);
        double bottom = c + ((d - c) * tx);
        return top + ((bottom - top) * ty);
    }

    public double Fbm(double x, double y, int octaves)
    {
        double sum = 0;
        double amplitude = 0.5;
        double total = 0;
        for (int i = 0; i < octaves; i++)
        {
            sum += amplitude * At(x, y);
            total += amplitude;
            x = (x * 2.03) + 17.1;
            y = (y * 2.03) - 9.7;
            amplitude *= 0.5;
        }

        return sum / total;
    }

    private double Lattice(int x, int y) => StableHash.Mix((uint)x, (uint)y, seed) * (1.0 / uint.MaxValue);
}
