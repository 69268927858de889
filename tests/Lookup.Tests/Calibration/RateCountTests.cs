using Lookup.Calibration;

namespace Lookup.Tests.Calibration;

public sealed class RateCountTests
{
    // Wilson score interval (Wilson 1927), 95 %, z = 1.96: 0 of 10 → upper 0.2775 and 5 of 10 → upper 0.7634 (from
    // memory of published tables); 1 of 1,000 → upper 0.00564, worked by hand from the formula.
    [Theory]
    [InlineData(0, 10, 0.2775)]
    [InlineData(5, 10, 0.7634)]
    [InlineData(1, 1000, 0.00564)]
    public void Upper95_is_the_wilson_score_upper_bound(int inside, int total, double expected) =>
        Assert.Equal(expected, new RateCount(inside, total).Upper95, 3);

    [Fact]
    public void Nothing_measured_has_rate_zero_and_upper_bound_one()
    {
        var none = new RateCount(0, 0);

        Assert.Equal(0, none.Rate);
        Assert.Equal(1, none.Upper95);
    }
}
