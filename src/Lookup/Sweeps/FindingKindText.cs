namespace Lookup.Sweeps;

/// <summary>Plain-English names of finding kinds and pair relations for people, and short codes for files.</summary>
public static class FindingKindText
{
    /// <summary>A heading, e.g. "Same photo under several SKUs".</summary>
    public static string Label(FindingKind kind) => kind switch
    {
        FindingKind.SamePhotoSeveralSkus => "Same photo under several SKUs",
        FindingKind.CopiesInOneSku => "Copies inside one SKU",
        FindingKind.LookAlikesAcrossSkus => "Look-alikes across SKUs",
        FindingKind.FarFromItsSku => "Far from its SKU",
        _ => kind.ToString(),
    };

    /// <summary>A short lower-case code, e.g. "same-photo", used in CSV cells and HTML attributes.</summary>
    public static string Code(FindingKind kind) => kind switch
    {
        FindingKind.SamePhotoSeveralSkus => "same-photo",
        FindingKind.CopiesInOneSku => "copies",
        FindingKind.LookAlikesAcrossSkus => "look-alikes",
        FindingKind.FarFromItsSku => "far-from-sku",
        _ => kind.ToString().ToLowerInvariant(),
    };

    /// <summary>A pair relation in words, e.g. "copy (cropped, resized)".</summary>
    public static string Relation(PairRelation relation, CopyEdits edits) => relation switch
    {
        PairRelation.IdenticalBytes => "identical file",
        PairRelation.SamePixels => "same pixels",
        PairRelation.Copy => $"copy ({Verdicts.EditWords(edits)})",
        PairRelation.LookAlike => "look-alike",
        _ => "different photos",
    };

    /// <summary>A member's role in words.</summary>
    public static string Role(MemberRole role) => role switch
    {
        MemberRole.Flagged => "flagged",
        MemberRole.NearestInOwnSku => "nearest in its own SKU",
        MemberRole.NearestInOtherSku => "nearest in another SKU",
        _ => "member",
    };
}
