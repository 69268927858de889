using Lookup.Calibration;
using Lookup.Tests.Graph;

namespace Lookup.Tests.Calibration;

public sealed class ThresholdChooserTests(FashionMnistEmbeddings fashion) : IClassFixture<FashionMnistEmbeddings>
{
    // Stranger statistics from the Fashion-MNIST embeddings (see FashionMnistPairs): 1,000 items per half give
    // 250,000 drawn stranger pairs, so even 0.1 % is 250 pairs and the held-out rate is measurable.
    [Theory]
    [InlineData(0.001, 11)]
    [InlineData(0.001, 12)]
    [InlineData(0.003, 13)]
    [InlineData(0.01, 14)]
    public void The_held_out_false_match_rate_is_within_a_factor_of_two_of_the_target(double target, int seed)
    {
        var (fit, heldOut) = FashionMnistPairs.EachImageItsOwnSku(fashion, seed);
        var options = new CalibrationOptions { TargetFalseMatchRate = target };

        var limits = ThresholdChooser.Choose(fit, options);
        var measured = HeldOutRates.Measure(heldOut, limits);

        Assert.Equal(BandLimit.StrangerRate, limits.CopySetBy);
        Assert.Equal(BandLimit.StrangerRate, limits.SamePartSetBy);
        Assert.InRange(measured.StrangersInCopyBand.Rate, target / 2, target * 2);
        Assert.InRange(measured.StrangersInSamePartBand.Rate, options.SamePartFalseMatchRate / 2, options.SamePartFalseMatchRate * 2);
        Assert.True(limits.Copy < limits.SamePart);
    }

    [Fact]
    public void With_classes_as_skus_the_same_part_band_holds_far_more_siblings_than_strangers()
    {
        // Items of one Fashion-MNIST class play second views of one product.
        var (fit, heldOut) = FashionMnistPairs.ClassesAsSkus(fashion, seed: 5);

        var limits = ThresholdChooser.Choose(fit, new CalibrationOptions());
        var measured = HeldOutRates.Measure(heldOut, limits);

        Assert.True(measured.SiblingsInSamePartBand.Total > 10_000);
        Assert.True(measured.SiblingsInSamePartBand.Rate > 3 * measured.StrangersInSamePartBand.Rate,
            $"siblings {measured.SiblingsInSamePartBand.Rate:P2}, strangers {measured.StrangersInSamePartBand.Rate:P2}");
    }

    [Fact]
    public void The_copy_band_stops_where_the_copies_end_when_strangers_lie_further_out()
    {
        // Worked example: 100 copies at 0.001 … 0.100, 1,000 strangers at 0.300 … 0.3999.
        var copies = Enumerable.Range(1, 100).Select(i => new CopyDistance(0, CopyEditKind.Crop, i / 1000f)).ToArray();
        var strangers = Enumerable.Range(0, 1000).Select(i => 0.3f + (i / 10_000f)).ToArray();

        var limits = ThresholdChooser.Choose(new DistanceSet(copies, [], strangers), new CalibrationOptions());

        Assert.Equal(BandLimit.CopyCoverage, limits.CopySetBy);
        Assert.Equal(0.099f, limits.Copy);
        Assert.Equal((strangers[0] + strangers[1]) / 2, limits.StrangerLimitAtTarget);
        Assert.Equal((strangers[9] + strangers[10]) / 2, limits.SamePart);
        Assert.Equal(BandLimit.StrangerRate, limits.SamePartSetBy);
    }

    [Fact]
    public void The_copy_band_stops_at_the_stranger_target_when_copies_reach_among_strangers()
    {
        var copies = Enumerable.Range(1, 100).Select(i => new CopyDistance(0, CopyEditKind.Crop, i / 200f)).ToArray();
        var strangers = Enumerable.Range(0, 1000).Select(i => 0.3f + (i / 10_000f)).ToArray();

        var limits = ThresholdChooser.Choose(new DistanceSet(copies, [], strangers), new CalibrationOptions());

        Assert.Equal(BandLimit.StrangerRate, limits.CopySetBy);
        Assert.Equal(limits.StrangerLimitAtTarget, limits.Copy);
        Assert.Equal(0.495f, limits.CopyCoverageLimit);
    }

    [Fact]
    public void When_strangers_tie_the_same_part_band_is_empty_and_says_so()
    {
        var strangers = Enumerable.Repeat(0.5f, 1000).ToArray();

        var limits = ThresholdChooser.Choose(new DistanceSet([], [], strangers), new CalibrationOptions());

        Assert.Equal(limits.Copy, limits.SamePart);
        Assert.Equal(BandLimit.CopyBand, limits.SamePartSetBy);
    }
}
