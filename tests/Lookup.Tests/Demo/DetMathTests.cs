using Lookup.DemoGenerator.Geometry;

namespace Lookup.Tests.Demo;

/// <summary>The generator's own trigonometry agrees with the runtime's Math (the reference) to shape-drawing accuracy.</summary>
public sealed class DetMathTests
{
    [Fact]
    public void SinCos_matches_Math_within_1e_minus_9_over_several_turns()
    {
        for (int i = -4000; i <= 4000; i++)
        {
            double x = i * 0.00731;
            var (sin, cos) = DetMath.SinCos(x);
            Assert.True(Math.Abs(sin - Math.Sin(x)) < 1e-9, $"sin({x}) = {sin}, Math says {Math.Sin(x)}");
            Assert.True(Math.Abs(cos - Math.Cos(x)) < 1e-9, $"cos({x}) = {cos}, Math says {Math.Cos(x)}");
        }
    }

    [Fact]
    public void Atan2_matches_Math_within_1e_minus_8_in_every_quadrant()
    {
        var rng = new SeededRandom(7);
        for (int i = 0; i < 20000; i++)
        {
            double y = rng.Range(-50, 50);
            double x = rng.Range(-50, 50);
            Assert.True(Math.Abs(DetMath.Atan2(y, x) - Math.Atan2(y, x)) < 1e-8, $"atan2({y}, {x})");
        }

        Assert.Equal(0, DetMath.Atan2(0, 0));
        Assert.Equal(Math.PI / 2, DetMath.Atan2(1, 0), 12);
        Assert.Equal(Math.PI, DetMath.Atan2(0, -1), 12);
    }
}
