using Lookup.Calibration;

namespace Lookup.Tests.Calibration;

public sealed class DistanceQuantilesTests
{
    private static readonly float[] Four = [0.1f, 0.2f, 0.3f, 0.4f];

    [Theory]
    [InlineData(0.25, 0.15f)]
    [InlineData(0.5, 0.25f)]
    [InlineData(0.74, 0.25f)]
    [InlineData(0.75, 0.35f)]
    [InlineData(1.0, 0.4f)]
    public void LimitAtRate_lies_halfway_between_the_last_pair_allowed_and_the_first_kept_out(double rate, float expected) =>
        Assert.Equal(expected, DistanceQuantiles.LimitAtRate(Four, rate), 6);

    [Fact]
    public void LimitAtRate_below_one_pair_keeps_every_pair_out()
    {
        float limit = DistanceQuantiles.LimitAtRate(Four, 0.2);

        Assert.True(limit < 0.1f);
        Assert.Equal(0, DistanceQuantiles.CountAtOrBelow(Four, limit));
    }

    [Fact]
    public void LimitAtRate_of_nothing_is_unbounded() =>
        Assert.Equal(float.PositiveInfinity, DistanceQuantiles.LimitAtRate([], 0.01));

    [Theory]
    [InlineData(0.25, 0.1f)]
    [InlineData(0.5, 0.2f)]
    [InlineData(0.51, 0.3f)]
    [InlineData(0.99, 0.4f)]
    [InlineData(1.0, 0.4f)]
    public void Covering_is_the_smallest_distance_with_that_share_at_or_below(double coverage, float expected) =>
        Assert.Equal(expected, DistanceQuantiles.Covering(Four, coverage));

    [Theory]
    [InlineData(0.05f, 0)]
    [InlineData(0.2f, 3)]
    [InlineData(0.25f, 3)]
    [InlineData(0.5f, 5)]
    public void CountAtOrBelow_counts_ties_at_the_limit(float limit, int expected) =>
        Assert.Equal(expected, DistanceQuantiles.CountAtOrBelow([0.1f, 0.2f, 0.2f, 0.3f, 0.4f], limit));

    [Fact]
    public void Median_of_an_even_count_is_the_middle_pair_mean() =>
        Assert.Equal(0.25f, DistanceQuantiles.Median(Four), 6);
}
