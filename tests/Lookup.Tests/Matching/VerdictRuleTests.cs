using Lookup.Matching;
using Lookup.Store;

namespace Lookup.Tests.Matching;

public sealed class VerdictRuleTests
{
    private static readonly VerdictThresholds Thresholds = VerdictThresholds.Default with { Copy = 0.10f, SamePart = 0.30f, MinMargin = 0.05f };

    [Theory]
    [InlineData(true, 0.90f, -1f, 0.90f, 40, Verdict.SameFile)] // identical bytes win over everything
    [InlineData(false, 0.31f, 0.50f, 0.31f, 0, Verdict.NoMatch)] // beyond the same-part distance
    [InlineData(false, 0.30f, 0.05f, 0.30f, 30, Verdict.SamePart)] // both limits are inclusive
    [InlineData(false, 0.20f, 0.049f, 0.20f, 30, Verdict.Unsure)] // another SKU about as close
    [InlineData(false, 0.05f, 0.01f, 0.05f, 2, Verdict.Unsure)] // even a copy-close answer needs the margin
    [InlineData(false, 0.05f, 0.40f, 0.05f, 10, Verdict.SamePhoto)] // whole photo within the copy distance, hash agrees
    [InlineData(false, 0.05f, 0.40f, 0.05f, 11, Verdict.SamePart)] // same distance but a different picture
    [InlineData(false, 0.05f, 0.40f, 0.20f, 0, Verdict.SamePart)] // only a crop came that close
    public void Decide_bands_distance_margin_and_evidence(bool identical, float distance, float margin, float whole, int bits, Verdict expected) =>
        Assert.Equal(expected, VerdictRule.Decide(identical, distance, margin, whole, bits, Thresholds));

    [Fact]
    public void Without_a_hash_nothing_is_called_the_same_photo() =>
        Assert.Equal(Verdict.SamePart, VerdictRule.Decide(false, 0.01f, 0.9f, 0.01f, null, Thresholds));

    [Theory]
    [InlineData(0.20f, 0.25f, 0.20f)]
    [InlineData(0.25f, 0.20f, -0.25f)]
    [InlineData(0.20f, 0.20f, 0f)]
    [InlineData(0f, 0f, 0f)]
    [InlineData(0.1f, 0f, -1f)]
    public void Margin_is_relative_to_the_nearest_other_SKU(float distance, float other, float expected) =>
        Assert.Equal(expected, VerdictRule.Margin(distance, other), 5);

    [Fact]
    public void Margin_without_another_SKU_is_1() => Assert.Equal(1f, VerdictRule.Margin(0.3f, null));

    [Fact]
    public void Verdict_names_are_plain_words_that_parse_back()
    {
        var names = Enum.GetValues<Verdict>().Select(VerdictNames.Of).ToList();

        Assert.Equal(["same file", "same photo", "same part", "unsure", "no match"], names);
        Assert.All(Enum.GetValues<Verdict>(), v => Assert.Equal(v, VerdictNames.Parse(VerdictNames.Of(v))));
        Assert.Null(VerdictNames.Parse("maybe"));
    }
}
