using Lookup.Calibration;

namespace Lookup.Tests.Calibration;

public sealed class DistanceHistogramsTests
{
    [Fact]
    public void From_bins_by_hundredths_and_clamps_what_lies_outside_0_to_2()
    {
        var h = DistanceHistograms.From([0f, 0.005f, 0.0101f, 0.999f, -0.001f], [1.505f], [2.5f, 0.425f]);

        Assert.Equal(200, h.BinCount);
        Assert.Equal(3, h.Copies[0]);
        Assert.Equal(1, h.Copies[1]);
        Assert.Equal(1, h.Copies[99]);
        Assert.Equal(1, h.Siblings[150]);
        Assert.Equal(1, h.Strangers[42]);
        Assert.Equal(1, h.Strangers[199]);
        Assert.Equal(2f, h.HighestDistance, 5);
    }

    [Fact]
    public void HighestDistance_is_the_top_of_the_last_filled_bin()
    {
        var h = DistanceHistograms.From([0.12f], [], [0.634f]);

        Assert.Equal(0.64f, h.HighestDistance, 5);
        Assert.Equal(0f, DistanceHistograms.From([], [], []).HighestDistance);
    }
}
