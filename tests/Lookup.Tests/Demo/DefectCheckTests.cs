using Lookup.Demo;
using Lookup.Sweeps;

namespace Lookup.Tests.Demo;

/// <summary>
/// Which sweep finding counts as having found a planted mistake: the kind a catalogue owner would act on, listing
/// the planted photos (invented findings here; the real tour is in Cli/DemoCommandTests).
/// </summary>
public sealed class DefectCheckTests
{
    private static readonly DemoDefect SamePhoto = new(
        DemoDefect.SamePhotoTwoSkus, ["photos/A/A_1.jpg", "photos/B/B_2.jpg"], ["A", "B"], ["A", "A"], "A's photo under B");

    private static readonly DemoDefect ReExport = new(
        DemoDefect.ReExportWithinSku, ["photos/A/A_1.jpg", "photos/A/A_1_web.jpg"], ["A", "A"], ["A", "A"], "web copy");

    private static readonly DemoDefect WrongPart = new(DemoDefect.WrongPart, ["photos/B/B_3.jpg"], ["B"], ["C"], "C's part under B");

    [Fact]
    public void A_photo_under_two_skus_is_found_by_the_same_photo_finding_that_lists_both_files()
    {
        var report = Report(
            Finding(FindingKind.LookAlikesAcrossSkus, ("A", "A/A_1.jpg", MemberRole.Member), ("B", "B/B_2.jpg", MemberRole.Member)),
            Finding(FindingKind.SamePhotoSeveralSkus, ("A", "A/A_1.jpg", MemberRole.Member), ("C", "C/C_1.jpg", MemberRole.Member),
                ("B", "B/B_2.jpg", MemberRole.Member)));

        var outcome = DefectCheck.Check(SamePhoto, report, Strip);

        Assert.True(outcome.Found);
        Assert.Equal(2, outcome.FindingNumber);
    }

    [Fact]
    public void Look_alike_listings_and_findings_naming_only_one_file_do_not_count()
    {
        var report = Report(
            Finding(FindingKind.LookAlikesAcrossSkus, ("A", "A/A_1.jpg", MemberRole.Member), ("B", "B/B_2.jpg", MemberRole.Member)),
            Finding(FindingKind.SamePhotoSeveralSkus, ("A", "A/A_1.jpg", MemberRole.Member), ("C", "C/C_1.jpg", MemberRole.Member)),
            Finding(FindingKind.FarFromItsSku, ("B", "B/B_3.jpg", MemberRole.NearestInOwnSku), ("C", "C/C_1.jpg", MemberRole.NearestInOtherSku)));

        Assert.False(DefectCheck.Check(SamePhoto, report, Strip).Found);
        Assert.False(DefectCheck.Check(ReExport, report, Strip).Found);
        Assert.Null(DefectCheck.Check(WrongPart, report, Strip).FindingNumber);
    }

    [Theory]
    [InlineData(FindingKind.CopiesInOneSku, true)]
    [InlineData(FindingKind.SamePhotoSeveralSkus, true)]
    [InlineData(FindingKind.LookAlikesAcrossSkus, false)]
    public void A_re_export_counts_when_grouped_with_its_original_as_copies(FindingKind kind, bool found)
    {
        var report = Report(Finding(kind, ("A", "A/A_1_web.jpg", MemberRole.Member), ("A", "A/A_1.jpg", MemberRole.Member)));

        Assert.Equal(found, DefectCheck.Check(ReExport, report, Strip).Found);
    }

    [Fact]
    public void A_wrong_part_counts_only_as_the_flagged_photo_of_a_far_from_its_sku_finding()
    {
        var flaggedElsewhere = Finding(FindingKind.FarFromItsSku,
            ("B", "B/B_1.jpg", MemberRole.Flagged), ("B", "B/B_3.jpg", MemberRole.NearestInOwnSku), ("C", "C/C_1.jpg", MemberRole.NearestInOtherSku));
        var flagged = Finding(FindingKind.FarFromItsSku,
            ("B", "B/B_3.jpg", MemberRole.Flagged), ("B", "B/B_1.jpg", MemberRole.NearestInOwnSku), ("C", "C/C_1.jpg", MemberRole.NearestInOtherSku));

        Assert.False(DefectCheck.Check(WrongPart, Report(flaggedElsewhere), Strip).Found);
        Assert.Equal(2, DefectCheck.Check(WrongPart, Report(flaggedElsewhere, flagged), Strip).FindingNumber);
    }

    /// <summary>The tour ingests photos/, so the sweep's paths lack that prefix.</summary>
    private static string Strip(string demoPath) => demoPath["photos/".Length..];

    private static SweepReport Report(params SweepFinding[] findings) =>
        new(new SweepOptions(), DateTimeOffset.UnixEpoch, DateTimeOffset.UnixEpoch, new SweepCounts(), findings);

    private static SweepFinding Finding(FindingKind kind, params (string Sku, string Path, MemberRole Role)[] members) => new(
        kind,
        $"{kind}-{string.Join('+', members.Select(m => m.Path))}",
        [.. members.Select((m, i) => new FindingMember(i, m.Sku, m.Path, new string('0', 64), 384, 384, 1000, m.Role))],
        [],
        "invented");
}
