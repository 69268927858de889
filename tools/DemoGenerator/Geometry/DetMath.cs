namespace Lookup.DemoGenerator.Geometry;

/// <summary>
/// Trigonometry and helpers built only from +, −, ×, ÷ and square root, which IEEE 754 rounds the same way
/// everywhere. The platform's Math.Sin/Atan2 come from the C library and may differ by an ulp between
/// machines; a one-ulp change can flip a pixel and so a JPEG byte, which the committed demo must not depend on.
/// </summary>
internal static class DetMath
{
    public const double Pi = 3.14159265358979323846;
    public const double TwoPi = 2 * Pi;
    public const double HalfPi = Pi / 2;
    private const double TanPiOver8 = 0.41421356237309504880;
    private const double QuarterPi = Pi / 4;

    /// <summary>1/21, 1/19, …, 1/1: the arctangent series coefficients, highest order first, signs applied by Horner.</summary>
    private static readonly double[] AtanSeries = [.. Enumerable.Range(0, 11).Select(i => 1.0 / (21 - (2 * i)))];

    /// <summary>Sine and cosine, absolute error below 1e-9.</summary>
    public static (double Sin, double Cos) SinCos(double x)
    {
        x -= TwoPi * Math.Round(x / TwoPi);
        // Fold into [-pi/2, pi/2], where the Taylor series below converges quickly.
        double cosSign = 1;
        if (x > HalfPi)
        {
            x = Pi - x;
            cosSign = -1;
        }
        else if (x < -HalfPi)
        {
            x = -Pi - x;
            cosSign = -1;
        }

        // Taylor series in Horner form; the reciprocals are compile-time constants, so no division at run time.
        double x2 = x * x;
        double sin = x * (1 - (x2 * (1.0 / 6) * (1 - (x2 * (1.0 / 20) * (1 - (x2 * (1.0 / 42) * (1 - (x2 * (1.0 / 72) * (1 - (x2 * (1.0 / 110) * (1 - (x2 * (1.0 / 156)))))))))))));
        double cos = 1 - (x2 * 0.5 * (1 - (x2 * (1.0 / 12) * (1 - (x2 * (1.0 / 30) * (1 - (x2 * (1.0 / 56) * (1 - (x2 * (1.0 / 90) * (1 - (x2 * (1.0 / 132) * (1 - (x2 * (1.0 / 182))))))))))))));
        return (sin, cosSign * cos);
    }

    public static double Sin(double x) => SinCos(x).Sin;

    public static double Cos(double x) => SinCos(x).Cos;

    /// <summary>Angle of (x, y) in (−π, π], absolute error below 1e-8.</summary>
    public static double Atan2(double y, double x)
    {
        double ax = Math.Abs(x);
        double ay = Math.Abs(y);
        if (ax == 0 && ay == 0)
        {
            return 0;
        }

        bool swap = ay > ax;
        double z = swap ? ax / ay : ay / ax;
        double a = AtanUnit(z);
        if (swap)
        {
            a = HalfPi - a;
        }

        if (x < 0)
        {
            a = Pi - a;
        }

        return y < 0 ? -a : a;
    }

    /// <summary>atan(z) for z in [0, 1].</summary>
    private static double AtanUnit(double z)
    {
        double offset = 0;
        if (z > TanPiOver8)
        {
            z = (z - 1) / (z + 1);
            offset = QuarterPi;
        }

        double z2 = z * z;
        double sum = 0;
        foreach (double c in AtanSeries)
        {
            sum = c - (z2 * sum);
        }

        return offset + (z * sum);
    }

    public static double Clamp01(double v) => v < 0 ? 0 : v > 1 ? 1 : v;

    public static double SmoothStep(double edge0, double edge1, double v)
    {
        double t = Clamp01((v - edge0) / (edge1 - edge0));
        return t * t * (3 - (2 * t));
    }

    public static double Fract(double v) => v - Math.Floor(v);

    /// <summary>x raised to 2^k by repeated squaring (exact and fast; used for specular lobes).</summary>
    public static double PowTwoToThe(double x, int k)
    {
        for (int i = 0; i < k; i++)
        {
            x *= x;
        }

        return x;
    }

    /// <summary>Display encoding: x^(7/16) from square roots, close to the usual 1/2.2 gamma.</summary>
    public static double Gamma(double x)
    {
        if (x <= 0)
        {
            return 0;
        }

        double r2 = Math.Sqrt(x);
        double r4 = Math.Sqrt(r2);
        double r8 = Math.Sqrt(r4);
        double r16 = Math.Sqrt(r8);
        return r4 * r8 * r16;
    }
}
