using Lookup.Graph;

namespace Lookup.Tests.Graph;

public sealed class CosineKernelTests
{
    [Fact]
    public void Dot_matches_a_double_precision_sum_at_every_length_from_0_to_300()
    {
        // Tolerance scaled to the values, as the .NET Tensors tests do: float rounding grows with the sum of |a·b| terms.
        var random = new Random(7);
        for (int n = 0; n <= 300; n++)
        {
            var a = SyntheticVectors.Gaussian(random, n, 3.0);
            var b = SyntheticVectors.Gaussian(random, n, 0.5);
            double expected = 0, magnitude = 0;
            for (int i = 0; i < n; i++)
            {
                expected += (double)a[i] * b[i];
                magnitude += Math.Abs((double)a[i] * b[i]);
            }

            double tolerance = (1e-6 * magnitude) + 1e-7;
            Assert.True(Math.Abs(CosineKernel.Dot(a, b) - expected) <= tolerance, $"length {n}: {CosineKernel.Dot(a, b)} vs {expected}");
        }
    }

    [Fact]
    public void Dot_reads_only_the_span_it_is_given()
    {
        var a = Enumerable.Range(0, 100).Select(i => (float)i).ToArray();
        var ones = Enumerable.Repeat(1f, 100).ToArray();
        Assert.Equal(Enumerable.Range(10, 37).Sum(), CosineKernel.Dot(a.AsSpan(10, 37), ones.AsSpan(0, 37)));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(7)]
    [InlineData(512)]
    public void Normalize_gives_a_unit_vector_in_the_same_direction(int n)
    {
        var v = SyntheticVectors.Gaussian(new Random(n), n, 10.0);
        v[0] = 5f;
        var unit = new float[n];
        CosineKernel.Normalize(v, unit);
        Assert.Equal(1.0, CosineKernel.Norm(unit), 5);
        Assert.Equal(0.0, SyntheticVectors.ReferenceDistance(v, unit), 5);
    }

    [Fact]
    public void Normalize_rejects_a_zero_vector_with_a_message_naming_the_length()
    {
        var error = Assert.Throws<ArgumentException>(() => CosineKernel.Normalize(new float[4], new float[4]));
        Assert.Contains("length 0", error.Message);
    }

    [Fact]
    public void Normalize_rejects_a_vector_holding_nan()
    {
        Assert.Throws<ArgumentException>(() => CosineKernel.Normalize([1f, float.NaN], new float[2]));
    }
}
