using Lookup.Sweeps;

namespace Lookup.Tests.Sweeps;

public sealed class FindingKeysTests
{
    private const string A = "aa00000000000000000000000000000000000000000000000000000000000001";
    private const string B = "BB00000000000000000000000000000000000000000000000000000000000002";

    [Fact]
    public void Pair_does_not_depend_on_order_or_letter_case() =>
        Assert.Equal(FindingKeys.Pair(A, B), FindingKeys.Pair(B.ToLowerInvariant(), A.ToUpperInvariant()));

    [Fact]
    public void Group_does_not_depend_on_member_order_but_on_kind_and_members()
    {
        var key = FindingKeys.Group(FindingKind.CopiesInOneSku, [A, B]);
        Assert.Equal(key, FindingKeys.Group(FindingKind.CopiesInOneSku, [B, A]));
        Assert.NotEqual(key, FindingKeys.Group(FindingKind.SamePhotoSeveralSkus, [A, B]));
        Assert.NotEqual(key, FindingKeys.Group(FindingKind.CopiesInOneSku, [A, B, B]));
        Assert.Equal(32, key.Length);
    }

    [Fact]
    public void Outlier_depends_on_the_sku_the_photo_is_filed_under() =>
        Assert.NotEqual(FindingKeys.Outlier(A, "SKU-1"), FindingKeys.Outlier(A, "SKU-2"));
}
